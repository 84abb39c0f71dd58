// The operating point's motor running into its service factor (motor-service-factor.ts): above 100 % load and within
// rating × service factor, a note with the load, the rating and the service factor (common practice: a service factor is
// margin for occasional overload, not for continuous running). Edges: exactly 100 % (nothing), just above (the note),
// exactly at the service factor (the note), just past it (nothing here: the overload is verdict-motor.ts's). Hand arithmetic.
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { verdictMotorNote } from "./verdict-motor";
import { serviceFactorNote } from "./motor-service-factor";

/** A 3 kW motor, service factor 1.15 (limit 3450 W), at `load` of its rating at the operating point. */
const fig = (load: number, sf = 1.15) => ({ motorLimit: 3000 * sf, motorLoadAtDuty: load, motor: { rating: 3000 }, nonOverloading: true });

describe("the motor at the operating point between its rating and rating × service factor", () => {
  it("exactly 100 %: nothing", () => expect(serviceFactorNote(fig(1))).toBeNull());
  it("just above (100.1 %): the note with load, rating and service factor", () => {
    expect(inSI(serviceFactorNote(fig(1.001))!)).toBe("runs into its service factor at the operating point: 100.1 % load, one pump's 3.003 kW above its 3.00 kW rating, within rating × service factor 115 % (3.45 kW); a service factor is margin for occasional overload, not for continuous running (common practice): a motor of the next rating up is the usual choice");
    expect(verdictMotorNote({ status: "meets" }, fig(1.001))).toBeNull(); // not an overload: the verdict's line says nothing
  });
  it("exactly at the service factor (3450 W): the note; just past it: an overload, the verdict's line says it instead", () => {
    expect(serviceFactorNote(fig(1.15))).toMatch(/^runs into its service factor at the operating point: 115\.0 % load/);
    expect(serviceFactorNote(fig(1.1501))).toBeNull();
    expect(verdictMotorNote({ status: "meets" }, fig(1.1501))).toMatch(/^but the motor is overloaded at the operating point/);
  });
  it("service factor 1: above the rating is an overload, never this note", () => expect(serviceFactorNote(fig(1.001, 1))).toBeNull());
});
