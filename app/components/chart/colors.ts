/**
 * The chart's colours: the pump palette and the fixed colours of system, band, NPSHa, duty,
 * grid, axes and readout (set as SVG attributes, so the chart reads right without any CSS).
 */

/**
 * Pump palette (our own): distinct in hue and lightness, chosen to stay apart under
 * deuteranopia/protanopia and to avoid amber (reserved for the duty and operating point)
 * and red (failures). Every pump also carries a numbered badge, so colour is never the
 * only cue.
 */
export const PUMP_PALETTE = [
  "#0f766e", // teal
  "#4338ca", // indigo
  "#a21caf", // magenta
  "#5b6b12", // olive
  "#2b6cb0", // slate-blue
  "#7c4a21", // brown
] as const;

/** Palette colour for an index (wraps around). */
export function pumpColor(index: number): string {
  const n = PUMP_PALETTE.length;
  const i = Number.isFinite(index) ? ((Math.trunc(index) % n) + n) % n : 0;
  return PUMP_PALETTE[i];
}

/** Fixed chart colours (SVG attributes, so the chart reads right without any CSS). */
export const CHART_COLORS = {
  system: "#1e293b", // slate-800
  band: "#94a3b8", // slate-400
  npsha: "#1e293b",
  duty: "#d97706", // amber, the app's duty token
  grid: "#e2e8f0", // slate-200
  gridFaint: "#f1f5f9", // slate-100
  axis: "#94a3b8",
  tick: "#475569", // slate-600
  title: "#1e293b",
  cursor: "#0f172a",
  readoutBg: "#ffffff",
  readoutBorder: "#cbd5e1",
} as const;
