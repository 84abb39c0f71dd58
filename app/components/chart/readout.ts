/**
 * Values of every curve at one flow (for the crosshair readout and the table view).
 * Pure; works in display units on a {@link ChartModel}.
 */
import { interpolateAt } from "./curves.ts";
import { formatKindValue, formatNpshaValue, formatValue } from "./format.ts";
import { pumpSeries, type ChartModel, type PanelKind } from "./model.ts";
import { powerHeading } from "./power-basis.ts";

export interface ReadoutRow {
  key: string;
  label: string;
  color: string;
  dashed: boolean;
  badge?: number;
  /** Value per panel kind at the flow; null = outside the curve (shown as "—"); undefined = no column. */
  values: Partial<Record<PanelKind, number | null>>;
  /** System band as "low–high" text in the head column. */
  headText?: string;
}

/** Rows of the readout at a display flow; pumps in `hidden` are left out. */
export function readoutRows(model: ChartModel, flow: number, hidden: ReadonlySet<string> = new Set()): ReadoutRow[] {
  const kinds = model.panels.map((p) => p.kind);
  const rows: ReadoutRow[] = [];
  if (model.system) {
    if (model.system.design.length > 0) {
      rows.push({
        key: "system",
        label: "System",
        color: "#1e293b",
        dashed: false,
        values: { head: interpolateAt(model.system.design, flow) },
      });
    }
    if (model.system.band.length > 0) {
      const lo = interpolateAt(
        model.system.band.map((b) => ({ flow: b.flow, y: b.y0 })),
        flow,
      );
      const hi = interpolateAt(
        model.system.band.map((b) => ({ flow: b.flow, y: b.y1 })),
        flow,
      );
      rows.push({
        key: "band",
        label: "System band",
        color: "#94a3b8",
        dashed: false,
        values: {},
        headText: lo === null || hi === null ? "—" : `${formatValue(lo)}–${formatValue(hi)}`,
      });
    }
  }
  for (const p of model.pumps) {
    if (hidden.has(p.id)) continue;
    const values: ReadoutRow["values"] = {};
    for (const k of kinds) {
      const s = pumpSeries(p, k);
      values[k] = s.length > 0 ? interpolateAt(s, flow) : null;
    }
    rows.push({ key: `pump-${p.id}`, label: p.label, color: p.color, dashed: p.adjusted, badge: p.badge, values });
  }
  if (model.npsha.length > 0 && kinds.includes("npsh")) {
    rows.push({
      key: "npsha",
      label: "NPSHa (aged pipe)",
      color: "#1e293b",
      dashed: true,
      values: { npsh: interpolateAt(model.npsha, flow) },
    });
  }
  return rows;
}

/**
 * What the readout's power column is for, when a shown curve is of several duty pumps together (their power summed):
 * "P, 2 duty pumps together (kW)", or by curve when the shown curves differ; null when every shown power curve is one
 * pump's (the column title "P kW" says it all) or no power panel is drawn. The power panel's title says the same for
 * every curve drawn; this follows the curves the readout shows (hidden ones left out).
 */
export function readoutPowerNote(model: ChartModel, hidden: ReadonlySet<string> = new Set()): string | null {
  if (!model.panels.some((p) => p.kind === "power")) return null;
  const shown = model.pumps.filter((p) => !hidden.has(p.id)).map((p) => ({ badge: p.badge, power: pumpSeries(p, "power"), powerBasis: p.powerBasis }));
  if (!shown.some((p) => p.power.length > 0 && p.powerBasis)) return null;
  return powerHeading("P", model.units.power.label, shown);
}

/** One-line text of the readout, for the screen-reader live region. */
export function readoutText(model: ChartModel, flow: number, hidden: ReadonlySet<string> = new Set()): string {
  const u = model.units;
  const unitOf: Record<PanelKind, string> = {
    head: u.head.label,
    efficiency: "%",
    power: u.power.label,
    npsh: u.npsh.label,
  };
  const nameOf: Record<PanelKind, string> = { head: "head", efficiency: "efficiency", power: "power", npsh: "NPSH" };
  const parts = readoutRows(model, flow, hidden).map((r) => {
    if (r.headText !== undefined) return `${r.label} ${r.headText} ${u.head.label}`;
    const vals = (Object.keys(r.values) as PanelKind[])
      .filter((k) => r.values[k] !== undefined)
      .map((k) => `${nameOf[k]} ${r.key === "npsha" ? formatNpshaValue(r.values[k]) : formatKindValue(k, r.values[k])}${r.values[k] == null ? "" : " " + unitOf[k]}`);
    return `${r.label}: ${vals.join(", ")}`;
  });
  const note = readoutPowerNote(model, hidden);
  return `Flow ${formatValue(flow)} ${u.flow.label}. ${parts.join(". ")}.${note ? ` ${note}.` : ""}`;
}
