// The importer's no-speed warning for each traced curve it takes without a speed (curve-checks.ts curveWarnings), shown
// beside the other warnings before the import, with what a curve without a speed cannot give.
import type { CurveProblem } from "./curve-checks";

export function NoSpeedNotice(props: { warnings: CurveProblem[] }) {
  if (!props.warnings.length) return null;
  return (
    <div className="space-y-1 rounded border border-amber-300 bg-amber-50 p-2 text-xs" data-testid="no-speed-notice" role="note">
      {props.warnings.map((w) => (
        <p key={w.curveId} data-testid={`no-speed-warning-${w.curveId}`}>
          {w.message}
        </p>
      ))}
    </div>
  );
}
