// What the energy display prints (system page panel, candidates table rows, selection report): money to the currency's
// minor unit, small kWh and hours with significant digits, totals that add up as printed (or say the rows are rounded),
// an incomplete mark in the steps' own words, a downhill step met by gravity, and the life-cycle cost's plausibility
// warning wherever the cost is shown. Server-rendered markup (react-dom/server); cycles from the engine via the fixture.
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { CandidateEnergyPanel, energyRows, incompleteMark } from "./CandidateEnergy";
import { SelectionEnergy } from "./SelectionEnergy";
import { cycleNoteLines } from "./cycle-notes";
import { fixtureEnergy as energyOf } from "~/lib/projects/energy-fixture";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { SI_UNITS } from "~/lib/shared/units";

type E = ReturnType<typeof energyOf>;
const text = (html: string) => html.replace(/<[^>]*>/g, " ").replace(/&#x27;/g, "'").replace(/&amp;/g, "&").replace(/\s+/g, " ");
const panel = (e: E, currency = "EUR") => text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency, canWrite: false })));
const report = (e: E) => text(renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump A", energy: e }, unitSystem: SI_UNITS, currency: "EUR" })));
const rows = (e: E, currency = "EUR") => Object.fromEntries(energyRows(currency).map(([label, cell]) => [label, renderToStaticMarkup(createElement("span", null, cell({ id: 1, label: "P", energy: e }))).replace(/<[^>]*>/g, "").replace(/&#x27;/g, "'").replace(/&amp;/g, "&")]));
const energy = (over: Partial<NonNullable<ReturnType<typeof defaultSystemInput>["energy"]>>) => ({ energy: { ...defaultSystemInput().energy!, ...over } });
/** The step rows' hours and energy cells and the total row, as printed in the panel's table. */
function table(e: E) {
  const html = renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 7, label: "Pump A", energy: e }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false }));
  const body = /<tbody>([\s\S]*?)<\/tbody>/.exec(html)![1];
  const trs = [...body.matchAll(/<tr class="border-t border-slate-100">([\s\S]*?)<\/tr>/g)].map((m) => [...m[1].matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => text(c[1]).trim()));
  const total = /data-testid="cycle-total-7">([^<]*)</.exec(html)![1];
  return { hours: trs.map((r) => r[r.length - 2]), energy: trs.map((r) => r[r.length - 1]), total, rounded: /data-testid="cycle-rounded-7"/.test(html), html };
}
/** Printed numbers added in units of the last decimal place (what a reader adding the column would get). */
const addUp = (xs: string[]) => {
  const d = Math.max(...xs.map((x) => (x.split(".")[1] ?? "").length));
  return xs.reduce((s, x) => s + Math.round(Number(x) * 10 ** d), 0) / 10 ** d;
};

describe("money to the currency's minor unit (ISO 4217 digits from Intl.NumberFormat: energy-numbers.ts)", () => {
  it("an annual cost of 0.40 and a purchase price of 12.50 read as such (were '0 EUR' and '13 EUR')", () => {
    // 2 h a year at 0.11 per kWh: the fixture's cycle is about 3.59 kWh, so about 0.40 a year (hand arithmetic)
    const e = energyOf({ hoursPerYear: 2, tariffPerKWh: 0.11 }, 1250);
    expect(e.annualCost!).toBeGreaterThan(0.395);
    expect(e.annualCost!).toBeLessThan(0.405);
    expect(table(e).total).toMatch(/ · 0\.40 EUR \(duty cycle, 2 h\/yr\)$/);
    expect(rows(e)["Purchase price"]).toBe("12.50 EUR");
  });
  it("the life-cycle cost line adds up as printed: purchase + energy = total (was 13 + 15603 = 15615 with a price of 12.50)", () => {
    for (const cents of [1250, 50040, 99, 250000, 123457]) {
      const line = /Life-cycle cost over 15 years: ([\d.]+) EUR = purchase ([\d.]+) EUR \+ energy ([\d.]+) EUR \(present value\)( \(each rounded)?/.exec(panel(energyOf({}, cents)));
      expect(line, String(cents)).not.toBeNull();
      const [, total, purchase, energyPv, note] = line!;
      expect(purchase).toBe((cents / 100).toFixed(2));
      if (!note) expect(addUp([purchase, energyPv]), String(cents)).toBe(Number(total));
    }
  });
});

describe("kWh and hours of a small cycle: significant digits, rows that add up to the total as printed", () => {
  it("2 h a year: no step reads 0 kWh, and the rows add up to the total (were 0, 1, 1, 1 kWh under a total of 4 kWh)", () => {
    const t = table(energyOf({ hoursPerYear: 2 }));
    const kwh = t.energy.map((x) => x.replace(/ kWh$/, ""));
    expect(kwh.every((x) => Number(x) > 0)).toBe(true);
    expect(t.rounded).toBe(false);
    expect(addUp(kwh)).toBe(Number(/^([\d.]+) kWh/.exec(t.total)![1]));
    expect(addUp(t.hours)).toBe(2); // 6/15/35/44 % of 2 h: 0.12, 0.30, 0.70, 0.88 (EN 16297-1 shares, from memory)
    expect(t.hours).toEqual(["0.12", "0.30", "0.70", "0.88"]);
  });
  it("over many sizes of cycle the rows add up to the total as printed, or the table says they are rounded", () => {
    let noted = 0;
    for (const h of [1, 2, 3, 7, 13, 50, 333, 1000, 4000, 8760]) {
      const t = table(energyOf({ hoursPerYear: h }));
      const kwh = t.energy.map((x) => x.replace(/ kWh$/, ""));
      const total = Number(/^([\d.]+) kWh/.exec(t.total)![1]);
      if (addUp(kwh) !== total || addUp(t.hours) !== h) {
        expect(t.rounded, `${h} h`).toBe(true);
        expect(t.html).toMatch(/Rows are rounded: as printed, their (hours add up to [\d.]+ h|energy adds up to [\d.]+ kWh)/);
        noted++;
      } else expect(t.rounded, `${h} h`).toBe(false);
    }
    expect(noted).toBeLessThan(10); // most add up as printed
  });
});

describe("the incomplete mark counts steps in the words the steps use", () => {
  const step = (status: string, hours = 100) => ({ flowFraction: 0.5, hours, status });
  const cycle = (...statuses: string[]) => ({ complete: false, steps: statuses.map((s) => step(s)) }) as never;
  it("a step without power data is 'not computed', not 'not met' (was '1 of 3 steps not met')", () => {
    expect(incompleteMark(cycle("ok", "no-power-data", "ok"))).toBe(" (incomplete: 1 of 3 steps not computed)");
    expect(incompleteMark(cycle("beyond-curve", "no-power-data", "control-below-system"))).toBe(" (incomplete: 2 of 3 steps not met, 1 not computed)");
    expect(incompleteMark(cycle("beyond-curve", "ok", "ok"))).toBe(" (incomplete: 1 of 3 steps not met)");
  });
});

describe("a downhill system under system-curve control (static −1 m): the steps below 0 m run by gravity", () => {
  const e = energyOf({ staticLow: -1, staticHigh: -1, ...energy({ control: "system-curve" }) });
  it("the 75/50/25 % steps say 'met, no pump head needed, pump stopped' with the assumption; the 100 % step is met at its lowest on-curve speed, throttled", () => {
    const p = panel(e);
    expect(p).toMatch(/met, no pump head needed, pump stopped: the system needs ⟦head\|-0\.139084⟧/);
    expect(p.match(/met, no pump head needed, pump stopped/g)).toHaveLength(3);
    // 36 m³/h first reaches the curve's 55 m³/h end at 36/55 = 65.5 % speed (affinity laws), where the pump gives
    // 0.6545² × 7 m = 3.00 m (hand algebra): held there, the surplus throttled (dutyCycle.ts, common practice). Was "▲ not met"
    // and the cycle "(incomplete: 1 of 4 steps not met)".
    expect(p).not.toMatch(/not met/);
    expect(p).toMatch(/65\.5 % speed, throttled/);
    expect(p).toMatch(/met, throttled at the lowest on-curve speed: at 65\.5 % speed, the lowest where ⟦flow\|0\.01⟧ is on the curve \(its end: ⟦flow\|0\.0152778⟧ as published at full speed\); the pump gives ⟦head\|2\.999[\d]*\|/);
    expect(incompleteMark(e.cycle)).toBe("");
    expect(e.cycle!.complete).toBe(true);
    expect(cycleNoteLines(e.cycle!)[0]).toMatch(/^Step at 100 % flow, 240 h: met, throttled at the lowest on-curve speed — at 65\.5 % speed/);
    // The 100 % step's second line: held at 65.5 % speed at the curve's end, 36/(36 × 0.6545) = 153 % of its BEP flow at that
    // speed (stepPor.ts: right of the preferred operating region, ANSI/HI 9.6.3 from memory), printed with the other steps
    // off the BEP on one line after the steps' own notes.
    expect(cycleNoteLines(e.cycle!)[1]).toMatch(/^Step at 75 % flow, 600 h: met, no pump head needed, pump stopped — the system needs/);
    expect(cycleNoteLines(e.cycle!).at(-1)).toMatch(/^Steps outside the preferred operating region 70–120 % of BEP flow .*: 100 % flow, 240 h at 153 %\. Notes, not failures\.$/);
  });
  it("static −2 m: the whole cycle by gravity, 0 kWh, complete (was refused: 'must be positive at the design flow for a pressure set point')", () => {
    const all = energyOf({ staticLow: -2, staticHigh: -2, ...energy({ control: "system-curve" }) });
    expect(all.cycleError).toBeNull();
    expect(all.cycle!.complete).toBe(true);
    expect(rows(all)["Energy per year over the duty cycle"]).toBe("0 kWh");
    expect(all.lcc!.total).toBe(2500); // the purchase alone
  });
});

describe("an implausible tariff escalation is said wherever the life-cycle cost is shown", () => {
  const WARN = /▲ tariff escalation 100\.0 %\/year makes year 50's energy cost 5\.6e14 × year 1's \(above 15 %\/year; more than 10× year 1's\): implausible/;
  it("+100 %/year over 50 years: the table row, the panel and the report (screen and printed line) carry the warning", () => {
    const e = energyOf(energy({ escalation: 1, years: 50 }));
    expect(rows(e)["Life-cycle cost (present value)"]).toMatch(WARN);
    expect(panel(e)).toMatch(WARN);
    const rep = renderToStaticMarkup(createElement(SelectionEnergy, { c: { id: 7, label: "Pump A", energy: e }, unitSystem: SI_UNITS, currency: "EUR" }));
    expect(text(/<p class="hidden text-xs print:block"[^>]*>([\s\S]*?)<\/p>/.exec(rep)![1])).toMatch(/life-cycle cost \(present value\): [\d.e+]+ EUR over 50 years at a tariff escalation of \+100 %\/year and a discount rate of 5 %\/year — ▲ priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow.*? is not in this cost — ▲ tariff escalation 100\.0 %\/year/);
    expect(report(e)).toMatch(WARN);
  });
  it("flips at 15 %/year over 2 years (growth 1.15×): nothing at 15 %, the warning just above", () => {
    expect(panel(energyOf(energy({ escalation: 0.15, years: 2 })))).not.toMatch(/implausible/);
    expect(panel(energyOf(energy({ escalation: 0.15 + 1e-6, years: 2 })))).toMatch(/▲ tariff escalation 15\.0001 %\/year makes year 2's energy cost 1\.15 × year 1's \(above 15 %\/year\)/);
  });
});

describe("a life-cycle cost over 1 year reads '1 year' (was '1 years')", () => {
  it("the table's cell, the panel's line and the report's list; 2 years reads '2 years'", () => {
    const one = energyOf(energy({ years: 1 }));
    expect(rows(one)["Life-cycle cost (present value)"]).toMatch(/^[\d.]+ EUR over 1 year — ▲ priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow.*? is not in this cost$/); // the circulator profile's 25 % step (lcc-range-note.ts)
    expect(panel(one)).toMatch(/Life-cycle cost over 1 year: [\d.]+ EUR = purchase/);
    expect(report(one)).toMatch(/Life-cycle cost: over 1 year at a tariff escalation of \+3 %\/year and a discount rate of 5 %\/year; /);
    expect(rows(energyOf(energy({ years: 2 })))["Life-cycle cost (present value)"]).toMatch(/^[\d.]+ EUR over 2 years — ▲ priced as if the pump ran normally at 1 step outside its allowable flow range — below 50 % of BEP flow.*? is not in this cost$/);
  });
});

describe("the system page's assumptions under the cycles: each candidate's own too", () => {
  it("shared ones once; one candidate's own under its number (it showed the first candidate's list only)", () => {
    const a = energyOf({});
    const own = "The drive runs the pump up to the candidate's set speed, 115.0 % of its curve's (the speeds of the duty cycle are fractions of the curve's speed).";
    const b = { ...energyOf({}), assumptions: [...a.assumptions, own] }; // as candidateEnergy adds it (energy-overspeed.test.ts)
    const html = text(renderToStaticMarkup(createElement(CandidateEnergyPanel, { candidates: [{ id: 1, label: "Pump A", energy: a }, { id: 2, label: "Pump B", energy: b }], unitSystem: SI_UNITS, currency: "EUR", canWrite: false })));
    expect(html).toContain(`2 Pump B: ${own}`);
    expect(html.split(a.assumptions[0]).length - 1).toBe(1); // a shared one once
  });
});
