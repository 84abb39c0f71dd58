// The curve tracer (issue 20): load the picture (a PDF page through pdf.js, or a PNG/JPEG), calibrate
// the flow axis once and each panel's vertical axis, trace curves by clicking or by colour, see them
// drawn back as the engine will interpolate them, export our CSV or send it to the import checks.
import { useEffect, useMemo, useState } from "react";
import { Form } from "react-router";
import { colourAt, colourMask, engineSmooth, toPixel, traceIsland, traceMask, type Box, type Px, type Rgb } from "~/lib/tracer";
import { loadImage, loadPdfPage, type Picture } from "./load-picture";
import { PictureCanvas, type Selection, type Tool } from "./PictureCanvas";
import { AxesEditor, CurvesEditor } from "./Sidebar";
import { PeakNotice } from "./PeakNotice";
import { curveProblems, curveWarnings, importBlock } from "./curve-checks";
import { NoSpeedNotice } from "./NoSpeedNotice";
import { calibrations, csvOf, initialState, keptPoints, takeIsland, unreadPeaks, type TracerState } from "./model";
import { peakNote } from "~/lib/tracer/peak";

const TOOLS: [Tool, string][] = [
  ["xref", "Flow axis point"],
  ["yref", "Vertical axis point"],
  ["point", "Add points"],
  ["move", "Move / delete"],
  ["colour", "Follow a colour"],
  ["box", "Draw the trace box"],
  ["pan", "Pan"],
];

export function TracerWorkbench(props: { src: string; type: string; filename: string; units: { flow: string; head: string } }) {
  const isPdf = props.type === "application/pdf";
  const [page, setPage] = useState(1);
  const [renderScale, setRenderScale] = useState(1.5);
  const [picture, setPicture] = useState<Picture | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [s, set] = useState<TracerState>(() => initialState(props.units));
  const [tool, setTool] = useState<Tool>("xref");
  const [selected, setSelected] = useState<Selection>(null);
  const [colour, setColour] = useState<{ rgb: Rgb; seed: Px } | null>(null);
  const [tolerance, setTolerance] = useState(80);
  const [box, setBox] = useState<Box | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  useEffect(() => {
    let live = true;
    setLoadError(null);
    (isPdf ? loadPdfPage(props.src, page, renderScale) : loadImage(props.src))
      .then((p) => live && setPicture(p))
      .catch((e: unknown) => live && setLoadError(e instanceof Error ? e.message : String(e)));
    return () => {
      live = false;
    };
  }, [props.src, isPdf, page, renderScale]);

  const cals = useMemo(() => calibrations(s), [s]);
  const active = s.curves.find((c) => c.id === s.activeCurve) ?? s.curves[0];
  const whole: Box | null = picture ? { u0: 0, v0: 0, u1: picture.width - 1, v1: picture.height - 1 } : null;
  const mask = useMemo(() => (picture && colour && tool === "colour" ? colourMask(picture, colour.rgb, tolerance, box ?? whole!) : null), [picture, colour, tolerance, box, tool]); // eslint-disable-line react-hooks/exhaustive-deps
  const csv = useMemo(() => csvOf(s, cals), [s, cals]);
  const rows = csv.trim().split("\n").length - 1;
  // Curves the CSV would lose or the importer refuse (curve-checks.ts): import and export wait for them.
  const problems = useMemo(() => curveProblems(s, cals), [s, cals]);
  const blockedWhy = useMemo(() => importBlock(s, cals), [s, cals]);
  const peaks = useMemo(() => unreadPeaks(s, cals), [s, cals]);
  const noSpeed = useMemo(() => curveWarnings(s, cals, problems), [s, cals, problems]);
  const blocked = rows === 0 || blockedWhy !== null;

  const overlay = useMemo(() => {
    const refs = [
      ...s.xRefs.map((r) => ({ p: { u: r.u, v: r.v }, axis: "x" as const, label: Number.isFinite(r.value) ? String(r.value) : "?" })),
      ...(s.panels.find((p) => p.id === s.activePanel)?.refs ?? []).map((r) => ({ p: { u: r.u, v: r.v }, axis: "y" as const, label: Number.isFinite(r.value) ? String(r.value) : "?" })),
    ];
    const curves = s.curves.map((c) => {
      const cal = cals.get(c.panelId);
      let smooth: Px[] = [];
      if (cal && typeof cal !== "string") {
        smooth = c.kind === "contour" ? c.points : engineSmooth(keptPoints(c, cals, s.pointsPerCurve), 120).map((d) => toPixel(cal, d.x, d.y)).filter((p): p is Px => p !== null);
      }
      return { id: c.id, points: c.points, smooth, active: c.id === s.activeCurve, closed: c.kind === "contour" && c.closed === true };
    });
    return { refs, curves, mask, box };
  }, [s, cals, mask, box]);

  const setPoints = (id: number, f: (pts: Px[]) => Px[]) => set((x) => ({ ...x, curves: x.curves.map((c) => (c.id === id ? { ...c, points: f(c.points) } : c)) }));

  const onClick = (p: Px) => {
    if (!picture) return;
    if (tool === "xref") set((x) => ({ ...x, xRefs: [...x.xRefs, { ...p, value: NaN }] }));
    else if (tool === "yref") set((x) => ({ ...x, panels: x.panels.map((q) => (q.id === x.activePanel ? { ...q, refs: [...q.refs, { ...p, value: NaN }] } : q)) }));
    else if (tool === "point") setPoints(active.id, (pts) => [...pts, p]);
    else if (tool === "colour") {
      setColour({ rgb: colourAt(picture, p), seed: p });
      setMessage(null);
    }
  };

  const trace = () => {
    if (!picture || !colour || !mask) return;
    const cal = cals.get(active.panelId);
    if (!cal || typeof cal === "string") {
      setMessage("Calibrate this curve's panel first (two clicks on each axis, with their values).");
      return;
    }
    const b = box ?? whole!;
    const pts = active.kind === "contour" ? traceIsland(mask, picture, b, 160) : traceMask(mask, picture, cal, b, { seed: colour.seed, maxJump: 12 * renderScale });
    // The island tracer's outline is a closed loop; a line clicked by hand stays open unless the user closes it.
    if (active.kind === "contour") set((x) => ({ ...x, curves: x.curves.map((c) => (c.id === active.id ? takeIsland(c, pts) : c)) }));
    else setPoints(active.id, () => pts);
    setMessage(pts.length ? `${pts.length} points taken; move or delete any that missed, or trace again.` : "No pixels of that colour in the box: raise the tolerance or pick again.");
  };

  const download = () => {
    const url = URL.createObjectURL(new Blob([csv], { type: "text/csv" }));
    const a = document.createElement("a");
    a.href = url;
    a.download = `traced-${props.filename.replace(/\.[a-z0-9]+$/i, "")}${isPdf ? `-p${page}` : ""}.csv`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  };

  return (
    <div className="space-y-4" data-testid="tracer" data-ready={picture ? "yes" : "no"}>
      {isPdf ? (
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <label className="flex items-center gap-2">
            Page
            <input type="number" min={1} max={picture?.pages ?? 1} value={page} className="field w-20" data-testid="pdf-page" onChange={(e) => setPage(Math.max(1, Number(e.target.value) || 1))} />
            {picture ? <span className="text-slate-500">of {picture.pages}</span> : null}
          </label>
          <label className="flex items-center gap-2">
            Rendered at
            <select className="field w-auto" value={renderScale} data-testid="render-scale" onChange={(e) => setRenderScale(Number(e.target.value))}>
              {[1, 1.5, 2, 3].map((x) => <option key={x} value={x}>{x} px per point</option>)}
            </select>
          </label>
        </div>
      ) : null}
      {loadError ? <p className="text-sm text-fail" role="alert">{loadError}</p> : null}
      <div className="flex flex-wrap gap-1" role="toolbar" aria-label="Tracer tools">
        {TOOLS.map(([t, label]) => (
          <button key={t} type="button" className={t === tool ? "btn" : "btn-quiet"} aria-pressed={t === tool} data-testid={`tool-${t}`} onClick={() => setTool(t)}>
            {label}
          </button>
        ))}
      </div>
      {tool === "colour" ? (
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <span>Click the curve to pick its colour{colour ? ":" : "."}</span>
          {colour ? <span className="inline-block h-5 w-8 rounded border" style={{ background: `rgb(${colour.rgb.join(",")})` }} data-testid="picked-colour" /> : null}
          <label className="flex items-center gap-2">
            Tolerance
            <input type="range" min={10} max={200} value={tolerance} onChange={(e) => setTolerance(Number(e.target.value))} />
          </label>
          <span className="text-slate-500">{box ? "restricted to the box" : "whole picture (draw a box to restrict)"}</span>
          <button type="button" className="btn" disabled={!colour} data-testid="trace-colour" onClick={trace}>
            Take the highlighted pixels
          </button>
        </div>
      ) : null}
      {message ? <p className="text-sm" role="status">{message}</p> : null}
      <div className="grid gap-4 xl:grid-cols-[auto_1fr]">
        <div className="overflow-auto">
          {picture ? (
            <PictureCanvas
              picture={picture}
              tool={tool}
              overlay={overlay}
              selected={selected}
              onSelect={setSelected}
              onClick={onClick}
              onMovePoint={(id, i, p) => setPoints(id, (pts) => pts.map((q, j) => (j === i ? p : q)))}
              onDeletePoint={(id, i) => setPoints(id, (pts) => pts.filter((_, j) => j !== i))}
              onBox={setBox}
            />
          ) : (
            <p className="text-sm text-slate-500">{loadError ? "" : "Loading the picture…"}</p>
          )}
        </div>
        <div className="space-y-4">
          <AxesEditor s={s} cals={cals} set={set} />
          <CurvesEditor s={s} set={set} problems={problems} />
        </div>
      </div>
      <section className="panel space-y-2 text-sm">
        <h2 className="font-semibold">3 · Into the library</h2>
        <div className="flex flex-wrap items-center gap-3">
          <label className="flex items-center gap-2">
            Model
            <input className="field w-48" data-testid="trace-model" value={s.model} onChange={(e) => set((x) => ({ ...x, model: e.target.value.slice(0, 160) }))} />
          </label>
          <label className="flex items-center gap-2">
            Points per curve
            <input type="number" min={3} max={60} className="field w-20" value={s.pointsPerCurve} onChange={(e) => set((x) => ({ ...x, pointsPerCurve: Math.min(60, Math.max(3, Number(e.target.value) || 15)) }))} />
          </label>
        </div>
        <NoSpeedNotice warnings={noSpeed} />
        <PeakNotice peaks={peaks} flowUnit={s.flowUnit} onTake={(id, taken) => set((x) => ({ ...x, curves: x.curves.map((c) => (c.id === id ? { ...c, peakAtMidpoint: taken } : c)) }))} />
        <textarea readOnly className="field h-32 w-full font-mono text-xs" value={csv} aria-label="Traced points as CSV" data-testid="traced-csv" />
        {blockedWhy ? (
          <p className="text-sm text-fail" role="alert" data-testid="import-blocked">
            {blockedWhy}
          </p>
        ) : null}
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn-quiet" disabled={blocked} onClick={download}>
            Export the traced points (CSV)
          </button>
          <Form method="post">
            <input type="hidden" name="intent" value="import" />
            <input type="hidden" name="csv" value={csv} />
            <input type="hidden" name="note" value={peakNote(peaks, s.flowUnit)} />
            {isPdf ? <input type="hidden" name="page" value={page} /> : null}
            <button type="submit" className="btn" disabled={blocked} data-testid="trace-import">
              Check and import ({rows} rows)
            </button>
          </Form>
        </div>
        <p className="text-xs text-slate-500">
          The points go through the same checks and report as an uploaded CSV; the revision records “traced from {props.filename}
          {isPdf ? `, page ${page}` : ""}”.
        </p>
      </section>
    </div>
  );
}
