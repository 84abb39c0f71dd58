/**
 * Pipe catalogue (data) and materials (roughness, Hazen-Williams C). Inch tables here; the
 * metric (DN) tables of EN 10255, EN 10217 / ISO 4200, EN 1057, ISO 4427 and EN 545 in pipesDN.ts.
 *
 * Every table carries its source. Values recalled rather than re-read from the standard are
 * labelled "from memory": keep them as data, correct them here when the standard is at hand.
 * Inner diameter is computed as OD − 2·wall from the inch dimensions (exact 25.4 mm/in).
 * A typed inner diameter is always allowed wherever a catalogue size can be used.
 */
import { EngineInputError, requirePositive } from "./errors.ts";
import { DN_TABLES } from "./pipesDN.ts";

/** One nominal size: outside diameter and wall, m; inner diameter derived, m. */
export interface PipeSize {
  /** Nominal size label, e.g. `"4"` (inches, NPS) or `"DN100"`. */
  nominal: string;
  /** Outside diameter, m. */
  outsideDiameter: number;
  /** Wall thickness, m. */
  wall: number;
  /** Inner diameter, m (OD − 2·wall − 2·lining). */
  innerDiameter: number;
}

/** A catalogue table: one material & schedule/class. */
export interface PipeTable {
  /** Stable id, e.g. `"steel-sch40"`. */
  id: string;
  /** Display name. */
  name: string;
  /** The standard it belongs to (the editor groups tables by it). */
  standard: string;
  /** Material id in {@link MATERIALS}. */
  material: string;
  /** Where the dimensions come from (standard, and "from memory" when recalled). */
  source: string;
  /** Sizes in ascending order. */
  sizes: readonly PipeSize[];
}

import { buildPipeTable } from "./pipe-table.ts";

const IN = 0.0254;

function table(id: string, name: string, standard: string, material: string, source: string, rows: readonly (readonly [string, number, number])[], lining?: (nominal: string, od: number) => number): PipeTable {
  return buildPipeTable({ id, name, standard, material, source }, rows, IN, lining);
}

// NPS outside diameters, in (ASME B36.10M; shared by ASTM D1785 PVC).
const NPS_OD: Record<string, number> = {
  "1/2": 0.84, "3/4": 1.05, "1": 1.315, "1-1/4": 1.66, "1-1/2": 1.9, "2": 2.375, "2-1/2": 2.875,
  "3": 3.5, "4": 4.5, "5": 5.563, "6": 6.625, "8": 8.625, "10": 10.75, "12": 12.75, "14": 14,
  "16": 16, "18": 18, "20": 20, "24": 24,
};
// Wall thickness, in: [Sch 40, Sch 80] (ASME B36.10M, from memory).
const STEEL_WALL: Record<string, readonly [number, number]> = {
  "1/2": [0.109, 0.147], "3/4": [0.113, 0.154], "1": [0.133, 0.179], "1-1/4": [0.14, 0.191],
  "1-1/2": [0.145, 0.2], "2": [0.154, 0.218], "2-1/2": [0.203, 0.276], "3": [0.216, 0.3],
  "4": [0.237, 0.337], "5": [0.258, 0.375], "6": [0.28, 0.432], "8": [0.322, 0.5],
  "10": [0.365, 0.594], "12": [0.406, 0.688], "14": [0.438, 0.75], "16": [0.5, 0.844],
  "18": [0.562, 0.938], "20": [0.594, 1.031], "24": [0.688, 1.219],
};
// Ascending nominal sizes (object key order would put "10" before "1/2").
const NPS_ORDER = ["1/2", "3/4", "1", "1-1/4", "1-1/2", "2", "2-1/2", "3", "4", "5", "6", "8", "10", "12", "14", "16", "18", "20", "24"];
const steelRows = (k: 0 | 1) =>
  NPS_ORDER.filter((n) => STEEL_WALL[n]).map((n) => [n, NPS_OD[n], STEEL_WALL[n][k]] as const);

// ASTM D1785 minimum wall, in: [Sch 40, Sch 80] (from memory). Sizes 1/2–12 only.
const PVC_WALL: Record<string, readonly [number, number]> = {
  "1/2": [0.109, 0.147], "3/4": [0.113, 0.154], "1": [0.133, 0.179], "1-1/4": [0.14, 0.191],
  "1-1/2": [0.145, 0.2], "2": [0.154, 0.218], "2-1/2": [0.203, 0.276], "3": [0.216, 0.3],
  "4": [0.237, 0.337], "5": [0.258, 0.375], "6": [0.28, 0.432], "8": [0.322, 0.5],
  "10": [0.365, 0.593], "12": [0.406, 0.687],
};
const pvcRows = (k: 0 | 1) =>
  NPS_ORDER.filter((n) => PVC_WALL[n]).map((n) => [n, NPS_OD[n], PVC_WALL[n][k]] as const);

// ASTM B88 copper water tube: OD = nominal + 1/8 in; walls, in: [type K, type L] (from memory).
const COPPER: readonly (readonly [string, number, number, number])[] = [
  ["1/4", 0.375, 0.035, 0.03], ["3/8", 0.5, 0.049, 0.035], ["1/2", 0.625, 0.049, 0.04],
  ["5/8", 0.75, 0.049, 0.042], ["3/4", 0.875, 0.065, 0.045], ["1", 1.125, 0.065, 0.05],
  ["1-1/4", 1.375, 0.065, 0.055], ["1-1/2", 1.625, 0.072, 0.06], ["2", 2.125, 0.083, 0.07],
  ["2-1/2", 2.625, 0.095, 0.08], ["3", 3.125, 0.109, 0.09], ["3-1/2", 3.625, 0.12, 0.1],
  ["4", 4.125, 0.134, 0.11], ["5", 5.125, 0.16, 0.125], ["6", 6.125, 0.192, 0.14],
  ["8", 8.125, 0.271, 0.2], ["10", 10.125, 0.338, 0.25], ["12", 12.125, 0.405, 0.28],
];

// AWWA C151 ductile iron, pressure class 350: OD and nominal wall, in (from memory), with
// AWWA C104 standard cement-mortar lining 1/16 in (3–12 in) and 3/32 in (14–24 in) (from memory).
const DUCTILE: readonly (readonly [string, number, number])[] = [
  ["3", 3.96, 0.25], ["4", 4.8, 0.25], ["6", 6.9, 0.25], ["8", 9.05, 0.25], ["10", 11.1, 0.26],
  ["12", 13.2, 0.28], ["14", 15.3, 0.31], ["16", 17.4, 0.34], ["18", 19.5, 0.36],
  ["20", 21.6, 0.38], ["24", 25.8, 0.43],
];
const ductileLining = (n: string) => (Number(n) >= 14 ? 3 / 32 : 1 / 16);

/** All catalogue tables. */
export const PIPE_TABLES: readonly PipeTable[] = [
  table("steel-sch40", "Steel, Schedule 40", "ASME B36.10M", "steel",
    "ASME B36.10M welded and seamless wrought steel pipe (from memory; inch dimensions)", steelRows(0)),
  table("steel-sch80", "Steel, Schedule 80", "ASME B36.10M", "steel",
    "ASME B36.10M welded and seamless wrought steel pipe (from memory; inch dimensions)", steelRows(1)),
  table("copper-k", "Copper tube, type K", "ASTM B88", "copper",
    "ASTM B88 seamless copper water tube (from memory)", COPPER.map(([n, od, k]) => [n, od, k] as const)),
  table("copper-l", "Copper tube, type L", "ASTM B88", "copper",
    "ASTM B88 seamless copper water tube (from memory)", COPPER.map(([n, od, , l]) => [n, od, l] as const)),
  table("pvc-sch40", "PVC, Schedule 40", "ASTM D1785", "pvc",
    "ASTM D1785 PVC pipe, minimum wall (from memory); ID = OD − 2 × minimum wall", pvcRows(0)),
  table("pvc-sch80", "PVC, Schedule 80", "ASTM D1785", "pvc",
    "ASTM D1785 PVC pipe, minimum wall (from memory); ID = OD − 2 × minimum wall", pvcRows(1)),
  table("ductile-pc350", "Ductile iron, pressure class 350, cement-mortar lined", "AWWA C151", "ductile-iron-lined",
    "AWWA C151 pressure class 350 with AWWA C104 standard lining (from memory)", DUCTILE, ductileLining),
  ...DN_TABLES,
];

/**
 * Finds a catalogue table; throws {@link EngineInputError} if unknown.
 * @param tableId catalogue id, e.g. "steel-sch40" (unitless id)
 */
export function pipeTable(tableId: string): PipeTable {
  const t = PIPE_TABLES.find((x) => x.id === tableId);
  if (!t) throw new EngineInputError("tableId", `unknown pipe table "${tableId}"`);
  return t;
}

/**
 * Inner diameter of a nominal size.
 * @param tableId catalogue id (unitless id)
 * @param nominal nominal size label, e.g. "4" (unitless label)
 * @returns inner diameter, m
 */
export function innerDiameter(tableId: string, nominal: string): number {
  const t = pipeTable(tableId);
  const s = t.sizes.find((x) => x.nominal === nominal);
  if (!s) throw new EngineInputError("nominal", `${t.name} has no size "${nominal}"`);
  return s.innerDiameter;
}

/** A pipe material: absolute roughness new and aged, and a Hazen-Williams C. */
export interface Material {
  id: string;
  name: string;
  /** Absolute roughness of new pipe, m. */
  roughnessNew: number;
  /** Typical aged roughness, m (a design allowance). */
  roughnessAged: number;
  /** Hazen-Williams C, new (dimensionless in the SI form used here). */
  hazenWilliamsC: number;
  /** Hazen-Williams C, aged. */
  hazenWilliamsCAged: number;
  /** Sources for each number. */
  source: string;
}

const MOODY = "Moody (1944) roughness table as reprinted in common fluid-mechanics texts (from memory)";
const AGED = "aged value: our design allowance, from memory of common design tables";
const HW = "Hazen-Williams C: common practice (from memory)";

/** Materials. Roughness in m. */
export const MATERIALS: readonly Material[] = [
  { id: "steel", name: "Commercial steel", roughnessNew: 0.045e-3, roughnessAged: 0.5e-3,
    hazenWilliamsC: 120, hazenWilliamsCAged: 100, source: `${MOODY}; ${AGED}; ${HW}` },
  { id: "galvanised", name: "Galvanised iron", roughnessNew: 0.15e-3, roughnessAged: 0.5e-3,
    hazenWilliamsC: 120, hazenWilliamsCAged: 100, source: `${MOODY}; ${AGED}; ${HW}` },
  { id: "cast-iron", name: "Cast iron", roughnessNew: 0.26e-3, roughnessAged: 1.0e-3,
    hazenWilliamsC: 130, hazenWilliamsCAged: 100, source: `${MOODY}; ${AGED}; ${HW}` },
  { id: "asphalted-cast-iron", name: "Asphalted cast iron", roughnessNew: 0.12e-3, roughnessAged: 0.5e-3,
    hazenWilliamsC: 130, hazenWilliamsCAged: 100, source: `${MOODY}; ${AGED}; ${HW}` },
  { id: "ductile-iron-lined", name: "Ductile iron, cement-mortar lined", roughnessNew: 0.1e-3,
    roughnessAged: 0.3e-3, hazenWilliamsC: 130, hazenWilliamsCAged: 120,
    source: `roughness from memory of common design tables (lined ductile iron 0.03–0.3 mm); ${HW}` },
  { id: "copper", name: "Copper / drawn tubing", roughnessNew: 0.0015e-3, roughnessAged: 0.01e-3,
    hazenWilliamsC: 140, hazenWilliamsCAged: 130, source: `${MOODY}; ${AGED}; ${HW}` },
  { id: "pvc", name: "PVC / plastics", roughnessNew: 0.0015e-3, roughnessAged: 0.01e-3,
    hazenWilliamsC: 150, hazenWilliamsCAged: 140, source: `${MOODY}; ${AGED}; ${HW}` },
  { id: "concrete", name: "Concrete", roughnessNew: 0.3e-3, roughnessAged: 3e-3,
    hazenWilliamsC: 130, hazenWilliamsCAged: 100, source: `${MOODY} (0.3–3 mm); ${AGED}; ${HW}` },
  { id: "riveted-steel", name: "Riveted steel", roughnessNew: 0.9e-3, roughnessAged: 9e-3,
    hazenWilliamsC: 110, hazenWilliamsCAged: 90, source: `${MOODY} (0.9–9 mm); ${AGED}; ${HW}` },
];

/**
 * Finds a material; throws {@link EngineInputError} if unknown.
 * @param materialId material id, e.g. "steel" (unitless id)
 */
export function material(materialId: string): Material {
  const m = MATERIALS.find((x) => x.id === materialId);
  if (!m) throw new EngineInputError("materialId", `unknown material "${materialId}"`);
  return m;
}

/**
 * Checks a typed inner diameter and returns it.
 * @param diameter inner diameter, m
 */
export function typedDiameter(diameter: number): number {
  return requirePositive("diameter", diameter);
}
