/** How curves are named to people: "Model · 2900 rpm · Ø190 mm" (never the internal key), the diameter as a quantity token
 * (rendered in the reader's units where the name is shown; `renderUnits` in app/lib/shared/units.ts). Pure. */
import { qt } from "../../engine/quantityText.ts";

const round = (x: number, digits: number) => String(Math.round(x * 10 ** digits) / 10 ** digits);

/** impellerM in metres (SI, as stored). */
export function curveName(model: string, speed: number | null, impellerM: number | null): string {
  const parts = [model];
  if (speed != null) parts.push(`${round(speed, 1)} rpm`);
  if (impellerM != null) parts.push(`Ø${qt("diameter", impellerM)}`);
  return parts.join(" · ");
}

/** The same name from a curve key ("model|speed|impeller_mm", see curveKey in validate.ts). */
export function curveNameOfKey(key: string): string {
  const b = key.lastIndexOf("|");
  const a = key.lastIndexOf("|", b - 1);
  if (a < 0 || b < 0) return key;
  const model = key.slice(0, a);
  const speed = key.slice(a + 1, b);
  const mm = key.slice(b + 1);
  return curveName(model, speed === "" ? null : Number(speed), mm === "" ? null : Number(mm) / 1000);
}
