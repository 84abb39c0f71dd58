import type { systemFormValues, FormErrors, UnitChoice } from "~/lib/projects/system-form";

/** What the system form shows: the stored inputs in the user's units, as strings. */
export type SystemFormValues = ReturnType<typeof systemFormValues>;

/** Props every fieldset of the editor takes. */
export type FieldsetProps = { f: SystemFormValues; errors: FormErrors; unitSystem: UnitChoice };
