// The field checks' CSV says what units its notes are in: its columns are SI named in each header (m³/s, m, Pa, W, °C),
// its verdict_note is rendered in the app's SI display units (m³/h, kPa, kW…), and the header line names those, each unit the
// note uses among them. It used to say "SI units in every header" alone beside a note in m³/h. Check values: the fixture
// curve H = 40 m − 1000 s²/m⁵ · Q ending at 0.03 m³/s = 108 m³/h (invented; 1 m³/s = 3600 m³/h, definition); a flow of
// 0.033 m³/s (118.8 m³/h) beyond its end gives a note with both flows (curve-ends.ts).
import { expect, test } from "vitest";
import Papa from "papaparse";
import { fluidAt } from "~/engine";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { evaluateCheck, historyCsv, parseCheckFields, verdictNote } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const p = parseCheckFields(fieldsForHead(7, RHO20, { flow: "0.033" }), { kind: "water" });
if (!p.ok) throw new Error(JSON.stringify(p.errors));
const result = evaluateCheck(frozenFixture(), p.readings, "2B");
const csv = historyCsv({
  selection: { id: 1, title: "Fixture", projectName: "Project" },
  checks: [{
    id: 1, chainId: 1, version: 1, superseded: false, createdAt: "2026-12-03T09:00:00Z",
    times: { takenAt: null, recordedAt: "2026-12-03T09:00:00Z", text: "", warnings: [] } as never,
    byName: "A", byWorkspace: "W", verdict: result.verdict, grade: "2B", notes: "", readable: true, result, readings: p.readings,
  }],
});
const rows = Papa.parse<string[]>(csv.trim()).data;
const unitsLine = rows.find((r) => /units/i.test(r[0]) && r[0].startsWith("#"))![0];
const header = rows.find((r) => r[0] === "check_id")!;
const note = rows.at(-1)![header.indexOf("verdict_note")];

test("the case: a note with flows in m³/h beside the flow_m3s column", () => {
  expect(verdictNote(result)).not.toBeNull();
  expect(note).toMatch(/the measured flow 119 m³\/h lies beyond the curve's end at 108 m³\/h/);
  expect(header).toContain("flow_m3s");
});

test("the header line names the notes' units, every unit the note writes among them; the columns as SI", () => {
  expect(unitsLine).toMatch(/verdict_note writes quantities in the app's SI display units: flow m³\/h, head m, pressure kPa, power kW, temperature °C, speed rpm\./); // old: "# SI units in every header."
  for (const unit of note.match(/\d (m³\/h|m³\/s|kPa|Pa|kW|W|°C|m)\b/g)!.map((x) => x.slice(2))) expect(unitsLine, unit).toContain(` ${unit}`);
  expect(unitsLine).toMatch(/^# Columns in SI units, each named in its header \(m3s = m³\/s/);
  expect(unitsLine).not.toMatch(/SI units in every header/);
});
