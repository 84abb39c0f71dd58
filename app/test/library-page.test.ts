// The library page's markup, rendered on the server from loader data (no database): each curve's
// label is written once in its point table, and the table keeps its accessible name.
import { describe, expect, it } from "vitest";
import LibraryPage, { type loader } from "~/routes/libraries.$id";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { plainHtml, renderPage } from "./render-page";

// Two invented points of one curve (SI as stored: m³/s, m, fraction, W, m).
const points = [
  { flow: 0.001, head: 30, efficiency: 0.5, power: 1000, npshr: 2 },
  { flow: 0.01, head: 20, efficiency: 0.7, power: 2000, npshr: 3 },
];
const data = {
  lib: { id: 1, name: "Test library", description: "", visibility: "workspace", owner: "Owner", access: "owner" },
  locked: false,
  writer: false,
  canPublish: false,
  unitSystem: SI_UNITS,
  filters: { q: "", type: "", size: "", speed: "", flow: "", head: "", sort: "name" },
  paging: { page: 1, pages: 1, pageSize: 50, total: 1, first: 0 },
  modelMissing: null,
  models: [{ id: 5, name: "Model X", type: "", size: "", curveCount: 2, flowMax: 0.01, headMax: 30, speeds: [2900] }],
  modelId: 5,
  modelName: "Model X",
  curves: [0.25, 0.2].map((impellerDiameter, i) => ({ id: 9 + i, speed: 2900, impellerDiameter, minFlow: null as number | null, points })),
  revisions: [],
  pending: [],
  imported: "",
  imports: [],
  importId: 0,
  refreshHref: "/libraries/1",
} satisfies Awaited<ReturnType<typeof loader>>; // the loader's own shape: a field it adds must be added here

function render(d: typeof data = data): string {
  return renderPage("/libraries/:id", LibraryPage, "/libraries/1", d);
}
const count = (s: string, needle: string) => s.split(needle).length - 1;
const text = (s: string) => s.replace(/<[^>]*>/g, "").replace(/&amp;/g, "&");

describe("library page: point tables", () => {
  // 0.25 m = 250 mm, 0.2 m = 200 mm (SI diameters in mm: the app's preset).
  const labels = ["2900 rpm · Ø250 mm", "2900 rpm · Ø200 mm"];
  it("writes each curve's label once in its point table, and names the table by model and curve", () => {
    const html = render();
    const start = html.indexOf("Point tables of");
    expect(start, "the point tables are on the page").toBeGreaterThan(0);
    const tables = html.slice(start, html.indexOf("</details>", start)).split("<table").slice(1);
    expect(tables).toHaveLength(2);
    tables.forEach((t, i) => {
      expect(count(t, labels[i]), `label of curve ${i + 1} in its table`).toBe(1);
      // The caption names the table (HTML-AAM: a table without aria-label takes its caption as its name).
      expect(t).not.toContain("aria-label");
      const caption = /<caption[^>]*>([\s\S]*?)<\/caption>/.exec(t)?.[1] ?? "";
      expect(text(caption)).toBe(`Points of Model X ${labels[i]}`);
    });
  });

  it("the chart's table view of a library's curves (no system curve) claims no operating point", () => {
    const html = render();
    expect(html).not.toContain("does not meet the system curve");
    expect(html).not.toContain("operating point");
    expect(count(html, labels[0])).toBeGreaterThan(0); // the curve is still named: legend, table view, point table
  });
});

describe("library page: the maker's minimum continuous flow", () => {
  // 12 m³/h on the first curve only (invented); 12 m³/h = 52.8 gpm (1 US gal = 3.785411784 L, NIST SP 811).
  const withFigure = (unitSystem: typeof SI_UNITS) => ({ ...data, unitSystem, curves: data.curves.map((c, i) => ({ ...c, minFlow: i === 0 ? 12 / 3600 : null })) });
  const captions = (markup: string) => {
    const html = plainHtml(markup);
    const tables = html.slice(html.indexOf("Point tables of")).split("<table").slice(1);
    return tables.map((t) => text(/<caption[^>]*>([\s\S]*?)<\/caption>/.exec(t)?.[1] ?? ""));
  };
  it("is shown with the curve that records it, in the reader's units, and only there", () => {
    const si = captions(render(withFigure(SI_UNITS)));
    expect(si[0]).toBe("Points of Model X 2900 rpm · Ø250 mm Maker's minimum continuous flow: 12.0 m³/h");
    expect(si[1]).toBe("Points of Model X 2900 rpm · Ø200 mm");
    expect(captions(render(withFigure(US_UNITS)))[0]).toContain("Maker's minimum continuous flow: 52.8 gpm");
  });
  it("says nothing where no curve records one", () => {
    expect(render()).not.toContain("minimum continuous flow");
  });
});
