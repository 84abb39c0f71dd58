import { fromSI, UNIT_SYSTEMS, unitLabel, type Quantity } from "~/engine";

export type UnitSystem = "SI" | "US";

/** A number for reading (not a form field): fixed decimals chosen per magnitude. */
export function fmtNum(x: number | null | undefined, digits?: number): string {
  if (x == null || !Number.isFinite(x)) return "—";
  const d = digits ?? (Math.abs(x) >= 100 ? 0 : Math.abs(x) >= 10 ? 1 : Math.abs(x) >= 1 ? 2 : 3);
  return x.toFixed(d);
}

export function fmtQ(sys: UnitSystem, q: Quantity, si: number | null | undefined, digits?: number): string {
  if (si == null || !Number.isFinite(si)) return "—";
  const unit = UNIT_SYSTEMS[sys][q];
  return `${fmtNum(fromSI(q, unit, si), digits)} ${unitLabel(q, unit)}`;
}

export const fmtFlow = (sys: UnitSystem, si: number | null | undefined) => fmtQ(sys, "flow", si);
export const fmtHead = (sys: UnitSystem, si: number | null | undefined) => fmtQ(sys, "head", si);
export const fmtPower = (sys: UnitSystem, si: number | null | undefined) => fmtQ(sys, "power", si);
export const fmtPressure = (sys: UnitSystem, si: number | null | undefined) => fmtQ(sys, "pressure", si);
export const fmtPct = (x: number | null | undefined, digits = 1) => (x == null || !Number.isFinite(x) ? "—" : `${(x * 100).toFixed(digits)} %`);
