import { useEffect, useState } from "react";

/** Shown once JavaScript runs (without it, the browser's own print command works the same). */
export function PrintButton() {
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);
  if (!ready) return null;
  return (
    <button type="button" className="btn" onClick={() => window.print()}>
      Print report
    </button>
  );
}
