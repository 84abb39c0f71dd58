// The readings' total head before a check is recorded: a running pump adds head, so gauges that give a total head at or
// below zero (suction above discharge, with the elevations and velocity heads) are misread — swapped, on mixed references or
// in the wrong unit — and are refused at the discharge pressure's field with the head they give, never recorded as a
// pump "outside tolerance" (common practice). Pure: the server checks it before recording (and the phone before queueing);
// where the flow is inferred, on the check's own head too (`checkedHeadRefusal`); the numbers in the units typed.
import { fromSI, gaugeTdh, STANDARD_ATMOSPHERE, unitLabel } from "~/engine";
import { fluidOf, type SystemInput } from "../projects/hydraulics";
import type { CheckFields, Readings } from "./form";

/**
 * The refusal under `dPressure` when the readings give a total head at or below zero, or null.
 * @param readings the readings (SI)
 * @param input the selection's system inputs (its liquid: the density at the measured temperature)
 * @param fields the fields as typed (their units, for the message)
 */
export function headRefusal(readings: Readings, input: SystemInput, fields: CheckFields): string | null {
  const { suction: s, discharge: d } = readings;
  // Without a flow meter the flow is inferred: where a smaller discharge pipe would add velocity head with flow, a head at
  // or below zero at no flow does not settle it, and the check works it out.
  if (readings.flow === null && d.diameter < s.diameter) return null;
  const rho = fluidOf({ ...input, temperatureC: readings.temperatureC }).density;
  const asGauge = (g: Readings["suction"]) => (g.reference === "absolute" ? g.pressure - STANDARD_ATMOSPHERE : g.pressure);
  const g = (x: Readings["suction"]) => ({ pressure: asGauge(x), elevation: x.elevation, pipeDiameter: x.diameter });
  const tdh = gaugeTdh(g(s), g(d), readings.flow ?? 0, rho).tdh;
  return tdh > 0 ? null : noHeadText(tdh, readings, fields);
}

/**
 * The same refusal on the check's own total head (`evaluateCheck`'s `delivered.head`): where `headRefusal` leaves the
 * readings to the check (no flow meter, a smaller discharge pipe), the head at the flow the check infers from the curve, or
 * at no flow where the curve gives none, at or below zero is refused as well, never recorded. Null above zero.
 */
export function checkedHeadRefusal(head: number, readings: Readings, fields: CheckFields): string | null {
  return head > 0 ? null : noHeadText(head, readings, fields, readings.flow === null);
}

/** The refusal's words, with the head in the elevation unit typed (`inferred`: no flow reading, the check's own head). */
function noHeadText(tdh: number, readings: Readings, fields: CheckFields, inferred = false): string {
  const { suction: s, discharge: d } = readings;
  const eUnit = fields.elevationUnit || "m";
  const head = `${String(Number(fromSI("length", eUnit, tdh).toPrecision(4))).replace("-", "−")} ${unitLabel("length", eUnit)}`;
  const p = fields.pressureUnit || "kPa";
  const said = (key: string, ref: string) => `${(fields[key] ?? "").replace(/^-/, "−")} ${unitLabel("pressure", p)} ${ref}`;
  const flowWords = inferred ? "; no flow reading: at the flow inferred from the curve, or at no flow where the curve gives none" : "";
  return `The readings give the pump a total head of ${head}, ${tdh < 0 ? "below" : "at"} zero (suction ${said("sPressure", s.reference)}, discharge ${said("dPressure", d.reference)}, with the gauge elevations and pipe sizes entered${flowWords}): the total head must be above zero, as a running pump adds head. Check that the suction and discharge readings are not swapped, each gauge's reference (gauge or absolute) and unit, and the gauge elevations.`;
}
