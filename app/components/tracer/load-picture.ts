// Loading the stored picture into pixels in the browser: a PDF page rendered with pdf.js (its
// worker loaded as a Vite asset from our own origin, no eval: the CSP stays as it is), or a PNG or
// JPEG decoded by the browser. Browser-only: called from effects, never during server rendering.
import type { Rgba } from "~/lib/tracer";

export type Picture = Rgba & { canvas: HTMLCanvasElement; pages: number };

type PdfDoc = { numPages: number; getPage(n: number): Promise<PdfPage>; destroy(): Promise<void> };
type PdfPage = {
  getViewport(o: { scale: number }): { width: number; height: number };
  render(o: { canvas: HTMLCanvasElement; canvasContext: CanvasRenderingContext2D; viewport: unknown }): { promise: Promise<void> };
};

const docs = new Map<string, Promise<PdfDoc>>();

async function pdfDocument(src: string): Promise<PdfDoc> {
  let d = docs.get(src);
  if (!d) {
    d = (async () => {
      const [pdfjs, worker, bytes] = await Promise.all([
        import("pdfjs-dist"),
        import("pdfjs-dist/build/pdf.worker.min.mjs?url"),
        fetch(src, { credentials: "same-origin" }).then((r) => {
          if (!r.ok) throw new Error(`The picture could not be loaded (${r.status}).`);
          return r.arrayBuffer();
        }),
      ]);
      pdfjs.GlobalWorkerOptions.workerSrc = worker.default;
      return (await pdfjs.getDocument({ data: new Uint8Array(bytes), isEvalSupported: false }).promise) as unknown as PdfDoc;
    })();
    docs.set(src, d);
  }
  return d;
}

function toPicture(canvas: HTMLCanvasElement, pages: number): Picture {
  const ctx = canvas.getContext("2d", { willReadFrequently: true });
  if (!ctx) throw new Error("This browser cannot draw on a canvas.");
  const img = ctx.getImageData(0, 0, canvas.width, canvas.height);
  return { width: img.width, height: img.height, data: img.data, canvas, pages };
}

/** Renders page `page` (1-based) of the PDF at `scale` pixels per point. */
export async function loadPdfPage(src: string, page: number, scale: number): Promise<Picture> {
  const doc = await pdfDocument(src);
  const n = Math.min(Math.max(1, Math.round(page)), doc.numPages);
  const p = await doc.getPage(n);
  const vp = p.getViewport({ scale });
  const canvas = document.createElement("canvas");
  canvas.width = Math.ceil(vp.width);
  canvas.height = Math.ceil(vp.height);
  const ctx = canvas.getContext("2d", { willReadFrequently: true });
  if (!ctx) throw new Error("This browser cannot draw on a canvas.");
  ctx.fillStyle = "#fff";
  ctx.fillRect(0, 0, canvas.width, canvas.height);
  await p.render({ canvas, canvasContext: ctx, viewport: vp }).promise;
  return toPicture(canvas, doc.numPages);
}

/** Decodes a PNG or JPEG into pixels. */
export async function loadImage(src: string): Promise<Picture> {
  const blob = await fetch(src, { credentials: "same-origin" }).then((r) => {
    if (!r.ok) throw new Error(`The picture could not be loaded (${r.status}).`);
    return r.blob();
  });
  const bmp = await createImageBitmap(blob);
  const canvas = document.createElement("canvas");
  canvas.width = bmp.width;
  canvas.height = bmp.height;
  const ctx = canvas.getContext("2d", { willReadFrequently: true });
  if (!ctx) throw new Error("This browser cannot draw on a canvas.");
  ctx.drawImage(bmp, 0, 0);
  bmp.close();
  return toPicture(canvas, 1);
}
