// What a selection's report and CSV say of a drooping pump: the verdict's rule names a point reached from rest (a static
// above the shut-off head gives "no operating point" although the curves cross), the curve-level drooping warning is true
// beside every verdict, two such pumps in parallel started one after another do not meet a duty both meet together (the
// headline says so on its line, as NPSH does), and a duty in the laminar–turbulent transition is said once per run.
// Real route modules and MariaDB. Check values: common practice, from memory (a pump starts against a closed check valve;
// in parallel, against the head of those running; Re 2000–4000 the transition). The drooping curve is invented (40 m shut-off,
// 41.9 m peak); heads and flows quoted are read off it.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, getSelection, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import type { FrozenSelection } from "~/lib/projects/stored-selection";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import { makeMember, type TestMember } from "./harness";
import { importDroopPump } from "./droop-pump";
import { csvFigures, figureCell, selectionPages, textOf } from "./selection-pages";

afterAll(() => closeDb());

const M3H = 1 / 3600;

let m: TestMember;
let v: Viewer;
let project = 0;
let setId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  setId = await importDroopPump(v); // droop-pump.ts: 40 m shut-off, 41.9 m peak (invented)
  project = await createProject(v, { name: "Start texts", site: "", description: "" });
});

async function select(name: string, input: SystemInput, adj: Adjustment = DEFAULT_ADJUSTMENT) {
  const systemId = await createSystem(v, project, name, input);
  const added = await addCandidate(v, systemId, setId, adj);
  if (!added.ok) throw new Error(added.reason);
  const id = await selectCandidate(v, added.id, name, "");
  return { f: renderDeep((await getSelection(v, id)).frozen, SI_UNITS) as FrozenSelection, pages: await selectionPages(m, id) };
}
const sys = (o: Partial<SystemInput>): SystemInput => ({ ...defaultSystemInput(), ...o });

describe("the drooping pump alone against 41–42 m static: no operating point, said truly in the report and the CSV", () => {
  test("verdict_rule and the report's rule name a point reached from rest; the drooping warning names the 40 m shut-off head", async () => {
    const { f, pages } = await select("Above its shut-off", sys({ staticLow: 41, staticHigh: 42, duty: { flow: 36 * M3H, head: 41.5 } }));
    expect(f.result.verdict?.status).toBe("no-operating-point"); // control
    const rows = csvFigures(pages.csv);
    const rule = rows.get("verdict_rule")?.[0] ?? "";
    expect(rule).toMatch(/^no-operating-point: at every edge of the band the pump must reach an operating point from rest/); // old code: "no-operating-point: the pump curve must cross the system curve at every edge of the band"
    expect(pages.text).toContain(`Rule — ${rule}`);
    const drooping = f.result.warnings.filter((w) => /drooping curve/.test(w));
    expect(drooping).toEqual(["head rises from its shut-off head 40.0 m before falling (drooping curve): a system curve may cross it twice, and the point judged is the one the pump reaches from rest, started against its closed check valve (the first crossing where its head falls below the system's); a system head above 40.0 m there leaves it unable to start"]); // old code: "…: more than one operating point is possible"
    expect(figureCell(pages.html, "Notes")).toContain(textOf(drooping[0]));
    expect([...rows].filter(([k, [val]]) => /^warning_\d+$/.test(k) && /drooping curve/.test(val)).map(([, [val]]) => val)).toEqual(drooping);
  });
});

describe("two drooping pumps in parallel, 36–37 m static, duty 54 m³/h: meets together, not started one after another", () => {
  test("the report's verdict line and the CSV's verdict_start carry it with the numbers; the chart's label its short form", async () => {
    const { f, pages } = await select("Two in parallel", sys({ staticLow: 36, staticHigh: 37, duty: { flow: 54 * M3H, head: 40 } }), { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 });
    expect(f.result.verdict?.status).toBe("meets"); // control
    const note = "but started one after another (duty/standby staging) the duty is not met: at most lift, aged pipe pump 2 of 2 cannot open its check valve against the 41.2 m pump 1 holds (above its shut-off head 40.0 m), so only 1 delivers, 50.8 m³/h, below the duty 54.0 m³/h; the verdict assumes the 2 started together";
    expect(csvFigures(pages.csv).get("verdict_start")?.[0]).toBe(note); // old code: no verdict_start row
    const line = textOf(/data-testid="report-verdict-start"[^>]*>([\s\S]*?)<\/span>/.exec(pages.html)?.[1] ?? "");
    expect(line).toBe(`— ${note}`);
    expect(pages.html).toContain("meets the duty, but NPSH not checked, but not met if started one after another"); // the droop pumps publish no NPSHr (decision "npshzero")
  });
  test("the flip: 30–32 m static, pump 1 alone holds less than its 40 m shut-off head, pump 2 starts: no qualifier, an empty verdict_start", async () => {
    const { pages } = await select("Two in parallel, less lift", sys({ staticLow: 30, staticHigh: 32, duty: { flow: 54 * M3H, head: 40 } }), { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 });
    expect(pages.text).not.toMatch(/cannot open its check valve/);
    expect(csvFigures(pages.csv).get("verdict_start")?.[0]).toBe("");
    expect(pages.html).not.toContain("report-verdict-start");
  });
});

describe("a duty in the laminar–turbulent transition (0.72 m³/h in the default 100 mm runs) is said once per run", () => {
  test("system_warning_N carry each run's band text with the duty's Re; run_warning_N not the one-flow transition warning", async () => {
    const { f, pages } = await select("Tiny duty", sys({ duty: { flow: 0.72 * M3H, head: 12 } }));
    const rows = csvFigures(pages.csv);
    const sysW = [...rows].filter(([k]) => /^system_warning_\d+$/.test(k)).map(([, [val]]) => val);
    const runW = [...rows].filter(([k]) => /^run_warning_\d+$/.test(k)).map(([, [val]]) => val);
    expect(sysW.filter((w) => /laminar–turbulent transition.*the duty flow 0\.720 m³\/h \(Re = 25\d\d\) is in it/.test(w))).toHaveLength(2); // control: one per run
    expect(runW.filter((w) => /laminar–turbulent transition/.test(w))).toEqual([]); // old code: "Re = 2538 is in the laminar–turbulent transition…" per run
    expect(f.systemCurve!.runs.flatMap((r) => r.warnings).filter((w) => /laminar–turbulent transition/.test(w))).toEqual([]);
  });
});
