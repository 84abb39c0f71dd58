// The demo libraries' curves (fixtures/demo, invented data) as engine inputs in SI, read from the
// clean CSV files exactly as printed (the rounded numbers the importer stores).
import { demoLibraries } from "../../../fixtures/demo";
import type { PumpCurveInput, PumpPoint } from "../index.ts";

export interface DemoCurveInput {
  /** model|speed|impeller mm */
  id: string;
  library: string;
  curve: PumpCurveInput;
}

const M3H = 1 / 3600;

/** Every curve set of the three clean demo files (model × speed × impeller), in file order. */
export function demoCurveInputs(): DemoCurveInput[] {
  const out: DemoCurveInput[] = [];
  for (const lib of demoLibraries()) {
    for (const f of lib.files.filter((x) => !x.variantOf)) {
      const lines = f.text.trim().split(/\r?\n/);
      const head = lines[0].split(",");
      const col = (name: string) => head.indexOf(name);
      const byKey = new Map<string, { speed: number; d: number; points: PumpPoint[] }>();
      for (const line of lines.slice(1)) {
        const c = line.split(",");
        const key = `${c[col("model")]}|${c[col("speed_rpm")]}|${c[col("impeller_mm")]}`;
        let set = byKey.get(key);
        if (!set) byKey.set(key, (set = { speed: Number(c[col("speed_rpm")]), d: Number(c[col("impeller_mm")]) / 1000, points: [] }));
        const num = (name: string) => (c[col(name)] === "" ? undefined : Number(c[col(name)]));
        const eff = num("efficiency_pct"), power = num("power_kw"), npshr = num("npshr_m");
        const p: PumpPoint = { flow: Number(c[col("flow_m3h")]) * M3H, head: Number(c[col("head_m")]) };
        if (eff !== undefined) p.efficiency = eff / 100;
        if (power !== undefined) p.power = power * 1000;
        if (npshr !== undefined) p.npshr = npshr;
        set.points.push(p);
      }
      for (const [id, s] of byKey) out.push({ id, library: lib.library, curve: { points: s.points, speed: s.speed, impellerDiameter: s.d } });
    }
  }
  return out;
}
