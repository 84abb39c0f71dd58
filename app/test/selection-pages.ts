// Tests only: a selection's report and CSV as their own route modules give them (loader data rendered with the page
// component on the server, the CSV loader's text parsed), for tests that read what the engineer sees and downloads.
import { expect } from "vitest";
import Papa from "papaparse";
import SelectionReport, * as selectionPage from "~/routes/selections.$id";
import * as selectionCsv from "~/routes/selections.$id.export-csv";
import { call, type TestMember } from "./harness";
import { renderPage } from "./render-page";

/** Markup as visible text: comments and tags dropped, the usual entities decoded, white space folded. */
export const textOf = (html: string) =>
  html.replace(/<!--.*?-->/g, "").replace(/<[^>]*>/g, " ").replace(/&amp;/g, "&").replace(/&quot;/g, '"').replace(/&#x27;/g, "'").replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/\s+/g, " ").trim();

export type SelectionPages = { html: string; text: string; csv: string[][]; csvText: string };

/** The report (markup and text) and the CSV (rows) of selection `id`, as `m` gets them. */
export async function selectionPages(m: TestMember, id: number): Promise<SelectionPages> {
  const sel = await call(selectionPage.loader as never, { path: `/selections/${id}`, cookie: m.cookie, params: { id: String(id) } });
  expect(sel.status).toBe(200);
  const html = renderPage("/selections/:id", SelectionReport, `/selections/${id}`, sel.body);
  const csv = await call(selectionCsv.loader as never, { path: `/selections/${id}/export.csv`, cookie: m.cookie, params: { id: String(id) } });
  expect(csv.status).toBe(200);
  const csvText = String(csv.body);
  return { html, text: textOf(html), csv: Papa.parse<string[]>(csvText.trim()).data, csvText };
}

/** The text of the figures table's cell in the row labelled `label` (one candidate: the report's table). */
export function figureCell(html: string, label: string): string {
  const m = new RegExp(`<th scope="row"[^>]*>${label.replace(/[/()]/g, "\\$&")}</th><td[^>]*>(.*?)</td>`).exec(html);
  expect(m, label).toBeTruthy();
  return textOf(m![1]);
}

/** The CSV's figures rows by name: [value, unit, basis] as written. */
export function csvFigures(rows: string[][]): Map<string, string[]> {
  return new Map(rows.filter((r) => r[0] === "figures").map((r) => [r[1], r.slice(2)]));
}

/** The header row of the CSV section whose rows start with `section` (the row just above its first row). */
export function csvHeader(rows: string[][], section: string): string[] {
  const i = rows.findIndex((r) => r[0] === section);
  expect(i, section).toBeGreaterThan(0);
  return rows[i - 1];
}
