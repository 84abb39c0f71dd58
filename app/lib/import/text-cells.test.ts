// The inverse of our CSV writer's formula defusing (app/lib/shared/csv.ts), cell by cell. The cases
// follow the writer's FORMULA_START (= + - @ tab CR first: OWASP "CSV Injection", common practice).
import { describe, expect, it } from "vitest";
import { FORMULA_START } from "~/lib/shared/csv";
import { undefused } from "./text-cells";

describe("undefused", () => {
  it("takes off exactly one apostrophe, and only before = + - @ tab CR (the writer's FORMULA_START)", () => {
    expect(undefused("'+GF 50-250")).toBe("+GF 50-250");
    expect(undefused("'-3")).toBe("-3");
    expect(undefused("'=SUM(A1)")).toBe("=SUM(A1)");
    expect(undefused("'@x")).toBe("@x");
    expect(undefused("'\tx")).toBe("\tx");
    expect(undefused("'\rx")).toBe("\rx");
    expect(undefused("''+x")).toBe("''+x"); // an apostrophe follows: never written so by the writer, kept
    expect(undefused("'+'+x")).toBe("+'+x"); // one only
    expect(undefused("'plain")).toBe("'plain"); // never defused: kept
    expect(undefused("x'+y")).toBe("x'+y");
    expect(undefused("")).toBe("");
  });

  it("undoes what the writer defuses, character for character (every ASCII first character)", () => {
    for (let c = 0; c < 128; c++) {
      const text = `${String.fromCharCode(c)}x`;
      const written = FORMULA_START.test(text) ? `'${text}` : text;
      expect(undefused(written)).toBe(text);
    }
  });
});
