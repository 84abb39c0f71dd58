import { expect, test } from "@playwright/test";
import { axeViolations, signIn, watchNetwork } from "./helpers";

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
  { who: "admin@lowmoor.example", paths: ["/workspace", "/workspace/shares"] },
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
    const network = watchNetwork(page);
    if (group.who) await signIn(page, group.who);
    const found: Record<string, unknown> = {};
    for (const step of group.paths) {
      const p = typeof step === "string" ? step : (await firstLink(page, step.link)) + (step.suffix ?? "");
      const res = await page.goto(p);
      expect(res?.status(), p).toBeLessThan(400);
      await network.quiet();
      const v = await axeViolations(page);
      if (v.length) found[p] = v;
    }
    expect(found).toEqual({});
  });
}

// Issue 19: the field pages as a contractor holds them, 390×844, including a refused submit (the
// summary at the top takes the focus) and the number fields' keypad hints and thumb-sized targets.
test.describe("field pages on a phone", () => {
  test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

  test("accessibility: field pages at 390×844 have no serious or critical axe violations; a refused check moves focus to the summary", async ({ page }) => {
    test.setTimeout(150_000);
    const network = watchNetwork(page);
    await signIn(page, "contractor@lowmoor.example");
    const found: Record<string, unknown> = {};
    const check = async (label: string) => {
      const v = await axeViolations(page);
      if (v.length) found[label] = v;
    };
    await page.goto("/field");
    await network.quiet();
    await check("/field");
    const selectionPath = await firstLink(page, /^\/field\/selections\/\d+$/);
    await page.goto(selectionPath);
    await network.quiet();
    await check(selectionPath);

    // Every number brings up the decimal keypad with an Enter key that moves on; targets are thumb-sized (WCAG 2.5.5: 44 px).
    const form = page.locator("form[method=post]").filter({ has: page.getByRole("button", { name: "Record the check" }) });
    const numbers = form.locator("input[type=text]");
    expect(await numbers.count()).toBeGreaterThan(15);
    const attrs = await numbers.evaluateAll((els) => els.map((el) => ({ name: el.getAttribute("name"), inputmode: el.getAttribute("inputmode"), enterkeyhint: el.getAttribute("enterkeyhint"), h: el.getBoundingClientRect().height })));
    for (const a of attrs) {
      expect(a.inputmode, `${a.name}`).toBe("decimal");
      expect(["next", "done"], `${a.name}`).toContain(a.enterkeyhint);
      expect(a.h, `${a.name}`).toBeGreaterThanOrEqual(44);
    }
    await expect(page.locator("#fc-sPressure-unit")).toHaveText("kPa");
    const buttonBox = await form.getByRole("button", { name: "Record the check" }).boundingBox();
    expect(buttonBox?.height ?? 0).toBeGreaterThanOrEqual(44);

    // A refused check: the summary at the top takes the focus, each field says what is wrong beside it.
    await page.getByLabel("Suction reading").fill("");
    await page.getByLabel("Discharge reading").fill("lots");
    await form.getByRole("button", { name: "Record the check" }).click();
    const summary = page.getByRole("alert").filter({ hasText: "need another look" });
    await expect(summary).toBeFocused();
    await expect(summary.getByRole("link", { name: /Discharge reading/ })).toBeVisible();
    await expect(page.locator("#dPressure-err")).toHaveText(/must be a number/);
    await expect(page.getByLabel("Discharge reading")).toHaveAttribute("aria-invalid", "true");
    await check(`${selectionPath} (refused)`);

    await page.goto("/field");
    const checkPath = await firstLink(page, /^\/field\/checks\/\d+$/);
    await page.goto(checkPath);
    await network.quiet();
    await check(checkPath);
    expect(found).toEqual({});
  });
});
