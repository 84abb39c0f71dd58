/**
 * Column mapping: which column holds which field in which unit, long or wide layout.
 * A Mapping is a plain JSON object: it is saved per library and offered again, and comes back
 * from a form, where MappingSchema validates it. Pure: no Node or DOM APIs.
 */
import { filledCellsBeyond, shiftedRowReason, unnamedNumberReason, unnamedTailOf } from "./shifted-cells";
import * as v from "valibot";
import { parseNumber } from "./numbers";
import { oneLine } from "./text-cells";
import type { Delimiter, SourceRow } from "./parse";
import type { Problem } from "./types";
import { powerKindMessage } from "./power-kinds";
import {
  DIAMETER_UNITS,
  EFFICIENCY_UNITS,
  FIELDS,
  FLOW_UNITS,
  LENGTH_UNITS,
  NUMERIC_FIELDS,
  POWER_UNITS,
  SPEED_UNITS,
  guessHeader,
  headerPowerKind,
  headerUnitRefusal,
  refusalMessage,
  unitAllowed,
  type DiameterUnit,
  type Field,
  type NumericField,
  type TextField,
  type Unit,
} from "./units-in-headers";

// ---------- schema ----------

const ALL_UNITS = [
  ...new Set<string>([...FLOW_UNITS, ...LENGTH_UNITS, ...DIAMETER_UNITS, ...EFFICIENCY_UNITS, ...POWER_UNITS, ...SPEED_UNITS]),
] as Unit[];

const Positive = v.pipe(v.number(), v.finite(), v.gtValue(0, "must be greater than zero"));

export const BlockSchema = v.pipe(
  v.object({
    speed: v.optional(Positive),
    impeller: v.optional(Positive),
    impellerUnit: v.optional(v.picklist(DIAMETER_UNITS)),
  }),
  v.check((b) => b.speed !== undefined || b.impeller !== undefined, "a block needs a speed or an impeller diameter"),
  v.check((b) => (b.impeller === undefined) === (b.impellerUnit === undefined), "an impeller diameter needs its unit"),
);

export const MappedColumnSchema = v.pipe(
  v.object({
    index: v.pipe(v.number(), v.integer(), v.minValue(0)),
    header: v.string(),
    field: v.picklist(FIELDS),
    unit: v.nullable(v.picklist(ALL_UNITS)),
    /** Where the unit came from: read in the header, judged from the data, assumed, or chosen by the user. */
    unitSource: v.optional(v.picklist(["header", "data", "default", "user"])),
    /** Wide layout only: the curve this column belongs to ("Head 250mm" → impeller 250 mm). */
    block: v.optional(v.nullable(BlockSchema)),
  }),
  v.check((c) => unitAllowed(c.field, c.unit), "this unit does not fit the field"),
  v.check((c) => !c.block || c.field === "flow" || c.field === "head" || c.field === "efficiency" || c.field === "power" || c.field === "npshr" || c.field === "minflow",
    "only flow, head, efficiency, power, NPSHr and maker's minimum flow columns can belong to a block"),
);

export const MappingSchema = v.pipe(
  v.object({
    version: v.literal(1),
    layout: v.picklist(["long", "wide"]),
    columns: v.array(MappedColumnSchema),
    /** Values used when the file has no such column (a file for one model, one speed...). */
    defaults: v.object({
      model: v.optional(v.pipe(v.string(), v.trim(), v.nonEmpty(), v.transform(oneLine))), // a model name is one line (text-cells.ts)
      speed: v.optional(Positive),
      impeller: v.optional(Positive),
      impellerUnit: v.optional(v.picklist(DIAMETER_UNITS)),
      /** Fluid and temperature as read from a title line (shown for the user to confirm; text only). */
      fluid: v.optional(v.pipe(v.string(), v.trim(), v.maxLength(120))),
    }),
    /** Copy the model down into rows whose model cell is blank (exports that name the model once per block). */
    fillDownModel: v.boolean(),
    /** Copy speed and impeller diameter down into blank cells of their columns (from the row above). */
    fillDownKeys: v.optional(v.boolean()),
    /** What to do with a curve that has bad points: keep it out (skip-curves, the default) or drop the points (drop-points). */
    policy: v.optional(v.picklist(["skip-curves", "drop-points"])),
    /** Text encoding of the upload as chosen on the mapping page (server side; see decode.ts). */
    encoding: v.optional(v.picklist(["utf-8", "utf-16le", "utf-16be", "windows-1252"])),
    /** Corrections to what the sniffer found. */
    source: v.optional(
      v.object({
        delimiter: v.optional(v.picklist([",", ";", "\t"])),
        decimalComma: v.optional(v.boolean()),
        headerRowIndex: v.optional(v.pipe(v.number(), v.integer(), v.minValue(0))),
      }),
    ),
  }),
  v.check((m) => new Set(m.columns.map((c) => c.index)).size === m.columns.length, "a column is mapped twice"),
  v.check((m) => m.columns.some((c) => c.field === "flow"), "map a column to flow"),
  v.check((m) => m.columns.some((c) => c.field === "head"), "map a column to head"),
  v.check((m) => m.layout === "wide" || m.columns.every((c) => !c.block), "a long layout has no column blocks"),
  v.check((m) => m.layout === "long" || m.columns.some((c) => c.block), "a wide layout needs at least one column block"),
  v.check(
    (m) => (m.defaults.impeller === undefined) === (m.defaults.impellerUnit === undefined),
    "a default impeller diameter needs its unit",
  ),
);

export type Mapping = v.InferOutput<typeof MappingSchema>;
export type MappedColumn = v.InferOutput<typeof MappedColumnSchema>;
export type Block = v.InferOutput<typeof BlockSchema>;

// ---------- suggestion ----------

/** Guess a mapping from header text, using a sample of data rows to settle efficiency % vs fraction. */
export function suggestMapping(headers: string[], sample: SourceRow[], decimalComma: boolean): Mapping {
  const columns: MappedColumn[] = headers.map((header, index) => {
    const g = guessHeader(header);
    const col: MappedColumn = {
      index,
      header,
      field: g.field,
      unit: g.unit,
      unitSource: g.unit === null ? undefined : g.unitFromHeader ? "header" : "default",
    };
    if (g.qualifier) col.block = { ...g.qualifier };
    if (g.field === "efficiency" && !g.unitFromHeader) {
      // Percent when values above 1.5 are at least as many as values in (0, 1] (zeros at shutoff say
      // nothing): most values decide, not the largest, so one typo (1.6 among fractions) does not read
      // the whole column in percent. Each curve set's best efficiency is then checked after conversion
      // (point-rules.ts): a curve written in the other unit is flagged, never imported 100× off.
      let percent = 0;
      let fraction = 0;
      let read = false;
      for (const r of sample) {
        const x = parseNumber(r.cells[index] ?? "", decimalComma);
        if (Number.isNaN(x)) continue;
        read = true;
        if (x > 1.5) percent++;
        else if (x > 0 && x <= 1) fraction++;
      }
      if (read) {
        col.unit = percent > 0 && percent >= fraction ? "%" : "fraction";
        col.unitSource = "data";
      }
    }
    return col;
  });

  // No model column by name: take the first unnamed column that holds text.
  if (!columns.some((c) => c.field === "model")) {
    const textCol = columns.find((c) => {
      if (c.field !== "ignore") return false;
      const cells = sample.map((r) => (r.cells[c.index] ?? "").trim()).filter(Boolean);
      return cells.length > 0 && cells.filter((x) => Number.isNaN(parseNumber(x, decimalComma))).length / cells.length > 0.8;
    });
    if (textCol) textCol.field = "model";
  }

  // One column per field; later repeats are left for the user (ignored). A P1 (electrical input) column, or any other
  // power that is not shaft power, is never guessed as power (power-kinds.ts), so a P2 column is the power column wherever it stands.
  // Columns of wide blocks are kept as they are: two blocks with the same qualifier are shown to the
  // user by checkMapping rather than silently dropped.
  const seen = new Map<string, MappedColumn>();
  for (const c of columns) {
    if (c.field === "ignore" || c.field === "notes" || c.block) continue;
    const k = `${c.field}|${JSON.stringify(c.block ?? null)}`;
    const prev = seen.get(k);
    if (!prev) {
      seen.set(k, c);
      continue;
    }
    // A column whose header unit can be read wins over one whose unit word is refused ("Head (m)" over "Head (kPa)").
    const readable = headerUnitRefusal(prev.header, prev.field) !== null && headerUnitRefusal(c.header, c.field) === null;
    if (readable) {
      prev.field = "ignore";
      prev.unit = null;
      prev.unitSource = undefined;
      seen.set(k, c);
    } else {
      c.field = "ignore";
      c.unit = null;
      c.unitSource = undefined;
      c.block = undefined;
    }
  }

  const wide = columns.some((c) => c.block);
  return {
    version: 1,
    layout: wide ? "wide" : "long",
    columns: columns.map(clean),
    defaults: {},
    fillDownModel: false,
  };
}

function clean(c: MappedColumn): MappedColumn {
  const out: MappedColumn = { index: c.index, header: c.header, field: c.field, unit: c.unit };
  if (c.unitSource) out.unitSource = c.unitSource;
  if (c.block) out.block = c.block;
  return out;
}

// ---------- wide → long ----------

export type KeyField = Exclude<Field, "ignore">;

export interface Cell {
  raw: string;
  /** Header text of the column the value came from ("(default)" for mapping defaults). */
  column: string;
  unit: Unit | null;
  /** Already-numeric value (from a block qualifier or a mapping default), in `unit`. */
  preset?: number;
}

export interface LongRow {
  /** 1-based source line. */
  line: number;
  /** 0 for the long layout; the block's position for the wide layout. */
  block: number;
  cells: Partial<Record<KeyField, Cell>>;
  /** Numbers beyond the header's columns: why the row's cells cannot be read by their columns (shifted-cells.ts); validate.ts refuses the point. */
  shifted?: string;
  /** The column the shifted reason is charged to (the last named column, when a number spilled into an unnamed one after it); none for the whole row. */
  shiftedColumn?: string;
}

interface BlockPlan {
  qualifier: Block;
  columns: MappedColumn[];
  label: string;
}

const POINT_FIELDS: NumericField[] = ["flow", "head", "efficiency", "power", "npshr"];

/** Structural problems of a mapping against this file's header row (reported at the header line). */
export function checkMapping(mapping: Mapping, headers: string[], headerLine: number): Problem[] {
  const problems: Problem[] = [];
  const p = (reason: string, column: string | null, severity: "error" | "warning" = "error", code: Problem["code"] = "mapping") =>
    problems.push({ row: headerLine, column, reason, severity, code, curveKey: null });
  for (const c of mapping.columns) {
    if (c.field === "ignore") continue;
    if (c.index >= headers.length) p(`column ${c.index + 1} (“${c.header}”) is mapped to ${c.field} but the file has only ${headers.length} columns`, c.header);
    else if (c.header !== headers[c.index])
      p(`column ${c.index + 1} was saved as “${c.header}” but this file calls it “${headers[c.index]}”: check its field and unit`, headers[c.index], "warning", "header-changed");
    // A unit word the field does not take (head in kPa, speed in Hz) is an error until the user chooses the unit for this header.
    const h = headers[c.index] ?? c.header;
    const refused = c.unitSource !== "user" || h !== c.header ? headerUnitRefusal(h, c.field) : null;
    if (refused) p(refusalMessage(h, refused), h);
  }
  const used = mapping.columns.filter((c) => c.field !== "ignore" && c.field !== "notes");
  // A header naming a power that is not shaft power (P1, hydraulic, per-unit) or one with two readings (P_w, Förderleistung):
  // say so when it is mapped to power, and when it was left out of a file that then lacks what it may hold (power-kinds.ts).
  const mapped = {
    efficiency: used.find((c) => c.field === "efficiency")?.header ?? null,
    hasPower: used.some((c) => c.field === "power"),
    hasFlow: used.some((c) => c.field === "flow"),
  };
  headers.forEach((h, i) => {
    const field = mapping.columns.find((c) => c.index === i)?.field ?? "ignore"; // a column a mapping leaves out is unmapped
    const kind = field === "power" || field === "ignore" ? headerPowerKind(h) : null;
    const say = kind && powerKindMessage(kind, h, field, mapped);
    if (say) p(say, h, "warning");
  });
  const byKey = new Map<string, MappedColumn[]>();
  for (const c of used) {
    const k = `${c.field}|${JSON.stringify(c.block ?? null)}`;
    byKey.set(k, [...(byKey.get(k) ?? []), c]);
  }
  for (const cols of byKey.values())
    if (cols.length > 1)
      p(`${cols.length} columns are mapped to ${cols[0].field}${cols[0].block ? ` for ${blockLabel(cols[0].block)}` : ""}: ${cols.map((c) => `“${c.header}”`).join(", ")}`, cols[1].header);
  if (!used.some((c) => c.field === "model") && !mapping.defaults.model) p("no column is mapped to model and no default model is set", null);
  if (mapping.layout === "wide") {
    const sharedFlow = used.some((c) => c.field === "flow" && !c.block);
    for (const b of plan(mapping).blocks)
      if (!sharedFlow && !b.columns.some((c) => c.field === "flow"))
        p(`the block for ${b.label} has no flow column and there is no shared flow column`, b.columns[0].header);
  }
  return problems;
}

export function blockLabel(b: Block): string {
  const parts: string[] = [];
  if (b.speed !== undefined) parts.push(`${b.speed} rpm`);
  if (b.impeller !== undefined) parts.push(`${b.impeller} ${b.impellerUnit ?? "mm"}`);
  return parts.join(", ");
}

function plan(mapping: Mapping): { shared: MappedColumn[]; blocks: BlockPlan[] } {
  const shared: MappedColumn[] = [];
  const blocks = new Map<string, BlockPlan>();
  for (const c of mapping.columns) {
    if (c.field === "ignore") continue;
    if (mapping.layout === "wide" && c.block) {
      const k = JSON.stringify([c.block.speed ?? null, c.block.impeller ?? null, c.block.impellerUnit ?? null]);
      let b = blocks.get(k);
      if (!b) blocks.set(k, (b = { qualifier: c.block, columns: [], label: blockLabel(c.block) }));
      b.columns.push(c);
    } else shared.push(c);
  }
  return { shared, blocks: [...blocks.values()] };
}

/**
 * Turn parsed data rows into one LongRow per point. Long layout: one per row. Wide layout: one per
 * row and block, with the block's qualifier (speed or impeller) as a preset value; a block whose
 * point cells are all blank on a row is skipped (its curve ended earlier than the others).
 * Also reports rows with content beyond the header (warning) and rows without point values.
 */
export function toLongRows(rows: SourceRow[], mapping: Mapping, headers: string[], delimiter?: Delimiter): { rows: LongRow[]; problems: Problem[] } {
  const out: LongRow[] = [];
  const problems: Problem[] = [];
  const { shared, blocks } = plan(mapping);
  const defaults: Partial<Record<KeyField, Cell>> = {};
  const d = mapping.defaults;
  if (d.model && !shared.some((c) => c.field === "model")) defaults.model = { raw: d.model, column: "(default)", unit: null };
  if (d.speed !== undefined) defaults.speed = { raw: String(d.speed), column: "(default)", unit: "rpm", preset: d.speed };
  if (d.impeller !== undefined && d.impellerUnit)
    defaults.impeller = { raw: String(d.impeller), column: "(default)", unit: d.impellerUnit, preset: d.impeller };
  const modelCol = shared.find((c) => c.field === "model");
  let lastModel = "";
  const lastKey: Partial<Record<"speed" | "impeller", string>> = {};

  // A decimal comma in the last named column of a comma-separated file spills into an unnamed column (shifted-cells.ts).
  const tail = delimiter === "," ? unnamedTailOf(headers, new Set(mapping.columns.filter((c) => c.field !== "ignore").map((c) => c.index))) : null;
  const cellOf = (row: SourceRow, c: MappedColumn): Cell => ({ raw: row.cells[c.index] ?? "", column: c.header, unit: (c.unit ?? null) as Unit | null });

  for (const row of rows) {
    const extra = filledCellsBeyond(row.cells, headers.length);
    const beyond = extra ? shiftedRowReason(row.cells, headers.length) : null;
    if (extra && !beyond)
      problems.push({ row: row.line, column: null, reason: `row has ${extra} filled cell(s) beyond the ${headers.length} header columns; they were ignored`, severity: "warning", code: "extra-cells", curveKey: null });
    const spilt = beyond || !tail ? null : unnamedNumberReason(row.cells, headers, tail);
    const shifted = beyond ?? spilt?.reason ?? null;
    const moved = shifted ? { shifted, ...(spilt ? { shiftedColumn: spilt.column } : {}) } : {};

    const base: Partial<Record<KeyField, Cell>> = { ...defaults };
    for (const c of shared) base[c.field as KeyField] = cellOf(row, c);
    if (modelCol) {
      const m = base.model!.raw.trim();
      if (m) lastModel = m;
      else if (mapping.fillDownModel && lastModel) base.model = { ...base.model!, raw: lastModel };
    }
    // Blank speed/diameter cells of mapped columns: the row above's value when ticked, else the
    // value set for blank cells (mapping defaults), else left blank for validation to name.
    for (const f of ["speed", "impeller"] as const) {
      const cell = base[f];
      if (!cell || cell.column === "(default)") continue;
      const raw = cell.raw.trim();
      if (raw) lastKey[f] = cell.raw;
      else if (mapping.fillDownKeys && lastKey[f] !== undefined) base[f] = { ...cell, raw: lastKey[f]! };
      else if (defaults[f]) base[f] = defaults[f];
    }

    if (blocks.length === 0) {
      if (POINT_FIELDS.every((f) => !base[f] || base[f]!.raw.trim() === "")) {
        // A row naming its curve (model with speed or impeller) but no point values was cut short:
        // pass it on so validation charges "flow is empty" to that curve instead of skipping it quietly.
        const keyed = (base.model?.raw.trim() ?? "") !== "" && ((base.speed?.raw.trim() ?? "") !== "" || (base.impeller?.raw.trim() ?? "") !== "");
        if (keyed && !(base.speed?.preset !== undefined && base.impeller?.preset !== undefined && !row.cells[modelCol?.index ?? -1]?.trim())) {
          out.push({ line: row.line, block: 0, cells: base });
          continue;
        }
        if (!(mapping.fillDownModel && modelCol && row.cells[modelCol.index]?.trim()))
          problems.push({ row: row.line, column: null, reason: "row has no point values (flow, head...); skipped", severity: "warning", code: "no-point-values", curveKey: null });
        continue;
      }
      out.push({ line: row.line, block: 0, cells: base, ...moved });
      continue;
    }

    let any = false;
    blocks.forEach((b, bi) => {
      const own = b.columns.map((c) => cellOf(row, c));
      if (own.every((x, i) => x.raw.trim() === "" || !POINT_FIELDS.includes(b.columns[i].field as NumericField))) return; // a maker's minimum flow alone is no point
      any = true;
      const cells: Partial<Record<KeyField, Cell>> = { ...base };
      b.columns.forEach((c, i) => (cells[c.field as KeyField] = own[i]));
      const q = b.qualifier;
      if (q.speed !== undefined) cells.speed = { raw: String(q.speed), column: b.columns[0].header, unit: "rpm", preset: q.speed };
      if (q.impeller !== undefined)
        cells.impeller = { raw: String(q.impeller), column: b.columns[0].header, unit: (q.impellerUnit ?? "mm") as DiameterUnit, preset: q.impeller };
      out.push({ line: row.line, block: bi, cells, ...moved });
    });
    if (!any && !(mapping.fillDownModel && modelCol && row.cells[modelCol.index]?.trim()))
      problems.push({ row: row.line, column: null, reason: "row has no point values in any block; skipped", severity: "warning", code: "no-point-values", curveKey: null });
  }
  return { rows: out, problems };
}

export type { Field, NumericField, TextField };
export { NUMERIC_FIELDS };
