// Test helper: a FormData with one value per field, as a browser posts a plain form.
export function formOf(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}
