import type { FormErrors } from "~/lib/projects/system-form";
import type { TypedValues } from "~/lib/projects/typed-back";
import type { UnitChoice } from "~/lib/shared/units";

/** What the system form shows: the stored inputs in the user's units, as strings, or after a refused save as typed (typed-back.ts). */
export type SystemFormValues = TypedValues;

/** Props every fieldset of the editor takes. */
export type FieldsetProps = { f: SystemFormValues; errors: FormErrors; unitSystem: UnitChoice };
