// Unsaved changes of the system editor: the form as loaded (or last saved) is kept as a snapshot; any
// difference makes the editor "dirty". While dirty, a navigation inside the app to another page waits
// for the engineer's answer (React Router's useBlocker; LeaveQuestion shows the question), and leaving
// the document (reload, close, an outside link) raises the browser's own beforeunload question.
// Without JavaScript none of this runs, and the form works as before.
import { useCallback, useEffect, useRef, useState, type RefObject } from "react";
import { useBlocker } from "react-router";

type Field = HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement;

/**
 * The form's fields in order, name and value. With `loaded`, inputs give the values the page was served
 * with (their default values), so edits typed before the page came to life count as changes too; selects
 * always give their current choice (React does not mark a controlled select's default, e.g. PipePicker's).
 */
function snapshot(form: HTMLFormElement | null, loaded = false): string {
  if (!form) return "";
  const out: [string, string][] = [];
  for (const el of Array.from(form.elements) as Field[]) {
    if (!el.name || el.disabled || el.type === "file" || el.type === "submit" || el.type === "button") continue;
    if (el instanceof HTMLSelectElement) {
      for (const o of Array.from(el.options)) if (o.selected) out.push([el.name, o.value]);
    } else if (el instanceof HTMLInputElement && (el.type === "checkbox" || el.type === "radio")) {
      if (loaded ? el.defaultChecked : el.checked) out.push([el.name, el.value]);
    } else out.push([el.name, loaded ? el.defaultValue : el.value]);
  }
  return JSON.stringify(out);
}

/** The baseline of a form that holds a refused save's typed values: no snapshot equals it, so the form is unsaved until a save goes through. */
const NOT_SAVED = "not saved: the values of a refused save";

/**
 * `loadedKey` changes when another system is loaded; `savedKey` is a new non-null value after each
 * successful save. `servedUnsaved`: the form holds a refused save's typed values (the page was served with them as the
 * answer to a post sent without JavaScript, typed-back.ts, or a refused save came back to it): they are not what is
 * stored, so the form is unsaved until a save goes through. Call `check()` on every input of the form. `watching` is
 * false until the page runs its scripts (the editor marks its form with it, so tests know when a change is noticed).
 */
export function useUnsavedChanges(formRef: RefObject<HTMLFormElement | null>, loadedKey: unknown, savedKey: unknown, servedUnsaved = false) {
  const baseline = useRef<string | null>(null);
  const [dirty, setDirty] = useState(false);
  const [watching, setWatching] = useState(false);
  // As loaded: the served values (none, when they are a refused save's). After a save: the form as it stands (its values
  // are now the stored ones, though the server may write them back formatted differently). This effect reads its inputs
  // and keeps nothing of an earlier run: React's StrictMode runs it twice on mount in a development build (npm test's
  // browser tests run one, db/cli.mjs building under NODE_ENV=test), and a flag consumed by the first run made the
  // second take the typed values as the baseline (decision "nojsbaseline").
  useEffect(() => {
    baseline.current = servedUnsaved ? NOT_SAVED : snapshot(formRef.current, true);
    setDirty(snapshot(formRef.current) !== baseline.current);
    setWatching(true);
  }, [formRef, loadedKey, servedUnsaved]);
  useEffect(() => {
    if (savedKey == null) return;
    baseline.current = snapshot(formRef.current);
    setDirty(false);
  }, [formRef, savedKey]);
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
  return { dirty, watching, check, blocker };
}
