/**
 * An invented pump chart drawn by the tests themselves (never a vendor's): three impeller curves
 * H = H0 − K·Q² and iso-efficiency islands of the invented field η(Q, H) below, drawn to an RGBA
 * buffer with a small anti-aliased rasteriser (optionally rotated and sheared like a skewed scan)
 * and to a one-page PDF with vector path operators (ISO 32000-1 §8.5: m, l, S; §8.6: RG). The
 * tests calibrate and trace these and compare with the functions that drew them. Test-only module.
 */

export const CHART = { width: 800, height: 600, left: 80, right: 760, top: 60, bottom: 520, flow: [0, 100], head: [0, 60] } as const;
export const K = 0.003; // m per (m³/h)², invented
export const IMPELLERS = [
  { mm: 250, h0: 52 },
  { mm: 230, h0: 45 },
  { mm: 210, h0: 38 },
] as const;
export const Q_MAX = 95; // m³/h, the curves are drawn from 0 to here
export const headOf = (h0: number, q: number) => h0 - K * q * q;
/** Invented efficiency field, % (elliptic islands centred on 55 m³/h, 38 m). */
export const etaField = (q: number, h: number) => 84 - 0.01 * (q - 55) ** 2 - 0.05 * (h - 38) ** 2;
export const LEVELS = [66, 70, 74, 78, 82] as const;
/** One colour per level, far apart in RGB and from the curve colour. */
export const LEVEL_COLOURS: Record<number, [number, number, number]> = {
  66: [220, 0, 0],
  70: [0, 160, 0],
  74: [230, 140, 0],
  78: [200, 0, 200],
  82: [0, 170, 170],
};
export const CURVE_COLOUR: [number, number, number] = [0, 0, 200];
export const GRID_COLOUR: [number, number, number] = [215, 215, 215];

/** Chart data → unskewed page pixels. */
export function paper(q: number, h: number): [number, number] {
  const c = CHART;
  return [c.left + ((q - c.flow[0]) / (c.flow[1] - c.flow[0])) * (c.right - c.left), c.bottom - ((h - c.head[0]) / (c.head[1] - c.head[0])) * (c.bottom - c.top)];
}

export type Skew = { angleDeg: number; shear: number };

/** Page pixels → picture pixels: shear along u, then rotation about the centre. */
export function skewed(p: [number, number], s?: Skew): [number, number] {
  if (!s) return p;
  const cx = CHART.width / 2, cy = CHART.height / 2;
  const x = p[0] - cx + s.shear * (p[1] - cy), y = p[1] - cy;
  const a = (s.angleDeg * Math.PI) / 180;
  return [cx + x * Math.cos(a) - y * Math.sin(a), cy + x * Math.sin(a) + y * Math.cos(a)];
}

type Stroke = { pts: [number, number][]; colour: [number, number, number]; width: number; closed?: boolean };

/** Everything on the chart as strokes in page pixels, in drawing order. */
export function chartStrokes(opts: { islands?: boolean } = {}): Stroke[] {
  const out: Stroke[] = [];
  for (let q = 10; q <= 100; q += 10) out.push({ pts: [paper(q, 0), paper(q, 60)], colour: GRID_COLOUR, width: 1 });
  for (let h = 10; h <= 60; h += 10) out.push({ pts: [paper(0, h), paper(100, h)], colour: GRID_COLOUR, width: 1 });
  out.push({ pts: [paper(0, 60), paper(0, 0), paper(100, 0)], colour: [0, 0, 0], width: 2 });
  // Tick marks at every 10 (the tests' "clicks" land on their ends at the axis).
  for (let q = 0; q <= 100; q += 10) out.push({ pts: [paper(q, 0), [paper(q, 0)[0], paper(q, 0)[1] + 8]], colour: [0, 0, 0], width: 2 });
  for (let h = 0; h <= 60; h += 10) out.push({ pts: [paper(0, h), [paper(0, h)[0] - 8, paper(0, h)[1]]], colour: [0, 0, 0], width: 2 });
  if (opts.islands) {
    for (const L of LEVELS) {
      const d = 84 - L; // 0.01 dQ² + 0.05 dH² = d
      const pts: [number, number][] = [];
      for (let i = 0; i < 240; i++) {
        const t = (2 * Math.PI * i) / 240;
        pts.push(paper(55 + Math.sqrt(d / 0.01) * Math.cos(t), 38 + Math.sqrt(d / 0.05) * Math.sin(t)));
      }
      out.push({ pts, colour: LEVEL_COLOURS[L], width: 2, closed: true });
    }
  }
  for (const imp of IMPELLERS) {
    const pts: [number, number][] = [];
    for (let q = 0; q <= Q_MAX + 1e-9; q += 0.5) pts.push(paper(q, headOf(imp.h0, q)));
    out.push({ pts, colour: CURVE_COLOUR, width: 3 });
  }
  return out;
}

/** Distance from p to segment a–b. */
function segDist(px: number, py: number, a: [number, number], b: [number, number]): number {
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const l2 = dx * dx + dy * dy;
  const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - a[0]) * dx + (py - a[1]) * dy) / l2));
  return Math.hypot(px - a[0] - t * dx, py - a[1] - t * dy);
}

/** Renders the chart (anti-aliased strokes over white) into an RGBA buffer. */
export function drawChart(opts: { skew?: Skew; islands?: boolean } = {}): { width: number; height: number; data: Uint8ClampedArray } {
  const { width, height } = CHART;
  const data = new Uint8ClampedArray(width * height * 4).fill(255);
  for (const s of chartStrokes(opts)) {
    const pts = s.pts.map((p) => skewed(p, opts.skew));
    if (s.closed) pts.push(pts[0]);
    const cover = new Float32Array(width * height);
    for (let i = 0; i + 1 < pts.length; i++) {
      const [a, b] = [pts[i], pts[i + 1]];
      const r = s.width / 2 + 1;
      const u0 = Math.max(0, Math.floor(Math.min(a[0], b[0]) - r)), u1 = Math.min(width - 1, Math.ceil(Math.max(a[0], b[0]) + r));
      const v0 = Math.max(0, Math.floor(Math.min(a[1], b[1]) - r)), v1 = Math.min(height - 1, Math.ceil(Math.max(a[1], b[1]) + r));
      for (let v = v0; v <= v1; v++)
        for (let u = u0; u <= u1; u++) {
          const c = Math.max(0, Math.min(1, s.width / 2 + 0.5 - segDist(u, v, a, b)));
          if (c > cover[v * width + u]) cover[v * width + u] = c;
        }
    }
    for (let k = 0; k < cover.length; k++) {
      const c = cover[k];
      if (c > 0) for (let j = 0; j < 3; j++) data[4 * k + j] = Math.round(data[4 * k + j] * (1 - c) + s.colour[j] * c);
    }
  }
  return { width, height, data };
}

/** The chart as a one-page PDF (page 800 × 600 pt, one page pixel = one point, y flipped). */
export function chartPdf(opts: { islands?: boolean } = {}): Uint8Array<ArrayBuffer> {
  const f = (x: number) => x.toFixed(3);
  let ops = "1 J 1 j\n";
  for (const s of chartStrokes(opts)) {
    ops += `${s.colour.map((c) => (c / 255).toFixed(4)).join(" ")} RG ${s.width} w\n`;
    s.pts.forEach((p, i) => (ops += `${f(p[0])} ${f(CHART.height - p[1])} ${i === 0 ? "m" : "l"}\n`));
    ops += s.closed ? "s\n" : "S\n";
  }
  const objs = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${CHART.width} ${CHART.height}] /Contents 4 0 R /Resources << >> >>`,
    `<< /Length ${ops.length} >>\nstream\n${ops}endstream`,
  ];
  let pdf = "%PDF-1.4\n";
  const offsets: number[] = [];
  objs.forEach((o, i) => {
    offsets.push(pdf.length);
    pdf += `${i + 1} 0 obj\n${o}\nendobj\n`;
  });
  const xref = pdf.length;
  pdf += `xref\n0 ${objs.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, "0")} 00000 n \n`).join("")}`;
  pdf += `trailer\n<< /Size ${objs.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return new TextEncoder().encode(pdf);
}
