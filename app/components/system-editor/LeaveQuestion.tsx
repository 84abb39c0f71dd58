// The question asked when the engineer leaves the system editor with unsaved changes (see useUnsavedChanges).
import type { Blocker } from "react-router";

export function LeaveQuestion({ blocker }: { blocker: Blocker }) {
  if (blocker.state !== "blocked") return null;
  return (
    // Escape answers "stay", as closing a question does elsewhere.
    <div className="fixed inset-0 z-50 flex items-start justify-center bg-slate-900/30 p-4 pt-24" onKeyDown={(e) => e.key === "Escape" && blocker.reset()}>
      <div role="alertdialog" aria-modal="true" aria-labelledby="leave-h" aria-describedby="leave-d" className="panel max-w-md space-y-3 shadow-lg">
        <h2 id="leave-h" className="font-semibold">
          Leave without saving?
        </h2>
        <p id="leave-d" className="text-sm text-slate-700">
          This system has changes that are not saved. If you leave now, they are lost.
        </p>
        <div className="flex flex-wrap gap-2">
          <button type="button" className="btn" autoFocus onClick={() => blocker.reset()}>
            Stay and keep editing
          </button>
          <button type="button" className="btn-quiet" onClick={() => blocker.proceed()}>
            Leave without saving
          </button>
        </div>
      </div>
    </div>
  );
}
