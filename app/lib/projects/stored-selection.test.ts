// The frozen selection's reader (stored-selection.ts) on the fields the newer conclusions added: the points NPSH could
// not judge (`npsh.unjudged`), the wanted NPSH margin kept with it (`npsh.requiredMargin`), the band's NPSHa and NPSHr,
// the ratio solved before rounding (`solvedRatio`) and the motor's verdict text (`figures.motorCheck`). A document frozen
// before them (none of the keys) still reads; a document whose value there is of the wrong kind is refused with its place
// named, never handed to the report and the CSV (which call `.map` on the points: a TypeError, a 500). Pure.
// Check values: our product rule (stored-selection.ts: "the parts the report, the exports and the field pages read, with
// their types") and the fixture's straight-line curve (app/test/fieldcheck-fixture.ts, made up).
import { describe, expect, test } from "vitest";
import { readStoredSelection } from "./stored-selection";
import { selectionCsv } from "./selection-export.server";
import { frozenFixture } from "~/test/fieldcheck-fixture";

/** The fixture as JSON with `edit` applied to its parsed copy. */
function stored(edit: (doc: { result: Record<string, unknown> & { npsh: Record<string, unknown>; figures: Record<string, unknown>; band: Record<string, unknown>[] } }) => void): string {
  const doc = JSON.parse(JSON.stringify(frozenFixture({ adjustment: { method: "speed", ratio: null, arrangement: "single", dutyPumps: 1, standbyPumps: 0, motorRating: 0, serviceFactor: 1.15, ieClass: "IE3" } as never })));
  edit(doc);
  return JSON.stringify(doc);
}

describe("readStoredSelection: the newer fields", () => {
  test("a document the app froze now reads, with the new fields present (control)", () => {
    const json = stored(() => {});
    const doc = JSON.parse(json);
    expect(Array.isArray(doc.result.npsh.unjudged)).toBe(true);
    expect(typeof doc.result.npsh.requiredMargin).toBe("number");
    expect(readStoredSelection(json).ok).toBe(true);
  });

  test("a document frozen before them (no unjudged, requiredMargin, band NPSH, solvedRatio, motorCheck) still reads, and its CSV is written", () => {
    const json = stored((d) => {
      delete d.result.npsh.unjudged;
      delete d.result.npsh.requiredMargin;
      for (const b of d.result.band) { delete b.npshAvailable; delete b.npshRequired; }
      delete d.result.solvedRatio;
      delete d.result.figures.motorCheck;
    });
    const r = readStoredSelection(json);
    expect(r.ok).toBe(true);
    if (r.ok) expect(selectionCsv(1, "t", r.frozen)).toContain("npsh_not_judged_at");
  });

  test.each([
    ["npsh.unjudged as text", (d: Parameters<Parameters<typeof stored>[0]>[0]) => { d.result.npsh.unjudged = "least lift, new pipe"; }, "result.npsh.unjudged"],
    ["an unjudged point without its why", (d: Parameters<Parameters<typeof stored>[0]>[0]) => { d.result.npsh.unjudged = [{ at: "least lift, new pipe" }]; }, "result.npsh.unjudged.0.why"],
    ["npsh.requiredMargin as text", (d: Parameters<Parameters<typeof stored>[0]>[0]) => { d.result.npsh.requiredMargin = "1.1"; }, "result.npsh.requiredMargin"],
    ["a band edge's NPSHa as text", (d: Parameters<Parameters<typeof stored>[0]>[0]) => { d.result.band[0].npshAvailable = "6"; }, "result.band.0.npshAvailable"],
  ])("%s is refused with its place named", (_what, edit, path) => {
    const r = readStoredSelection(stored(edit));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems.map((p) => p.path)).toContain(path);
  });
});
