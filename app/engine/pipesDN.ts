/**
 * Metric (DN) pipe tables, European and ISO standards. Dimensions in mm as printed in the
 * standards' tables, converted to m. Inner diameter = OD − 2·wall (− 2·lining where lined).
 * Every table says where its numbers come from; "from memory" means recalled, not re-read from
 * the standard: check against the standard or the maker's data for a contract.
 * Valid only for the sizes listed: any other size is refused (EngineInputError in `innerDiameter`).
 */
import type { PipeTable } from "./pipes.ts";
import { buildPipeTable } from "./pipe-table.ts";

const MM = 1e-3;

function dnTable(id: string, name: string, standard: string, material: string, source: string, rows: readonly (readonly [string, number, number])[], lining?: (nominal: string, od: number) => number): PipeTable {
  return buildPipeTable({ id, name, standard, material, source }, rows, MM, lining);
}

// EN 10255 medium series (M), non-alloy steel tubes for welding and threading (the former BS 1387
// medium): OD and wall, mm (from memory).
const EN10255_M: readonly (readonly [string, number, number])[] = [
  ["DN6", 10.2, 2.0], ["DN8", 13.5, 2.3], ["DN10", 17.2, 2.3], ["DN15", 21.3, 2.6], ["DN20", 26.9, 2.6],
  ["DN25", 33.7, 3.2], ["DN32", 42.4, 3.2], ["DN40", 48.3, 3.2], ["DN50", 60.3, 3.6], ["DN65", 76.1, 3.6],
  ["DN80", 88.9, 4.0], ["DN100", 114.3, 4.5], ["DN125", 139.7, 5.0], ["DN150", 165.1, 5.0],
];

// EN 10217-1 welded steel tubes, outside diameters of EN 10220 / ISO 4200 (series 1), with the wall
// thicknesses commonly stocked for heating and cooling (the former DIN 2458 "normal" walls), mm
// (from memory; ISO 4200 lists many walls per OD — pick the one ordered).
const EN10217: readonly (readonly [string, number, number])[] = [
  ["DN15", 21.3, 2.0], ["DN20", 26.9, 2.3], ["DN25", 33.7, 2.6], ["DN32", 42.4, 2.6], ["DN40", 48.3, 2.6],
  ["DN50", 60.3, 2.9], ["DN65", 76.1, 2.9], ["DN80", 88.9, 3.2], ["DN100", 114.3, 3.6], ["DN125", 139.7, 4.0],
  ["DN150", 168.3, 4.5], ["DN200", 219.1, 5.9], ["DN250", 273.0, 6.3], ["DN300", 323.9, 7.1],
  ["DN350", 355.6, 8.0], ["DN400", 406.4, 8.8], ["DN450", 457.0, 10.0], ["DN500", 508.0, 11.0],
];

// EN 1057 copper tube, R250 (half-hard) / R290 (hard), the walls usual in UK building services
// (the former BS 2871 "Table X"), mm (from memory).
const EN1057: readonly (readonly [string, number, number])[] = [
  ["8 × 0.6", 8, 0.6], ["10 × 0.6", 10, 0.6], ["12 × 0.6", 12, 0.6], ["15 × 0.7", 15, 0.7], ["22 × 0.9", 22, 0.9],
  ["28 × 0.9", 28, 0.9], ["35 × 1.2", 35, 1.2], ["42 × 1.2", 42, 1.2], ["54 × 1.2", 54, 1.2],
  ["66.7 × 1.2", 66.7, 1.2], ["76.1 × 1.5", 76.1, 1.5], ["108 × 1.5", 108, 1.5], ["133 × 1.5", 133, 1.5],
  ["159 × 2.0", 159, 2.0],
];

// ISO 4427-2 PE100 pressure pipe: nominal OD and minimum wall e_min, mm (from memory of the
// standard's table; e_min ≈ d_n / SDR rounded up to 0.1 mm). ID from the minimum wall: the
// actual bore is slightly smaller (mean wall a few per cent thicker).
const PE_SDR11: readonly (readonly [string, number, number])[] = [
  ["d20", 20, 2.0], ["d25", 25, 2.3], ["d32", 32, 3.0], ["d40", 40, 3.7], ["d50", 50, 4.6], ["d63", 63, 5.8],
  ["d75", 75, 6.8], ["d90", 90, 8.2], ["d110", 110, 10.0], ["d125", 125, 11.4], ["d140", 140, 12.7],
  ["d160", 160, 14.6], ["d180", 180, 16.4], ["d200", 200, 18.2], ["d225", 225, 20.5], ["d250", 250, 22.7],
  ["d280", 280, 25.4], ["d315", 315, 28.6], ["d355", 355, 32.2], ["d400", 400, 36.3], ["d450", 450, 40.9],
  ["d500", 500, 45.4], ["d560", 560, 50.8], ["d630", 630, 57.2],
];
const PE_SDR17: readonly (readonly [string, number, number])[] = [
  ["d40", 40, 2.4], ["d50", 50, 3.0], ["d63", 63, 3.8], ["d75", 75, 4.5], ["d90", 90, 5.4], ["d110", 110, 6.6],
  ["d125", 125, 7.4], ["d140", 140, 8.3], ["d160", 160, 9.5], ["d180", 180, 10.7], ["d200", 200, 11.9],
  ["d225", 225, 13.4], ["d250", 250, 14.8], ["d280", 280, 16.6], ["d315", 315, 18.7], ["d355", 355, 21.1],
  ["d400", 400, 23.7], ["d450", 450, 26.7], ["d500", 500, 29.7], ["d560", 560, 33.2], ["d630", 630, 37.4],
];

// EN 545 ductile iron pipe: OD by DN and the minimum iron wall of the preferred pressure classes
// (C40 DN80–300, C30 DN350–600, C25 DN700–800), mm, with the standard cement-mortar lining
// 3 mm (DN ≤ 300), 5 mm (DN350–600), 6 mm (DN700–800) (all from memory; check the maker's data:
// the delivered wall is thicker than the minimum, so the real bore is a little smaller).
const EN545: readonly (readonly [string, number, number])[] = [
  ["DN80", 98, 4.4], ["DN100", 118, 4.4], ["DN125", 144, 4.5], ["DN150", 170, 4.5], ["DN200", 222, 4.7],
  ["DN250", 274, 5.5], ["DN300", 326, 6.2], ["DN350", 378, 6.3], ["DN400", 429, 6.5], ["DN450", 480, 6.9],
  ["DN500", 532, 7.5], ["DN600", 635, 8.7], ["DN700", 738, 8.8], ["DN800", 842, 9.6],
];
const en545Lining = (_nominal: string, od: number) => (od <= 326 ? 3 : od <= 635 ? 5 : 6);

/** The DN tables, grouped by `standard` in the editor. */
export const DN_TABLES: readonly PipeTable[] = [
  dnTable("en10255-medium", "Steel tube EN 10255, medium (M)", "EN 10255", "steel",
    "EN 10255:2004 medium series: OD and wall (from memory)", EN10255_M),
  dnTable("en10217-steel", "Welded steel EN 10217-1, ISO 4200 ODs", "EN 10217 / ISO 4200", "steel",
    "EN 10217-1 with EN 10220 / ISO 4200 outside diameters; walls as commonly stocked, former DIN 2458 normal walls (from memory)", EN10217),
  dnTable("en1057-copper", "Copper tube EN 1057 (R250/R290)", "EN 1057", "copper",
    "EN 1057 copper tube, walls usual in UK building services (former BS 2871 Table X) (from memory)", EN1057),
  dnTable("iso4427-pe100-sdr11", "PE100 SDR 11 (ISO 4427)", "ISO 4427", "pvc",
    "ISO 4427-2 PE100 SDR 11: nominal OD and minimum wall (from memory); ID = OD − 2 × minimum wall", PE_SDR11),
  dnTable("iso4427-pe100-sdr17", "PE100 SDR 17 (ISO 4427)", "ISO 4427", "pvc",
    "ISO 4427-2 PE100 SDR 17: nominal OD and minimum wall (from memory); ID = OD − 2 × minimum wall", PE_SDR17),
  dnTable("en545-ductile", "Ductile iron EN 545, cement-mortar lined", "EN 545", "ductile-iron-lined",
    "EN 545 ductile iron: OD, minimum iron wall of the preferred classes C40/C30/C25 and standard cement-mortar lining (from memory)", EN545, en545Lining),
];
