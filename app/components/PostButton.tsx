// One button that posts one intent (copy, archive) or one intent about one record (revoke, remove,
// withdraw…: the record's id in a hidden field; other hidden fields in `fields`, e.g. the page's
// workspace): a form of its own, so it works without JavaScript.
import type { ReactNode } from "react";
import { Form } from "react-router";

export function PostButton({
  intent,
  field,
  id,
  fields,
  className = "btn-quiet",
  children,
}: {
  intent: string;
  field?: string;
  id?: number | string;
  fields?: Record<string, number | string>;
  className?: string;
  children: ReactNode;
}) {
  return (
    <Form method="post">
      {field ? <input type="hidden" name={field} value={id} /> : null}
      {Object.entries(fields ?? {}).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      <button className={className} name="intent" value={intent}>
        {children}
      </button>
    </Form>
  );
}
