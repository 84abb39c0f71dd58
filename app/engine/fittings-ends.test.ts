/**
 * Fitting K = n·fT at and beyond the ends of Crane's fT table (½–24 in) and of a fitting's size range (fittings.ts),
 * swept over every catalogue fitting and many sizes. Check values: K = n·fT (Crane TP-410, from memory); outside the
 * table fT is the rough-pipe Colebrook limit 0.25 / log10(ε/(3.7·D))² with ε = 0.045 mm (Colebrook 1939), computed
 * here from that formula; the warning must name the K returned.
 */
import { describe, expect, it } from "vitest";
import { CRANE_FT, FITTINGS, fittingKDetailed } from "./index.ts";
import { prng } from "../../fixtures/prng";

const INCH = 0.0254;
const roughLimit = (d: number) => 0.25 / Math.log10(0.045e-3 / d / 3.7) ** 2; // Colebrook's rough-pipe limit, clean steel
const sized = FITTINGS.filter((f) => f.model.type !== "fixed");

describe("K below the smallest and above the largest size of the fT table: the K used is said", () => {
  it("every sized fitting × 400 bores from 0.2 in to 80 in (no nominal), and nominals ⅛–⅜ in and 26–60 in: each size warning names the K returned", () => {
    const r = prng(9);
    const cases: [number, string | undefined][] = [];
    for (let i = 0; i < 400; i++) cases.push([INCH * 0.2 * Math.pow(400, r()), undefined]);
    const nominals: [string, number][] = [["1/8", 0.125], ["1/4", 0.25], ["3/8", 0.375], ["26", 26], ["30", 30], ["36", 36], ["42", 42], ["48", 48], ["60", 60]];
    for (const [n, inches] of nominals) cases.push([inches * INCH * 0.9, n]);
    let warned = 0;
    for (const f of sized) {
      for (const [d, nominal] of cases) {
        const res = fittingKDetailed(f.id, d, nominal);
        const inches = nominal !== undefined ? d / INCH / 0.9 : d / INCH;
        const outsideTable = nominal !== undefined ? true : inches < 0.5 * 0.9 || inches > 24;
        const ft = res.warnings.some((w) => w.code === "ft-outside-table");
        expect(ft, `${f.id} ${nominal ?? d}`).toBe(outsideTable);
        if (outsideTable) {
          const n = f.model.type === "ft-multiple" ? f.model.n : null;
          if (n !== null) expect(res.k, `${f.id} ${nominal ?? d}`).toBeCloseTo(Math.max(n * roughLimit(Math.max(d, 1e-3)), f.model.type === "ft-multiple" ? f.model.atLeast ?? 0 : 0), 12);
        }
        for (const w of res.warnings) {
          // Before: "…; fT from the rough-pipe Colebrook limit" and "…; K extrapolated", no number.
          const said = /K = (\d+) × fT (0\.\d{4}) = (\d+\.\d{3})(, raised to its floor ([\d.]+))? used$/.exec(w.message);
          expect(said, `${f.id} ${nominal ?? d}: ${w.message}`).not.toBeNull();
          const kSaid = said![5] !== undefined ? Number(said![5]) : Number(said![3]);
          expect(Math.abs(kSaid - res.k), w.message).toBeLessThanOrEqual(5e-4 + 1e-12);
          warned++;
        }
      }
    }
    expect(warned).toBeGreaterThan(sized.length * 100);
  });
  it("inside the table (every listed nominal, ½–24 in): the table's fT, no fT warning", () => {
    for (const f of sized) {
      for (const [nominal, ft] of Object.entries(CRANE_FT)) {
        const res = fittingKDetailed(f.id, 0.9 * INCH * (nominal.includes("/") ? 1 : Number(nominal)), nominal);
        expect(res.warnings.map((w) => w.code), `${f.id} ${nominal}`).not.toContain("ft-outside-table");
        if (f.model.type === "ft-multiple") expect(res.k).toBeCloseTo(Math.max(f.model.n * ft, f.model.atLeast ?? 0), 12);
      }
    }
  });
});
