/**
 * Title lines above the header ("Curve data, Model HC-3x2-8 - 3500 rpm, impeller Ø 190 mm,
 * water 20 °C"): model, speed, impeller diameter and fluid read from them, and proposed as the
 * mapping's defaults when no column holds them. The user sees and confirms them on the mapping
 * page. Pure: no Node or DOM APIs.
 */
import type { Mapping } from "./mapping";
import { parseRows } from "./parse";
import type { SniffResult } from "./sniff";

export interface TitleInfo {
  /** The title lines as text (cells joined by a space), top to bottom. */
  lines: string[];
  model?: string;
  /** rpm */
  speed?: number;
  impeller?: number;
  impellerUnit?: "mm" | "in";
  /** Fluid and temperature as written, e.g. "water 20 °C". */
  fluid?: string;
}

const num = (s: string) => Number(s.replace(",", "."));

// Speed: "3500 rpm", "2900 1/min", "1450 min-1", "2900 U/min" (a bare number of 3–5 digits before the unit).
const SPEED = /(?:^|[^\d.,])(\d{3,5}(?:[.,]\d+)?)\s*(?:rpm|r\/min|1\/min|min-1|min⁻¹|u\/min)(?![a-z])/i;
// Impeller: "Ø190 mm", "impeller 190 mm", "dia. 7.5 in", "D = 190mm", "190 mm impeller".
const IMPELLER_BEFORE = /(?:[Øø⌀]|\bimpeller(?:\s+dia(?:meter|\.)?)?|\bdia(?:meter|\.)?|\bd\s*=)\s*[:=]?\s*(\d+(?:[.,]\d+)?)\s*(mm|in\b|inch(?:es)?|")?/i;
const IMPELLER_AFTER = /(\d+(?:[.,]\d+)?)\s*(mm|in|inch(?:es)?|")\s+(?:impeller|trim)\b/i;
// Model: the word after "model"/"type"/"pump" up to a separator ( - , ; | ( ) or a speed/diameter phrase.
const MODEL = /\b(?:model|modell|modèle|pump model|type)\b\s*[:#]?\s*(.+)$/i;
const FLUID_WORD = /\b(?:fluid|medium|liquid|fluide|medien)\b\s*[:=]?\s*([^,;|]+)/i;
const FLUID_TEMP = /\b((?:clean |cold |hot |sea ?)?water|glycol[^,;|]*?|brine|oil)\b[^,;|\d]*?(-?\d+(?:[.,]\d+)?)\s*°\s*([CF])\b/i;

function readModel(line: string): string | undefined {
  const m = MODEL.exec(line);
  if (!m) return undefined;
  let rest = m[1];
  const stops = [/\s+[-–—]\s+/, /[,;|(]/, SPEED, IMPELLER_BEFORE, /\s{2,}/];
  for (const r of stops) {
    const x = r.exec(rest);
    if (x && x.index >= 0) rest = rest.slice(0, x.index);
  }
  rest = rest.trim().replace(/[.:]+$/, "");
  return rest && rest.length <= 160 ? rest : undefined;
}

export function readTitle(body: string, sniff: Pick<SniffResult, "delimiter" | "headerRowIndex" | "headerRowCount">): TitleInfo {
  // A group row ("2900 rpm;;1450 rpm") merged into the header is not a title.
  const n = sniff.headerRowIndex;
  if (n <= 0) return { lines: [] };
  const records = parseRows(body, { delimiter: sniff.delimiter, maxRows: n }).rows;
  const lines = records
    .map((r) => r.cells.map((c) => c.trim()).filter(Boolean).join(" "))
    .filter((l) => l !== "");
  const out: TitleInfo = { lines };
  for (const l of lines) {
    if (out.model === undefined) out.model = readModel(l);
    if (out.speed === undefined) {
      const s = SPEED.exec(l);
      if (s) {
        const x = num(s[1]);
        if (x >= 100 && x <= 100_000) out.speed = x;
      }
    }
    if (out.impeller === undefined) {
      const d = IMPELLER_BEFORE.exec(l) ?? IMPELLER_AFTER.exec(l);
      if (d) {
        const x = num(d[1]);
        const unit = d[2] && !/mm/i.test(d[2]) ? "in" : "mm";
        if (x > 0 && (unit === "in" ? x < 100 : x >= 10 && x < 5000)) {
          out.impeller = x;
          out.impellerUnit = unit;
        }
      }
    }
    if (out.fluid === undefined) {
      const t = FLUID_TEMP.exec(l);
      const f = FLUID_WORD.exec(l);
      if (t) out.fluid = `${t[1].trim()} ${t[2].replace(",", ".")} °${t[3].toUpperCase()}`;
      else if (f) out.fluid = f[1].trim().slice(0, 120);
    }
  }
  return out;
}

/** Proposes what the title holds as mapping defaults, only where no column (or column block) gives it. */
export function withTitleDefaults(m: Mapping, t: TitleInfo): Mapping {
  const has = (f: string) => m.columns.some((c) => c.field === f);
  const blocks = (k: "speed" | "impeller") => m.columns.some((c) => c.block?.[k] !== undefined);
  const defaults = { ...m.defaults };
  if (t.model && !has("model") && !defaults.model) defaults.model = t.model;
  if (t.speed && !has("speed") && !blocks("speed") && defaults.speed === undefined) defaults.speed = t.speed;
  if (t.impeller && t.impellerUnit && !has("impeller") && !blocks("impeller") && defaults.impeller === undefined) {
    defaults.impeller = t.impeller;
    defaults.impellerUnit = t.impellerUnit;
  }
  if (t.fluid && !defaults.fluid) defaults.fluid = t.fluid;
  return { ...m, defaults };
}
