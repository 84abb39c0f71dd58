// The search's direct rule, printed on each row with its numbers (search-how.ts `directRuleText`, through the service
// the search page and the API read): a pump is direct (as published) only when its head at the duty flow lies within
// the duty head to duty head × 1.05, each end to 1 part in 10⁸ (engine search.ts, limitText.ts `insideEnds`). Check
// values: the rule (common practice: a published curve through or just above the duty point, 5 % over allowed); the
// curve is invented ("Direct probe", 44 m at 40 m³/h, a published point, so its head there is 44 m exactly); the typed
// duty head is set 1e-6 relative either side of each end of the window (arithmetic, beside the 1e-8 allowance).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import type { Viewer } from "../libraries";
import { createProject, createSystem } from "./projects.server";
import { searchForSystem } from "./search.server";
import { defaultSystemInput } from "./hydraulics";
import { M3H, oneModelLibrary, viewerOfUser } from "./test-kit";
import { makeMember } from "~/test/harness";
import { inSI } from "~/engine/quantityText";

afterAll(() => closeDb());

let v: Viewer;
let projectId = 0;
const MODEL = "Direct probe 65";
const H1 = 44; // m at 40 m³/h: the curve's published point (invented)
// flow m³/h, head m, efficiency % (invented, falling from shut-off)
const ROWS = [[0, 50, 0], [20, 48, 50], [40, H1, 70], [60, 38, 72], [80, 30, 60]];

beforeAll(async () => {
  const m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await oneModelLibrary(v, "Direct probes", { model: MODEL, size: "DN65", impellerMm: 200, rows: ROWS });
  projectId = await createProject(v, { name: "Direct rule", site: "", description: "" });
});

async function rowAt(head: number) {
  const base = defaultSystemInput();
  const id = await createSystem(v, projectId, `Duty head ${head} m`, { ...base, staticLow: 10, staticHigh: 10, duty: { flow: 40 * M3H, head } });
  const r = await searchForSystem(v, id, { allowBeyondCatalogue: true });
  return r.results.find((x) => x.model === MODEL);
}
/** The numbers the words print: the head as published, the duty head, the window's top (m, read back in SI). */
function printed(words: string) {
  const m = inSI(words).match(/at the duty flow 40(?:\.0*)? m³\/h is ([\d.]+) m, (within|above the window of|below the window of) the duty head ([\d.]+) m to duty head × 1\.05 = ([\d.]+) m/);
  expect(m, inSI(words)).not.toBeNull();
  return { head: Number(m![1]), side: m![2], duty: Number(m![3]), top: Number(m![4]) };
}

describe("search row: direct only within the duty head to × 1.05 at the duty flow, the words with the row's numbers", () => {
  test("low end: 44 m = duty head × (1 + 1e-6) is direct, and says so with its numbers", async () => {
    const hd = H1 / (1 + 1e-6);
    const row = (await rowAt(hd))!;
    expect(row.method).toBe("direct");
    expect(row.directRule).toMatch(/^Direct: /);
    const p = printed(row.directRule);
    expect(p.side).toBe("within");
    expect(p.head).toBeGreaterThan(p.duty); // printed apart, in order (44 m above the duty head by 1e-6)
    expect(p.head).toBeCloseTo(H1, 6);
    expect(p.top).toBeCloseTo(hd * 1.05, 4);
  });
  test("low end: 44 m = duty head × (1 − 1e-6) is not direct: below the duty head, and no speed above the published one, so not found", async () => {
    const row = await rowAt(H1 / (1 - 1e-6));
    expect(row).toBeUndefined(); // the search's speed ratio is at most 1 (engine search.ts maxSpeedRatio)
  });
  test("high end: 44 m = duty head × 1.05 × (1 − 1e-6) is direct", async () => {
    const hd = (H1 / 1.05) * (1 + 1e-6);
    const row = (await rowAt(hd))!;
    expect(row.method).toBe("direct");
    const p = printed(row.directRule);
    expect(p.side).toBe("within");
    expect(p.head).toBeLessThan(p.top); // printed apart from the window's top
  });
  test("high end: 44 m = duty head × 1.05 × (1 + 1e-6) is trimmed, and the words say it is above the window, with its numbers", async () => {
    const hd = (H1 / 1.05) * (1 - 1e-6);
    const row = (await rowAt(hd))!;
    expect(row.method).toBe("trim");
    expect(row.directRule).toMatch(/^Not direct: /);
    const p = printed(row.directRule);
    expect(p.side).toBe("above the window of");
    expect(p.head).toBeGreaterThan(p.top);
    expect(p.duty).toBeCloseTo(hd, 1); // the duty head at display precision (41.9 m), apart from the readings beside it
    expect(row.directRule).toContain("each end to 1 part in 10⁸");
  });
});
