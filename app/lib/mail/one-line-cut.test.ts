// Names and titles cut for an e-mail (templates.ts `oneLine`, 120 code points by default): the cut falls between
// user-perceived characters (Unicode extended grapheme clusters, UAX #29 — a letter with its combining marks, an emoji with
// its modifier or joiners), never inside one, and the text ends with "…" to say it was cut. Was: cut by code points, so an
// accent's combining mark (U+0301) or an emoji's skin tone (U+1F3FD) was dropped and the letter or emoji before it kept
// as another one ("…e…" for "…é", a yellow thumb for a brown one). Check values: the code points from the Unicode charts
// (U+0301 COMBINING ACUTE ACCENT, U+1F44D THUMBS UP SIGN, U+1F3FD EMOJI MODIFIER FITZPATRICK TYPE-4, U+200D ZERO WIDTH
// JOINER), from memory.
import { describe, expect, test } from "vitest";
import { fieldCheckMail, oneLine } from "./templates";

const A118 = "a".repeat(118);
/** A UTF-16 string with a high or low surrogate alone (a split pair). */
const LONE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

describe("a cut at 120 never splits a character and says it was cut", () => {
  test("a combining mark at the cut: 'e' + U+0301 is kept whole or left out whole", () => {
    const name = `${A118}e\u0301 and more`; // é is the 119th and 120th code points
    const cut = oneLine(name);
    expect(cut).toBe(`${A118}…`); // was `${A118}e…`: the acute dropped, another letter kept
    expect([...cut].length).toBeLessThanOrEqual(120);
    // One code point earlier it fits whole (118 + 2 = 120 > 119 does not; 117 + 2 = 119 does).
    expect(oneLine(`${"a".repeat(117)}e\u0301 and more`)).toBe(`${"a".repeat(117)}e\u0301…`);
  });

  test("an emoji with a skin tone at the cut: U+1F44D U+1F3FD kept whole or left out whole; no surrogate alone", () => {
    const cut = oneLine(`${A118}\u{1F44D}\u{1F3FD} thanks`);
    expect(cut).toBe(`${A118}…`); // was `${A118}\u{1F44D}…`: the tone dropped
    expect(cut).not.toMatch(LONE);
  });

  test("a joined family emoji (three people and two joiners) across the cut is left out whole", () => {
    const family = "\u{1F468}\u200D\u{1F469}\u200D\u{1F467}";
    const cut = oneLine(`${"a".repeat(116)}${family} x`);
    expect(cut).toBe(`${"a".repeat(116)}…`);
    expect(cut).not.toMatch(LONE);
  });

  test("a surrogate pair at the cut (an emoji of one code point) is never split, as before", () => {
    const cut = oneLine(`${A118}\u{1F600}\u{1F600}\u{1F600}`); // code points 119–121
    expect(cut).toBe(`${A118}\u{1F600}…`);
    expect(cut).not.toMatch(LONE);
  });

  test("not cut, nothing added: 120 code points stay whole, with no '…'", () => {
    const exact = `${A118}e\u0301`;
    expect(oneLine(exact)).toBe(exact);
  });

  test("the field check's e-mail: a selection title cut in the subject and the text keeps its last character whole and ends with '…'", () => {
    const m = fieldCheckMail({ projectName: "P", selectionName: `${A118}e\u0301${"b".repeat(20)}`, verdict: "pass", link: "https://dutymark.localhost/field/checks/1" });
    expect(m.subject).toBe(`Field check on ${A118}… (P): within tolerance`);
    expect(m.text).toContain(`“${A118}…”`);
    expect(m.subject).not.toMatch(LONE);
  });
});
