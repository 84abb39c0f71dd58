// The address confirmation page (/verify) opened while signed in. Nobody signed in: the link signs its
// account in (accounts-hardening.test.ts). Signed in as another account: an attacker's own unused link,
// sent to someone signed in, must not sign them in as the attacker (login CSRF): the address is confirmed,
// the session stays, and the page says whose address it was and how to use that account. Real route
// modules and MariaDB; mail read from the outbox. Check values: our own product rule (a confirmation link
// never replaces the signed-in account) — common practice against login CSRF (OWASP CSRF cheat sheet, from memory).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { createRoutesStub } from "react-router";
import { afterAll, describe, expect, test } from "vitest";
import { desc, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { outbox, sessions, users } from "@db/schema";
import { startSession } from "~/lib/auth/session.server";
import * as signupRoute from "~/routes/signup";
import * as verifyRoute from "~/routes/verify";
import VerifyPage from "~/routes/verify";
import { BASE, call, makeMember } from "./harness";

afterAll(() => closeDb());

const uniqEmail = (p: string) => `${p}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.test`;
const mailsTo = (email: string) => db().select().from(outbox).where(eq(outbox.toAddress, email)).orderBy(desc(outbox.id));
const linkIn = (text: string, path: string) => new RegExp(`https?://[^\\s"<>]*${path}[^\\s"<>]*`).exec(text)![0];
const tokenOf = (link: string) => new URL(link).searchParams.get("token")!;

/** The page as the server renders it after the action answered `actionData` (no script needed to read it). */
function renderVerify(actionData: unknown) {
  const Stub = createRoutesStub([{ path: "/verify", Component: VerifyPage as never, action: () => actionData }]);
  return renderToString(createElement(Stub, { initialEntries: ["/verify?token=x"], hydrationData: { actionData: { "0": actionData } } } as never));
}

describe("a confirmation link opened while signed in (login CSRF)", () => {
  async function signUpFor(email: string) {
    await call(signupRoute.action as never, { path: "/signup", form: { email, name: "Someone", password: "a long password" } });
    return tokenOf(linkIn((await mailsTo(email))[0].textBody, "/verify"));
  }

  test("another account's link confirms that address, keeps the signed-in session and says whose address it was", async () => {
    const victim = await makeMember("engineer");
    const attacker = uniqEmail("mallory");
    const token = await signUpFor(attacker); // the attacker's own, unused link, sent to the victim
    const r = await call(verifyRoute.action as never, { path: "/verify", cookie: victim.cookie, form: { token, next: "/projects" } });
    expect(r.headers.get("set-cookie")).toBeNull(); // before: the victim's session replaced by the attacker's account
    expect(r.status).toBe(200); // no redirect to `next` as the attacker
    expect(r.body).toMatchObject({ ok: true, signedInAs: victim.email, confirmed: attacker });
    const [u] = await db().select().from(users).where(eq(users.email, attacker));
    expect(u.emailVerified).toBe(true);
    expect(await db().select().from(sessions).where(eq(sessions.userId, u.id))).toEqual([]);
    // The page says so, with a sign-out form that works without JavaScript and comes back to where the link led.
    const html = renderVerify(r.body);
    expect(html).toContain(`You are signed in as <strong>${victim.email}</strong>, and you still are`);
    expect(html).toContain(`this link confirmed the address of another account, <strong>${attacker}</strong>`);
    expect(html).toMatch(/<form[^>]*action="\/signout"[^>]*method="post"/);
    expect(html).toContain('name="next" value="/projects"');
  });

  test("the owner's own link while signed in as that account confirms it and goes on, with no second session", async () => {
    const email = uniqEmail("owner");
    const token = await signUpFor(email);
    const [u] = await db().select().from(users).where(eq(users.email, email));
    const cookie = (await startSession(u.id, new Request(BASE))).split(";")[0]; // signed in before confirming
    const r = await call(verifyRoute.action as never, { path: "/verify", cookie, form: { token, next: "/projects" } });
    expect([r.status, r.location, r.headers.get("set-cookie")]).toEqual([302, "/projects", null]);
    expect((await db().select().from(users).where(eq(users.id, u.id)))[0].emailVerified).toBe(true);
    expect(await db().select().from(sessions).where(eq(sessions.userId, u.id))).toHaveLength(1);
  });
});
