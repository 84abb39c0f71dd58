// Thumb-sized inputs for the field-check form: numbers bring up the decimal keypad, say their unit
// beside the box and carry their own error message (also listed in the summary at the top).
import type { ReactNode } from "react";
import { unitLabel, type Quantity } from "~/engine";

export type Errors = Record<string, string> | undefined;

/** Big enough for a thumb on site (48 px tall, 16 px text so phones do not zoom). */
export const BIG_INPUT = "field min-h-12 text-base";

export const errorId = (name: string) => `${name}-err`;
export const inputId = (name: string) => `fc-${name}`;

export function FieldError({ errors, name }: { errors: Errors; name: string }) {
  return errors?.[name] ? (
    <p id={errorId(name)} className="text-sm font-semibold text-fail">
      {errors[name]}
    </p>
  ) : null;
}

/**
 * A number read on site. `enterKeyHint` is "next" (the keypad's key moves on) unless this is the
 * last number before the submit button ("done"). The unit sits beside the box and is read with it.
 */
export function NumberField(props: {
  name: string;
  label: string;
  unit: string;
  value: string;
  errors: Errors;
  optional?: boolean;
  hint?: string;
  last?: boolean;
}) {
  const { name, label, unit, value, errors, optional, hint, last } = props;
  const error = errors?.[name];
  const describedBy = [unit ? `${inputId(name)}-unit` : null, hint ? `${inputId(name)}-hint` : null, error ? errorId(name) : null].filter(Boolean).join(" ");
  return (
    <div className="block text-sm">
      <label htmlFor={inputId(name)} className="label">
        {label}
        {optional ? <span className="font-normal normal-case text-slate-600"> (optional)</span> : null}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={inputId(name)}
          name={name}
          defaultValue={value}
          type="text"
          inputMode="decimal"
          enterKeyHint={last ? "done" : "next"}
          autoComplete="off"
          className={BIG_INPUT}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy || undefined}
        />
        {unit ? (
          <span id={`${inputId(name)}-unit`} className="min-w-10 text-sm font-semibold text-slate-700">
            {unit}
          </span>
        ) : null}
      </div>
      {hint ? (
        <span id={`${inputId(name)}-hint`} className="text-xs text-slate-600">
          {hint}
        </span>
      ) : null}
      <FieldError errors={errors} name={name} />
    </div>
  );
}

export function UnitSelect(props: { name: string; quantity: Quantity; units: readonly string[]; value: string; label: string; onChange?: (unit: string) => void }) {
  const { name, quantity, units, value, label, onChange } = props;
  return (
    <label className="block text-sm">
      <span className="label">{label}</span>
      <select name={name} defaultValue={value} className={BIG_INPUT} onChange={onChange ? (e) => onChange(e.currentTarget.value) : undefined}>
        {units.map((unit) => (
          <option key={unit} value={unit}>
            {unitLabel(quantity, unit)}
          </option>
        ))}
      </select>
    </label>
  );
}

export function ChoiceSelect(props: { name: string; label: string; value: string; children: ReactNode }) {
  return (
    <label className="block text-sm">
      <span className="label">{props.label}</span>
      <select name={props.name} defaultValue={props.value} className={BIG_INPUT}>
        {props.children}
      </select>
    </label>
  );
}
