// An invented pump for low-head circuits (not any vendor's): H = 5.5 − 0.0008 · Q² (m, Q in m³/h), efficiency peaking
// at 75 % near 36 m³/h, shaft power ρgQH/η + 30 W (water at 998.2 kg/m³), NPSHr 2 m; 1450 rpm, Ø120 mm. As a curve CSV.
const M3H = 1 / 3600;

export const LOWHEAD_CSV = [
  "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m",
  ...[0, 10, 20, 30, 36, 45, 60].map((q) => {
    const h = 5.5 - 0.0008 * q * q;
    const eta = q === 0 ? 0 : 0.75 * (1 - ((q / 60 - 0.6) / 0.6) ** 2);
    const kw = q === 0 ? 0.06 : (998.2 * 9.80665 * q * M3H * h) / eta / 1000 + 0.03;
    return `Lowhead 40,in-line,DN40,1450,120,${q},${h.toFixed(4)},${(eta * 100).toFixed(2)},${kw.toFixed(5)},2`;
  }),
].join("\n");
