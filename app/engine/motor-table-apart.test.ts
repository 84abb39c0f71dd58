/**
 * A motor rating beside the IEC 60034-30-1 table's entries that its efficiency warning names reads apart from them in the
 * reader's units: a US nameplate of 7.38 hp (5503 W) read "motor 7.38 hp lies between the table's 7.38 hp and 10.1 hp"
 * (the 5.5 kW entry is 7.376 hp). Check values: the table's entries 0.12, 5.5 and 7.5 kW (IEC 60034-30-1:2014, from
 * memory, IE_TABLE_KW); 1 hp = 745.69987158 W (NIST SP 811).
 */
import { describe, expect, it } from "vitest";
import { motorEfficiency } from "./index.ts";
import { renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";

const HP = 745.69987158; // W (NIST SP 811)
const CHOICES = { SI: UNIT_SYSTEMS.SI, US: UNIT_SYSTEMS.US };
const NUM = String.raw`(\d+(?:\.\d+)?)`;

/** The numbers the warning prints for the motor and the entries it names. */
function printed(rating: number, code: string, units: (typeof CHOICES)[keyof typeof CHOICES]): number[] {
  const w = motorEfficiency(rating).warnings.find((x) => x.code === code);
  expect(w, code).toBeDefined();
  const text = renderQuantities(w!.message, units);
  const m = code === "motor-between-table"
    ? text.match(new RegExp(`^motor ${NUM} \\S+ lies between the IEC 60034-30-1 table's ${NUM} \\S+ \\(.*?\\) and ${NUM} \\S+`))
    : text.match(new RegExp(`^motor ${NUM} \\S+ is below the IEC 60034-30-1 table, which starts at ${NUM} \\S+:`));
  expect(m, text).not.toBeNull();
  return m!.slice(1).map(Number);
}

describe("the motor's rating against the efficiency table's entries", () => {
  it("between two entries: the rating reads strictly between them, in SI and US units", () => {
    for (const rating of [7.38 * HP, 5500.1, 7.3757 * HP]) {
      for (const [name, units] of Object.entries(CHOICES)) {
        const [motor, lower, upper] = printed(rating, "motor-between-table", units);
        expect(motor, `${name} ${rating} W: ${motor} vs ${lower}`).toBeGreaterThan(lower);
        expect(motor, `${name} ${rating} W`).toBeLessThan(upper);
      }
    }
  });

  it("below the table: the rating reads below the table's first entry, in SI and US units", () => {
    for (const rating of [119.9, 0.1609 * HP]) {
      for (const [name, units] of Object.entries(CHOICES)) {
        const [motor, first] = printed(rating, "motor-below-table", units);
        expect(motor, `${name} ${rating} W: ${motor} vs ${first}`).toBeLessThan(first);
      }
    }
  });
});
