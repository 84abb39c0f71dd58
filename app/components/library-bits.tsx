import { qt } from "~/engine/quantityText";

export function AccessBadge({ access, visibility }: { access: "owner" | "open" | "locked"; visibility: "private" | "workspace" | "shared" }) {
  if (access === "locked")
    return (
      <span className="inline-flex items-center gap-1 rounded bg-slate-200 px-1.5 py-0.5 text-xs font-semibold text-slate-700" title="Opens with the Network plan">
        <svg width="10" height="12" viewBox="0 0 10 12" aria-hidden="true">
          <rect x="1" y="5" width="8" height="6" rx="1" fill="currentColor" />
          <path d="M3 5V3.5a2 2 0 0 1 4 0V5" stroke="currentColor" fill="none" />
        </svg>
        locked
      </span>
    );
  const label = access === "open" ? "shared with you" : visibility === "private" ? "private draft" : visibility === "workspace" ? "whole workspace" : "shared with subscribers";
  return <span className="rounded bg-brand-50 px-1.5 py-0.5 text-xs font-semibold text-brand-800">{label}</span>;
}

export const fmtBytes = (n: number) => (n > 1048576 ? `${(n / 1048576).toFixed(1)} MB` : `${Math.max(1, Math.round(n / 1024))} kB`);

/** "2900 rpm · Ø250 mm" with the diameter as a quantity token (render with `renderUnits`). */
export function curveLabel(speed: number | null, diameter: number | null): string {
  const parts = [];
  if (speed) parts.push(`${Math.round(speed)} rpm`);
  if (diameter) parts.push(`Ø${qt("diameter", diameter)}`);
  return parts.join(" · ") || "curve";
}
