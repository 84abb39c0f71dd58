// The built app for the tests that post a page's form to it as a browser without JavaScript posts it, and read the page
// it answers (not the action's data): one describe block's set-up for all of them. Not in harness.ts: that one is also
// imported by the bench scripts, which run under tsx, without vitest.
import { existsSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe } from "vitest";
import { ROOT, startBuiltApp, type BuiltApp } from "./harness";

/** Whether the production build is there (`npx react-router build`; `npm test` builds first): the wire tests skip without it. */
export const BUILT = existsSync(path.join(ROOT, "build/server/index.js"));

export type Wire = {
  /** The built app's origin (only inside a test: it starts before the block's tests). */
  base: () => string;
  /** `form` posted to `path` as a browser without JavaScript posts it: signed in by `cookie`, same origin, urlencoded, redirects not followed. */
  postAsBrowser: (path: string, cookie: string, form: Record<string, string>) => Promise<Response>;
  /** A page loaded afresh (GET) by `cookie`. */
  get: (path: string, cookie: string) => Promise<Response>;
};

/**
 * A describe block (skipped without a build) around the built app (app/serve.mjs on build/server/index.js, as npm start
 * runs it; plain http, so COOKIE_SECURE=0; no Stripe), started before its tests and stopped after them.
 */
export function describeOnTheWire(name: string, body: (wire: Wire) => void) {
  describe.skipIf(!BUILT)(name, () => {
    let app: BuiltApp | null = null;
    beforeAll(async () => {
      app = await startBuiltApp({ COOKIE_SECURE: "0", STRIPE_API_BASE: "" });
    }, 60_000);
    afterAll(() => app?.stop());
    const base = () => {
      if (!app) throw new Error("the built app is not running (its beforeAll failed, or this ran outside a test)");
      return app.base;
    };
    body({
      base,
      postAsBrowser: (p, cookie, form) =>
        fetch(`${base()}${p}`, {
          method: "POST",
          headers: { cookie, origin: base(), "content-type": "application/x-www-form-urlencoded" },
          body: new URLSearchParams(form),
          redirect: "manual",
        }),
      get: (p, cookie) => fetch(`${base()}${p}`, { headers: { cookie } }),
    });
  });
}
