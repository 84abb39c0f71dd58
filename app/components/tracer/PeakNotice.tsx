// The peak the contours do not trace (app/lib/tracer/peak.ts): one warning per head curve whose
// efficiency comes from contours, with the box that writes the middle of its innermost span at the
// contour's level (`peakBoxLabel`): between two crossings it is then the best-efficiency point; for a
// curve that ends (or starts) inside the contour it only carries the efficiency and shaft power to the
// middle, the engine knowing no best-efficiency point there either way. Unticked, those rows stay blank. A curve that crosses one contour only, once or
// twice or more, or none, and a span where the curve is outside a contour (a dip), get their warning without a box
// (`peakBoxLabel` null): the CSV writes no efficiency for the former either way, and a dip's middle is no peak. A curve
// with two spans inside its top level's contours (two islands) has one box, on its first span: it writes every middle.
// The same facts go with the import, short, into the source line and so into the revision's note.
import { peakBoxLabel, peakWarning, type UnreadPeak } from "~/lib/tracer/peak";

export function PeakNotice(props: { peaks: UnreadPeak[]; flowUnit: string; onTake: (curveId: number, taken: boolean) => void }) {
  if (!props.peaks.length) return null;
  return (
    <div className="space-y-2 rounded border border-amber-300 bg-amber-50 p-2 text-xs" data-testid="peak-notice" role="note">
      {props.peaks.map((p, i) => {
        const first = props.peaks.findIndex((q) => q.curveId === p.curveId && peakBoxLabel(q, props.flowUnit) !== null) === i;
        const label = first ? peakBoxLabel(p, props.flowUnit) : null;
        return (
          <div key={`${p.curveId}-${i}`} className="space-y-1">
            <p data-testid={`peak-warning-${p.curveId}`}>{peakWarning(p, props.flowUnit)}</p>
            {label === null ? null : (
              <label className="flex items-center gap-1">
                <input type="checkbox" data-testid={`peak-take-${p.curveId}`} checked={p.taken} onChange={(e) => props.onTake(p.curveId, e.target.checked)} />
                {label}
              </label>
            )}
          </div>
        );
      })}
    </div>
  );
}
