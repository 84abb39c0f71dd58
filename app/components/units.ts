// The formatters moved to app/lib/shared/units.ts (one definition for every screen); kept as the components' import path.
export { fmtNum, fmtPct, fmtQ, fmtFlow, fmtHead, fmtPower, fmtPressure, labelOf, renderUnits, type UnitChoice } from "~/lib/shared/units";
