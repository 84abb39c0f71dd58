// Errors summarised at the top of the form: focus moves here when a submit is refused, and each
// entry links to its field (whose own message sits beside it).
import { useEffect, useRef } from "react";
import { inputId, type Errors } from "./inputs";

/** Errors about the form as a whole, with no field to link to (the page's workspace is a hidden field). */
const WHOLE_FORM = new Set(["_form", "pageWorkspaceId"]);

export function ErrorSummary({ errors, labels }: { errors: Errors; labels: Record<string, string> }) {
  const box = useRef<HTMLDivElement>(null);
  const entries = Object.entries(errors ?? {});
  const key = entries.map(([k, v]) => `${k}:${v}`).join("|");
  useEffect(() => {
    if (key) box.current?.focus();
  }, [key]);
  if (!entries.length) return null;
  return (
    <div ref={box} tabIndex={-1} role="alert" aria-labelledby="fc-error-title" className="caution space-y-1 focus:outline-2 focus:outline-fail">
      <h2 id="fc-error-title" className="font-semibold">
        {entries.length === 1 ? "One thing needs another look" : `${entries.length} things need another look`}
      </h2>
      <ul className="list-disc pl-5">
        {entries.map(([name, message]) => (
          <li key={name}>
            {WHOLE_FORM.has(name) ? message : <a href={`#${inputId(name)}`}>{labels[name] ? `${labels[name]}: ${message}` : message}</a>}
          </li>
        ))}
      </ul>
    </div>
  );
}
