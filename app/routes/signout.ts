import * as v from "valibot";
import { redirect } from "react-router";
import type { Route } from "./+types/signout";
import { endSession } from "~/lib/auth/session.server";
import { readForm, safeNext } from "~/lib/shared/forms.server";

export async function loader() {
  throw redirect("/");
}

/** Where to go after signing in again (a local path only), e.g. the invitation page that asked for another account. */
const SignOut = v.object({ next: v.optional(v.string(), "") });

export async function action({ request }: Route.ActionArgs) {
  // Signing out never fails on its body: one that cannot be read just has no next.
  const r = await readForm(request, SignOut).catch(() => null);
  const next = r?.ok ? safeNext(r.value.next, "") : "";
  const cookie = await endSession(request);
  throw redirect(next ? `/signin?next=${encodeURIComponent(next)}` : "/signin", { headers: { "Set-Cookie": cookie } });
}
