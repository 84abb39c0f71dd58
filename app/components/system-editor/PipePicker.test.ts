import { describe, expect, it } from "vitest";
import { PIPE_TABLES } from "~/engine";
import { groupByStandard, searchPipeTables } from "./PipePicker";

describe("pipe picker: grouped by standard, searchable", () => {
  it("groups every table under its standard, each table once", () => {
    const groups = groupByStandard(PIPE_TABLES);
    expect(groups.map((g) => g.standard)).toEqual(expect.arrayContaining(["EN 10255", "EN 10217 / ISO 4200", "EN 1057", "ISO 4427", "EN 545", "ASME B36.10M"]));
    expect(groups.flatMap((g) => g.tables).length).toBe(PIPE_TABLES.length);
    expect(groups.find((g) => g.standard === "ISO 4427")!.tables.map((t) => t.id)).toEqual(["iso4427-pe100-sdr11", "iso4427-pe100-sdr17"]);
  });
  it("finds tables by standard, material word or size label; nothing for nonsense", () => {
    expect(searchPipeTables("EN 545").map((t) => t.id)).toEqual(["en545-ductile"]);
    expect(searchPipeTables("pe100").map((t) => t.id)).toEqual(["iso4427-pe100-sdr11", "iso4427-pe100-sdr17"]);
    expect(searchPipeTables("sdr 17").map((t) => t.id)).toEqual(["iso4427-pe100-sdr17"]);
    // "d20" is in SDR 11 only (SDR 17 starts at d40 in the table).
    expect(searchPipeTables("d20").map((t) => t.id)).toEqual(["iso4427-pe100-sdr11"]);
    // DN800: EN 545 only.
    expect(searchPipeTables("DN800").map((t) => t.id)).toEqual(["en545-ductile"]);
    expect(searchPipeTables("zzz")).toEqual([]);
    expect(searchPipeTables("  ").length).toBe(PIPE_TABLES.length);
  });
});
