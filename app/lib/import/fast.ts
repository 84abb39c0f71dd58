/**
 * Fast path for clean long-layout files (the usual big export): one pass over the text with
 * indexOf, cells sliced only for mapped columns, numbers read without regular expressions, no
 * per-cell objects. It gives the same result as toLongRows + validateLongRows — or null as soon as
 * anything would need a message (quotes, a bad or blank cell, extra cells, a sequence problem, a
 * warning...), and the caller then runs the full path, which names every problem. Pure.
 * app/lib/import/fast.test.ts checks that both paths agree on every clean fixture.
 */
import type { Mapping } from "./mapping";
import { parseNumber } from "./numbers";
import { packedResult, PointStore, type SetHead } from "./packed";
import type { SniffResult } from "./sniff";
import { SI_FACTOR, type NumericField, type Unit } from "./units-in-headers";
import { CONSISTENCY_TOLERANCE, G_STANDARD, curveKey, type ValidationResult } from "./validate";
import { DEFAULT_POWER_DENSITY } from "../../engine/pumpCurve.ts";
import { BEST_EFFICIENCY, efficiencyPlausible, importHeadShape, NPSHR_SMALL, POWER_EFFICIENCY_MAX, powerEfficiency } from "./point-rules";
import type { HeadShape } from "../../engine/headShape.ts";
import { FRACTION_BELOW } from "./efficiency-fraction";
import { looksLikeRating } from "./constant-power";
import { textCell } from "./text-cells";
import { minFlowFits } from "./min-flow";

const NUMERIC: NumericField[] = ["speed", "impeller", "flow", "head", "efficiency", "power", "npshr"];

const POW10 = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`)); // exact doubles up to 1e22

/**
 * Writes to out[k] the number in body[i, end) when it is a plain decimal ([-+]digits[.digits]), read
 * straight from the character codes; NaN otherwise (the cell then goes through parseNumber). With at
 * most 15 significant digits the mantissa is an exact integer and 10^k (k ≤ 22) an exact double, so
 * one division is correctly rounded: the same double as Number() gives (Clinger 1990, "How to read
 * floating point numbers accurately", the fast path). Written into a Float64Array rather than
 * returned, so that no boxed number is made per cell when the call is not inlined.
 */
function numberAt(body: string, i: number, end: number, decimal: number, out: Float64Array, k: number): void {
  let neg = false;
  if (i < end) {
    const c = body.charCodeAt(i);
    if (c === 45) {
      neg = true;
      i++;
    } else if (c === 43) i++;
  }
  let m = 0;
  let frac = 0;
  let dot = false;
  let any = false;
  for (; i < end; i++) {
    const c = body.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      if (m >= 1e14) {
        out[k] = NaN;
        return;
      }
      m = m * 10 + (c - 48);
      any = true;
      if (dot) frac++;
    } else if (c === decimal && !dot) dot = true;
    else {
      out[k] = NaN;
      return;
    }
  }
  if (!any || frac > 22) out[k] = NaN;
  else {
    const x = frac ? m / POW10[frac] : m;
    out[k] = neg ? -x : x;
  }
}

const BLANK_LINE = /^[\s,;]*$/;

/** body[a, e) has the same characters as body[pa, pe). */
function sameText(body: string, a: number, e: number, pa: number, pe: number): boolean {
  if (e - a !== pe - pa) return false;
  for (let i = 0; i < e - a; i++) if (body.charCodeAt(a + i) !== body.charCodeAt(pa + i)) return false;
  return true;
}

export function fastLongValidate(body: string, sniff: SniffResult, mapping: Mapping, density = DEFAULT_POWER_DENSITY): ValidationResult | null {
  if (mapping.layout !== "long" || body.indexOf('"') !== -1) return null;
  const width = sniff.headers.length;
  const delim = sniff.delimiter;
  const dc = sniff.decimalComma;
  // column index → slot; slots: 0..6 numeric fields, 7 model, 8 type, 9 size, 10 notes
  const slotOf = new Int8Array(width).fill(-1);
  const factor = new Float64Array(7).fill(NaN);
  const colOf = new Int32Array(11).fill(-1);
  let minCol = -1; // the maker's minimum flow (min-flow.ts): one figure per curve, read per row below
  let minFactor = NaN;
  for (const c of mapping.columns) {
    if (c.field === "ignore" || c.index >= width) continue;
    if (c.field === "minflow") {
      if (minCol !== -1) return null;
      minCol = c.index;
      minFactor = SI_FACTOR.minflow[c.unit as Unit] ?? NaN;
      continue;
    }
    const k = NUMERIC.indexOf(c.field as NumericField);
    const slot = k >= 0 ? k : 7 + ["model", "type", "size", "notes"].indexOf(c.field);
    if (slot < 0 || colOf[slot] !== -1) return null;
    slotOf[c.index] = slot;
    colOf[slot] = c.index;
    if (k >= 0) {
      const f = SI_FACTOR[c.field as NumericField][c.unit as Unit];
      if (f === undefined) return null;
      factor[k] = f;
    }
  }
  if (colOf[2] < 0 || colOf[3] < 0) return null;
  const d = mapping.defaults;
  let defaultModel = "";
  if (colOf[7] < 0) {
    if (!d.model) return null;
    defaultModel = d.model;
  }
  const defSpeed = colOf[0] < 0 && d.speed !== undefined ? d.speed : null;
  const defImpeller = colOf[1] < 0 && d.impeller !== undefined && d.impellerUnit ? d.impeller * (SI_FACTOR.impeller[d.impellerUnit] ?? NaN) : null;
  if (colOf[0] < 0 && defSpeed === null) return null; // no-speed warning: the full path says it

  const cellStart = new Int32Array(width);
  const cellEnd = new Int32Array(width);
  const decimal = dc ? 44 : 46;
  const num = new Float64Array(7);
  const seen = new Set<string>();
  let cur: SetHead | null = null;
  let curModel = "";
  let lastA = -1; // model cell of the row above (body offsets), and its text trimmed: an unchanged cell makes no new string
  let lastE = -1;
  let lastRawTrim = "";
  let curSpeed: number | null = null;
  let curImpeller: number | null = null;
  let shape: HeadShape | null = null; // the current curve's head shape (the engine's rule, point-rules.ts), the flow before
  let prevFlow = 0;
  let best = -1; // best efficiency of the current curve (-1: none given)
  let bestPower = -1; // best efficiency its powers imply, ρgQH/P (point-rules.ts; -1: none)
  const powerImplausible = () => bestPower > 0 && bestPower < BEST_EFFICIENCY.min * (1 - 1e-9);
  // the current curve's powers: how many, their least and largest, the flows of the first and last (constant-power.ts)
  let powCount = 0, powMin = Infinity, powMax = -Infinity, powFirstFlow = NaN, powLastFlow = NaN;
  let curPoints = 0;
  let pointRows = 0;
  let lastModel = "";

  // skip to the first data record (no quotes: one record per line)
  let pos = 0;
  let line = 1;
  for (let r = 0; r < sniff.dataStartRow; r++) {
    const nl = body.indexOf("\n", pos);
    if (nl === -1) return null;
    pos = nl + 1;
    line++;
  }
  const len = body.length;
  let lines = 1; // records left at most (one per line): the store's size
  for (let at = body.indexOf("\n", pos); at !== -1 && at < len - 1; at = body.indexOf("\n", at + 1)) lines++;
  const store = new PointStore(lines);
  for (; pos < len; line++) {
    let end = body.indexOf("\n", pos);
    if (end === -1) end = len;
    // cells
    let col = 0;
    let start = pos;
    for (;;) {
      let cut = body.indexOf(delim, start);
      if (cut === -1 || cut > end) cut = end;
      if (col < width) {
        cellStart[col] = start;
        cellEnd[col] = cut;
      } else if (body.slice(start, cut).trim() !== "") return null; // extra cells: a warning
      col++;
      if (cut === end) break;
      start = cut + 1;
    }
    for (let k = col; k < width; k++) cellStart[k] = cellEnd[k] = end;
    const lineStart = pos;
    pos = end + 1;
    if (cellStart[colOf[2]] === cellEnd[colOf[2]] && cellStart[colOf[3]] === cellEnd[colOf[3]]) {
      if (BLANK_LINE.test(body.slice(lineStart, end))) continue; // a blank row (cells empty or spaces)
      return null;
    }
    pointRows++;

    for (let k = 0; k < 7; k++) {
      const ci = colOf[k];
      if (ci < 0) {
        num[k] = NaN;
        continue;
      }
      const a = cellStart[ci];
      const e = cellEnd[ci];
      if (a === e) {
        if (k <= 3) return null; // flow and head are required; whether a blank speed or diameter cell splits a curve is the full path's (blank-keys.ts)
        num[k] = NaN;
        continue;
      }
      numberAt(body, a, e, decimal, num, k);
      let x = num[k];
      if (x !== x) x = parseNumber(body.slice(a, e), dc);
      if (!(x >= 0) || ((k === 0 || k === 1) && x === 0)) return null; // not a number, negative, zero key
      const si = x * factor[k];
      if (!Number.isFinite(si) || si > 1e12 || (k === 4 && si > 1 + 1e-9)) return null;
      num[k] = si;
    }
    let model: string;
    if (colOf[7] >= 0) {
      const a = cellStart[colOf[7]];
      const e = cellEnd[colOf[7]];
      if (!sameText(body, a, e, lastA, lastE)) lastRawTrim = textCell(body.slice(a, e));
      lastA = a;
      lastE = e;
      model = lastRawTrim;
      if (model) lastModel = model;
      else if (mapping.fillDownModel && lastModel) model = lastModel;
      else return null;
    } else model = defaultModel;
    const speed = colOf[0] >= 0 ? num[0] : defSpeed;
    const impeller = colOf[1] >= 0 ? num[1] : defImpeller;

    if (!cur || model !== curModel || speed !== curSpeed || impeller !== curImpeller) {
      if (cur && curPoints < 3) return null; // too few points
      if (shape && (shape.drooping || shape.end())) return null; // a drooping curve's warning, or a curve rising along its length
      if (cur?.minFlow !== undefined && !minFlowFits(cur.minFlow, prevFlow)) return null; // a maker's minimum flow not below the curve's end
      if (best > 0 && !efficiencyPlausible(best)) return null; // implausible best efficiency
      if (powerImplausible()) return null; // powers far above ρgQH at every point: W read as kW
      if (looksLikeRating(powCount, powMin, powMax, powFirstFlow, powLastFlow)) return null; // one power at every point: a warning
      // the same model and one key the same, the other another, the flow rising on across: perhaps a mistyped key (stray-keys.ts)
      if (cur && model === curModel && (speed === curSpeed) !== (impeller === curImpeller) && num[2] > prevFlow) return null;
      const key = curveKey(model, speed, impeller);
      if (seen.has(key)) return null; // duplicate curve
      seen.add(key);
      cur = store.open({ key, model, speed, impellerDiameter: impeller });
      curModel = model;
      curSpeed = speed;
      curImpeller = impeller;
      curPoints = 0;
      best = -1;
      bestPower = -1;
      powCount = 0;
      powMin = Infinity;
      powMax = -Infinity;
    }
    for (let t = 8; t <= 10; t++) {
      const ci = colOf[t];
      if (ci < 0) continue;
      const f = t === 8 ? "type" : t === 9 ? "size" : "notes";
      if (cur[f] === undefined) {
        const v = textCell(body.slice(cellStart[ci], cellEnd[ci]));
        if (v) cur[f] = v;
      }
    }
    if (minCol >= 0 && cellStart[minCol] !== cellEnd[minCol]) {
      const m = parseNumber(body.slice(cellStart[minCol], cellEnd[minCol]), dc) * minFactor;
      // unreadable, not above zero, or another figure than the curve's first: the full path names it
      if (!(m > 0 && m <= 1e12) || (cur.minFlow !== undefined && cur.minFlow !== m)) return null;
      cur.minFlow = m;
    }
    const flow = num[2], head = num[3], eff = num[4], pow = num[5];
    // the engine's point rules (point-rules.ts): a zero power or NPSHr, or a zero efficiency at flow, needs a message
    if (pow === 0 || num[6] === 0 || (eff === 0 && flow > 0)) return null;
    if (num[6] < NPSHR_SMALL) return null; // an NPSHr below 0.1 m: a warning (npshr-small); NaN (absent) passes
    if (eff > 0 && eff < FRACTION_BELOW) return null; // an efficiency below 1 %: perhaps a fraction among percents (efficiency-fraction.ts)
    if (curPoints === 0) {
      if (!(head > 0)) return null;
      shape = importHeadShape(head, flow, line);
    } else {
      if (!(flow > prevFlow)) return null;
      if (shape!.judge(head)) return null;
      shape!.take(head, flow, line);
    }
    if (eff > best) best = eff; // NaN (no efficiency) is never above
    if (pow === pow && flow > 0) {
      const eta = powerEfficiency(flow, head, pow);
      if (eta > POWER_EFFICIENCY_MAX) return null; // a power below the hydraulic power: an error the full path names
      if (eta > bestPower) bestPower = eta;
    }
    if (eff === eff && pow === pow && pow > 0 && flow > 0) {
      const eta = (density * G_STANDARD * flow * head) / pow;
      // past the 3-point warning, or a ratio the hp signature may reach (point-rules.ts powerUnitSignature): the full path judges the curve
      if (Math.abs(eta - eff) > CONSISTENCY_TOLERANCE || eta < 0.8 * eff || eta > 1.25 * eff) return null;
    }
    if (pow === pow) {
      if (powCount++ === 0) powFirstFlow = flow;
      powLastFlow = flow;
      if (pow < powMin) powMin = pow;
      if (pow > powMax) powMax = pow;
    }
    store.lines[store.add(flow, head, eff, pow, num[6])] = line;
    prevFlow = flow;
    curPoints++;
  }
  if (pointRows === 0 || curPoints < 3 || (best > 0 && !efficiencyPlausible(best)) || powerImplausible()) return null;
  if (shape && (shape.drooping || shape.end())) return null;
  if (cur?.minFlow !== undefined && !minFlowFits(cur.minFlow, prevFlow)) return null;
  if (looksLikeRating(powCount, powMin, powMax, powFirstFlow, powLastFlow)) return null;
  const sets = store.sets.length;
  return packedResult(store, { pointRows, pointsAccepted: store.count, curveSets: sets, curveSetsOk: sets, errors: 0, warnings: 0 });
}
