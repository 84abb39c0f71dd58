/**
 * A rating column mapped to shaft power all the same (a user's or a saved mapping: "Rated power kW", "Rated power P2", "Motor kW",
 * "Rated motor output kW" set to "Shaft power"): its values, curve by curve, added to checkMapping's warning.
 *
 * Decision: such a mapping is kept. The user chose the column (or kept a saved mapping, perhaps from before the header was read as
 * a rating), and only the values tell a rating (one figure at every point) from a shaft power curve under a loose name; the
 * suggestion is still made from the header alone (rated-power.ts). So the warning states, besides the header's rule, the numbers:
 * for each curve with a power from that column, the figure and the flows it covers when the values are one figure by the
 * constant-power rule (constant-power.ts, the rule the validation's `power-constant` warning applies), else their range and flows.
 * Pure: no Node or DOM APIs.
 */
import { fmtPctExact, fmtPctLimit, qt, qtExact } from "../../engine/quantityText.ts";
import { CONSTANT_POWER, PowerRun } from "./constant-power";
import type { LongRow, Mapping } from "./mapping";
import { curveNameOfKey } from "./names";
import type { Problem } from "./types";
import { headerPowerKind, type PowerKind } from "./units-in-headers";
import { validateLongRows, type CurveSet, type ValidateOptions } from "./validate";

/** The kinds of power header that name or assume a rating (power-kinds.ts). */
const RATING_KINDS: ReadonlySet<PowerKind> = new Set<PowerKind>(["rated", "motor", "rated-motor"]);
/** Curves named one by one in each group; the rest are counted. */
const NAMED = 3;

const CONSTANT_RULE =
  `the same power within ${fmtPctLimit(CONSTANT_POWER.spread)} at ${CONSTANT_POWER.minPoints} points or more over at least ` +
  `${fmtPctLimit(CONSTANT_POWER.flowSpan)} of the curve's largest flow, the rule of the power-constant warning`;

const runOf = (c: CurveSet) => {
  const run = new PowerRun();
  for (const p of c.points) if (p.power !== undefined) run.add(p.flow, p.power, 0);
  return run;
};
const flows = (r: PowerRun) => `flow ${qt("flow", r.firstFlow)} to ${qt("flow", r.lastFlow)}`;
const named = <T>(list: T[], say: (x: T) => string) =>
  list.slice(0, NAMED).map(say).join("; ") + (list.length > NAMED ? `; and ${list.length - NAMED} more` : "");

/** What a rating column's values are on `curves` (the curve sets built from its rows), with the rule and the numbers. */
export function ratingValuesText(curves: readonly CurveSet[]): string {
  const runs = curves.map((c) => ({ key: c.key, run: runOf(c) })).filter((x) => x.run.count > 0);
  if (runs.length === 0) return "As mapped, no point of any curve has a power from it.";
  const flat = runs.filter((x) => x.run.flat());
  const other = runs.filter((x) => !x.run.flat());
  const parts: string[] = [];
  if (flat.length)
    parts.push(
      `one figure at every point on ${flat.length} of ${runs.length} curves with a power — ` +
        named(flat, ({ key, run: r }) =>
          `${qt("power", r.max)} at all ${r.count} points of ${curveNameOfKey(key)} (${flows(r)}, ${fmtPctExact((r.lastFlow - r.firstFlow) / r.lastFlow, [CONSTANT_POWER.flowSpan])} of its largest flow)`),
    );
  if (other.length)
    parts.push(
      `not one figure by that rule on ${other.length} of ${runs.length} — ` +
        named(other, ({ key, run: r }) =>
          `${r.min === r.max ? qt("power", r.max) : `${qtExact("power", r.min, [r.max])} to ${qtExact("power", r.max, [r.min])}`} at ${r.count} point${r.count === 1 ? "" : "s"} of ${curveNameOfKey(key)} (${flows(r)})`),
    );
  const verdict =
    other.length === 0
      ? "so they read as a rating: kept as mapped (your choice), every point of those curves takes that one figure as its shaft power"
      : flat.length === 0
        ? "so nothing in the values says rating: kept as mapped (your choice)"
        : "kept as mapped (your choice): the curves with one figure take it as their shaft power at every point";
  return `Its values as mapped, by the constant-power rule (${CONSTANT_RULE}): ${parts.join("; ")}; ${verdict}.`;
}

/**
 * checkMapping's problems with the values added to the warning of each rating column mapped to power. `rows` are the long rows
 * the validation read and `curveSets` what it built from them; a column's curves are those built from the rows whose power came
 * from it (one column in the long layout; a block's in the wide layout).
 */
export function withRatingValues(problems: Problem[], mapping: Mapping, headers: readonly string[], rows: LongRow[], opts: ValidateOptions, curveSets: readonly CurveSet[]): Problem[] {
  const rating = mapping.columns
    .filter((c) => c.field === "power" && c.index < headers.length)
    .map((c) => headers[c.index])
    .filter((h) => RATING_KINDS.has(headerPowerKind(h) as PowerKind));
  if (rating.length === 0) return problems;
  return problems.map((p) => {
    const h = rating.find((x) => p.code === "mapping" && p.severity === "warning" && p.column === x && p.reason.startsWith(`“${x}” is mapped to shaft power`));
    if (h === undefined) return p;
    const keys = new Set(validateLongRows(rows.filter((lr) => lr.cells.power?.column === h), opts).curveSets.map((c) => c.key));
    return { ...p, reason: `${p.reason} ${ratingValuesText(curveSets.filter((c) => keys.has(c.key)))}` };
  });
}
