// The mapping page's markup, rendered on the server from loader data (no database): a column whose header names a
// unit its field does not take ("Head (kPa)") offers no unit — its select starts on "choose…" and says why — while
// a column whose unit was only assumed keeps its default and the "assumed" mark. The file is invented.
import { describe, expect, it } from "vitest";
import UploadPreview, { type loader } from "~/routes/libraries.$id.uploads.$uploadId";
import { analyseStored, summarise } from "~/lib/libraries/upload-analysis";
import { SI_UNITS } from "~/lib/shared/units";
import { renderPage } from "./render-page";

const csv = "Model,Speed rpm,Flow,Head (kPa)\nA,2900,0,200\nA,2900,10,190\nA,2900,20,170\n";

function render(text: string): string {
  const data = {
    lib: { id: 1, name: "Test library" },
    upload: { id: 2, filename: "kpa.csv", size: text.length, sha256: "0".repeat(64), source: null },
    unitSystem: SI_UNITS,
    correctedFrom: null,
    ...summarise(analyseStored(text, { mappingJson: null })),
  } satisfies Awaited<ReturnType<typeof loader>>; // the loader's own shape
  return renderPage("/libraries/:id/uploads/:uploadId", UploadPreview, "/libraries/1/uploads/2", data);
}
const selectOf = (html: string, label: string) => [...html.matchAll(/<select[^>]*aria-label="([^"]*)"[^>]*>([\s\S]*?)<\/select>/g)].find((m) => m[1] === label)?.[2] ?? "";
const selected = (options: string) => /<option value="([^"]*)" selected="">/.exec(options)?.[1];

describe("mapping page: a header unit the field does not take", () => {
  const html = render(csv);
  it("the unit select of “Head (kPa)” starts on “choose…” and says the word was not read", () => {
    const head = selectOf(html, "Unit of Head (kPa)");
    expect(head).toContain(">choose…</option>"); // source: importer rule (no unit offered for a refused word)
    expect(selected(head)).toBe(""); // source: same (the default m is not preselected)
    expect(html).toContain("“<!-- -->kPa<!-- -->” is not a unit the importer reads for <!-- -->Head"); // source: importer rule (names the word and the field)
  });
  it("a column with no unit word keeps its default and the “assumed” mark", () => {
    const flow = selectOf(html, "Unit of Flow");
    expect(selected(flow)).toBe("m3/h"); // source: DEFAULT_UNIT (flow)
    expect(flow).not.toContain("choose…"); // source: nothing refused in “Flow”
    expect(html).toContain(">assumed</span>"); // source: unitSource "default" shown as before
  });
  it("the problems list names the header and the units head takes", () => {
    expect(html).toContain("“Head (kPa)” gives the unit “kPa”, which the importer does not read for head (it reads m, ft)"); // source: refusalMessage
  });
});

// P1 is the motor's electrical input, P2 the pump's shaft power (common practice in pump data sheets): a P1 column is left
// out, the row says so beside its field, and the problems list carries the warning (edge hunt of 2026-12-03).
describe("mapping page: a column of electrical input power (P1)", () => {
  const html = render("Model,Speed rpm,Flow m3/h,Head m,P1 kW\nA,2900,0,20,1.0\nA,2900,10,19,1.2\nA,2900,20,17,1.4\n");
  it("“P1 kW” means “— ignore —”, not shaft power, and the row says why", () => {
    expect(selected(selectOf(html, "Meaning of P1 kW"))).toBe("ignore"); // source: common practice (P1 is not shaft power)
    expect(html).toMatch(/data-testid="input-power">electrical input power \(P1\), not the shaft power \(P2\) the importer reads: (?:<!-- -->)?left out/); // source: importer rule (the row names the reason)
  });
  it("the problems list warns that the file then has no power figures", () => {
    expect(html).toContain("“P1 kW” is left unmapped: its header names the motor&#x27;s electrical input power (P1)"); // source: notShaftPowerMessage (INPUT_POWER)
    expect(html).toContain("no shaft power (P2) or pump efficiency column"); // source: same
    expect(html).toContain("▲ "); // source: a warning, not an error (the page marks warnings ▲)
  });
});

// Hydraulic power (ρ·g·Q·H, the power given to the liquid) is not shaft power either (P2 = P_hyd / η, common practice): the
// column is left out and its row says so, as a P1 column's does (edge hunt of 2026-12-03).
describe("mapping page: a column of hydraulic power", () => {
  const html = render("Model,Speed rpm,Flow m3/h,Head m,Eff %,Hydraulic power (kW)\nA,2900,0,20,0,0\nA,2900,10,19,55,0.517\nA,2900,20,17,70,0.925\n");
  it("“Hydraulic power (kW)” means “— ignore —”, and the row says why", () => {
    expect(selected(selectOf(html, "Meaning of Hydraulic power (kW)"))).toBe("ignore"); // source: common practice (hydraulic power is not P2)
    expect(html).toMatch(/data-testid="hydraulic-power">hydraulic power \(ρ·g·Q·H\), not the shaft power \(P2\) the importer reads: left out/); // source: importer rule (the row names the reason)
    expect(html).toContain("worked out from the pump efficiency column “Eff %” instead"); // source: notShaftPowerMessage (HYDRAULIC_POWER)
  });
});

// Header words the importer does not read as shaft power, beside their column (review of 2026-12-03): P_w (water power or
// watts?) and Förderleistung (flow or useful power?) are left out until the user chooses; p.u. is a ratio; a motor's output
// is shaft power (definition). The rows' notes come from powerKindNote (power-kinds.ts).
describe("mapping page: P_w, Förderleistung, p.u. and a motor's output", () => {
  const html = render("Model,Speed rpm,Flow m3/h,Head m,P_w,Förderleistung,P.U.,Motor output kW\nA,2900,0,20,0,0,0.5,1.0\nA,2900,10,19,517,0.5,0.8,1.2\nA,2900,20,17,925,0.9,1.0,1.4\n");
  it("“P_w” is left out until the user chooses, and the row names both readings", () => {
    expect(selected(selectOf(html, "Meaning of P_w"))).toBe("ignore"); // source: ambiguous-power.ts
    expect(html).toMatch(/data-testid="water-or-watts-power">“P_w”: the water \(hydraulic\) power, or a power in W\? Left out until you choose</); // source: importer rule
  });
  it("“Förderleistung” is left out until the user chooses, and the row names both readings", () => {
    expect(selected(selectOf(html, "Meaning of Förderleistung"))).toBe("ignore"); // source: ambiguous-power.ts
    expect(html).toContain('data-testid="flow-or-hydraulic-power">“Förderleistung”: the flow, or the useful (hydraulic) power?'); // source: importer rule
  });
  it("“P.U.” is left out as a ratio, and “Motor output kW” is the shaft power", () => {
    expect(selected(selectOf(html, "Meaning of P.U."))).toBe("ignore"); // source: per-unit.ts
    expect(html).toMatch(/data-testid="per-unit-power">a per-unit \(p\.u\.\) ratio, not a power in kW, W or hp: (?:<!-- -->)?left out/); // source: importer rule
    expect(selected(selectOf(html, "Meaning of Motor output kW"))).toBe("power"); // source: definition (a motor's output is its shaft power, P2)
  });
});

// A motor's power with no input word ("Motor kW") is taken to be its rated output, as vendor catalogues write it, and a rated
// power ("Rated power kW") a nameplate figure too (review of 2026-12-03: they were P1 and shaft power). The rows say "assumed".
describe("mapping page: a motor's power and a rated power, assumed ratings", () => {
  const html = render("Model,Speed rpm,Flow m3/h,Head m,Motor kW,Rated power kW\nA,2900,0,20,7.5,7.5\nA,2900,10,19,7.5,7.5\nA,2900,20,17,7.5,7.5\n");
  it("“Motor kW” is left out, and the row says the motor's rated output was assumed (was: P1)", () => {
    expect(selected(selectOf(html, "Meaning of Motor kW"))).toBe("ignore"); // source: rated-power.ts
    expect(html).toMatch(/data-testid="motor-power">assumed: the motor&#x27;s rated output \(its size, one figure for all points\), not the shaft power \(P2\) at each point; if it is the shaft power at each point, choose “Shaft power”: (?:<!-- -->)?left out/); // source: importer rule
  });
  it("“Rated power kW” is left out as a rating, assumed (was: shaft power)", () => {
    expect(selected(selectOf(html, "Meaning of Rated power kW"))).toBe("ignore"); // source: rated-power.ts
    expect(html).toMatch(/data-testid="rated-power">assumed: a rating \(one figure for all points\)/); // source: importer rule
  });
});

// "gpm" and "gal/min" with no US or imperial mark are read as the US gallon (NIST SP 811), which is an assumption: the
// imperial gallon (Weights and Measures Act 1985) is 20.1 % larger. The row says so, as for a unit assumed (smalledges).
describe("mapping page: a gallon with no US or imperial mark", () => {
  const file = (q: string) => render(`Model,Speed rpm,${q},Head m\nA,2900,0,20\nA,2900,10,19\nA,2900,20,17\n`);
  const html = file("Q [gal/min]");
  it("“Q [gal/min]” is read as US gpm and the row says the US gallon was assumed, with both gallons", () => {
    expect(selected(selectOf(html, "Unit of Q [gal/min]"))).toBe("gpm"); // source: unit-words.ts (US unless marked imperial)
    expect(html).toMatch(/data-testid="gallon-assumed">US gallon assumed \(3\.785411784 L\); if the file&#x27;s gallons are imperial \(4\.54609 L, 20\.1 % larger\), choose imp gpm</); // source: NIST SP 811; Weights and Measures Act 1985
  });
  it("guard: “Q (US gpm)” names its gallon: read as US gpm with no note (passed before too)", () => {
    const us = file("Q (US gpm)");
    expect(selected(selectOf(us, "Unit of Q (US gpm)"))).toBe("gpm"); // source: US_MARK
    expect(us).not.toContain("gallon-assumed"); // source: the header names the US gallon
    expect(file("Flow gpm (Imp)")).not.toContain("gallon-assumed"); // source: IMPERIAL_MARK, read as imp gpm
  });
});
