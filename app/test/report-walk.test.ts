// The selection report as the engineer who signs it reads it, for every demo selection: both demo systems (app/cli/
// demo-systems.ts) set up as the seed sets them up (`seedDemoProject`: the search's best pumps over the three demo
// libraries as candidates), and every candidate selected, read by an SI and a US-units member. Each report (screen and
// printed lines, with its tooltips) is walked for: a verdict without its rule or numbers, a verdict or figure that reads
// otherwise than in the candidates table of the system page (one computation: the same row, the same words), an SI unit
// word in US units, NaN/Infinity/undefined/"null" or a raw quantity token, and the cautions (certified data, local codes,
// a licensed engineer) at its head and foot. The CSV is walked for the same bad words and for the verdict's status and
// qualifiers as the report states them. Check values: the rules as the product states them (engine verdict.ts,
// verdict-motor.ts, verdict-npsh.ts, ReportMethods.tsx; ANSI/HI 9.6.3 POR 70–120 %, common practice); SI unit words as
// the US-units browser walk lists them (e2e/units.spec.ts); the demo data is invented (fixtures/demo).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { outbox, users, workspaces } from "@db/schema";
import { getSelection, selectCandidate, systemWorkbench } from "~/lib/projects";
import { parseCheckFields, VERDICT_TEXT } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import { fluidAt } from "~/engine";
import type { Viewer } from "~/lib/libraries";
import { fieldsForHead } from "./fieldcheck-fixture";
import { demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import { seedDemoProject } from "~/cli/seed";
import { demoSystems } from "~/cli/demo-systems";
import * as sysPage from "~/routes/systems.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { csvFigures, selectionPages, textOf, type SelectionPages } from "./selection-pages";
import { candidateColumns, noSiWords, BAD_WORDS, titlesOf, verdictProblems } from "./report-walk-checks";

afterAll(() => closeDb());

type Walked = { where: string; us: boolean; pages: SelectionPages; systemColumn: Map<string, string>; reportColumn: Map<string, string>; mail: string };

/**
 * A field check recorded on the selection by its engineer, with the e-mail the engineer gets (in the engineer's units): the
 * pump read 4 % under the operating flow at 2 % under its head (invented readings, as the demo check of seed-fieldchecks.ts),
 * water at the system's temperature, the speed the selection runs at; the mail's text.
 */
async function checkWithMail(v: Viewer, email: string, selectionId: number): Promise<string> {
  const f = (await getSelection(v, selectionId)).frozen;
  const op = f.result.operating!;
  const rpm = Math.round(f.pump.speed! * (f.adjustment.method === "speed" ? f.result.ratio ?? 1 : 1));
  const rho = fluidAt({ kind: "water" }, f.system.input.temperatureC).density;
  const p = parseCheckFields(fieldsForHead(op.head * 0.98, rho, { flow: String(op.flow * 0.96), rpm: String(rpm), temperature: String(f.system.input.temperatureC) }), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  await recordFieldCheck(v, selectionId, { readings: p.readings, fields: p.fields, notes: "", gradeId: "2B" }, [], { notify: true });
  const mails = await db().select().from(outbox).where(eq(outbox.toAddress, email));
  return mails.at(-1)!.textBody;
}
const walked: Walked[] = [];

beforeAll(async () => {
  const m = await makeMember("admin");
  await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, m.workspaceId));
  const us = await makeMember("admin", m.workspaceId);
  await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, us.userId));
  const v = await viewerOfUser(m.userId);
  const vUs = await viewerOfUser(us.userId);
  for (const f of ["harrow-vell.csv", "nordquay.csv", "tallowmere.csv"]) await demoLibrary(v, f, f);
  for (const d of demoSystems()) {
    const { systemId, candidateIds } = await seedDemoProject(v, d);
    const order = (await systemWorkbench(v, systemId)).candidates.map((c) => c.id);
    const systemPages = new Map<TestMember, string>();
    for (const who of [m, us]) systemPages.set(who, (await loadedPage(who, sysPage, "/systems/:id", `/systems/${systemId}`, { id: String(systemId) })).html);
    for (const c of candidateIds) {
      // Each reader selects the candidate (the selection's engineer gets the field check's e-mail), records a check, reads the report.
      for (const [who, viewer] of [[m, v], [us, vUs]] as const) {
        const id = await selectCandidate(viewer, c, `Walk ${c}`, "");
        const mail = await checkWithMail(viewer, who.email, id);
        const pages = await selectionPages(who, id);
        walked.push({
          where: `${d.system}, candidate ${order.indexOf(c) + 1} (${who === us ? "US" : "SI"})`, us: who === us, pages, mail,
          systemColumn: candidateColumns(systemPages.get(who)!)[order.indexOf(c)], reportColumn: candidateColumns(pages.html)[0],
        });
      }
    }
  }
}, 300_000);

describe("every demo selection's report, as the engineer who signs it", () => {
  test("the walk saw every demo system's candidates in both unit presets (it is not vacuous)", () => {
    expect(walked.length).toBeGreaterThanOrEqual(2 * 2 * 2); // two systems, at least two candidates each, SI and US
    expect(new Set(walked.map((w) => w.where.split(",")[0])).size).toBe(2);
  });

  test("no NaN, Infinity, undefined, null, [object …] or unrendered quantity token in the report (text and tooltips) or the CSV", () => {
    const hits: string[] = [];
    for (const w of walked) {
      for (const [what, text] of [["report", `${w.pages.text}\n${titlesOf(w.pages.html).join("\n")}`], ["CSV", w.pages.csvText], ["e-mail", w.mail]] as const) {
        for (const m of text.matchAll(BAD_WORDS)) hits.push(`${w.where} ${what}: …${text.slice(Math.max(0, m.index! - 60), m.index! + 30)}…`);
      }
    }
    expect(hits).toEqual([]);
  });

  test("a US-units report carries no SI unit word beside a number (text and tooltips); SI reports are the control", () => {
    const hits: string[] = [];
    let siSeen = 0;
    for (const w of walked) {
      const found = noSiWords(`${w.pages.text}\n${titlesOf(w.pages.html).join("\n")}\n${w.mail}`);
      if (w.us) hits.push(...found.map((h) => `${w.where}: …${h}…`));
      else siSeen += found.length;
    }
    expect(hits).toEqual([]);
    expect(siSeen, "the scan finds SI words in the SI reports").toBeGreaterThan(50);
  });

  test("the cautions: design guidance, the manufacturer's certified data, local codes and a licensed engineer, at the head and the foot", () => {
    for (const w of walked) {
      const n = w.pages.text.split("Verify against the manufacturer's certified data, local codes and a licensed engineer before sizing pumps, pressures or motors.").length - 1;
      expect(n, w.where).toBe(2);
      expect(w.pages.csvText.split("\n")[1], w.where).toMatch(/design guidance; verify against the manufacturer's certified data, local codes and a licensed engineer/);
    }
  });

  test("every figure and verdict of the report's table reads as the candidates table on the system page reads it (one computation)", () => {
    const diffs: string[] = [];
    for (const w of walked) {
      for (const [label, cell] of w.reportColumn) {
        if (label === "Library") continue; // the report names the frozen revision ("… rev. 1"), the system page the library
        const there = w.systemColumn.get(label);
        if (there !== cell) diffs.push(`${w.where} — ${label}:\n  report: ${cell}\n  system: ${there}`);
      }
      for (const [label, cell] of w.systemColumn)
        if (!w.reportColumn.has(label) && !/^(—|none recorded for this curve|)$/.test(cell)) diffs.push(`${w.where} — ${label} on the system page only: ${cell}`);
    }
    expect(diffs).toEqual([]);
    expect(walked.every((w) => w.reportColumn.size > 20)).toBe(true); // control: the table was read
  });

  test("the headline verdict, its qualifiers and every verdict of the figures state their rule and numbers", () => {
    const problems = walked.flatMap((w) => verdictProblems(w.pages.html).map((p) => `${w.where}: ${p}`));
    expect(problems).toEqual([]);
  });

  test("the field check listed on the report and the engineer's e-mail state the check's verdict with its grade's rule and numbers, and the cautions", () => {
    const wrong: string[] = [];
    for (const w of walked) {
      const row = /<table[^>]*aria-label="Field checks of this selection"[^>]*>([\s\S]*?)<\/table>/.exec(w.pages.html)?.[1] ?? "";
      const cells = [...row.matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => textOf(c[1]));
      const verdict = cells[3] ?? "";
      const rule = cells[4] ?? "";
      if (!Object.values(VERDICT_TEXT).some((t) => verdict.startsWith(t))) wrong.push(`${w.where}: report's check verdict "${verdict}"`);
      if (!/grade 2B/.test(rule) || (rule.match(/\d[\d.,]*/g) ?? []).length < 4) wrong.push(`${w.where}: report's check rule without its numbers: "${rule}"`);
      const said = /^Verdict: (.*)\.$/m.exec(w.mail)?.[1];
      if (!said) wrong.push(`${w.where}: e-mail without a verdict line`);
      const judged = /Judged against grade 2B: .*$/m.exec(w.mail)?.[0] ?? "";
      if ((judged.match(/\d[\d.,]*/g) ?? []).length < 4) wrong.push(`${w.where}: e-mail's verdict without its rule and numbers: "${judged}"`);
      if (!w.mail.includes("verify against the manufacturer's certified data, local codes and a licensed engineer")) wrong.push(`${w.where}: e-mail without the caution`);
    }
    expect(wrong).toEqual([]);
    expect(walked[0].mail, "control: the mail was read").toMatch(/recorded a field check on the selection/);
  });

  test("the CSV carries the report's verdict and each of its qualifiers (SI readers: the same words)", () => {
    const wrong: string[] = [];
    for (const w of walked) {
      const fig = csvFigures(w.pages.csv);
      const status = /data-testid="report-verdict" data-status="([^"]+)"/.exec(w.pages.html)?.[1];
      if (fig.get("verdict")?.[0] !== status) wrong.push(`${w.where}: CSV verdict ${fig.get("verdict")?.[0]}, report ${status}`);
      if (w.us) continue;
      for (const [testId, column] of [["npsh", "verdict_npsh"], ["start", "verdict_start"], ["motor", "verdict_motor"], ["staged-npsh", "verdict_staged_npsh"], ["min-flow", "verdict_min_flow"]]) {
        const span = new RegExp(`data-testid="report-verdict-${testId}"[^>]*>([\\s\\S]*?)</span>`).exec(w.pages.html);
        const onReport = span ? textOf(span[1]).replace(/^— /, "") : "";
        if ((fig.get(column)?.[0] ?? "") !== onReport) wrong.push(`${w.where}: ${column} "${fig.get(column)?.[0]}", report "${onReport}"`);
      }
    }
    expect(wrong).toEqual([]);
  });
});
