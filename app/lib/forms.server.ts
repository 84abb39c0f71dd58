import * as v from "valibot";
import { data } from "react-router";

export type FieldErrors = Record<string, string>;

/** Reads a form body and validates it with a valibot object schema. Oversized bodies are refused upstream (middleware). */
export async function readForm<S extends v.GenericSchema>(
  request: Request,
  schema: S,
): Promise<{ ok: true; value: v.InferOutput<S>; form: FormData } | { ok: false; errors: FieldErrors; form: FormData }> {
  let form: FormData;
  try {
    form = await request.formData();
  } catch {
    throw data({ errors: { _form: "The form could not be read." } }, { status: 400 });
  }
  const obj: Record<string, unknown> = {};
  for (const [k, val] of form.entries()) if (typeof val === "string") obj[k] = val;
  const r = v.safeParse(schema, obj);
  if (r.success) return { ok: true, value: r.output, form };
  const errors: FieldErrors = {};
  for (const issue of r.issues) {
    const key = issue.path?.map((p) => String(p.key)).join(".") || "_form";
    errors[key] ??= issue.message;
  }
  return { ok: false, errors, form };
}

export const invalid = (errors: FieldErrors, status = 400) => data({ errors }, { status });

export const Email = v.pipe(v.string("Enter an e-mail address."), v.trim(), v.maxLength(254, "That address is too long."), v.email("Enter a valid e-mail address."));
export const NewPassword = v.pipe(
  v.string("Choose a password."),
  v.minLength(10, "Use at least 10 characters."),
  v.maxLength(200, "Use at most 200 characters."),
);
export const AnyPassword = v.pipe(v.string("Enter your password."), v.minLength(1, "Enter your password."), v.maxLength(200, "Password too long."));
export const Name = (label: string, max = 120) =>
  v.pipe(v.string(`Enter ${label}.`), v.trim(), v.minLength(1, `Enter ${label}.`), v.maxLength(max, `Keep ${label} under ${max} characters.`));
export const IdField = v.pipe(v.string(), v.regex(/^\d{1,15}$/, "Bad id."), v.transform(Number));

/** Only local paths may be returned to after sign-in (no open redirect). */
export function safeNext(next: string | null | undefined, fallback = "/"): string {
  if (!next || !next.startsWith("/") || next.startsWith("//") || next.startsWith("/\\")) return fallback;
  return next;
}
