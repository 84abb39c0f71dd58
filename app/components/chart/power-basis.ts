/**
 * What the power panel's and tables' values are for. A curve of pumps in parallel or series carries the power of its duty
 * pumps together (lib/projects/power-basis.ts); the chart names that basis beside "Shaft power" / "Power": shared by every
 * power curve, "Shaft power, 2 duty pumps together (kW)"; differing, each curve by its badge, "Shaft power (kW) — curve 1:
 * one pump; curve 2: 2 duty pumps together". With no basis on any curve (one pump each) the words read as before. Pure.
 */
import type { Pt } from "./types.ts";

type PowerCurve = { badge: number; power: readonly Pt[]; powerBasis: string | null };

const ONE_PUMP = "one pump";

/**
 * A power heading with its basis.
 * @param word "Shaft power" (the panel) or "Power" (a table column)
 * @param unit the display unit's label, e.g. "kW"
 * @param pumps the chart's pumps; only those with a power curve count
 */
export function powerHeading(word: string, unit: string, pumps: readonly PowerCurve[]): string {
  const drawn = pumps.filter((p) => p.power.length > 0);
  if (!drawn.some((p) => p.powerBasis)) return `${word} (${unit})`;
  const bases = [...new Set(drawn.map((p) => p.powerBasis ?? ONE_PUMP))];
  if (bases.length === 1) return `${word}, ${bases[0]} (${unit})`;
  const groups = bases.map((b) => {
    const badges = drawn.filter((p) => (p.powerBasis ?? ONE_PUMP) === b).map((p) => p.badge);
    return `${badges.length > 1 ? "curves" : "curve"} ${badges.join(", ")}: ${b}`;
  });
  return `${word} (${unit}) — ${groups.join("; ")}`;
}

/** One curve's power column heading: "Power (kW)" for one pump, "Power, 2 duty pumps together (kW)" for several. */
export const curvePowerHeading = (unit: string, p: { powerBasis: string | null }) => (p.powerBasis ? `Power, ${p.powerBasis} (${unit})` : `Power (${unit})`);
