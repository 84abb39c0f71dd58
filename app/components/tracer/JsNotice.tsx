import { useSyncExternalStore } from "react";
import { Notice } from "~/components/forms";

const subscribe = () => () => {};

/**
 * Says the tracer needs JavaScript: rendered on the server and while scripts are off, gone once the
 * page has hydrated (a <noscript> element is not rendered by React on the server here).
 */
export function JsNotice({ children }: { children: string }) {
  const hydrated = useSyncExternalStore(subscribe, () => true, () => false);
  return hydrated ? null : <Notice>{children}</Notice>;
}
