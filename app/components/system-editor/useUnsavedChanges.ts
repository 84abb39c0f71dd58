// Unsaved changes of the system editor: the form as loaded (or last saved) is kept as a snapshot; any
// difference makes the editor "dirty". While dirty, a navigation inside the app to another page waits
// for the engineer's answer (React Router's useBlocker; LeaveQuestion shows the question), and leaving
// the document (reload, close, an outside link) raises the browser's own beforeunload question.
// Without JavaScript none of this runs, and the form works as before.
import { useCallback, useEffect, useRef, useState, type RefObject } from "react";
import { useBlocker } from "react-router";

/** The form's text fields in order (files are not part of the editor). */
function snapshot(form: HTMLFormElement | null): string {
  if (!form) return "";
  return JSON.stringify([...new FormData(form).entries()].filter(([, v]) => typeof v === "string"));
}

/**
 * `loadedKey` changes when another system is loaded; `savedKey` is a new non-null value after each
 * successful save. Call `check()` on every input of the form.
 */
export function useUnsavedChanges(formRef: RefObject<HTMLFormElement | null>, loadedKey: unknown, savedKey: unknown) {
  const baseline = useRef<string | null>(null);
  const [dirty, setDirty] = useState(false);
  const reset = useCallback(() => {
    baseline.current = snapshot(formRef.current);
    setDirty(false);
  }, [formRef]);
  useEffect(reset, [reset, loadedKey]);
  useEffect(() => {
    if (savedKey != null) reset();
  }, [reset, savedKey]);
  const check = useCallback(() => {
    if (baseline.current !== null) setDirty(snapshot(formRef.current) !== baseline.current);
  }, [formRef]);
  // Submissions to this page (save, adjust, …) stay on its path and are never asked about.
  const blocker = useBlocker(({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname);
  useEffect(() => {
    if (!dirty) return;
    const ask = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      e.returnValue = ""; // older browsers ask only when returnValue is set
    };
    window.addEventListener("beforeunload", ask);
    return () => window.removeEventListener("beforeunload", ask);
  }, [dirty]);
  return { dirty, check, blocker };
}
