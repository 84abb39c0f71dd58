// The curves of an upload with their maker's minimum continuous flow, as the mapping page lists them for the distributor to
// set or correct (components/MinFlowEditor.tsx; the figures it saves go into a corrected copy of the upload:
// min-flow-form.ts). Made in the analysis worker with the rest of the page's summary (upload-analysis.ts): one page of
// MIN_FLOW_CURVES_SHOWN curves (the page asked, `?minflows=N`, clamped by shared/paging.ts), each with its source lines,
// whatever the file's size; every curve of the file is on some page, so each can be corrected. Pure.
import { curveName, type Mapping } from "../import";
import { curveSetsFrom } from "../import/packed";
import { pageOf } from "../shared/paging";
import type { StoredAnalysis } from "./upload-analysis";

/** Curves listed with their figure on one page of the mapping page's list (in the file's order). */
export const MIN_FLOW_CURVES_SHOWN = 50;

/** One curve: its number in the file (1-based, the analysis' order: curve 51 is the first of page 2), name, last published flow and figure (m³/s; null: none), its rows. */
export type MinFlowRow = { n: number; name: string; lastFlow: number | null; minFlow: number | null; ok: boolean; lines: number[] };

export type MinFlowList = {
  rows: MinFlowRow[];
  /** Curves in the file (rows holds the page's, at most MIN_FLOW_CURVES_SHOWN). */
  total: number;
  /** The page shown (1-based) and how many there are. */
  page: number;
  pages: number;
  /** The column mapped to the maker's minimum flow (long layout), or null when none is. */
  column: { index: number; header: string; unit: string } | null;
  /** Column blocks: each curve's figure is in its block's column, edited in the file (the page lists them read only). */
  wide: boolean;
};

/** One page of the analysis' curves with their figures (the first page when none is asked), and where the figure is written in the file. */
export function minFlowList(analysis: Pick<StoredAnalysis, "result" | "mapping">, page?: number | null): MinFlowList {
  const at = pageOf(analysis.result.stats.curveSets, MIN_FLOW_CURVES_SHOWN, page);
  const sets = curveSetsFrom(analysis.result, at.first, MIN_FLOW_CURVES_SHOWN);
  const col = analysis.mapping.layout === "long" ? analysis.mapping.columns.find((c) => c.field === "minflow" && !c.block) : undefined;
  return {
    rows: sets.map((c, i) => ({
      n: at.first + i + 1,
      name: curveName(c.model, c.speed, c.impellerDiameter),
      lastFlow: c.points.length ? c.points[c.points.length - 1].flow : null,
      minFlow: c.minFlow ?? null,
      ok: c.ok,
      lines: c.sourceRows,
    })),
    total: analysis.result.stats.curveSets,
    page: at.page,
    pages: at.pages,
    column: col ? { index: col.index, header: col.header, unit: col.unit ?? "m3/h" } : null,
    wide: analysis.mapping.layout === "wide",
  };
}

/**
 * A saved mapping with the columns it does not list that read as the maker's minimum flow mapped to it (as the file's
 * headers propose them): a column added to the file since the mapping was saved — by the mapping page's editor, or by a
 * distributor's newer export — is read, not left out unseen.
 */
export function withMinFlowColumns(saved: Mapping, suggested: Mapping): Mapping {
  const listed = new Set(saved.columns.map((c) => c.index));
  const added = suggested.columns.filter((c) => c.field === "minflow" && !listed.has(c.index) && (saved.layout === "wide" || !c.block));
  return added.length ? { ...saved, columns: [...saved.columns, ...added].sort((a, b) => a.index - b.index) } : saved;
}
