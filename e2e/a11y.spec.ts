import { expect, test } from "@playwright/test";
import { axeViolations, signIn } from "./helpers";

// axe-core on the pages the journeys reach: no serious or critical violation.
// Pages of the demo's own objects are reached by their links (a `link` step opens the first link on
// the page before it that matches), never by guessed ids: on a Galera cluster ids are not 1, 2, 3…
type Step = string | { link: RegExp; suffix?: string };
const PAGES: { who: string | null; paths: Step[] }[] = [
  { who: null, paths: ["/", "/signin", "/signup", "/forgot", "/api"] },
  {
    who: "engineer@kestrel.example",
    paths: [
      "/projects",
      { link: /^\/projects\/\d+$/ },
      { link: /^\/systems\/\d+$/ },
      { link: /^\/systems\/\d+\/search$/ },
      "/projects",
      { link: /^\/projects\/\d+$/ },
      { link: /^\/selections\/\d+$/ },
      "/libraries",
      "/account",
      "/workspace",
      "/workspace/billing",
    ],
  },
  { who: "distributor@harrow-vell.example", paths: ["/libraries", { link: /^\/libraries\/\d+$/ }] },
  { who: "contractor@lowmoor.example", paths: ["/field", { link: /^\/field\/selections\/\d+$/ }, "/field", { link: /^\/field\/checks\/\d+$/ }] },
];

/** The first link on the open page whose path matches. */
async function firstLink(page: import("@playwright/test").Page, re: RegExp): Promise<string> {
  const hrefs = await page.locator("a[href]").evaluateAll((as) => as.map((a) => new URL((a as HTMLAnchorElement).href).pathname));
  const hit = hrefs.find((h) => re.test(h));
  if (!hit) throw new Error(`no link matching ${re} on ${page.url()}`);
  return hit;
}

for (const group of PAGES) {
  test(`accessibility: ${group.who ?? "visitor"} pages have no serious or critical axe violations`, async ({ page }) => {
    // Up to nine pages with axe on each: a hang guard per page, not a timing (busy machines are slow).
    test.setTimeout(30_000 * (group.paths.length + 1));
    if (group.who) await signIn(page, group.who);
    const found: Record<string, unknown> = {};
    for (const step of group.paths) {
      const p = typeof step === "string" ? step : (await firstLink(page, step.link)) + (step.suffix ?? "");
      const res = await page.goto(p);
      expect(res?.status(), p).toBeLessThan(400);
      await page.waitForLoadState("networkidle");
      const v = await axeViolations(page);
      if (v.length) found[p] = v;
    }
    expect(found).toEqual({});
  });
}
