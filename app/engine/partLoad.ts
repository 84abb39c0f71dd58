/**
 * Motor and drive efficiency at part load, as factors on the rated efficiencies by load fraction x = P_shaft / motor
 * rating (moved out of dutyCycle.ts, which uses them; the assumptions are stated in its module comment):
 * - motor (common practice assumption, from memory of typical IE3 induction-motor part-load data): k_m = 1 at x ≥ 0.5,
 *   0.93 at 0.25, 0.80 at 0.10, linear between; below 10 % load the 10 % value.
 * - drive (common practice assumption, from memory of published part-load efficiency curves of low-voltage PWM drives):
 *   k_d = 1 at x ≥ 1, 0.995 at 0.75, 0.985 at 0.5, 0.95 at 0.25, 0.88 at 0.10, linear between.
 * Units: dimensionless (load fraction in, factor out). Validity: any load fraction; clamped at the tables' ends.
 */

/** Motor part-load factor on the rated efficiency, by load fraction (assumption stated above). */
export const MOTOR_PART_LOAD: readonly (readonly [number, number])[] = [[0.1, 0.8], [0.25, 0.93], [0.5, 1], [1, 1]];
/** Drive part-load factor on the rated drive efficiency, by load fraction (assumption stated above). */
export const DRIVE_PART_LOAD: readonly (readonly [number, number])[] = [[0.1, 0.88], [0.25, 0.95], [0.5, 0.985], [0.75, 0.995], [1, 1]];
export const PART_LOAD_SOURCE = "motor and drive part-load factors: common practice assumption (from memory of typical IE3 motor and PWM drive part-load data; check the makers' data)";

/**
 * A piecewise-linear factor table [(x, k)] ascending in x, read at x; clamped at both ends.
 * @param table the factor table (load fraction, factor), dimensionless, ascending in load fraction
 * @param x the load fraction (shaft power / motor rating), dimensionless
 */
export function partLoadFactor(table: readonly (readonly [number, number])[], x: number): number {
  if (x <= table[0][0]) return table[0][1];
  for (let i = 1; i < table.length; i++) {
    const [x1, k1] = table[i];
    if (x <= x1) {
      const [x0, k0] = table[i - 1];
      return k0 + ((k1 - k0) * (x - x0)) / (x1 - x0);
    }
  }
  return table[table.length - 1][1];
}
