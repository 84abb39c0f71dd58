import { notFound } from "~/lib/shared/problem.server";

export function loader() {
  return notFound("No API route at this path.");
}
export function action() {
  return notFound("No API route at this path.");
}
