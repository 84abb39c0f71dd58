import type { systemFormValues, FormErrors } from "~/lib/projects/system-form";
import type { UnitChoice } from "~/lib/shared/units";

/** What the system form shows: the stored inputs in the user's units, as strings. */
export type SystemFormValues = ReturnType<typeof systemFormValues>;

/** Props every fieldset of the editor takes. */
export type FieldsetProps = { f: SystemFormValues; errors: FormErrors; unitSystem: UnitChoice };
