import type { Route } from "./+types/api.v1.calc.system-curve";
import { calcAction, calcMethodNotAllowed } from "~/lib/calc-api";

// POST /api/v1/calc/system-curve — public calculator (anonymous: rate-limited per address; Bearer token:
// unlimited). Request and response fields are SI with the unit in the name; documented on /api.
export async function action({ request }: Route.ActionArgs) {
  return calcAction(request, "system-curve");
}

// GET / HEAD → 405 problem+json with Allow: POST.
export const loader = calcMethodNotAllowed;
