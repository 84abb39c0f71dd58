import { Form } from "react-router";
import { shownFigure } from "~/lib/libraries/min-flow-form";
import type { MinFlowList } from "~/lib/libraries/upload-min-flows";
import { fmtFlow, labelOf, type UnitChoice } from "~/lib/shared/units";
import { Pager } from "./Pager";

/**
 * The maker's minimum continuous flow of each curve of an upload, MIN_FLOW_CURVES_SHOWN a page (`?minflows=N`, the form
 * posts to the page it is on), set or corrected here (a plain form: works without JavaScript). The server writes the changed figures on every row of their curve — in the
 * file's minimum-flow column, or in a column it adds — and keeps the result as a corrected copy beside the original,
 * which it then checks again (lib/libraries/min-flow-form.ts). `mapping`: the mapping the list was made with (JSON).
 */
export function MinFlowEditor({ list, units, mapping, encoding }: { list: MinFlowList; units: UnitChoice; mapping: string; encoding: string }) {
  if (list.rows.length === 0) return null;
  const unit = labelOf(units, "flow");
  return (
    <section className="panel space-y-3" aria-labelledby="min-flow-title">
      <h2 id="min-flow-title" className="text-lg font-semibold">
        Maker's minimum flow per curve
      </h2>
      <p className="text-sm text-slate-700">
        The maker's minimum continuous flow of each curve, as its data sheet gives it: an engineer's pump whose duty puts it below this
        figure fails its verdict. It must lie above zero and below the curve's last published flow; blank means none is recorded.{" "}
        {list.column ? `Read from the column “${list.column.header}”.` : "The file has no such column: saving adds one."}{" "}
        {list.pages > 1 ? `Showing curves ${list.rows[0].n}–${list.rows[list.rows.length - 1].n} of ${list.total}: the others are on the other pages; a save keeps the figures of this page.` : ""}
      </p>
      {list.wide ? (
        <p className="text-sm text-duty-ink">This file has column blocks: each curve's figure is written in its block's column in the file (“Qmin 250mm”), shown here as read.</p>
      ) : null}
      <Form method="post" className="space-y-3">
        <input type="hidden" name="intent" value="min-flow" />
        <input type="hidden" name="base" value={mapping} />
        <input type="hidden" name="encoding" value={encoding} />
        <div className="max-h-[28rem] overflow-auto">
          <table className="w-full text-sm" aria-label="Maker's minimum flow per curve">
            <thead className="sticky top-0 bg-white text-left text-slate-600">
              <tr>
                <th className="py-1 pr-2 font-normal">Curve</th>
                <th className="pr-2 font-normal">Last published flow</th>
                <th className="pr-2 font-normal">Maker's minimum flow ({unit})</th>
              </tr>
            </thead>
            <tbody>
              {list.rows.map((r) => (
                <tr key={r.n} className="border-t border-slate-100">
                  <td className="py-1 pr-2">
                    {r.name}
                    {r.ok ? "" : <span className="text-xs text-fail"> (flagged)</span>}
                  </td>
                  <td className="pr-2">{fmtFlow(units, r.lastFlow)}</td>
                  <td className="pr-2">
                    <input
                      name={`minflow.${r.n}`}
                      defaultValue={shownFigure(r.minFlow, units)}
                      inputMode="decimal"
                      maxLength={40}
                      readOnly={list.wide}
                      aria-label={`Maker's minimum flow of ${r.name} (${unit})`}
                      className="field w-28 px-1 py-0.5"
                      data-testid={`min-flow-input-${r.n}`}
                    />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <Pager paging={list} label="Pages of curves" param="minflows" />
        {list.wide ? null : (
          <button className="btn" name="save" value="1">
            Save the figures as a corrected copy and check again
          </button>
        )}
      </Form>
    </section>
  );
}
