/**
 * Visual check: renders sample charts to static HTML (no Tailwind, no CSS needed for the
 * chart itself) at /tmp/chart-preview.html (SI, crosshair on) and /tmp/chart-preview-us.html
 * (US, compact) and /tmp/chart-preview-cursors.html (readout placement). Run: npx tsx app/components/chart/preview.tsx
 */
import { writeFileSync } from "node:fs";
import { renderToStaticMarkup } from "react-dom/server";
import { DutyChart } from "./DutyChart.tsx";
import { sampleProps } from "./sample.ts";

// Only the app's shipped font is loaded (as the app does via @fontsource); no other CSS.
const FONT_DIR = new URL("../../../node_modules/@fontsource/source-sans-3/files/", import.meta.url).href;
const FONT_FACES = [400, 600, 700]
  .map(
    (w) =>
      `@font-face{font-family:'Source Sans 3';font-weight:${w};src:url(${FONT_DIR}source-sans-3-latin-${w}-normal.woff2) format('woff2')}`,
  )
  .join("");

function page(body: string, width: number): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Dutymark chart preview</title>
<style>${FONT_FACES}</style></head>
<body style="margin:12px;font-family:sans-serif"><div style="max-width:${width}px">${body}</div></body></html>`;
}

const si = renderToStaticMarkup(<DutyChart {...sampleProps("SI")} defaultCursorFlow={0.085} />);
writeFileSync("/tmp/chart-preview.html", page(si, 860));
const us = renderToStaticMarkup(<DutyChart {...sampleProps("US")} compact defaultCursorFlow={0.13} />);
writeFileSync("/tmp/chart-preview-us.html", page(us, 420));
const cursors = [0.03, 0.14].map((f) =>
  renderToStaticMarkup(<DutyChart {...sampleProps("SI")} defaultCursorFlow={f} height={420} />),
);
writeFileSync("/tmp/chart-preview-cursors.html", page(cursors.join("<hr>"), 860));
console.log("wrote /tmp/chart-preview.html, /tmp/chart-preview-us.html, /tmp/chart-preview-cursors.html");
