import { data } from "react-router";
import { routeErrorBoundary } from "~/components/RouteError";

// Any address no other route claims: a real 404 status, with its own words inside the shell.
export function loader() {
  throw data("Not found", { status: 404 });
}

export default function NotFound() {
  return null;
}

export const ErrorBoundary = routeErrorBoundary({
  what: "this page",
  back: { href: "/", label: "Back to the start page" },
  notFound: "Nothing lives at this address. Check the link or go back to the start page.",
  notFoundTitle: "Page not found",
});
