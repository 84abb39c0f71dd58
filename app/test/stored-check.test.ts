// A recorded field check's stored documents (field_checks.readings_json and result_json) damaged in the database — cut
// off, a reading turned into text, a part of the result missing — used to be read with an unchecked JSON.parse: a 500 on
// the selection's report, the field page, the check's own page, the checks' CSV and the phone's retry for text that was
// not JSON, else numbers shown from whatever was there. Here checks are recorded, one corrupted directly in MariaDB, and
// every reader must answer honestly: the lists and the CSV name the damaged check as unreadable (id, date, what is wrong)
// and show the others as before; its own page says it cannot be read and why, with no numbers; amending it starts from a
// blank form; the phone's retry of it is still answered as already recorded.
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: our product rules (stored-check.ts,
// stored-doc.ts); the fixture's straight-line curve (H = 40 − 1000·Q) is invented (app/test/fieldcheck-fixture.ts).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks } from "@db/schema";
import { fluidAt } from "~/engine";
import type { Viewer } from "~/lib/libraries";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import { SelectionFieldChecks, type SelectionCheckRow } from "~/components/SelectionFieldChecks";
import { SI_UNITS } from "~/lib/shared/units";
import * as selectionPage from "~/routes/selections.$id";
import * as fieldPage from "~/routes/field.selections.$id";
import * as fieldQueue from "~/routes/field.selections.$id.checks";
import * as fieldCsv from "~/routes/field.selections.$id.export-csv";
import * as checkPage from "~/routes/field.checks.$id";
import { call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
const RHO20 = fluidAt({ kind: "water" }, 20).density;
/** 28 m at 0.012 m³/s: on the fixture's curve (40 − 1000 × 0.012 = 28 m), so the sound check passes. */
const FIELDS = fieldsForHead(28, RHO20, { flow: "0.012" });
const parsed = parseCheckFields(FIELDS, { kind: "water" });
if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
});

type Stored = { readingsJson: string; resultJson: string };
type Corruption = { name: string; corrupt: (s: Stored) => Partial<Stored>; label: string; message: RegExp; stored: string | null };
/** Each corruption and the place it must be named by (stored-check.ts) with what must be said (stored-doc.ts). */
const CASES: Corruption[] = [
  { name: "its result cut off (not JSON)", corrupt: (s) => ({ resultJson: s.resultJson.slice(0, 300) }), label: "the stored result", message: /^Is not valid JSON/, stored: null },
  {
    name: "a reading turned into text",
    corrupt: (s) => {
      const r = JSON.parse(s.readingsJson);
      return { readingsJson: JSON.stringify({ ...r, readings: { ...r.readings, suction: { ...r.readings.suction, pressure: "350 kPa" } } }) };
    },
    label: "readings, suction gauge, pressure",
    message: /^Should be a number\.$/,
    stored: '"350 kPa"',
  },
  {
    name: "the delivered point missing from its result",
    corrupt: (s) => {
      const { delivered: _d, ...rest } = JSON.parse(s.resultJson);
      return { resultJson: JSON.stringify(rest) };
    },
    label: "result, delivered point",
    message: /^Missing from the stored document\.$/,
    stored: null,
  },
];

describe.each(CASES)("a recorded check with $name", (c) => {
  let s: { selectionId: number; sound: number; damaged: number; clientId: string };
  beforeAll(async () => {
    const sel = await storeSelection(m.workspaceId, m.userId, undefined, `Checks (${c.name})`);
    const record = (clientId: string | null) => recordFieldCheck(v, sel.selectionId, { readings: parsed.readings, fields: parsed.fields, notes: "", gradeId: "2B", clientId }, [], { notify: false });
    const sound = (await record(null)).id;
    const clientId = `damaged-${sel.selectionId}-check`;
    const damaged = (await record(clientId)).id;
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, damaged));
    await db().update(fieldChecks).set(c.corrupt(row)).where(eq(fieldChecks.id, damaged));
    s = { selectionId: sel.selectionId, sound, damaged, clientId };
  });
  const get = (fn: unknown, path: string, id = s.selectionId) => call(fn as never, { path, params: { id: String(id) }, cookie: m.cookie });

  test("the selection's report lists it as unreadable, with where, beside the sound check shown as before (was: a 500, or numbers from the damaged record)", async () => {
    const r = await get(selectionPage.loader, `/selections/${s.selectionId}`);
    expect(r.status).toBe(200);
    const rows = (r.body as { fieldChecks: SelectionCheckRow[] }).fieldChecks;
    expect(rows.map((x) => [x.id, x.readable])).toEqual([[s.damaged, false], [s.sound, true]]); // newest first, as before
    const [bad, good] = rows;
    expect(bad.readable ? "" : bad.unreadable).toMatch(/^Its stored record cannot be read \(\d+ problems?: /);
    expect(bad.readable ? "" : bad.unreadable).toContain(c.label);
    expect(good.readable && [good.flow, good.head, good.verdict]).toEqual([0.012, expect.closeTo(28, 9), "pass"]);
    const html = renderToString(createElement(SelectionFieldChecks, { checks: rows, unitSystem: SI_UNITS, selectionId: s.selectionId })).replace(/<!-- -->/g, "");
    expect(html).toContain(`Check ${s.damaged}.</strong> Its stored record cannot be read (`);
    expect(html).toContain(c.label);
    expect(html).toContain("within tolerance"); // the sound check's verdict
  });

  test("the field page's history lists it as unreadable; the other as before (was: a 500, or numbers from the damaged record)", async () => {
    const r = await get(fieldPage.loader, `/field/selections/${s.selectionId}`);
    expect(r.status).toBe(200);
    const history = (r.body as { history: ({ id: number; readable: boolean; unreadable?: string; verdict?: string })[] }).history;
    expect(history.map((x) => [x.id, x.readable, x.verdict])).toEqual([[s.damaged, false, undefined], [s.sound, true, "pass"]]);
    expect(history[0].unreadable).toContain(c.label);
  });

  test("the checks' CSV keeps the sound check's row and names the damaged one in a comment line, with what is wrong (was: a 500, or a row from the damaged record)", async () => {
    const r = await get(fieldCsv.loader, `/field/selections/${s.selectionId}/export.csv`);
    expect(r.status).toBe(200);
    const lines = String(r.body).trim().split("\r\n");
    expect(lines[2]).toMatch(/^"?# verdict: pass when either arm of the grade's tolerance cross is met/);
    const note = lines[3].startsWith('"') ? lines[3].slice(1, -1).replace(/""/g, '"') : lines[3]; // one cell (a CSV cell doubles its quotes)
    expect(note).toMatch(new RegExp(`^# check ${s.damaged} \\(chain ${s.damaged}, version 1, recorded \\d{4}-\\d\\d-\\d\\dT[^)]*\\) cannot be read, so it has no row below: 1 problem in its stored record — `));
    const line = note.slice(note.indexOf(" — ") + 3);
    const stored = c.stored ? ` (stored: ${c.stored})` : "";
    expect(line.startsWith(`${c.label}: `) && line.endsWith(stored), line).toBe(true);
    expect(line.slice(c.label.length + 2, line.length - stored.length)).toMatch(c.message);
    expect(lines[4]).toMatch(/^check_id,chain_id,version/);
    expect(lines.slice(5).map((l) => l.split(",")[0])).toEqual([String(s.sound)]);
    expect(String(r.body)).not.toContain("⟦");
  });

  test("its own page says it cannot be read and what is wrong, with no numbers; the sound check's page is as before (was: a 500, or the damaged numbers drawn)", async () => {
    const r = await get(checkPage.loader, `/field/checks/${s.damaged}`, s.damaged);
    expect(r.status).toBe(200);
    const body = r.body as { readable: boolean; problems: { label: string; message: string; stored: string | null }[]; problemCount: number; check: { id: number } };
    expect(body.readable).toBe(false);
    const p = body.problems.find((x) => x.label === c.label);
    expect(p?.message ?? JSON.stringify(body.problems)).toMatch(c.message);
    expect(p?.stored ?? null).toBe(c.stored);
    const html = renderPage("/field/checks/:id", checkPage.default, `/field/checks/${s.damaged}`, body).replace(/<!-- -->/g, "");
    expect(html).toContain("This check cannot be read: its stored record does not pass the checks");
    expect(html).toContain(c.label);
    expect(html).toContain(`Field check ${s.damaged}`);
    expect(html).not.toContain("Delivered flow");
    expect(html).not.toContain("Total dynamic head");
    const ok = await get(checkPage.loader, `/field/checks/${s.sound}`, s.sound);
    expect(ok.status).toBe(200);
    expect((ok.body as { readable: boolean; result: { delivered: { flow: number } } }).result.delivered.flow).toBe(0.012);
  });

  test("amending it starts from a blank form and says why (was: a 500, or the damaged readings filled in)", async () => {
    const r = await get(fieldPage.loader, `/field/selections/${s.selectionId}?amend=${s.damaged}`);
    expect(r.status).toBe(200);
    const body = r.body as { amends: { id: number; unreadable: boolean }; fields: Record<string, string> };
    expect(body.amends).toMatchObject({ id: s.damaged, unreadable: true });
    expect([body.fields.sPressure, body.fields.dPressure, body.fields.flow]).toEqual(["", "", ""]); // blankFields: nothing typed
    const sound = await get(fieldPage.loader, `/field/selections/${s.selectionId}?amend=${s.sound}`);
    expect((sound.body as { amends: { unreadable: boolean }; fields: Record<string, string> }).amends.unreadable).toBe(false);
    expect((sound.body as { fields: Record<string, string> }).fields.dPressure).toBe(FIELDS.dPressure); // control: a sound check fills the form
  });

  test("the phone's retry of it is answered as already recorded, nothing recorded twice (was: a 500 the queue would retry for ever, when its result was damaged)", async () => {
    const form = new FormData();
    for (const [k, x] of Object.entries({ ...FIELDS, clientId: s.clientId, pageWorkspaceId: String(m.workspaceId) })) form.set(k, x);
    const r = await call(fieldQueue.action as never, { path: `/field/selections/${s.selectionId}/checks`, params: { id: String(s.selectionId) }, cookie: m.cookie, body: form });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ id: s.damaged, duplicate: true });
    expect((await db().select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.selectionId, s.selectionId))).map((x) => x.id).sort()).toEqual([s.sound, s.damaged].sort());
  });
});
