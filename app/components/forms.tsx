import type { ReactNode } from "react";

/** A labelled input with its unit, hint or error; other props (defaultValue, autoComplete, required, …) go to the input. */
export function Field({
  label,
  name,
  type = "text",
  error,
  unit,
  hint,
  ...rest
}: {
  label: string;
  name: string;
  type?: string;
  error?: string;
  defaultValue?: string | number;
  autoComplete?: string;
  required?: boolean;
  unit?: string;
  hint?: string;
  [k: string]: unknown;
}) {
  const id = `f-${name}`;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="label">
        {label}
        {unit ? <span className="ml-1 font-normal normal-case text-slate-500">({unit})</span> : null}
      </label>
      <input
        id={id}
        name={name}
        type={type}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-err` : hint ? `${id}-hint` : undefined}
        className="field"
        {...rest}
      />
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-slate-500">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-err`} className="text-sm text-fail" role="alert">
          {error}
        </p>
      ) : null}
    </div>
  );
}

export function FormError({ error }: { error?: string }) {
  if (!error) return null;
  return (
    <p className="rounded-md border border-fail bg-fail-soft px-3 py-2 text-sm text-fail" role="alert">
      {error}
    </p>
  );
}

export function Notice({ children }: { children: ReactNode }) {
  return (
    <p className="rounded-md border border-brand-200 bg-brand-50 px-3 py-2 text-sm text-brand-900" role="status">
      {children}
    </p>
  );
}

/** What the last action said to the whole page: its notice (done) and its form-level error, each only when there is one. */
export function FormOutcome({ notice, error }: { notice?: string | null; error?: string }) {
  return (
    <>
      {notice ? <Notice>{notice}</Notice> : null}
      <FormError error={error} />
    </>
  );
}

export function Card({ title, children, narrow }: { title: string; children: ReactNode; narrow?: boolean }) {
  return (
    <section className={`panel ${narrow ? "mx-auto max-w-md" : ""}`}>
      <h1 className="mb-4 text-2xl font-bold text-brand-900">{title}</h1>
      {children}
    </section>
  );
}

/** The options of a select: one per value, shown as `label(value)` (the value itself when no label is given). */
export function Options<T extends string>({ values, label = (x) => x }: { values: readonly T[]; label?: (value: T) => ReactNode }) {
  return values.map((x) => (
    <option key={x} value={x}>
      {label(x)}
    </option>
  ));
}

/**
 * The workspace the page shows, sent with each of its forms: the action acts on that workspace or, when the
 * session has switched to another meanwhile (another tab), refuses with 409 (`staleWorkspacePage`).
 */
export function PageWorkspaceField({ id }: { id: number }) {
  return <input type="hidden" name="pageWorkspaceId" value={id} />;
}
