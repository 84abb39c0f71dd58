import { DutyChart } from "./chart/DutyChart";
import type { PumpSeries, UnitSystemId } from "./chart/types";

type P = { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null };

/** Library curves (SI points as stored) on the duty chart, one series per curve set. */
export function CurvePreview({ unitSystem, title, curves }: { unitSystem: UnitSystemId; title: string; curves: { id: string; label: string; points: P[] }[] }) {
  const pumps: PumpSeries[] = curves.map((c, i) => {
    const pick = (k: "efficiency" | "power" | "npshr") => {
      const pts = c.points.filter((p) => p[k] != null).map((p) => ({ flow: p.flow, y: p[k] as number }));
      return pts.length >= 2 ? pts : undefined;
    };
    return { id: c.id, label: c.label, colorIndex: i, head: c.points.map((p) => ({ flow: p.flow, y: p.head })), efficiency: pick("efficiency"), power: pick("power"), npshr: pick("npshr") };
  });
  return <DutyChart unitSystem={unitSystem} title={title} description={`${curves.length} pump curves: head, and where given efficiency, shaft power and NPSHr, against flow.`} pumps={pumps} />;
}
