import { data } from "react-router";

// Any address no other route claims: a real 404 status, rendered by the root ErrorBoundary.
export function loader() {
  throw data("Not found", { status: 404 });
}

export default function NotFound() {
  return null;
}
