import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

// The verdict on screen: on (a copy of) the demo "CHW secondary loop", tripling the discharge run turns
// the candidate held at a fixed drive speed from `meets` to `short` (the rule: operating flow at the
// band's demanding edge below the duty flow; app/engine/verdict.ts).
test("Lengthening the discharge run turns a fixed-speed candidate's verdict from meets to short", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Harbourside Offices — chilled water", exact: true }).click();
  await page.getByRole("link", { name: "CHW secondary loop", exact: true }).click();
  await expect(page.getByRole("heading", { name: "CHW secondary loop" })).toBeVisible();
  // Work on a copy: the demo system stays as seeded for the other journeys.
  await page.getByRole("button", { name: "Copy system" }).click();
  // (Generous waits: the browser tests share a busy machine; nothing here measures speed.)
  await expect(page.getByRole("heading", { name: "CHW secondary loop (copy)" })).toBeVisible({ timeout: 20_000 });

  const verdicts = page.locator("[data-testid^=verdict-]");
  await expect(verdicts).toHaveCount(4, { timeout: 20_000 });
  const before = await verdicts.evaluateAll((els) => els.map((e) => ({ id: e.getAttribute("data-testid")!, status: e.getAttribute("data-status") })));
  expect(before.every((v) => v.status === "meets")).toBe(true);
  await expect(page.getByTestId("duty-check")).toHaveAttribute("data-differs", "no");
  // The chart legend carries the verdict too.
  await expect(page.locator("[data-legend]").first()).toContainText("meets the duty");

  // Triple the discharge run (180 m → 540 m): the live preview recomputes the candidates.
  const length = page.locator("#f-run\\.1\\.length");
  await expect(length).toHaveValue("180");
  await length.fill("540");
  await expect(page.getByText("Chart shows unsaved changes")).toBeVisible();
  // The fixed-speed candidate (and any that cannot re-solve against the longer pipe) turns short.
  await expect(page.locator("[data-testid^=verdict-][data-status=short]").first()).toBeVisible({ timeout: 20_000 });
  const shortId = await page.locator("[data-testid^=verdict-][data-status=short]").first().getAttribute("data-testid");
  expect(before.map((v) => v.id)).toContain(shortId);
  const cell = page.getByTestId(shortId!);
  await expect(cell).toContainText("short of the duty");
  await expect(cell).toContainText(/Delivers \d+\.\d m³\/h at aged pipe against a duty of 100 m³\/h/); // three digits: no decimal (the one rounding rule, app/lib/shared/format.ts)
  // The typed duty head no longer matches the system: said beside the duty.
  await expect(page.getByTestId("duty-check")).toHaveAttribute("data-differs", "yes");

  // Saved, the server renders the same verdict.
  await page.getByRole("button", { name: "Save system" }).click();
  await expect(page.getByText("System saved.")).toBeVisible({ timeout: 20_000 });
  await page.reload();
  await expect(page.getByTestId(shortId!)).toHaveAttribute("data-status", "short", { timeout: 20_000 });
});

test.describe("without JavaScript", () => {
  test.use({ javaScriptEnabled: false });
  test("the search's 'allow beyond the catalogue' box is a plain form field", async ({ page }) => {
    await page.goto("/signin");
    await page.getByLabel("E-mail").fill("engineer@kestrel.example");
    await page.getByLabel("Password").fill("duty-demo-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.goto("/projects");
    await page.getByRole("link", { name: "Harbourside Offices — chilled water", exact: true }).click();
    await page.getByRole("link", { name: "CHW secondary loop", exact: true }).click();
    await page.getByRole("link", { name: "Find pumps for this duty" }).click();
    await expect(page.getByRole("table", { name: "Ranked pumps" })).toBeVisible({ timeout: 20_000 });
    await expect(page.getByTestId("search-stats")).toContainText("outside the catalogue hidden");
    await expect(page.locator("[data-testid^=search-verdict-][data-status=outside-catalogue]")).toHaveCount(0);
    await page.getByLabel("allow beyond the catalogue").check();
    await page.getByRole("button", { name: "Search" }).click();
    await expect(page).toHaveURL(/beyond=1/);
    expect(await page.locator("[data-testid^=search-verdict-][data-status=outside-catalogue]").count()).toBeGreaterThan(0);
  });
});
