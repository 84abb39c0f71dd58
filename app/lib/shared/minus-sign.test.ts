// A negative quantity shown with the true minus sign "−" (U+2212), as per cents and refusals' typed numbers already are
// (helper "numtext"): fmtQ and its kin and every rendered token, so the system editor's refusals too ("it takes from
// −50 °C to 300 °C, not −60.0 °C", where it read "-50 °C"). The range −50–300 °C is the app's own rule
// (projects/temperature-range.ts); values are made up; units the engine's table (NIST SP 811).
import { describe, expect, it } from "vitest";
import { qt, qtBound, qtExact, qtLimit, qtSent } from "~/engine/quantityText";
import { UNITS, type Quantity } from "~/engine/units";
import { LIQUID_TEMPERATURE_RANGE } from "~/lib/projects/temperature-range";
import { outOfRange } from "~/lib/projects/run-ranges";
import { readDecimal } from "./decimal";
import { fmtQ, fmtQAboveZero, fmtQExact, renderUnits, unitsOf } from "./units";

const SI = unitsOf("SI");
const US = unitsOf("US");

describe("negatives read with the true minus", () => {
  it("fmtQ, fmtQExact, fmtQAboveZero: '−50.0 °C', '−58.0 °F', '−1.89 m' (old '-50.0 °C')", () => {
    expect(fmtQ(SI, "temperature", -50)).toBe("−50.0 °C");
    expect(fmtQ(US, "temperature", -50)).toBe("−58.0 °F");
    expect(fmtQExact(SI, "head", -1.89, [0])).toBe("−1.89 m");
    expect(fmtQAboveZero(SI, "head", -1.89)).toBe("−1.89 m");
  });
  it("the system editor's refusal of a temperature: the end and the number refused, '−50 °C' and '−60 °C'", () => {
    const said = renderUnits(outOfRange(LIQUID_TEMPERATURE_RANGE, -60)!, SI);
    expect(said).toContain("from −50 °C to 300 °C"); // old "from -50 °C"
    expect(said).toContain("not −60.0 °C"); // old "not -60.0 °C"
    expect(said).not.toMatch(/-\d/);
    expect(renderUnits(outOfRange(LIQUID_TEMPERATURE_RANGE, -60)!, US)).toContain("from −58 °F to 572 °F");
  });
  it("an end as printed is taken back by the forms' reader", () => {
    const end = renderUnits(qtBound("temperature", -50, [-60], "min"), SI).split(" ")[0];
    expect(readDecimal(end)).toMatchObject({ kind: "number", value: -50 });
  });
  it("sweep: every quantity × unit × negative values, every token kind, never a hyphen before a digit", () => {
    for (const q of Object.keys(UNITS) as Quantity[])
      for (const u of UNITS[q]) {
        const units = { ...SI, [q]: u.id };
        for (const si of [-1e-12, -0.5, -50, -12345.6, -2.5e6]) {
          let said: string;
          try {
            said = [qt(q, si), qtExact(q, si, [0]), qtLimit(q, si, [si * 2]), qtBound(q, si, [si * 2], "min"), qtSent(q, si * 2, [si])].map((t) => renderUnits(t, units)).join(" | ");
          } catch {
            continue;
          }
          if (said.includes("⟦")) continue; // past a double in this unit: the token stays as written
          expect(said, `${q} ${u.id} ${si}`).not.toMatch(/(^|[\s|(])-\d/);
        }
      }
  });
});
