// The motor qualifier of the verdict (verdict-motor.ts) wherever the verdict is a headline: the systems read API
// (`result.verdictMotor`), the candidates table on the system page's data, the report's verdict line, the selection CSV
// (`verdict_motor`) and JSON (`verdictMotor`); nothing where the motor covers the curve. A candidate that "meets the duty"
// on a motor smaller than its shaft power at the operating point read "meets" with the overload only in the Motor row.
// Check values: the product rule (common practice: a motor runs within its rating × service factor); an invented pump
// (below: head 30 − 0.008 Q² m, shaft power 2 + 0.05 Q kW, Q in m³/h), meeting 30 m³/h at 20.5 m at about 33.7 m³/h and
// 3.68 kW (verdict-motor.test.ts).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as selectionJson from "~/routes/selections.$id.export-json";
import { call, makeMember, type TestMember } from "./harness";
import { selectionPages } from "./selection-pages";
import { probePumpCsv } from "./probe-pump";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const CSV = probePumpCsv("Motor probe 40");
const SYSTEM: SystemInput = { ...defaultSystemInput(), staticLow: 19, staticHigh: 20, duty: { flow: 30 * M3H, head: 20.5 } };

let m: TestMember;
let v: Viewer;
let token = "";
const systems: Record<"small" | "ample", number> = { small: 0, ample: 0 };
const selections: Record<"small" | "ample", number> = { small: 0, ample: 0 };
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Motor probes", description: "" });
  await importCsvText(v, lib, CSV, "motor-probe.csv");
  const setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "Motor surfaces", site: "", description: "" });
  // 3 kW: below the 3.68 kW one pump takes at the operating point; 4 kW: above the curve's largest 3.99 kW.
  for (const [k, rating] of [["small", 3000], ["ample", 4000]] as const) {
    systems[k] = await createSystem(v, project, `Motor ${k}`, SYSTEM);
    const added = await addCandidate(v, systems[k], setId, { ...DEFAULT_ADJUSTMENT, motorRating: rating });
    if (!added.ok) throw new Error(added.reason);
    selections[k] = await selectCandidate(v, (await systemWorkbench(v, systems[k])).candidates[0].id, `Motor ${k}`, "");
  }
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

const OVER = /^but the motor is overloaded at the operating point: one pump takes 3\.6\d kW, above motor rating × service factor 3\.00 kW$/;

describe("a meeting pump on a motor too small for its operating point", () => {
  test("systems read API: result.verdictMotor on the verdict's line; null where the motor covers the curve", async () => {
    for (const [k, want] of [["small", OVER], ["ample", null]] as const) {
      const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systems[k]}`, params: { id: String(systems[k]) }, headers: { authorization: `Bearer ${token}` } });
      expect(r.status).toBe(200);
      const res = (r.body as { candidates: { result: { verdict: { status: string }; verdictMotor: string | null } }[] }).candidates[0].result;
      expect(res.verdict.status, k).toBe("meets");
      if (want) expect(res.verdictMotor).toMatch(want);
      else expect(res.verdictMotor).toBeNull();
    }
  });
  test("the report's verdict line and the CSV's verdict_motor; the JSON's verdictMotor", async () => {
    const small = await selectionPages(m, selections.small);
    expect(small.html).toMatch(/data-testid="report-verdict-motor"/);
    expect(small.text).toMatch(/meets the duty (— but NPSH not checked: [^—]+ )?— but the motor is overloaded at the operating point: one pump takes 3\.6\d kW, above motor rating × service factor 3\.00 kW/);
    expect(small.csv.find((r) => r[1] === "verdict_motor")?.[2]).toMatch(OVER);
    const ample = await selectionPages(m, selections.ample);
    expect(ample.html).not.toMatch(/report-verdict-motor/);
    expect(ample.csv.find((r) => r[1] === "verdict_motor")?.[2] ?? "").toBe("");
    const json = await call(selectionJson.loader as never, { path: `/selections/${selections.small}/export.json`, cookie: m.cookie, params: { id: String(selections.small) } });
    expect(json.status).toBe(200);
    const body = (typeof json.body === "string" ? JSON.parse(json.body) : json.body) as { verdictMotor: string | null };
    expect(body.verdictMotor).toMatch(OVER);
  });
});
