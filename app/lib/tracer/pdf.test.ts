// The invented chart as a PDF (vector paths, test-chart.ts), rendered with pdf.js — the library the
// tracer page uses in the browser — onto a canvas (@napi-rs/canvas here, pdf.js's own Node canvas),
// then calibrated and traced like the PNG. Limit: 0.5 % of the axis span (issue 20).
import { describe, expect, it } from "vitest";
import { calibrate, colourMask, crossings, toAxis, toData, traceIsland, traceMask, type Contour, type Rgba } from "./index";
import { CHART, CURVE_COLOUR, IMPELLERS, LEVELS, LEVEL_COLOURS, Q_MAX, chartPdf, etaField, headOf, paper } from "./test-chart";

const SCALE = 1.5; // the page renders at 1.5 px per point, as the tracer page does by default

async function render(bytes: Uint8Array): Promise<Rgba> {
  const pdfjs = await import("pdfjs-dist/legacy/build/pdf.mjs");
  const doc = await pdfjs.getDocument({ data: bytes, isEvalSupported: false }).promise;
  expect(doc.numPages).toBe(1);
  const page = await doc.getPage(1);
  const vp = page.getViewport({ scale: SCALE });
  const { createCanvas } = await import("@napi-rs/canvas");
  const canvas = createCanvas(vp.width, vp.height);
  const ctx = canvas.getContext("2d");
  await page.render({ canvasContext: ctx as never, canvas: canvas as never, viewport: vp }).promise;
  const d = ctx.getImageData(0, 0, vp.width, vp.height);
  await doc.destroy();
  return { width: d.width, height: d.height, data: d.data };
}

describe("tracing the invented chart from a PDF page rendered by pdf.js", () => {
  const px = (q: number, h: number) => paper(q, h).map((x) => x * SCALE) as [number, number];
  const ref = (q: number, h: number, value: number) => ({ u: px(q, h)[0], v: px(q, h)[1], value });
  const cal = calibrate({ xRefs: [ref(10, 0, 10), ref(90, 0, 90)], yRefs: [ref(0, 10, 10), ref(0, 50, 50)], xScale: "linear", yScale: "linear" });

  it("recovers the impeller curves within 0.5 % of the head span and the islands' efficiencies within 1 point", async () => {
    const bytes = chartPdf({ islands: true });
    expect(new TextDecoder().decode(bytes.subarray(0, 5))).toBe("%PDF-");
    const img = await render(bytes);
    expect(img.width).toBe(CHART.width * SCALE);
    const all = { u0: 0, v0: 0, u1: img.width - 1, v1: img.height - 1 };
    const contours: Contour[] = LEVELS.map((level) => ({
      level,
      closed: true,
      points: traceIsland(colourMask(img, LEVEL_COLOURS[level], 60, all), img, all, 240).map((p) => { const a = toAxis(cal, p); return { x: a.X, y: a.Y }; }),
    }));
    let worst = 0, worstEta = 0, n = 0, nx = 0;
    for (const imp of IMPELLERS) {
      const [u, v] = px(20, headOf(imp.h0, 20));
      const pts = traceMask(colourMask(img, CURVE_COLOUR, 90, all), img, cal, all, { seed: { u, v }, maxJump: 18 }).map((p) => toData(cal, p));
      const inside = pts.filter((p) => p.x >= 1 && p.x <= Q_MAX - 1);
      expect(inside.length).toBeGreaterThan(300);
      expect(inside[0].x).toBeLessThan(2);
      expect(inside[inside.length - 1].x).toBeGreaterThan(Q_MAX - 2);
      for (const p of inside) worst = Math.max(worst, (100 * Math.abs(p.y - headOf(imp.h0, p.x))) / (CHART.head[1] - CHART.head[0]));
      n += inside.length;
      for (const c of crossings(pts, contours)) {
        worstEta = Math.max(worstEta, Math.abs(c.level - etaField(c.x, headOf(imp.h0, c.x))));
        nx++;
      }
    }
    console.log(`tracer recovery, PDF via pdf.js at ${SCALE}×: max |error| ${worst.toFixed(3)} % of head span over ${n} points; iso-efficiency max |error| ${worstEta.toFixed(3)} points at ${nx} crossings`);
    expect(worst).toBeLessThan(0.5);
    expect(nx).toBeGreaterThan(12);
    expect(worstEta).toBeLessThan(1);
  });
});
