import type { Route } from "./+types/api.v1.calc.operating-point";
import { calcAction, calcMethodNotAllowed } from "~/lib/calc-api";

// POST /api/v1/calc/operating-point — public calculator (anonymous: rate-limited per address; Bearer token:
// unlimited). Request and response fields are SI with the unit in the name; documented on /api.
export async function action({ request }: Route.ActionArgs) {
  return calcAction(request, "operating-point");
}

// GET / HEAD → 405 problem+json with Allow: POST.
export const loader = calcMethodNotAllowed;
