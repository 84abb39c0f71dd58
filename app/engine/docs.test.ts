/**
 * Every exported function documents the unit of each parameter: its TSDoc has an `@param`
 * line for every parameter, and every `@param` line names a unit or says it is unitless /
 * dimensionless / a fraction / a count. Also: no engine source imports Node APIs or a
 * framework, and no comment cites teaching material (the words are in NOT_CITED below).
 * (node:fs is fine here, in a test; engine code itself never uses it.)
 */
import { readdirSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { NOT_CITED } from "./test/not-cited";

const dir = fileURLToPath(new URL(".", import.meta.url));
const files = readdirSync(dir).filter((f) => f.endsWith(".ts") && !f.endsWith(".test.ts"));

const UNIT = /(m³\/s|m²\/s|kg\/m³|Pa·s|\bPa\b|\bW\b|\bm\b|\bmm\b|°C|\bK\b|\brpm\b|\bh\b|kWh|m\/s|currency|dimensionless|unitless|fraction|count|any unit|unit of|same unit|\bSI\b)/;

/** Exported functions with their doc comment and parameter names. */
function exportedFunctions(src: string): { name: string; doc: string; params: string[] }[] {
  const out: { name: string; doc: string; params: string[] }[] = [];
  const re = /export function (\w+)\s*(<[^(]*>)?\s*\(/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(src))) {
    // Parameter list: scan to the matching parenthesis.
    let depth = 1, i = re.lastIndex;
    const start = i;
    for (; i < src.length && depth > 0; i++) {
      const ch = src[i];
      if (ch === "(" || ch === "{" || ch === "[") depth++;
      else if (ch === ")" || ch === "}" || ch === "]") depth--;
    }
    const list = src.slice(start, i - 1);
    const params: string[] = [];
    let d = 0, cur = "";
    for (const ch of list) {
      if (ch === "(" || ch === "{" || ch === "[" || ch === "<") d++;
      if (ch === ")" || ch === "}" || ch === "]" || ch === ">") d--;
      if (ch === "," && d === 0) { params.push(cur); cur = ""; } else cur += ch;
    }
    if (cur.trim()) params.push(cur);
    const names = params.map((p) => p.trim().match(/^(\w+)/)?.[1]).filter((x): x is string => !!x);
    // Doc comment: the /** ... */ block ending right before the declaration.
    const before = src.slice(0, m.index).trimEnd();
    const doc = before.endsWith("*/") ? before.slice(before.lastIndexOf("/**")) : "";
    out.push({ name: m[1], doc, params: names });
  }
  return out;
}

describe("TSDoc units on every exported function", () => {
  let count = 0;
  for (const f of files) {
    const src = readFileSync(join(dir, f), "utf8");
    for (const fn of exportedFunctions(src)) {
      count++;
      it(`${f}: ${fn.name}`, () => {
        expect(fn.doc, `${fn.name} has no TSDoc`).not.toBe("");
        const lines = fn.doc.split("\n").filter((l) => l.includes("@param"));
        for (const p of fn.params) {
          expect(lines.some((l) => new RegExp(`@param ${p}(\\s|\\.)`).test(l)), `${fn.name}: no @param for ${p}`).toBe(true);
        }
        for (const l of lines) expect(l, `${fn.name}: @param without a unit: ${l.trim()}`).toMatch(UNIT);
      });
    }
  }
  it("found the engine's exported functions", () => {
    expect(count).toBeGreaterThan(60);
  });
});

describe("engine sources stay portable and cite properly", () => {
  for (const f of files) {
    const src = readFileSync(join(dir, f), "utf8");
    it(`${f}: no Node APIs, no framework, no database`, () => {
      expect(src).not.toMatch(/from\s+["'](node:|fs|path|child_process|react|drizzle)/);
      expect(src).not.toMatch(/\bprocess\.|\brequire\(/);
    });
    it(`${f}: cites no teaching material`, () => {
      expect(src).not.toMatch(NOT_CITED);
    });
  }
});
