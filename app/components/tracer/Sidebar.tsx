// The tracer's controls beside the picture: axes and panels (calibration with its residual), and
// the curves (impeller curves and iso-efficiency contours) being traced.
import type { Calibration, Quantity } from "~/lib/tracer";
import { decimalOrNaN as num } from "~/lib/shared/decimal";
import type { Unit } from "~/lib/import";
import { QUANTITY_LABEL, UNITS, cleared, withNewCurve, type Curve, type Panel, type TracerState } from "./model";
import type { CurveProblem } from "./curve-checks";

// num: the forms' strict reader (shared/decimal.ts): blank, junk and an ambiguous 1,500 are NaN (not set yet).
const show = (x: number) => (Number.isFinite(x) ? String(x) : "");

function RefRows(props: { refs: Panel["refs"]; axis: "x" | "y"; testid: string; onValue: (i: number, v: number) => void; onRemove: (i: number) => void }) {
  if (!props.refs.length) return <p className="text-xs text-slate-500">No clicks yet.</p>;
  return (
    <ul className="space-y-1">
      {props.refs.map((r, i) => (
        <li key={i} className="flex items-center gap-2 text-xs">
          <span className="w-24 text-slate-500">
            ({r.u.toFixed(1)}, {r.v.toFixed(1)})
          </span>
          <input
            className="field w-24"
            inputMode="decimal"
            aria-label={`${props.axis === "x" ? "Flow" : "Vertical"} value at click ${i + 1}`}
            data-testid={`${props.testid}-${i}`}
            autoFocus={i === props.refs.length - 1 && !Number.isFinite(r.value)}
            defaultValue={show(r.value)}
            onChange={(e) => props.onValue(i, num(e.target.value))}
          />
          <button type="button" className="text-slate-500 underline" onClick={() => props.onRemove(i)}>
            remove
          </button>
        </li>
      ))}
    </ul>
  );
}

function Residual({ cal }: { cal: Calibration | string | undefined }) {
  if (cal === undefined) return null;
  if (typeof cal === "string") return <p className="text-xs text-amber-700">{cal}</p>;
  const r = cal.residual;
  return (
    <p className="text-xs text-emerald-800" data-testid="residual">
      Calibrated ({r.fullAffine ? "full affine fit" : "axes completed from two clicks each"}, {r.refs} references): residual flow {r.xMaxPct.toFixed(2)} %, vertical{" "}
      {r.yMaxPct.toFixed(2)} % of the span (RMS {r.rmsPct.toFixed(2)} %).
    </p>
  );
}

export function AxesEditor(props: { s: TracerState; cals: Map<number, Calibration | string>; set: (f: (s: TracerState) => TracerState) => void }) {
  const { s, set } = props;
  const setPanel = (id: number, f: (p: Panel) => Panel) => set((x) => ({ ...x, panels: x.panels.map((p) => (p.id === id ? f(p) : p)) }));
  return (
    <section className="panel space-y-3 text-sm">
      <h2 className="font-semibold">1 · Calibrate</h2>
      <p className="text-xs text-slate-500">
        Click two known points on the flow axis and two on the active panel’s vertical axis, and type their values. A tilted or sheared
        scan is read right from these four clicks; three or more clicks per axis (for instance on grid lines at different heights) give a
        full affine fit, and its residual below shows how well they agree.
      </p>
      <div className="space-y-1">
        <div className="flex flex-wrap items-center gap-2">
          <strong>Flow axis</strong>
          <select className="field w-auto" value={s.flowUnit} aria-label="Flow unit" onChange={(e) => set((x) => ({ ...x, flowUnit: e.target.value as Unit }))}>
            {UNITS.flow.map((u) => <option key={u}>{u}</option>)}
          </select>
          <ScaleSelect value={s.flowScale} label="Flow axis scale" onChange={(v) => set((x) => ({ ...x, flowScale: v }))} />
        </div>
        <RefRows
          refs={s.xRefs}
          axis="x"
          testid="xref"
          onValue={(i, v) => set((x) => ({ ...x, xRefs: withValue(x.xRefs, i, v) }))}
          onRemove={(i) => set((x) => ({ ...x, xRefs: x.xRefs.filter((_, j) => j !== i) }))}
        />
      </div>
      {s.panels.map((p) => (
        <div key={p.id} className={`space-y-1 rounded border p-2 ${p.id === s.activePanel ? "border-brand-500" : "border-slate-200"}`}>
          <div className="flex flex-wrap items-center gap-2">
            <label className="flex items-center gap-1">
              <input type="radio" name="active-panel" checked={p.id === s.activePanel} onChange={() => set((x) => ({ ...x, activePanel: p.id }))} />
              <strong>Panel {p.id}</strong>
            </label>
            <select
              className="field w-auto"
              value={p.quantity}
              aria-label={`Panel ${p.id} quantity`}
              onChange={(e) => setPanel(p.id, (q) => ({ ...q, quantity: e.target.value as Quantity, unit: UNITS[e.target.value as Quantity][0] }))}
            >
              {(Object.keys(QUANTITY_LABEL) as Quantity[]).map((q) => <option key={q} value={q}>{QUANTITY_LABEL[q]}</option>)}
            </select>
            <select className="field w-auto" value={p.unit} aria-label={`Panel ${p.id} unit`} onChange={(e) => setPanel(p.id, (q) => ({ ...q, unit: e.target.value as Unit }))}>
              {UNITS[p.quantity].map((u) => <option key={u}>{u}</option>)}
            </select>
            <ScaleSelect value={p.scale} label={`Panel ${p.id} scale`} onChange={(v) => setPanel(p.id, (q) => ({ ...q, scale: v }))} />
          </div>
          <RefRows
            refs={p.refs}
            axis="y"
            testid={`yref-${p.id}`}
            onValue={(i, v) => setPanel(p.id, (q) => ({ ...q, refs: withValue(q.refs, i, v) }))}
            onRemove={(i) => setPanel(p.id, (q) => ({ ...q, refs: q.refs.filter((_, j) => j !== i) }))}
          />
          <Residual cal={props.cals.get(p.id)} />
        </div>
      ))}
      <button
        type="button"
        className="btn-quiet"
        onClick={() => set((x) => {
          const id = Math.max(...x.panels.map((p) => p.id)) + 1;
          return { ...x, panels: [...x.panels, { id, quantity: "efficiency", unit: "%", scale: "linear", refs: [] }], activePanel: id };
        })}
      >
        Add a panel on the same flow axis
      </button>
    </section>
  );
}

export function CurvesEditor(props: { s: TracerState; set: (f: (s: TracerState) => TracerState) => void; problems: CurveProblem[] }) {
  const { s, set } = props;
  const problemOf = new Map(props.problems.map((p) => [p.curveId, p.message]));
  const setCurve = (id: number, f: (c: Curve) => Curve) => set((x) => ({ ...x, curves: x.curves.map((c) => (c.id === id ? f(c) : c)) }));
  const panelName = (id: number) => {
    const p = s.panels.find((q) => q.id === id);
    return p ? `${QUANTITY_LABEL[p.quantity]} (panel ${p.id})` : "—";
  };
  return (
    <section className="panel space-y-2 text-sm">
      <h2 className="font-semibold">2 · Curves</h2>
      <ul className="space-y-2">
        {s.curves.map((c) => (
          <li key={c.id} className={`space-y-1 rounded border p-2 ${c.id === s.activeCurve ? "border-brand-500" : "border-slate-200"}`}>
            <div className="flex flex-wrap items-center gap-2">
              <label className="flex items-center gap-1">
                <input type="radio" name="active-curve" checked={c.id === s.activeCurve} onChange={() => set((x) => ({ ...x, activeCurve: c.id, activePanel: c.panelId }))} />
                <strong>{c.kind === "contour" ? `Contour ${c.id} · ${c.level || "?"} %` : `Curve ${c.id}`}</strong>
              </label>
              <span className="text-slate-500">{panelName(c.panelId)} · {c.points.length} points</span>
              <button type="button" className="text-slate-500 underline" onClick={() => setCurve(c.id, cleared)}>clear</button>
              {s.curves.length > 1 ? (
                <button type="button" className="text-slate-500 underline" onClick={() => set((x) => ({ ...x, curves: x.curves.filter((y) => y.id !== c.id), activeCurve: x.curves.find((y) => y.id !== c.id)!.id }))}>
                  remove
                </button>
              ) : null}
            </div>
            {c.kind === "curve" ? (
              <div className="flex flex-wrap items-center gap-2">
                <label className="flex items-center gap-1">
                  Impeller Ø (mm)
                  <input className="field w-20" inputMode="decimal" data-testid={`impeller-${c.id}`} defaultValue={show(c.impellerMm || NaN)} onChange={(e) => setCurve(c.id, (x) => ({ ...x, impellerMm: num(e.target.value) }))} />
                </label>
                <label className="flex items-center gap-1">
                  Speed (rpm)
                  <input className="field w-20" inputMode="decimal" defaultValue={show(c.speedRpm)} onChange={(e) => setCurve(c.id, (x) => ({ ...x, speedRpm: num(e.target.value) }))} />
                </label>
              </div>
            ) : (
              <div className="flex flex-wrap items-center gap-2">
                <label className="flex items-center gap-1">
                  Efficiency of this contour (%)
                  <input className="field w-20" inputMode="decimal" data-testid={`level-${c.id}`} defaultValue={show(c.level || NaN)} onChange={(e) => setCurve(c.id, (x) => ({ ...x, level: num(e.target.value) }))} />
                </label>
                <label className="flex items-center gap-1" title="An island: the last point joins the first. Leave it open for a line that leaves the chart, or one arm of a contour.">
                  <input type="checkbox" data-testid={`closed-${c.id}`} checked={c.closed === true} onChange={(e) => setCurve(c.id, (x) => ({ ...x, closed: e.target.checked }))} />
                  Closed loop
                </label>
              </div>
            )}
            {problemOf.has(c.id) ? (
              <p className="text-xs text-fail" data-testid={`curve-problem-${c.id}`}>
                {problemOf.get(c.id)}
              </p>
            ) : null}
          </li>
        ))}
      </ul>
      <div className="flex flex-wrap gap-2">
        {(["curve", "contour"] as const).map((kind) => (
          <button
            key={kind}
            type="button"
            className="btn-quiet"
            data-testid={`add-${kind}`}
            onClick={() => set((x) => withNewCurve(x, kind))}
          >
            {kind === "curve" ? "Add a curve on the active panel" : "Add an iso-efficiency contour"}
          </button>
        ))}
      </div>
      <p className="text-xs text-slate-500">
        Curves of one impeller on several panels (head, efficiency, power, NPSHr) share its impeller Ø and speed; each curve is read in its
        own panel’s unit. Efficiency is read from the contours where they cross a head curve when no efficiency curve is traced for that
        impeller. A contour taken with “Follow a colour” is a closed loop; one clicked point by point is open unless “Closed loop” is ticked.
        With no impeller Ø on any curve the CSV has no impeller column. A curve without a Ø is imported without one when the curves next
        to it in the CSV are at another speed; next to a curve of its own speed that has a Ø, the importer refuses it, so the page asks for it.
        A curve without a speed is imported without one, with the importer’s no-speed warning, when the curves next to it in the CSV have
        another Ø; next to a curve that has a speed and its Ø (any Ø, when its own is blank too), the importer refuses it, so the page asks for it.
      </p>
    </section>
  );
}

/** Linear or logarithmic axis. */
function ScaleSelect({ value, label, onChange }: { value: "linear" | "log"; label: string; onChange: (v: "linear" | "log") => void }) {
  return (
    <select className="field w-auto" value={value} aria-label={label} onChange={(e) => onChange(e.target.value as "linear" | "log")}>
      <option value="linear">linear</option>
      <option value="log">logarithmic</option>
    </select>
  );
}

/** The reference list with the i-th reference's value replaced. */
function withValue<R extends { value: V }, V>(refs: R[], i: number, value: V): R[] {
  return refs.map((r, j) => (j === i ? { ...r, value } : r));
}
