// The inverse of our CSV writer's formula defusing (app/lib/shared/csv.ts), cell by cell. The cases
// follow the writer's DEFUSE_START (= + - @ tab CR first: OWASP "CSV Injection", common practice).
import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { toCsv } from "~/lib/shared/csv";
import { undefused } from "./text-cells";

describe("undefused", () => {
  it("takes off exactly one apostrophe, and only before = + - @ tab CR after none or more apostrophes (the writer's DEFUSE_START)", () => {
    expect(undefused("'+GF 50-250")).toBe("+GF 50-250");
    expect(undefused("'-3")).toBe("-3");
    expect(undefused("'=SUM(A1)")).toBe("=SUM(A1)");
    expect(undefused("'@x")).toBe("@x");
    expect(undefused("'\tx")).toBe("\tx");
    expect(undefused("'\rx")).toBe("\rx");
    expect(undefused("''+x")).toBe("'+x"); // the writer's apostrophe before a name "'+x": one taken off
    expect(undefused("'''=x")).toBe("''=x");
    expect(undefused("''x")).toBe("''x"); // no = + - @ tab CR after the apostrophes: never defused, kept
    expect(undefused("'+'+x")).toBe("+'+x"); // one only
    expect(undefused("'plain")).toBe("'plain"); // never defused: kept
    expect(undefused("x'+y")).toBe("x'+y");
    expect(undefused("")).toBe("");
  });

  it("undoes what the writer defuses, character for character (every ASCII first character, after 0 to 3 apostrophes)", () => {
    for (const lead of ["", "'", "''", "'''"])
      for (let c = 0; c < 128; c++) {
        const text = `${lead}${String.fromCharCode(c)}x`;
        const written = toCsv([[text]], { newline: "\n" });
        expect(undefused(Papa.parse<string[]>(written).data[0][0])).toBe(text);
      }
  });
});
