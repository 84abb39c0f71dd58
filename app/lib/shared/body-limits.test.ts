// One body-limit table (body-limits.mjs) for app/serve.mjs (bytes read) and the root middleware
// (declared Content-Length). Each route of app/routes.ts gets its class's limit; the root middleware
// refuses one byte over it and lets the limit itself through. (serve.mjs's counting on the bytes
// read is covered against the build by app/test/server-hardening.test.ts.) Limits: our own choice.
import { expect, test } from "vitest";
import routeConfig from "~/routes";
import { middleware } from "~/root";
import { BODY_LIMITS, DEFAULT_BODY_LIMIT, bodyLimitFor } from "./body-limits.mjs";

type Entry = { path?: string; index?: boolean; children?: Entry[] };
const paths = (entries: Entry[], parent = ""): string[] =>
  entries.flatMap((e) => {
    const p = e.index ? parent : [parent, e.path ?? ""].filter(Boolean).join("/");
    return [`/${p}`.replace(/:\w+/g, "7").replace(/\*$/, "x"), ...paths(e.children ?? [], p)];
  });
const ROUTES = paths(routeConfig as Entry[]);

const MB = 1024 * 1024;
/** Routes that take more than the default, by class; every other route takes DEFAULT_BODY_LIMIT. */
const EXPECTED: Record<string, number> = {
  "/libraries/7/upload": 25 * MB,
  "/api/v1/libraries/7/upload": 25 * MB,
  "/libraries/7/trace/upload": 25 * MB, // a datasheet picture for the tracer (20 MB file + framing)
  "/field/selections/7/photos": 12 * MB,
  "/field/selections/7/checks": 12 * MB, // a check queued on a phone, sent with its photos
  "/api/stripe/webhook": 512 * 1024,
};

test("every route of app/routes.ts gets its class's limit (uploads 25 MB, photos and queued checks 12 MB, Stripe webhook 512 KB, else 1 MB)", () => {
  expect(ROUTES.length).toBeGreaterThan(40);
  for (const p of Object.keys(EXPECTED)) expect(ROUTES).toContain(p);
  for (const p of ROUTES) expect([p, bodyLimitFor(p)]).toEqual([p, EXPECTED[p] ?? DEFAULT_BODY_LIMIT]);
  expect(DEFAULT_BODY_LIMIT).toBe(MB);
  expect(BODY_LIMITS.map((c) => c.name)).toEqual(["upload", "photos", "field-check-sync", "stripe-webhook"]);
});

test("the root middleware refuses a declared body one byte over the route's limit (413) and passes the limit itself", async () => {
  const run = async (pathname: string, length: number) => {
    let reached = false;
    const request = new Request(`http://app.test${pathname}`, {
      method: "POST",
      headers: { "content-length": String(length), origin: "http://app.test", "content-type": "application/x-www-form-urlencoded" },
    });
    const next = async () => ((reached = true), new Response("ok"));
    try {
      // Every root middleware in order, as React Router runs them (the request scope first).
      type Mw = (a: unknown, n: () => Promise<Response>) => Promise<Response>;
      const chain = (middleware as unknown as Mw[]).reduceRight<() => Promise<Response>>((n, mw) => () => mw({ request, params: {}, context: {} }, n), next);
      await chain();
      return reached ? "passed" : "stopped";
    } catch (e) {
      const status = (e as { init?: { status?: number }; status?: number }).init?.status ?? (e as { status?: number }).status;
      return `thrown ${status}`;
    }
  };
  for (const p of [...Object.keys(EXPECTED), "/signin", "/projects"]) {
    const limit = bodyLimitFor(p);
    expect([p, await run(p, limit + 1)]).toEqual([p, "thrown 413"]);
    expect([p, await run(p, limit)]).toEqual([p, "passed"]);
  }
});
