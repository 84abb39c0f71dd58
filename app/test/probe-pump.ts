// An invented radial pump for report and API tests (verdict-motor-surfaces.test.ts, selection-dead-head.test.ts): head
// 30 − 0.008 Q² m and shaft power 2 + 0.05 Q kW at 2900 rpm, Q 0–40 m³/h (30 m shut-off, 3.99 kW largest on water at
// 20 °C), as a CSV of our format under `model`.
export function probePumpCsv(model: string): string {
  return ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,power_kw", ...[0, 10, 20, 30, 40].map((q) => `${model},end-suction,DN50,2900,200,${q},${30 - 0.008 * q * q},${2 + 0.05 * q}`)].join("\n");
}
