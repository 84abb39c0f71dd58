/**
 * The readout as an HTML table under the chart, for the compact layout (phones, short charts,
 * many curves), where a box inside the SVG would hide too much of the plot. Hidden from screen
 * readers: the live region in DutyChart announces the same values.
 */
import { formatKindValue, formatNpshaValue, formatValue } from "./format.ts";
import type { ChartModel } from "./model.ts";
import { readoutPowerNote, readoutRows } from "./readout.ts";
import { Swatch } from "./Swatches.tsx";
import { readoutColumnTitles } from "./Crosshair.tsx";

/** Readout as an HTML table under the chart (compact layout: keeps the small plot clear). */
export function HtmlReadout({ model, flow, hidden }: { model: ChartModel; flow: number | null; hidden: ReadonlySet<string> }) {
  const kinds = model.panels.map((p) => p.kind);
  const u = model.units;
  const rows = readoutRows(model, flow ?? Number.NaN, hidden);
  const hdr = readoutColumnTitles(u);
  const note = readoutPowerNote(model, hidden);
  const td = "px-1 py-0.5 text-right tabular-nums";
  return (
    <div className="mt-1 overflow-x-auto print:hidden" data-readout="html" aria-hidden="true">
      <table className="w-full border-collapse text-xs">
        <thead>
          <tr className="text-slate-600">
            <th className="px-1 py-0.5 text-left font-semibold text-slate-800">
              {flow === null ? "Touch the chart" : `Flow ${formatValue(flow)} ${u.flow.label}`}
            </th>
            {kinds.map((k) => (
              <th key={k} className={td + " font-semibold"}>
                {hdr[k]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className="border-t border-slate-100">
              <td className="px-1 py-0.5 text-left">
                <Swatch color={r.color} dashed={r.dashed} width={16} />{" "}
                {r.badge !== undefined && (
                  <b style={{ color: r.color }}>{r.badge} </b>
                )}
                {r.label}
              </td>
              {kinds.map((k) => (
                <td key={k} className={td}>
                  {k === "head" && r.headText !== undefined
                    ? r.headText
                    : r.values[k] === undefined
                      ? ""
                      : r.key === "npsha" ? formatNpshaValue(r.values[k]) : formatKindValue(k, r.values[k])}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {note && <p className="px-1 text-xs text-slate-600" data-readout="power-note">{note}</p>}
    </div>
  );
}
