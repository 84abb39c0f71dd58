// What a page's action answered, read the same way on every page: field errors by name (empty
// when none) and the notice to show. Extra fields an action returns come through as `T`.
import { useActionData } from "react-router";

export type FormResult = { errors?: Record<string, string>; notice?: string | null };

export function useFormResult<T extends object = object>(): { errors: Record<string, string>; notice: string | null; data: (FormResult & Partial<T>) | undefined } {
  const data = useActionData() as (FormResult & Partial<T>) | undefined;
  return { errors: data?.errors ?? {}, notice: data?.notice ?? null, data };
}
