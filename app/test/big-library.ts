// Benches and tests: a large invented pump library as CSV text (models "Bench n", end-suction, DN50–DN225),
// curves shaped like real ones (head falling with the square of flow, efficiency peaking near 70 % of the
// run-out flow, power from the hydraulic power over efficiency plus 0.1 kW). Invented data, no vendor's.
/** `models` × 10 curve sets (2 speeds × 5 impellers) × 8 points; 1000 models make 10 000 sets. Imported through the service like any upload. */
export function bigLibraryCsv(models = 1000, first = 0): string {
  const lines = ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m"];
  for (let m = 0; m < models; m++) {
    const scale = 0.5 + (m % 50) / 25; // 0.5 … 2.46
    for (const speed of [2900, 1450]) {
      for (const d of [250, 235, 220, 205, 190]) {
        const r = (speed / 2900) * (d / 250);
        const h0 = 40 * scale * r * r;
        const qmax = 60 * scale * r;
        for (let i = 0; i < 8; i++) {
          const q = (qmax * i) / 7;
          const h = h0 * (1 - 0.6 * (q / qmax) ** 2);
          const eta = Math.max(0.01, 0.78 * (1 - ((q / qmax - 0.7) / 0.7) ** 2));
          const p = (998.2 * 9.80665 * (q / 3600) * h) / eta / 1000 + 0.1;
          lines.push(`Bench ${first + m},end-suction,DN${50 + (m % 8) * 25},${speed},${d},${q.toFixed(2)},${h.toFixed(2)},${(i === 0 ? 0 : eta * 100).toFixed(1)},${p.toFixed(3)},${(1 + 3 * (q / qmax) ** 2).toFixed(2)}`);
        }
      }
    }
  }
  return lines.join("\n");
}

