// Every field-check reading at the form's limits, through the page's action (guard, form reading, the check, MariaDB):
// text that is not a number (NaN, Infinity, 1e400), a negative gauge reading (vacuum on suction is real: down to −1 standard
// atmosphere gauge, 101 325 Pa, ISO 2533 / common practice), suction above discharge, a zero speed, the fluid temperature
// at the ends of water's table (0–100 °C, WATER_RANGE_C, IAPWS) — each answers a form error naming the field and the range
// it takes (400), never a 500, and nothing is stored with a number missing. The fixture curve is invented
// (app/test/fieldcheck-fixture.ts: H = 40 − 1000·Q).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks } from "@db/schema";
import { fluidAt } from "~/engine";
import * as formPage from "~/routes/field.selections.$id";
import { call, makeMember, type TestMember } from "./harness";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let selectionId = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  selectionId = (await storeSelection(m.workspaceId, m.userId, undefined, "Form limits")).selectionId;
});

/** Posts the form (a check of 20 m at 12 L/s, with `extra` over it) through the page's action. */
async function post(extra: Record<string, string>) {
  const form = { ...fieldsForHead(20, RHO20, { flow: "0.012" }), pageWorkspaceId: String(m.workspaceId), ...extra };
  const r = await call(formPage.action as never, { path: `/field/selections/${selectionId}/photos`, cookie: m.cookie, form, params: { id: String(selectionId) } });
  expect(r.status, JSON.stringify(extra)).toBeLessThan(500);
  const errors = (r.body as { errors?: Record<string, string> } | null)?.errors ?? {};
  return { status: r.status, errors, recorded: r.status === 302 };
}

const NUMERIC: [key: string, label: RegExp, extra?: Record<string, string>][] = [
  ["sPressure", /^Suction pressure/], ["dPressure", /^Discharge pressure/], ["sAccuracy", /^Suction gauge accuracy/], ["dAccuracy", /^Discharge gauge accuracy/],
  ["sElevation", /^Suction gauge elevation/], ["dElevation", /^Discharge gauge elevation/], ["sDiameter", /^Suction pipe inner diameter/], ["dDiameter", /^Discharge pipe inner diameter/],
  ["flow", /^Flow reading/], ["flowAccuracy", /^Flow meter accuracy/], ["rpm", /^Speed/],
  ["hz", /^Drive frequency/, { speedMode: "vfd", baseHz: "50", baseRpm: "2900" }],
  ["power", /^Motor input power/, { powerMode: "input" }], ["motorEfficiency", /^Motor efficiency/, { powerMode: "input", power: "5" }],
  ["volts", /^Voltage/, { powerMode: "electrical", amps: "10", powerFactor: "0.85" }], ["amps", /^Current/, { powerMode: "electrical", volts: "400", powerFactor: "0.85" }],
];

describe("text that is not a number, in every numeric field", () => {
  for (const [key, label, extra] of NUMERIC)
    test(`${key}: NaN, Infinity, −Infinity and 1e400 are refused at the field, with the range it takes`, async () => {
      for (const typed of ["NaN", "Infinity", "-Infinity", "1e400"]) {
        const r = await post({ ...extra, [key]: typed });
        expect(r.status, `${key}=${typed}`).toBe(400);
        expect(r.errors[key].replace(/^The /, ""), `${key}=${typed}`).toMatch(new RegExp(label.source, "i"));
        // Was: "… must be a number." with no range; the range in the unit typed now.
        expect(r.errors[key], `${key}=${typed}`).toMatch(/must be a number.*; the form takes (from|more than) −?[\d.]+/);
      }
    });
});

describe("a negative gauge reading: vacuum on suction down to −1 atm gauge", () => {
  test("−101.325 kPa and −1.01325 bar gauge are recorded; a hair below is refused, with full vacuum named", async () => {
    expect((await post({ sPressure: "-101.325" })).recorded).toBe(true);
    expect((await post({ pressureUnit: "bar", sPressure: "-1.01325", dPressure: String((20 * RHO20 * 9.80665) / 1e5) })).recorded).toBe(true);
    const below = await post({ sPressure: "-101.326" });
    expect(below.status).toBe(400);
    // Was: "Suction pressure is too low: check the value and its unit."
    expect(below.errors.sPressure).toBe("Suction pressure is too low: the form takes from −101.325 kPa to 100\u202f000 kPa (a gauge reads no lower than full vacuum, −1 standard atmosphere gauge; up to 1\u202f000 bar), not −101.326 kPa; check the value and its unit.");
    const psi = await post({ pressureUnit: "psi", sPressure: "-14.7", dPressure: "29" });
    expect(psi.errors.sPressure).toMatch(/^Suction pressure is too low: the form takes from −14\.6959 psi/);
  });
  test("an absolute reading below zero is refused as such", async () => {
    const r = await post({ sRef: "absolute", sPressure: "-0.001" });
    expect(r.errors.sPressure).toMatch(/^Suction pressure is too low: the form takes from 0 kPa to 100\u202f000 kPa \(an absolute reading is never below zero/);
  });
});

describe("suction above discharge", () => {
  test("gauges giving the pump no head are refused at the discharge pressure with the head they give; raised 15 m, the same gauges are a head", async () => {
    const swapped = await post({ sPressure: "300", dPressure: "200" }); // (200 − 300) kPa / (998.2 × 9.80665) = −10.2 m
    expect(swapped.status).toBe(400); // was: recorded, as a pump outside tolerance
    expect(swapped.errors.dPressure).toMatch(/^The readings give the pump a total head of −10\.2\d* m, below zero \(suction 300 kPa gauge, discharge 200 kPa gauge, .*\): the total head must be above zero/);
    const raised = await post({ sPressure: "300", dPressure: "200", dElevation: "15" }); // −10.2 + 15 = +4.8 m
    expect(raised.recorded).toBe(true);
    const level = await post({ sPressure: "200", dPressure: "200" }); // 0 m exactly: at zero
    expect(level.errors.dPressure).toMatch(/total head of 0 m, at zero/);
  });
});

describe("speed and temperature at their ends", () => {
  test("a zero speed is refused with the range; blank is no speed", async () => {
    const zero = await post({ rpm: "0" });
    expect(zero.errors.rpm).toBe("Speed is too low: the form takes from 100 rpm to 10\u202f000 rpm (a running pump; leave it blank when the speed was not measured), not 0 rpm; check the value and its unit."); // was: "Speed is too low: check the value and its unit."
    expect((await post({ rpm: "100" })).recorded).toBe(true);
    expect((await post({ rpm: "" })).recorded).toBe(true);
  });
  test("water at 0 °C and 100 °C (the table's ends) is recorded; a thousandth outside is refused with the range", async () => {
    for (const t of ["0", "100"]) expect((await post({ temperature: t })).recorded, t).toBe(true);
    for (const t of ["-0.001", "100.001"]) {
      const r = await post({ temperature: t });
      expect(r.errors.temperature, t).toMatch(/^Fluid temperature is too (low|high): the form takes 0 to 100 °C/);
    }
  });
});

test("nothing stored carries a missing number (a NaN is written as null in JSON)", async () => {
  const rows = await db().select().from(fieldChecks).where(eq(fieldChecks.selectionId, selectionId));
  expect(rows.length).toBeGreaterThan(0);
  for (const row of rows) {
    // An accuracy left blank is stored as null, not given (decision "fieldmeter"; it was 0, a perfect instrument) — and only then.
    const stored = JSON.parse(row.readingsJson) as { readings: Record<string, unknown> & { suction: { accuracy: unknown }; discharge: { accuracy: unknown } }; fields: Record<string, string> };
    const blanks: [unknown, string][] = [[stored.readings.suction.accuracy, "sAccuracy"], [stored.readings.discharge.accuracy, "dAccuracy"], [stored.readings.flowAccuracy, "flowAccuracy"]];
    for (const [x, key] of blanks) expect(x === null, `check ${row.id} ${key}`).toBe(stored.fields[key] === "");
    stored.readings.suction.accuracy = stored.readings.discharge.accuracy = stored.readings.flowAccuracy = 0;
    expect(JSON.stringify(stored.readings), `check ${row.id}`).not.toMatch(/null|NaN|Infinity/);
    const r = JSON.parse(row.resultJson);
    expect(Number.isFinite(r.delivered.head), `check ${row.id}`).toBe(true);
    expect(r.delivered.head, `check ${row.id}`).toBeGreaterThan(0);
  }
});
