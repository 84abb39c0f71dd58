// One labelled input of the system editor: unit beside the label, the server's or the live
// reader's error under it (linked by aria-describedby), else the hint.
import type { FormErrors } from "~/lib/projects/system-form";

export function NumberField({ label, name, def, errors, unit, hint, wide, placeholder, inputMode = "decimal" }: { label: string; name: string; def: string; errors: FormErrors; unit?: string; hint?: string; wide?: boolean; placeholder?: string; inputMode?: "decimal" | "numeric" }) {
  const id = `f-${name}`;
  const err = errors[name];
  return (
    <div className={wide ? "col-span-2" : ""}>
      <label htmlFor={id} className="label">
        {label}
        {unit ? <span className="ml-1 font-normal normal-case text-slate-500">({unit})</span> : null}
      </label>
      <input id={id} name={name} defaultValue={def} placeholder={placeholder} inputMode={inputMode} className="field" aria-invalid={err ? true : undefined} aria-describedby={err ? `${id}-err` : undefined} />
      {err ? (
        <p id={`${id}-err`} className="text-xs text-fail" role="alert">
          {err}
        </p>
      ) : hint ? (
        <p className="text-xs text-slate-500">{hint}</p>
      ) : null}
    </div>
  );
}
