// A stored run naming a pipe size its table no longer lists, or a table no longer in the catalogue (old data): the editor
// shows the size and table as stored with the system warning's words, and the form saved unchanged keeps the run as stored
// (table, size name and bore), never dropping the size silently. Through the route's loader (rendered as the server does),
// the form as the page posts it without script, and the route's action; then the stored document read back.
// Check values: the engine's catalogue (pipes.ts: Steel, Schedule 40 lists 1/2 to 24, no "30"; no table "steel-sch30"), the
// warning's words (system-input.ts `sizeNotInCatalogue`), bores invented (0.7 m, 0.1023 m).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { systems } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { createSystem } from "~/lib/projects";
import { runInputWarnings, tableRun, type PipeRunInput, type SystemInput } from "~/lib/projects/hydraulics";
import { boosterInput, demoProjectFixture } from "~/lib/projects/test-kit";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import * as systemPage from "~/routes/systems.$id";
import SystemPageView from "~/routes/systems.$id";
import { call, type TestMember } from "./harness";
import { renderPage } from "./render-page";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
beforeAll(async () => void ({ m, v, projectId } = await demoProjectFixture("Stored size pumps", "Stored sizes")));

const unlisted: PipeRunInput = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 120), nominal: "30", diameter: 0.7 };
const goneTable: PipeRunInput = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 120), pipeTable: "steel-sch30", diameter: 0.1023 };
const CASES = [
  { name: 'a size the table does not list (Schedule 40 "30", 0.7 m)', run: unlisted },
  { name: 'a table no longer in the catalogue ("steel-sch30" 4, 0.1023 m)', run: goneTable },
];

/** The fields a browser posts for a form's HTML without script: inputs (checkboxes when checked), selects' selected option (else the first). */
function posted(formHtml: string): Record<string, string> {
  const out: Record<string, string> = {};
  const attr = (tag: string, a: string) => tag.match(new RegExp(`\\s${a}="([^"]*)"`))?.[1];
  const un = (s: string) => s.replace(/&quot;/g, '"').replace(/&#x27;/g, "'").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&amp;/g, "&");
  for (const [tag] of formHtml.matchAll(/<input\b[^>]*>/g)) {
    const name = attr(tag, "name");
    const type = attr(tag, "type") ?? "text";
    if (!name || ((type === "checkbox" || type === "radio") && !/\schecked=""/.test(tag))) continue;
    out[un(name)] = un(attr(tag, "value") ?? "");
  }
  for (const [, open, body] of formHtml.matchAll(/<select\b([^>]*)>(.*?)<\/select>/gs)) {
    const name = attr(open, "name");
    if (!name) continue;
    const options = [...body.matchAll(/<option\b([^>]*)>/g)].map((o) => o[1]);
    const chosen = options.find((o) => /\sselected=""/.test(o)) ?? options[0];
    out[un(name)] = un(attr(chosen, "value") ?? "");
  }
  return out;
}

async function stored(systemId: number): Promise<SystemInput> {
  const [row] = await db().select().from(systems).where(eq(systems.id, systemId));
  return JSON.parse(row.inputJson);
}

describe.each(CASES)("a stored run with $name", ({ run }) => {
  let systemId = 0;
  let html = "";
  const warning = renderUnits(runInputWarnings({ ...boosterInput(), runs: [run] }).find((w) => w.includes("is used"))!, SI_UNITS);
  beforeAll(async () => {
    systemId = await createSystem(v, projectId, `Old main (${run.nominal})`, { ...boosterInput(), runs: [run] });
    const r = await call(systemPage.loader as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    const data = r.body;
    html = renderPage("/systems/:id", SystemPageView, `/systems/${systemId}`, data);
  });

  test("the editor shows the table and size as stored, with the warning's words beside them (was: the size shown as —)", () => {
    const form = html.match(/<form\b[^>]*aria-label="System inputs"[^>]*>(.*?)<\/form>/s)![1];
    const p = posted(form);
    expect(p["run.0.table"]).toBe(run.pipeTable); // old code, gone table: "" (typed inner diameter)
    expect(p["run.0.nominal"]).toBe(run.nominal); // old code: "" (—)
    expect(html).toContain("not in the catalogue now");
    // The same words as the system warning (each once beside the run, once in the warnings), HTML-escaped as rendered.
    const esc = warning.replace(/&/g, "&amp;").replace(/"/g, "&quot;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
    expect(html.split(esc).length - 1, warning).toBe(2);
  });

  test("the form saved unchanged keeps the run as stored: table, size name and bore (was: refused, or the size dropped)", async () => {
    const form = html.match(/<form\b[^>]*aria-label="System inputs"[^>]*>(.*?)<\/form>/s)![1];
    const a = await call(systemPage.action as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie, form: { ...posted(form), intent: "save" } });
    expect(a.status).toBe(200);
    expect((a.body as { errors: Record<string, string> }).errors).toEqual({});
    const r = (await stored(systemId)).runs[0];
    expect({ pipeTable: r.pipeTable, nominal: r.nominal, diameter: r.diameter }).toEqual({ pipeTable: run.pipeTable, nominal: run.nominal, diameter: run.diameter });
  });
});
