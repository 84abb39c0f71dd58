// The picture with everything drawn over it: reference clicks, traced points, the smoothed curves as
// the engine will interpolate them, the colour mask preview and the trace box. Zoom (wheel or
// buttons), pan (pan tool or middle button), a magnifier loupe under the cursor, point dragging,
// arrow-key nudging (Shift: ×10) and Delete for the selected point.
import { useEffect, useRef, useState, type KeyboardEvent, type PointerEvent } from "react";
import type { Box, Px } from "~/lib/tracer";
import type { Picture } from "./load-picture";

export type Tool = "xref" | "yref" | "point" | "move" | "colour" | "box" | "pan";
export type Overlay = {
  refs: { p: Px; axis: "x" | "y"; label: string }[];
  curves: { id: number; points: Px[]; smooth: Px[]; active: boolean; closed: boolean }[];
  mask: Uint8Array | null;
  box: Box | null;
};
export type Selection = { curveId: number; index: number } | null;

type View = { scale: number; ox: number; oy: number };
type DragKind = "pan" | "point" | "box" | "click";
const MAX_W = 960, MAX_H = 720;

export function PictureCanvas(props: {
  picture: Picture;
  tool: Tool;
  overlay: Overlay;
  selected: Selection;
  onSelect: (s: Selection) => void;
  onClick: (p: Px) => void;
  onMovePoint: (curveId: number, index: number, p: Px) => void;
  onDeletePoint: (curveId: number, index: number) => void;
  onBox: (b: Box) => void;
}) {
  const { picture, tool, overlay, selected } = props;
  const ref = useRef<HTMLCanvasElement>(null);
  const loupeRef = useRef<HTMLCanvasElement>(null);
  const [view, setView] = useState<View>({ scale: 1, ox: 0, oy: 0 });
  const [hover, setHover] = useState<Px | null>(null);
  const [drag, setDrag] = useState<{ kind: DragKind; start: Px; startView: View; moved: boolean; cur: Px } | null>(null);
  const width = Math.min(MAX_W, picture.width), height = Math.min(MAX_H, picture.height);

  const toImage = (sx: number, sy: number): Px => ({ u: (sx - view.ox) / view.scale, v: (sy - view.oy) / view.scale });
  const toScreen = (p: Px) => ({ x: p.u * view.scale + view.ox, y: p.v * view.scale + view.oy });

  // The mask preview as its own canvas (rebuilt only when the mask changes).
  const maskCanvas = useRef<HTMLCanvasElement | null>(null);
  useEffect(() => {
    if (!overlay.mask) {
      maskCanvas.current = null;
      return;
    }
    const c = document.createElement("canvas");
    c.width = picture.width;
    c.height = picture.height;
    const ctx = c.getContext("2d");
    if (!ctx) return;
    const img = ctx.createImageData(picture.width, picture.height);
    overlay.mask.forEach((w, k) => {
      if (w) img.data.set([255, 0, 170, 150], 4 * k);
    });
    ctx.putImageData(img, 0, 0);
    maskCanvas.current = c;
  }, [overlay.mask, picture]);

  useEffect(() => {
    const ctx = ref.current?.getContext("2d");
    if (!ctx) return;
    ctx.setTransform(1, 0, 0, 1, 0, 0);
    ctx.fillStyle = "#f1f5f9";
    ctx.fillRect(0, 0, width, height);
    ctx.setTransform(view.scale, 0, 0, view.scale, view.ox, view.oy);
    ctx.imageSmoothingEnabled = view.scale < 1;
    ctx.drawImage(picture.canvas, 0, 0);
    if (maskCanvas.current) ctx.drawImage(maskCanvas.current, 0, 0);
    ctx.setTransform(1, 0, 0, 1, 0, 0);
    const line = (pts: Px[], colour: string, w: number, closed = false) => {
      if (pts.length < 2) return;
      ctx.strokeStyle = colour;
      ctx.lineWidth = w;
      ctx.beginPath();
      pts.forEach((p, i) => {
        const s = toScreen(p);
        if (i === 0) ctx.moveTo(s.x, s.y);
        else ctx.lineTo(s.x, s.y);
      });
      if (closed) ctx.closePath();
      ctx.stroke();
    };
    if (overlay.box) {
      const a = toScreen({ u: overlay.box.u0, v: overlay.box.v0 }), b = toScreen({ u: overlay.box.u1, v: overlay.box.v1 });
      ctx.setLineDash([6, 4]);
      ctx.strokeStyle = "#0f766e";
      ctx.lineWidth = 1.5;
      ctx.strokeRect(a.x, a.y, b.x - a.x, b.y - a.y);
      ctx.setLineDash([]);
    }
    for (const c of overlay.curves) {
      line(c.smooth, c.active ? "rgba(234,88,12,0.9)" : "rgba(234,88,12,0.45)", 2, c.closed);
      for (let i = 0; i < c.points.length; i++) {
        const s = toScreen(c.points[i]);
        const isSel = selected?.curveId === c.id && selected.index === i;
        ctx.fillStyle = isSel ? "#dc2626" : c.active ? "#1d4ed8" : "rgba(29,78,216,0.4)";
        ctx.fillRect(s.x - (isSel ? 4 : 2), s.y - (isSel ? 4 : 2), isSel ? 8 : 4, isSel ? 8 : 4);
      }
    }
    for (const r of overlay.refs) {
      const s = toScreen(r.p);
      ctx.strokeStyle = r.axis === "x" ? "#059669" : "#7c3aed";
      ctx.lineWidth = 2;
      ctx.beginPath();
      ctx.moveTo(s.x - 7, s.y);
      ctx.lineTo(s.x + 7, s.y);
      ctx.moveTo(s.x, s.y - 7);
      ctx.lineTo(s.x, s.y + 7);
      ctx.stroke();
      ctx.fillStyle = ctx.strokeStyle;
      ctx.font = "12px sans-serif";
      ctx.fillText(r.label, s.x + 5, s.y - 5);
    }
    if (drag?.kind === "box") {
      const a = toScreen(drag.start), b = toScreen(drag.cur);
      ctx.strokeStyle = "#0f766e";
      ctx.strokeRect(a.x, a.y, b.x - a.x, b.y - a.y);
    }
  });

  // Magnifier loupe: 8× around the cursor with a cross-hair.
  useEffect(() => {
    const ctx = loupeRef.current?.getContext("2d");
    if (!ctx || !hover) return;
    const z = 8, size = 120;
    ctx.imageSmoothingEnabled = false;
    ctx.fillStyle = "#fff";
    ctx.fillRect(0, 0, size, size);
    ctx.drawImage(picture.canvas, hover.u - size / (2 * z), hover.v - size / (2 * z), size / z, size / z, 0, 0, size, size);
    ctx.strokeStyle = "rgba(220,38,38,0.8)";
    ctx.beginPath();
    ctx.moveTo(size / 2, 0);
    ctx.lineTo(size / 2, size);
    ctx.moveTo(0, size / 2);
    ctx.lineTo(size, size / 2);
    ctx.stroke();
  }, [hover, picture]);

  // Wheel zoom about the cursor (a non-passive listener, so the page does not scroll).
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const r = el.getBoundingClientRect();
      const sx = e.clientX - r.left, sy = e.clientY - r.top;
      setView((v) => {
        const scale = Math.min(16, Math.max(0.25, v.scale * (e.deltaY < 0 ? 1.25 : 0.8)));
        return { scale, ox: sx - ((sx - v.ox) * scale) / v.scale, oy: sy - ((sy - v.oy) * scale) / v.scale };
      });
    };
    el.addEventListener("wheel", onWheel, { passive: false });
    return () => el.removeEventListener("wheel", onWheel);
  }, []);

  const at = (e: PointerEvent) => {
    const r = e.currentTarget.getBoundingClientRect();
    return { sx: e.clientX - r.left, sy: e.clientY - r.top };
  };
  const nearest = (p: Px): Selection => {
    let best: Selection = null, bd = 10 / view.scale;
    for (const c of overlay.curves) {
      if (!c.active) continue;
      c.points.forEach((q, i) => {
        const d = Math.hypot(q.u - p.u, q.v - p.v);
        if (d < bd) [best, bd] = [{ curveId: c.id, index: i }, d];
      });
    }
    return best;
  };

  const onPointerDown = (e: PointerEvent<HTMLCanvasElement>) => {
    const { sx, sy } = at(e);
    const p = toImage(sx, sy);
    e.currentTarget.setPointerCapture?.(e.pointerId);
    const kind: DragKind = tool === "pan" || e.button === 1 ? "pan" : tool === "box" ? "box" : tool === "move" ? "point" : "click";
    if (kind === "point") {
      const s = nearest(p);
      props.onSelect(s);
      if (!s) return;
    }
    setDrag({ kind, start: p, startView: view, moved: false, cur: p });
  };
  const onPointerMove = (e: PointerEvent<HTMLCanvasElement>) => {
    const { sx, sy } = at(e);
    const p = toImage(sx, sy);
    setHover(p);
    if (!drag) return;
    const moved = drag.moved || Math.hypot(p.u - drag.start.u, p.v - drag.start.v) * view.scale > 3;
    if (drag.kind === "pan" && moved) {
      // The image point under the cursor at the start stays under the cursor.
      setView({ ...drag.startView, ox: sx - drag.start.u * drag.startView.scale, oy: sy - drag.start.v * drag.startView.scale });
    } else if (drag.kind === "point" && selected && moved) props.onMovePoint(selected.curveId, selected.index, p);
    setDrag({ ...drag, moved, cur: p });
  };
  const onPointerUp = (e: PointerEvent<HTMLCanvasElement>) => {
    const { sx, sy } = at(e);
    const p = toImage(sx, sy);
    const d = drag;
    setDrag(null);
    if (!d) return;
    if (d.kind === "box" && d.moved) props.onBox({ u0: Math.min(d.start.u, p.u), v0: Math.min(d.start.v, p.v), u1: Math.max(d.start.u, p.u), v1: Math.max(d.start.v, p.v) });
    else if (d.kind === "click" && !d.moved) props.onClick(p);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLCanvasElement>) => {
    if (!selected) return;
    const c = overlay.curves.find((x) => x.id === selected.curveId);
    const q = c?.points[selected.index];
    if (!q) return;
    const step = (e.shiftKey ? 10 : 1) / view.scale;
    const d: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] };
    if (d[e.key]) {
      e.preventDefault();
      props.onMovePoint(selected.curveId, selected.index, { u: q.u + d[e.key][0], v: q.v + d[e.key][1] });
    } else if (e.key === "Delete" || e.key === "Backspace") {
      e.preventDefault();
      props.onDeletePoint(selected.curveId, selected.index);
      props.onSelect(null);
    }
  };
  const zoom = (f: number) => setView((v) => ({ scale: Math.min(16, Math.max(0.25, v.scale * f)), ox: v.ox, oy: v.oy }));

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <button type="button" className="btn-quiet" onClick={() => zoom(1.25)} aria-label="Zoom in">+</button>
        <button type="button" className="btn-quiet" onClick={() => zoom(0.8)} aria-label="Zoom out">−</button>
        <button type="button" className="btn-quiet" onClick={() => setView({ scale: 1, ox: 0, oy: 0 })}>1:1</button>
        <span className="text-slate-500" data-testid="cursor">
          {(view.scale * 100).toFixed(0)} % · {hover ? `pixel ${hover.u.toFixed(1)}, ${hover.v.toFixed(1)}` : "—"}
        </span>
      </div>
      <div className="relative inline-block">
        <canvas
          ref={ref}
          width={width}
          height={height}
          style={{ width, height, cursor: tool === "pan" ? "grab" : "crosshair", touchAction: "none" }}
          tabIndex={0}
          aria-label="Chart picture: click to place points; arrow keys move the selected point"
          data-testid="trace-canvas"
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerUp}
          onPointerLeave={() => setHover(null)}
          onKeyDown={onKeyDown}
        />
        {hover ? <canvas ref={loupeRef} width={120} height={120} className="pointer-events-none absolute right-2 top-2 rounded border border-slate-400 shadow" aria-hidden /> : null}
      </div>
    </div>
  );
}
