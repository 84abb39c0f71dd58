// Small measuring helpers the benches share.
import { readFileSync } from "node:fs";

/** The middle value (the upper of the two middle ones for an even count). */
export const median = (xs: readonly number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1];

/** CPU time of process `pid` so far, ms (Linux /proc; utime + stime at 100 ticks a second). */
export function cpuMs(pid: number | string): number {
  const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
  const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" "); // after the name, which may hold ") "
  return (Number(fields[11]) + Number(fields[12])) * 10;
}
