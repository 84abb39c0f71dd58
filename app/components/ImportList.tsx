// The latest imports of a library with their progress (library page). While one runs, the page
// reloads its data every 1.5 s with JavaScript; without, a refresh link does the same.
import { useEffect } from "react";
import { useRevalidator } from "react-router";
import type { ImportView } from "~/lib/libraries/import-view";
import { fmtUtc, fmtInt } from "~/lib/shared/format";

export type ImportRow = Omit<ImportView, "uploadId">;

const STATUS: Record<ImportRow["status"], string> = { running: "running", done: "imported", failed: "failed", stopped: "stopped" };

export function ImportList({ imports, refreshHref, highlight }: { imports: ImportRow[]; refreshHref: string; highlight?: number | null }) {
  const running = imports.some((i) => i.status === "running");
  const { revalidate, state } = useRevalidator();
  useEffect(() => {
    if (!running) return;
    const t = setInterval(() => {
      if (state === "idle") void revalidate();
    }, 1500);
    return () => clearInterval(t);
  }, [running, revalidate, state]);
  if (imports.length === 0) return null;
  return (
    <section className="panel space-y-2" id="imports" aria-label="Imports">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-lg font-semibold">Imports</h2>
        {running ? (
          <a href={refreshHref} className="text-sm" data-testid="imports-refresh">
            Refresh
          </a>
        ) : null}
      </div>
      <ul className="space-y-2 text-sm">
        {imports.map((i) => {
          const pct = i.pointsTotal ? Math.min(100, Math.round((100 * i.pointsWritten) / i.pointsTotal)) : 0;
          const bad = i.status === "failed" || i.status === "stopped";
          return (
            <li key={i.id} data-testid={`import-${i.id}`} data-status={i.status} className={i.id === highlight ? "font-semibold" : ""}>
              <span>
                Import {i.id} ({fmtUtc(i.createdAt)}): {STATUS[i.status]}
                {i.status === "done" && i.revisionNumber ? ` as revision ${i.revisionNumber}` : ""} ·{" "}
                {i.status === "done" ? `${fmtInt(i.pointsTotal)} points` : `${fmtInt(i.pointsWritten)} of ${fmtInt(i.pointsTotal)} points written`}
                {i.status === "running" ? " (kept only when all are written)" : ""}
              </span>
              <div className="mt-1 h-2 w-full max-w-md rounded bg-slate-100" role="progressbar" aria-label={`Import ${i.id} progress`} aria-valuemin={0} aria-valuemax={100} aria-valuenow={i.status === "done" ? 100 : pct}>
                <div className={`h-2 rounded ${bad ? "bg-fail" : "bg-brand-700"}`} style={{ width: `${i.status === "done" ? 100 : bad ? 100 : pct}%` }} />
              </div>
              {bad && i.message ? <p className="text-fail">{i.message}</p> : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
