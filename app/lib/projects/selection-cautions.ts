// Every caution a selection's report shows, as figures for its CSV (selection-export.server.ts): the ratio note, the
// result's warnings (trim approximation, the ANSI/HI 9.6.7 correction with B and the factors, POR, NPSH, motor…), the
// viscosity status with B and the factors applied, the duty check, the system curve's warnings and each run's (which name
// their run). Numbered as the report lists them; nothing for what the frozen document does not hold. Pure.
import type { FrozenSelection } from "./stored-selection";

type Viscosity = { status: string; b: number | null; factors: { flow: number; head: number; efficiency: number } | null };

/** [name, value, unit] rows, in the order the report shows them. */
export function cautionFigures(f: FrozenSelection): [string, unknown, string][] {
  const out: [string, unknown, string][] = [];
  const r = f.result;
  if (r.ratioNote) out.push(["ratio_note", r.ratioNote, ""]);
  r.warnings.forEach((w, i) => out.push([`warning_${i + 1}`, w, ""]));
  const v = (r as { viscosity?: Viscosity | null }).viscosity;
  if (v) {
    out.push(["viscosity_status", v.status, ""], ["viscosity_b", v.b, "1"]);
    if (v.factors) out.push(["viscosity_c_q", v.factors.flow, "1"], ["viscosity_c_h_bep", v.factors.head, "1"], ["viscosity_c_eta", v.factors.efficiency, "1"]);
  } else if (v === undefined && f.system.input.fluid.kind === "custom") {
    out.push(["viscosity_status", "not recorded (selected before the ANSI/HI 9.6.7 check was kept): figures on the water curve", ""]);
  }
  const sc = f.systemCurve;
  if (sc?.dutyCheck) out.push(["duty_check", `${sc.dutyCheck.message} ${sc.dutyCheck.governs}`, ""]);
  (sc?.warnings ?? []).forEach((w, i) => out.push([`system_warning_${i + 1}`, w, ""]));
  (sc?.runs ?? []).flatMap((run) => run.warnings).forEach((w, i) => out.push([`run_warning_${i + 1}`, w, ""]));
  return out;
}
