/**
 * Builds a pipe catalogue table from the rows a standard prints: nominal size, outside diameter
 * and wall, in one length unit (inches for the ASME/ASTM/AWWA tables, mm for EN/ISO), converted
 * to m. Inner diameter = OD − 2·wall − 2·lining (common practice). Pure; the tables themselves
 * name their sources (`pipes.ts`, `pipesDN.ts`).
 */
import type { PipeTable } from "./pipes.ts";
import { EngineInputError } from "./errors.ts";

/** A table's identity and provenance (see `PipeTable`). */
export type PipeTableMeta = Pick<PipeTable, "id" | "name" | "standard" | "material" | "source">;

/**
 * One table from printed rows.
 * @param meta id, name, standard, material and source of the table (unitless text)
 * @param rows `[nominal, outside diameter, wall]` per size, lengths in the unit of `unit`
 * @param unit metres per unit of the rows' lengths, m (0.0254 for inches, 0.001 for mm)
 * @param lining lining thickness of a size (nominal, outside diameter), in the same unit as the rows; none by default
 * A row whose wall and lining leave no bore (wall + lining ≥ OD/2), or whose numbers are not positive, is refused
 * (EngineInputError naming the table and size): a typo in a table never becomes a zero or negative inner diameter.
 */
export function buildPipeTable(meta: PipeTableMeta, rows: readonly (readonly [string, number, number])[], unit: number, lining: (nominal: string, od: number) => number = () => 0): PipeTable {
  return {
    ...meta,
    sizes: rows.map(([nominal, od, wall]) => {
      const lined = lining(nominal, od);
      const bore = od - 2 * wall - 2 * lined;
      if (!(od > 0 && wall > 0 && lined >= 0 && bore > 0 && bore < Infinity)) {
        throw new EngineInputError("rows", `${meta.name} ${nominal}: outside diameter ${od}, wall ${wall} and lining ${lined} (the table's unit) leave no bore; the wall and lining must be positive and below half the outside diameter`);
      }
      return { nominal, outsideDiameter: od * unit, wall: wall * unit, innerDiameter: bore * unit };
    }),
  };
}
