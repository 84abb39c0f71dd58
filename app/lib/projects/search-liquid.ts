// The duty-point search on a custom (viscous) liquid: the water curves are searched at the equivalent water duty of
// ANSI/HI 9.6.7's procedure for choosing a pump for a viscous duty (engine `equivalentWaterDuty`, from memory), so the
// ranking is on what each pump does on the liquid, not on water. B needs the pump's speed, so each speed in the index
// has its own water duty: the sets are searched per water duty and the rows merged, each row's figures turned into the
// liquid's (efficiency × C_η, head × C_H, shaft power from them at the liquid's density) and scored again together
// (engine `searchScore`). Sets whose B is at most 1 (no correction), above 40 (outside the method) or that name no speed
// are searched at the duty itself, on their water curves, as before, and the plan says so. A pump slowed down takes B at
// the speed it runs at (its ratio and water duty found together: `atSlowedSpeed`), as its verdict does. Pure: the
// search service calls it only for a custom liquid; a water system never comes here.
import {
  equivalentWaterDuty, joinSearchIndexes, searchDuty, EQUIVALENT_WATER_DUTY_RULE, G0, VISCOSITY_B_MAX,
  type Candidate, type SearchIndex, type SearchOptions, type SearchResult,
} from "~/engine";
import { searchScore } from "~/engine/search"; // the engine's own score, for rows merged from several searches
import { fmtNum, fmtNumExact, qt } from "~/engine/quantityText";

/** How the sets of one speed (null: sets naming none) were searched on the liquid. */
export type LiquidSearchGroup = {
  speed: number | null;
  /** Curve sets at this speed in the index (count). */
  sets: number;
  /** `corrected`: at the equivalent water duty; the others at the duty itself (`no-speed`: B cannot be computed). */
  status: "corrected" | "no-correction" | "outside-method" | "no-speed";
  /** B with the duty taken as the BEP (dimensionless), null without a speed. */
  b: number | null;
  /** C_Q, C_H at 1.0 × Q_BEP, C_η (dimensionless), when corrected. */
  factors: { flow: number; head: number; efficiency: number } | null;
  /** The duty searched on the water curves: m³/s, m. */
  waterDuty: { flow: number; head: number };
};

/** The search's plan on a custom liquid, for the page and the read API. */
export type LiquidSearchPlan = {
  liquid: string;
  /** m²/s */
  kinematicViscosity: number;
  /** The duty searched on the liquid: m³/s, m — the typed duty for one pump, one pump's share for several (`dutyName`). */
  duty: { flow: number; head: number };
  /** Some set was searched at an equivalent water duty: the rows' figures are the liquid's. */
  ranksOnLiquid: boolean;
  groups: LiquidSearchGroup[];
  rule: string;
  /** One line in quantity tokens: each speed's B, factors and water duty, or why none. */
  message: string;
};

type Liquid = { name: string; kinematicViscosity: number; density: number };

/**
 * The search of `index` for a viscous duty, and its plan.
 * @param index the prepared index (SI curves)
 * @param duty the typed duty on the liquid: m³/s, m (per stage: the curves are taken as one stage, as the workbench does)
 * @param liquid name, kinematic viscosity m²/s, density kg/m³
 * @param options the engine's search options (its `limit` is the most rows returned)
 * @param dutyName what `duty` is, in the plan's and the rows' words: "the duty itself" for one pump; for pumps in parallel
 *   or series, one pump's share of the typed duty (search-arrangement.ts `dutyShare`), which the plan must not call the duty
 */
export function searchOnLiquid(index: SearchIndex, duty: { flow: number; head: number }, liquid: Liquid, options: SearchOptions, dutyName = DUTY_ITSELF): { result: SearchResult; plan: LiquidSearchPlan } {
  // Positions of the sets per speed (−1: none named).
  const bySpeed = new Map<number, number[]>();
  for (let e = 0; e < index.count; e++) {
    const s = index.speed[e];
    let list = bySpeed.get(s);
    if (!list) bySpeed.set(s, (list = []));
    list.push(e);
  }
  const groups: LiquidSearchGroup[] = [...bySpeed.entries()].sort((a, b) => b[0] - a[0]).map(([s, list]) => {
    if (s <= 0) return { speed: null, sets: list.length, status: "no-speed", b: null, factors: null, waterDuty: duty };
    const w = equivalentWaterDuty({ ...duty, kinematicViscosity: liquid.kinematicViscosity, speed: s });
    return { speed: s, sets: list.length, status: w.status, b: w.b, factors: w.factors, waterDuty: { flow: w.flow, head: w.head } };
  });
  // One search per water duty: the sets searched at the duty itself together, those whose figures stay the water curve's
  // although the liquid needs a correction (no speed, or B above 40) apart, to rank after the rows estimated on the liquid.
  const searches = new Map<string, { groups: LiquidSearchGroup[]; positions: number[] }>();
  for (const g of groups) {
    const key = g.status === "corrected" ? String(g.speed) : g.status === "no-correction" ? "duty" : "water";
    let s = searches.get(key);
    if (!s) searches.set(key, (s = { groups: [], positions: [] }));
    s.groups.push(g);
    s.positions.push(...bySpeed.get(g.speed ?? -1)!);
  }
  const ranksOnLiquid = groups.some((g) => g.status === "corrected");
  const plan: LiquidSearchPlan = { liquid: liquid.name, kinematicViscosity: liquid.kinematicViscosity, duty, ranksOnLiquid, groups, rule: EQUIVALENT_WATER_DUTY_RULE, message: planMessage(liquid, groups, dutyName) };
  if (!ranksOnLiquid) return { result: searchDuty(index, duty, options), plan }; // today's search, unchanged
  let positions: Map<string, number> | null = null; // id → position in the index, made for the first slowed row only
  const slowed = (c: Candidate, speed: number, factors: { head: number; efficiency: number }) => {
    positions ??= new Map(index.ids.map((id, e) => [id, e]));
    return atSlowedSpeed(joinSearchIndexes([index], [[positions.get(c.id)!]]), c, speed, factors, duty, liquid, options);
  };
  const parts = [...searches.values()].map((s) => {
    const g = s.groups[0];
    const sub = searches.size === 1 ? index : joinSearchIndexes([index], [s.positions.sort((a, b) => a - b)]);
    const r = searchDuty(sub, g.status === "corrected" ? g.waterDuty : duty, options);
    // A pump slowed down runs at speed × ratio: B is taken there, not at the group's speed (atSlowedSpeed).
    const rows = g.status === "corrected" ? r.candidates.map((c) => (c.method === "speed" ? slowed(c, g.speed!, g.factors!) : onLiquid(c, duty, g.factors!, liquid.density)))
      : g.status === "no-correction" ? r.candidates
      : r.candidates.map((c) => ({ ...c, warnings: [...c.warnings, { code: WATER_FIGURES, message: waterFiguresText(c.speed === null ? "no-speed" : "outside-method", dutyName) }] }));
    return { r, rows };
  });
  const rows = parts.flatMap((p) => p.rows);
  let minPower = Infinity;
  for (const c of rows) if (c.shaftPower !== null && c.shaftPower < minPower) minPower = c.shaftPower;
  const reqMargin = options.requiredNpshMargin ?? 1.1;
  for (const c of rows) c.score = searchScore(c.efficiency, c.bepRatio, c.npshMargin, c.shaftPower, minPower, reqMargin);
  const last = (c: Candidate) => (onWaterFigures(c) ? 1 : 0);
  rows.sort((a, b) => last(a) - last(b) || b.score - a.score || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const sum = (k: keyof SearchResult["stats"]) => parts.reduce((t, p) => t + p.r.stats[k], 0);
  const stats = { searched: sum("searched"), rejectedByEnvelope: sum("rejectedByEnvelope"), evaluated: sum("evaluated"), rejectedByNpsh: sum("rejectedByNpsh"), matched: sum("matched") };
  return { result: { candidates: rows.slice(0, Math.max(1, Math.round(options.limit ?? 50))), stats }, plan };
}

/**
 * A row found slowed down at its speed group's water duty (B at the curve's own speed `speed`), found again where B is
 * taken at the speed it runs at, speed × ratio (ANSI/HI 9.6.7: B at the pump's speed, from memory): the ratio r solves
 * the one set `one` to the water duty of B at speed × r, a fixed point. Slower means a larger B, a lower C_H and so a
 * higher water head, so the answer lies between the row's ratio r₀ and 1 (at 1 the water duty is the group's, solved
 * by r₀), and iterating from r₀ converges fast (B ∝ speed^−0.25: each step moves the ratio little; 72.12 % → 72.68 %
 * at 200 cSt in search-liquid.test.ts). Where the first step has no answer (B past the method's 40 at speed × r₀, or
 * its water duty not met at full speed: neither seen on ordinary curves, since a speed row's r₀ is well below 1) the
 * row keeps the estimate at the curve's speed (`factors`, its group's).
 */
function atSlowedSpeed(one: SearchIndex, c: Candidate, speed: number, factors: { head: number; efficiency: number }, duty: { flow: number; head: number }, liquid: Liquid, options: SearchOptions): Candidate {
  const opts = { ...options, methods: ["speed"] as const, limit: 1 };
  const at = (r: number) => {
    const w = equivalentWaterDuty({ ...duty, kinematicViscosity: liquid.kinematicViscosity, speed: speed * r });
    const row = w.status === "corrected" ? searchDuty(one, w, opts).candidates[0] : undefined;
    return row ? { row, factors: w.factors! } : null;
  };
  // g(r) = f(r) − r, f(r) the ratio solved at B of speed × r: secant steps from r₀ and f(r₀) (the plain iteration
  // r ← f(r) took about eight solves a row), kept within [r₀, 1].
  let found = at(c.ratio);
  if (!found) return onLiquid(c, duty, factors, liquid.density);
  let rPrev = c.ratio, gPrev = found.row.ratio - rPrev;
  let r = found.row.ratio;
  for (let k = 0; k < 30 && Math.abs(gPrev) > 1e-12 * rPrev; k++) {
    const next = at(r);
    if (!next) break; // not expected within [r₀, 1] past the first step; keep the last answer
    found = next;
    const g = next.row.ratio - r;
    const secant = g === gPrev ? next.row.ratio : r - (g * (r - rPrev)) / (g - gPrev);
    [rPrev, gPrev, r] = [r, g, Math.min(1, Math.max(c.ratio, secant))];
  }
  return onLiquid(found.row, duty, found.factors, liquid.density);
}

/** What the search's duty is called for one pump; pumps in parallel or series name one pump's share instead. */
const DUTY_ITSELF = "the duty itself";

/** The warning code of a row whose figures stay the water curve's in a search ranked on the liquid. */
const WATER_FIGURES = "viscous-water-figures";
/** A row of a search ranked on the liquid whose figures are the water curve's (no speed for B, or B above 40): ranked after the others. */
export const onWaterFigures = (c: Pick<Candidate, "warnings">) => c.warnings.some((w) => w.code === WATER_FIGURES);
const waterFiguresText = (why: "no-speed" | "outside-method", dutyName: string) =>
  `figures on the water curve at ${dutyName} (${why === "no-speed" ? "the curve names no speed, so B cannot be computed" : `B above ${VISCOSITY_B_MAX}, outside the ANSI/HI 9.6.7 method`}): ranked after the pumps whose figures are estimated on the liquid`;

/**
 * A row found at the equivalent water duty, with the liquid's figures (ANSI/HI 9.6.7, from memory): head × C_H, efficiency
 * × C_η, shaft power ρ·g·Q_vis·H_vis / η_vis; Q/Q_BEP is the same on both (flows scale by C_Q); NPSHr is the water
 * curve's at the water flow, carried to the liquid's flow as the corrected curve does (viscous.ts).
 */
function onLiquid(c: Candidate, duty: { flow: number }, f: { head: number; efficiency: number }, density: number): Candidate {
  const head = c.headAtDuty * f.head;
  const efficiency = c.efficiency === null ? null : c.efficiency * f.efficiency;
  const shaftPower = efficiency !== null && efficiency > 0 ? (density * G0 * duty.flow * head) / efficiency : null;
  return { ...c, headAtDuty: head, efficiency, shaftPower };
}

/** "B = 6.97" beside its limits: never "1.00" nor "40.0" for a B just past them. */
const bText = (b: number) => fmtNumExact(b, [1, VISCOSITY_B_MAX], 2);

/** One line: each speed's B, factors and water duty (quantity tokens), or why the duty itself was searched. */
function planMessage(liquid: Liquid, groups: readonly LiquidSearchGroup[], dutyName: string): string {
  const cst = liquid.kinematicViscosity * 1e6;
  const parts = groups.map((g) => {
    const at = g.speed === null ? `${g.sets} curve set${g.sets === 1 ? "" : "s"} naming no speed` : `${Math.round(g.speed)} rpm`;
    if (g.status === "no-speed") return `${at}: B needs the speed, so searched at ${dutyName} on the water curves`;
    if (g.status === "no-correction") return `${at}: B = ${bText(g.b!)}, at most 1: no correction, ${dutyName}`;
    if (g.status === "outside-method") return `${at}: B = ${bText(g.b!)}, above ${VISCOSITY_B_MAX}: outside the method, so ranked on the water curves at ${dutyName} as before (each verdict says the curve is not corrected)`;
    const f = g.factors!;
    return `${at}: B = ${bText(g.b!)}, C_Q ${f.flow.toFixed(3)}, C_H ${f.head.toFixed(3)}, C_η ${f.efficiency.toFixed(3)} → water duty ${qt("flow", g.waterDuty.flow)} at ${qt("head", g.waterDuty.head)}`;
  });
  const corrected = groups.some((g) => g.status === "corrected");
  const what = `${liquid.name} (ν ${fmtNum(cst, cst < 10 ? 2 : 0)} cSt)`;
  return corrected
    ? `Searched for ${what} at the equivalent water duty of ANSI/HI 9.6.7 (from memory)${dutyName === DUTY_ITSELF ? "" : ` of ${dutyName}`}: ${parts.join("; ")}. Those rows' efficiency, shaft power, head and "why this rank" are estimates on the liquid (C_η × the water efficiency at the water duty); a pump slowed down takes B at the speed it runs at (a larger B than at its curve's speed), its speed and water duty found together.`
    : `No equivalent water duty of ANSI/HI 9.6.7 (from memory) for ${what}${dutyName === DUTY_ITSELF ? "" : ` at ${dutyName}`}: ${parts.join("; ")}.`;
}
