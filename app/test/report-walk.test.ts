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
import { users, workspaces } from "@db/schema";
import { selectCandidate, systemWorkbench } from "~/lib/projects";
import { demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import { seedDemoProject } from "~/cli/seed";
import { demoSystems } from "~/cli/demo-systems";
import * as sysPage from "~/routes/systems.$id";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { csvFigures, selectionPages, textOf, type SelectionPages } from "./selection-pages";
import { candidateColumns, noSiWords, BAD_WORDS, titlesOf, verdictProblems } from "./report-walk-checks";

afterAll(() => closeDb());

type Walked = { where: string; us: boolean; pages: SelectionPages; systemColumn: Map<string, string>; reportColumn: Map<string, string> };
const walked: Walked[] = [];

beforeAll(async () => {
  const m = await makeMember("admin");
  await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, m.workspaceId));
  const us = await makeMember("admin", m.workspaceId);
  await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, us.userId));
  const v = await viewerOfUser(m.userId);
  for (const f of ["harrow-vell.csv", "nordquay.csv", "tallowmere.csv"]) await demoLibrary(v, f, f);
  for (const d of demoSystems()) {
    const { systemId, candidateIds } = await seedDemoProject(v, d);
    const order = (await systemWorkbench(v, systemId)).candidates.map((c) => c.id);
    const systemPages = new Map<TestMember, string>();
    for (const who of [m, us]) systemPages.set(who, (await loadedPage(who, sysPage, "/systems/:id", `/systems/${systemId}`, { id: String(systemId) })).html);
    for (const c of candidateIds) {
      const id = await selectCandidate(v, c, `Walk ${c}`, "");
      for (const who of [m, us]) {
        const pages = await selectionPages(who, id);
        walked.push({
          where: `${d.system}, candidate ${order.indexOf(c) + 1} (${who === us ? "US" : "SI"})`, us: who === us, pages,
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
      for (const [what, text] of [["report", `${w.pages.text}\n${titlesOf(w.pages.html).join("\n")}`], ["CSV", w.pages.csvText]] as const) {
        for (const m of text.matchAll(BAD_WORDS)) hits.push(`${w.where} ${what}: …${text.slice(Math.max(0, m.index! - 60), m.index! + 30)}…`);
      }
    }
    expect(hits).toEqual([]);
  });

  test("a US-units report carries no SI unit word beside a number (text and tooltips); SI reports are the control", () => {
    const hits: string[] = [];
    let siSeen = 0;
    for (const w of walked) {
      const found = noSiWords(`${w.pages.text}\n${titlesOf(w.pages.html).join("\n")}`);
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
