import { expect, test } from "@playwright/test";
import { axeViolations, signIn } from "./helpers";

// axe-core on the pages the journeys reach: no serious or critical violation.
const PAGES: { who: string | null; paths: string[] }[] = [
  { who: null, paths: ["/", "/signin", "/signup", "/forgot", "/api"] },
  { who: "engineer@kestrel.example", paths: ["/projects", "/projects/1", "/systems/1", "/systems/1/search", "/selections/1", "/libraries", "/account", "/workspace", "/workspace/billing"] },
  { who: "distributor@harrow-vell.example", paths: ["/libraries", "/libraries/1"] },
  { who: "contractor@lowmoor.example", paths: ["/field", "/field/selections/1", "/field/checks/1"] },
];

for (const group of PAGES) {
  test(`accessibility: ${group.who ?? "visitor"} pages have no serious or critical axe violations`, async ({ page }) => {
    // Up to nine pages with axe on each: a hang guard per page, not a timing (busy machines are slow).
    test.setTimeout(30_000 * (group.paths.length + 1));
    if (group.who) await signIn(page, group.who);
    const found: Record<string, unknown> = {};
    for (const p of group.paths) {
      const res = await page.goto(p);
      expect(res?.status(), p).toBeLessThan(400);
      await page.waitForLoadState("networkidle");
      const v = await axeViolations(page);
      if (v.length) found[p] = v;
    }
    expect(found).toEqual({});
  });
}
