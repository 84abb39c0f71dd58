import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

test("As an engineer I build a system from pipe runs, watch its curve, find pumps for the duty, compare three, slow the best to the duty, select it and print the report", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  await page.goto("/projects");
  const name = `Riverside pumping ${Date.now().toString(36)}`;
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Site").fill("Riverside depot (invented)");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();

  await page.getByLabel("New system").fill("Wash-water transfer");
  await page.getByRole("button", { name: "Add system" }).click();
  await expect(page.getByRole("heading", { name: "Wash-water transfer" })).toBeVisible();

  // Live curve: typing a new rising-main length updates the chart's readout before saving.
  const chart = page.locator("svg[role=img]").first();
  await expect(chart).toBeVisible();
  await page.getByLabel("Length").nth(1).fill("120");
  await expect(page.getByText("Chart shows unsaved changes")).toBeVisible();
  await page.getByLabel("Flow").first().fill("36");
  await page.getByLabel(/^Head/).first().fill("16");
  await page.getByRole("button", { name: "Save system" }).click();
  await expect(page.getByText("System saved.")).toBeVisible();

  await page.getByRole("link", { name: "Find pumps for this duty" }).click();
  await expect(page.getByRole("table", { name: "Ranked pumps" })).toBeVisible();
  for (let i = 0; i < 3; i++) {
    await page.goto(page.url());
    await page.getByRole("button", { name: /^Add / }).first().click();
    await expect(page).toHaveURL(/\/systems\/\d+$/);
    await page.goBack();
  }
  await page.goto(page.url().replace(/\/search.*$/, ""));
  const compare = page.getByRole("table", { name: "Candidates compared" });
  await expect(compare.locator("thead th")).toHaveCount(4);

  // Slow the first candidate to the duty with a VFD, then select it.
  const first = page.locator("form:has(select[name=method])").first();
  await first.locator("select[name=method]").selectOption("speed");
  await first.getByRole("button", { name: "Apply" }).click();
  await expect(page.getByText("Candidate adjusted.")).toBeVisible();
  await expect(compare).toContainText("% speed");
  await page.getByRole("button", { name: "Select this pump" }).first().click();
  await expect(page).toHaveURL(/\/selections\/\d+$/);
  await expect(page.getByText("Pump selection report")).toBeVisible();
  await expect(page.getByText("Figures are for design guidance").first()).toBeVisible();
  await expect(page.getByRole("heading", { name: "Sign-off" })).toBeVisible();
  await page.locator("svg[role=img]").first().screenshot({ path: "e2e/artifacts/selection-chart.png" });
  await page.emulateMedia({ media: "print" });
  await page.screenshot({ path: "e2e/artifacts/selection-report-print.png", fullPage: true });
  await page.emulateMedia({ media: "screen" });
  const csv = await page.request.get(page.url() + "/export.csv");
  expect(csv.status()).toBe(200);
  expect(await csv.text()).toContain("system_curve");
});
