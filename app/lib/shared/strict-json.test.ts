// parseStrictJson: JSON.parse's answer, and a name twice in one object refused with the name and where (RFC 8259 §4 leaves
// duplicates to the reader; RFC 7493 §2.3 I-JSON refuses them — cases from the RFCs' wording and common practice).
import { describe, expect, test } from "vitest";
import { duplicateName, parseStrictJson } from "./strict-json";

describe("a name twice in one object", () => {
  test.each([
    ['{"flow":1,"flow":2}', "flow", ""],
    ['{"a":1,"\\u0061":2}', "a", ""], // the same name written with an escape (RFC 8259 §7)
    ['{"\\u0061":1,"a":2}', "a", ""],
    ['{"é":1,"\\u00e9":2}', "é", ""],
    ['{"\\ud83d\\ude00":1,"😀":2}', "😀", ""], // a surrogate pair escaped and as UTF-8
    ['{"a\\/b":1,"a/b":2}', "a/b", ""],
    ['{"input":{"duty":{"flow":1,"head":2,"flow":3}}}', "flow", "/input/duty"],
    ['{"runs":[{"x":1},{"x":1,"y":2,"x":3}]}', "x", "/runs/1"],
    ['[[0,{"a":{}}],[1,2,{"q":[],"q":{}}]]', "q", "/1/2"],
    ['{"a/b":{"~":{"k":1,"k":2}}}', "k", "/a~1b/~0"], // RFC 6901 §3: "~" as ~0, "/" as ~1
    ['{"__proto__":1,"__proto__":2}', "__proto__", ""],
    ['{"":1,"":2}', "", ""],
    [' \r\n{ "s" : "}{][,\\"" , "s" : 0 }', "s", ""], // braces, brackets, commas and an escaped quote inside a string
  ])("%s → %j at %j", (text, name, at) => {
    expect(duplicateName(text)).toEqual({ name, at });
    const r = parseStrictJson(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problem).toContain(`the name ${JSON.stringify(name)} twice`);
  });

  test("the refusal names the object as a JSON Pointer, or the top", () => {
    expect(parseStrictJson('{"input":{"flow":1,"flow":2}}')).toEqual({ ok: false, problem: 'has the name "flow" twice in the object at /input (a JSON Pointer): give each name once' });
    expect(parseStrictJson('{"flow":1,"flow":2}')).toEqual({ ok: false, problem: 'has the name "flow" twice in its top object: give each name once' });
  });

  test("10 000 objects deep, the last with a name twice: found (no recursion)", () => {
    const deep = '{"a":'.repeat(10_000) + '{"z":1,"z":2}' + "}".repeat(10_000);
    expect(duplicateName(deep)?.name).toBe("z");
    expect(duplicateName(deep)?.at.split("/").length).toBe(10_001);
  });
});

describe("no name twice: the value as JSON.parse reads it", () => {
  test.each([
    '{"a":1,"b":2}',
    '{"a":{"a":{"a":1}}}', // the same name in nested objects
    '[{"a":1},{"a":2}]', // in sibling objects
    '{"a":1,"A":2,"a ":3,"\\u0041\\u0042":4,"AB\\u0000":5}', // names that differ
    '{"s":"\\"a\\":1,\\"a\\":2"}', // the pair inside a string value
    '{"x":["a","a"],"y":{"x":1}}',
    "{}",
    "[]",
    '"a"',
    "12",
    "null",
  ])("%s", (text) => {
    expect(duplicateName(text)).toBeNull();
    expect(parseStrictJson(text)).toEqual({ ok: true, value: JSON.parse(text) });
  });

  test("not JSON: JSON.parse's refusal", () => {
    const r = parseStrictJson('{"a":1,');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problem).toMatch(/^is not valid JSON \(/);
  });
});
