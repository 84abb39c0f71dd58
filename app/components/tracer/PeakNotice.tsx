// The peak the contours do not trace (app/lib/tracer/peak.ts): one warning per head curve whose
// efficiency comes from contours, with the box that writes the middle of its innermost span at the
// contour's level (`peakBoxLabel`): between two crossings it is then the best-efficiency point; for a
// curve that ends (or starts) inside the contour it only carries the efficiency and shaft power to the
// middle, the engine knowing no best-efficiency point there either way. Unticked, those rows stay blank. A curve that crosses one contour only, once or
// twice, gets its warning without a box (`peakBoxLabel` null): the CSV writes no efficiency for it either way.
// The same facts go with the import, short, into the source line and so into the revision's note.
import { peakBoxLabel, peakWarning, type UnreadPeak } from "~/lib/tracer/peak";

export function PeakNotice(props: { peaks: UnreadPeak[]; flowUnit: string; onTake: (curveId: number, taken: boolean) => void }) {
  if (!props.peaks.length) return null;
  return (
    <div className="space-y-2 rounded border border-amber-300 bg-amber-50 p-2 text-xs" data-testid="peak-notice" role="note">
      {props.peaks.map((p, i) => {
        const label = peakBoxLabel(p, props.flowUnit);
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
