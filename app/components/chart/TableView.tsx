/**
 * The table view: the chart's numbers as accessible HTML tables (caption, scoped headers) —
 * every curve at about eight flows over the axis, then the duty, operating points and BEPs.
 * Shown under "Table view" on screen and always in print. Numbers as the app's unit-aware formatters print them in the
 * reader's units (format.ts), the duty's flow apart from the flows delivered against it (`dutyFlowText`).
 */
import type { ReactNode } from "react";
import { interpolateAt } from "./curves.ts";
import { formatKindValue, formatNpshaValue, formatValue, numberOf } from "./format.ts";
import { pumpSeries, type ChartModel, type DisplayPump } from "./model.ts";
import { curvePowerHeading, powerHeading } from "./power-basis.ts";

/** The chart's numbers as tables: curves at ~8 flows over the axis, then the marked points. */
export function ChartTables({ model }: { model: ChartModel }) {
  const u = model.units;
  const kinds = model.panels.map((p) => p.kind);
  const flows = model.x.ticks(8).filter((f) => f >= 0 && f <= model.flowMax);
  const colName: Record<string, string> = {
    head: `Head (${u.head.label})`,
    efficiency: "Eff. (%)",
    power: `Power (${u.power.label})`, // one pump's; a curve of several pumps names its basis (curvePowerHeading)
    npsh: `NPSHr (${u.npsh.label})`,
  };
  const hasSystem = Boolean(model.system && model.system.design.length > 0);
  const hasNpsha = model.npsha.length > 0;
  const th = "border-b border-slate-300 px-2 py-1 text-right font-semibold text-slate-700";
  const td = "border-b border-slate-100 px-2 py-0.5 text-right tabular-nums";
  const pumpKinds = (p: DisplayPump) => kinds.filter((k) => pumpSeries(p, k).length > 0);
  // The marked points: the duty, each pump's operating point (or that it misses the system curve: only where there
  // is one, as the legend's opSummary), its BEP. No table when there are none (a library's curves alone).
  const pointRows: ReactNode[] = [];
  if (model.duty)
    pointRows.push(
      <tr key="duty">
        <th className={td + " text-left font-semibold"} scope="row">Duty point (required)</th>
        <td className={td}>{numberOf(model.duty.flowText, u.flow.label)}</td>
        <td className={td}>{numberOf(model.duty.headText, u.head.label)}</td>
        <td className={td}>—</td>
        <td className={td}>—</td>
        <td className={td}>—</td>
      </tr>,
    );
  for (const p of model.pumps) {
    const op = p.operating;
    if (op || model.system)
      pointRows.push(
        <tr key={`${p.id}-op`}>
          <th className={td + " text-left font-semibold"} scope="row">
            {p.badge}. {p.label} — operating point
          </th>
          {op ? (
            <>
              <td className={td}>{formatValue(op.flow)}</td>
              <td className={td}>{formatValue(op.head)}</td>
              <td className={td}>{formatKindValue("efficiency", op.efficiency ?? interpolateAt(p.efficiency, op.flow))}</td>
              <td className={td}>{formatValue(op.power ?? interpolateAt(p.power, op.flow))}</td>
              <td className={td}>{formatValue(op.npshr ?? interpolateAt(p.npshr, op.flow))}</td>
            </>
          ) : (
            <td className={td + " text-left"} colSpan={5}>
              does not meet the system curve
            </td>
          )}
        </tr>,
      );
    if (p.bep)
      pointRows.push(
        <tr key={`${p.id}-bep`}>
          <th className={td + " text-left"} scope="row">
            {p.badge}. {p.label} — BEP
          </th>
          <td className={td}>{formatValue(p.bep.flow)}</td>
          <td className={td}>{formatValue(p.bep.head)}</td>
          <td className={td}>{formatKindValue("efficiency", interpolateAt(p.efficiency, p.bep.flow))}</td>
          <td className={td}>{formatValue(interpolateAt(p.power, p.bep.flow))}</td>
          <td className={td}>{formatValue(interpolateAt(p.npshr, p.bep.flow))}</td>
        </tr>,
      );
  }

  return (
    <div className="mt-2 space-y-3 overflow-x-auto" data-tables="">
      <table className="min-w-full border-collapse text-xs">
        <caption className="py-1 text-left text-sm font-semibold text-slate-700">
          Curve values at selected flows (— outside a curve's range)
        </caption>
        <thead>
          <tr>
            <th className={th} rowSpan={2} scope="col">
              Flow ({u.flow.label})
            </th>
            {hasSystem && (
              <th className={th} rowSpan={2} scope="col">
                System head ({u.head.label})
              </th>
            )}
            {model.pumps.map((p) => (
              <th key={p.id} className={th + " text-center"} colSpan={Math.max(1, pumpKinds(p).length)} scope="colgroup">
                {p.badge}. {p.label}
              </th>
            ))}
            {hasNpsha && (
              <th className={th} rowSpan={2} scope="col">
                NPSHa, aged suction pipe ({u.npsh.label})
              </th>
            )}
          </tr>
          <tr>
            {model.pumps.map((p) =>
              (pumpKinds(p).length ? pumpKinds(p) : (["head"] as const)).map((k) => (
                <th key={`${p.id}-${k}`} className={th} scope="col">
                  {k === "power" ? curvePowerHeading(u.power.label, p) : colName[k]}
                </th>
              )),
            )}
          </tr>
        </thead>
        <tbody>
          {flows.map((f) => (
            <tr key={f}>
              <th className={td + " font-semibold"} scope="row">
                {formatValue(f)}
              </th>
              {hasSystem && <td className={td}>{formatValue(interpolateAt(model.system!.design, f))}</td>}
              {model.pumps.map((p) =>
                (pumpKinds(p).length ? pumpKinds(p) : (["head"] as const)).map((k) => (
                  <td key={`${p.id}-${k}`} className={td}>
                    {formatKindValue(k, interpolateAt(pumpSeries(p, k), f))}
                  </td>
                )),
              )}
              {hasNpsha && <td className={td}>{formatNpshaValue(interpolateAt(model.npsha, f))}</td>}
            </tr>
          ))}
        </tbody>
      </table>

      {pointRows.length > 0 && (
        <table className="min-w-full border-collapse text-xs" data-table="points">
          <caption className="py-1 text-left text-sm font-semibold text-slate-700">Duty, operating points and BEP</caption>
          <thead>
            <tr>
              <th className={th + " text-left"} scope="col">Point</th>
              <th className={th} scope="col">Flow ({u.flow.label})</th>
              <th className={th} scope="col">Head ({u.head.label})</th>
              <th className={th} scope="col">Eff. (%)</th>
              <th className={th} scope="col">{powerHeading("Power", u.power.label, model.pumps)}</th>
              <th className={th} scope="col">NPSHr ({u.npsh.label})</th>
            </tr>
          </thead>
          <tbody>{pointRows}</tbody>
        </table>
      )}
    </div>
  );
}
