// A recorded field check's page and the selection's list state the grade's power and efficiency limits with their
// numbers, or that they were not judged and why — also for a check stored before they were judged (old result shape) —,
// and the power reading's accuracy: a limit missed as read but met within it is marginal, with the power that meets it.
// Real route modules, guards and MariaDB (app/test/harness.ts). Check values: ISO 9906:2012 grade 1B from memory (power
// +4 %, efficiency −3 %, TOLERANCE_GRADES); the fixture's curve is invented (H = 40 − 1000·Q, 70 % at Q = 0.015 m³/s,
// app/test/fieldcheck-fixture.ts); curve shaft power there ρ·g₀·Q·H/η (hand formula), water at 20 °C through the engine.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks } from "@db/schema";
import { fluidAt, G0 } from "~/engine";
import type { Viewer } from "~/lib/libraries";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import type { SelectionCheckRow } from "~/components/SelectionFieldChecks";
import * as selectionPage from "~/routes/selections.$id";
import * as checkPage from "~/routes/field.checks.$id";
import * as csvRoute from "~/routes/field.selections.$id.export-csv";
import { call, makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const PC = (RHO20 * G0 * 0.015 * 25) / 0.7; // the curve's shaft power at 0.015 m³/s, W (≈ 5.24 kW)
let m: TestMember;
let v: Viewer;
let selectionId = 0;
const ids = { over: 0, none: 0, old: 0, within: 0 };

async function record(extra: Record<string, string>) {
  const p = parseCheckFields(fieldsForHead(25.5, RHO20, { flow: "0.015", gradeId: "1B", ...extra }), { kind: "water" }); // head +2 % of the curve's 25 m
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return (await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "1B" }, [], { notify: false })).id;
}

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  selectionId = (await storeSelection(m.workspaceId, m.userId, undefined, "Power grade")).selectionId;
  ids.over = await record({ powerMode: "input", power: String((1.12 * PC) / 0.9 / 1000), motorEfficiency: "90" }); // shaft power +12 %
  ids.none = await record({});
  ids.within = await record({ powerMode: "input", power: String((1.05 * PC) / 0.9 / 1000), motorEfficiency: "90", powerAccuracy: "2" }); // +5 %, read ±2 %
  // As stored before power and efficiency were judged: the grade without its allowances, no powerGrade.
  ids.old = await record({ powerMode: "input", power: String((1.12 * PC) / 0.9 / 1000), motorEfficiency: "90" });
  const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, ids.old));
  const { powerGrade: _pg, grade, ...rest } = JSON.parse(row.resultJson);
  const oldShape = { ...rest, verdict: "pass", verdictText: "within tolerance", grade: { id: grade.id, flow: grade.flow, head: grade.head, source: grade.source } };
  await db().update(fieldChecks).set({ resultJson: JSON.stringify(oldShape), verdict: "pass" }).where(eq(fieldChecks.id, ids.old));
});

const pageHtml = async (id: number) => (await loadedPage(m, checkPage, "/field/checks/:id", `/field/checks/${id}`, { id: String(id) })).html;

describe("the check's page states the grade's power and efficiency limits", () => {
  test("power +12 % on grade 1B: outside tolerance, and each limit with its rule and numbers", async () => {
    const html = await pageHtml(ids.over);
    expect(html).toContain('data-verdict="fail"');
    expect(html).toContain("Delivered point meets grade 1B on flow and head but misses its power limit (+12.0 % against +4 % allowed)");
    expect(html).toMatch(/Power: shaft 5\.87 kW \(input 6\.5\d kW × motor efficiency 90 %\) vs curve 5\.24 kW: \+12\.0 % &gt; \+4 % allowed — not met\./); // 1.12 × 5.243 = 5.872 kW
    expect(html).toMatch(/Efficiency: pump 63\.\d % \(ρ·g·Q·H \/ shaft power\) vs curve 70\.0 %: −8\.\d % of it &lt; −3 % allowed — not met\./);
    expect(html).toContain("1B: flow −5/+5 %, head −3/+3 %, power ≤ +4 %, efficiency ≥ −3 % of the curve's");
    expect(html).toContain("No power reading accuracy was given, so the power and efficiency limits are judged as read: a limit missed by any margin makes the check a fail.");
    expect(html).toContain("· no reading accuracy given");
    expect(html).not.toContain("⟦");
  });

  test("power +5 % read ±2 %: missed as read, met at a lower power within the accuracy — at the tolerance limit, with that power", async () => {
    const html = await pageHtml(ids.within);
    expect(html).toContain('data-verdict="marginal"');
    expect(html).toContain("· reading accuracy ±2 %"); // as typed (pctAsTyped)
    // 1.05 × 5.243 = 5.505 kW as read; within ±2 %: 5.395 to 5.615 kW (hand calculation), shown to 3 figures; the power meeting the limits is
    // between 5.395 kW (the lowest) and 5.453 kW (+4 %).
    expect(html).toMatch(/Power reading accuracy ±2 % of the reading \(shaft 5\.40 kW to 5\.62 kW\): the limits are missed as read, but within that accuracy a shaft power of 5\.4\d kW \(−[\d.]+ % of the reading\) meets them/);
    // The limit's own line agrees with the verdict (was "… > +4 % allowed — not met."): 1.05/1.04 = 101.0 % of it, 1.05 × 0.98 − 1 = +2.9 %.
    expect(html).toMatch(/Power: shaft 5\.51 kW \(input 6\.1\d kW × motor efficiency 90 %\) vs curve 5\.24 kW: \+5\.0 % &gt; \+4 % allowed as read — met within the meter's ±2 % \(read 101\.0 % of the limit; at the lowest power within it, reading × \(1 − 2 %\), \+2\.9 % ≤ \+4 % allowed\)\./);
    expect(html).not.toContain("not met");
    expect(html).not.toContain("⟦");
  });

  test("no power recorded: the flow/head verdict, and the page says power and efficiency were not judged", async () => {
    const html = await pageHtml(ids.none);
    expect(html).toContain('data-verdict="pass"');
    expect(html).toContain("Power and efficiency were not judged against grade 1B: no power was recorded, so the verdict is on flow and head only.");
  });

  test("a check stored before they were judged still displays, with its verdict as recorded and that power was not judged", async () => {
    const html = await pageHtml(ids.old);
    expect(html).toContain('data-verdict="pass"');
    expect(html).toContain("Power and efficiency were not judged against grade 1B: this check was recorded before a grade's power and efficiency limits were judged, so its verdict is on flow and head only.");
    expect(html).toContain("1B: flow −5/+5 %, head −3/+3 % (ISO 9906");
  });

  test("the selection's list gives each check's power judgement beside its rule", async () => {
    const r = await call(selectionPage.loader as never, { path: `/selections/${selectionId}`, params: { id: String(selectionId) }, cookie: m.cookie });
    const rows = (r.body as { fieldChecks: SelectionCheckRow[] }).fieldChecks;
    const power = Object.fromEntries(rows.map((x) => [x.id, x.readable ? x.power : null]));
    expect(power[ids.over]).toBe("Against grade 1B's power and efficiency limits: shaft power +12.0 % (+4 % allowed, not met), pump efficiency −8.9 % (−3 % allowed, not met); judged as read, no power reading accuracy was given."); // 1.02/1.12 − 1
    expect(power[ids.within]).toMatch(/shaft power \+5\.0 % as read \(\+4 % allowed, met within the meter's ±2 %: read 101\.0 % of the limit; at the lowest power within it, reading × \(1 − 2 %\), \+2\.9 % ≤ \+4 % allowed\), pump efficiency −2\.9 % \(−3 % allowed, met\); met within the power reading's ±2 % at shaft 5\.4\d kW \(power \+[\d.]+ % ≤ \+4 % allowed, efficiency −[\d.]+ % of the curve's ≥ −3 % allowed\), so at the tolerance limit\.$/); // 1.02/1.05 − 1
    expect(power[ids.none]).toMatch(/^Power and efficiency were not judged against grade 1B: no power was recorded/);
    expect(power[ids.old]).toMatch(/^Power and efficiency were not judged against grade 1B: this check was recorded before/);
  });

  test("the history CSV gives each check's power judgement and its numbers, 'not judged' where it was not", async () => {
    const r = await call(csvRoute.loader as never, { path: `/field/selections/${selectionId}/export.csv`, params: { id: String(selectionId) }, cookie: m.cookie });
    const lines = String(r.body).trim().split("\r\n").filter((l) => !/^"?#/.test(l));
    const head = lines[0].split(",");
    const cell = (id: number, name: string) => lines.find((l) => l.startsWith(`${id},`))!.split(",")[head.indexOf(name)];
    expect(cell(ids.over, "power_limits")).toBe("not met");
    expect(Number(cell(ids.over, "power_dev_from_curve"))).toBeCloseTo(0.12, 6); // recorded as +12 % (beforeAll)
    expect(Number(cell(ids.over, "power_allowed_above"))).toBe(0.04); // grade 1B, TOLERANCE_GRADES
    expect(Number(cell(ids.over, "efficiency_dev_from_curve"))).toBeCloseTo(1.02 / 1.12 - 1, 6); // head +2 %, power +12 %
    expect(cell(ids.none, "power_limits")).toBe("not judged");
    expect(cell(ids.none, "shaft_power_w")).toBe("");
    expect(cell(ids.old, "power_limits")).toBe("not judged");
    expect([cell(ids.over, "power_accuracy"), cell(ids.over, "power_limits_within_accuracy")]).toEqual(["", ""]); // none given
    expect([cell(ids.within, "power_limits"), cell(ids.within, "power_accuracy"), cell(ids.within, "power_limits_within_accuracy")]).toEqual(["met within accuracy", "0.02", "met"]); // was "not met" beside the marginal verdict
  });
});
