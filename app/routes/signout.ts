import { redirect } from "react-router";
import type { Route } from "./+types/signout";
import { endSession } from "~/lib/auth/session.server";

export async function loader() {
  throw redirect("/");
}

export async function action({ request }: Route.ActionArgs) {
  const cookie = await endSession(request);
  throw redirect("/signin", { headers: { "Set-Cookie": cookie } });
}
