import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

test("As a distributor I drop a messy vendor CSV, see every bad row named, import the good curves, see them drawn and publish the library", async ({ page }) => {
  await signIn(page, "distributor@harrow-vell.example");
  await page.goto("/libraries");
  const name = `Vendor drop ${Date.now().toString(36)}`;
  await page.getByLabel("Name").fill(name);
  await page.getByLabel("Description").fill("Spring vendor export");
  await page.getByRole("button", { name: "Create library" }).click();
  await expect(page.getByRole("heading", { name })).toBeVisible();

  await page.getByTestId("upload-input").setInputFiles("fixtures/demo/harrow-vell.broken.csv");
  await expect(page).toHaveURL(/\/uploads\/\d+$/);
  await expect(page.getByTestId("import-stats")).toContainText("flagged");
  const problems = page.getByRole("table", { name: "Problems found" });
  await expect(problems).toBeVisible();
  await expect(problems).toContainText("130");
  await page.screenshot({ path: "e2e/artifacts/import-preview.png", fullPage: true });
  await page.getByRole("button", { name: /^Import \d+ curves$/ }).click();
  await expect(page).toHaveURL(/\/libraries\/\d+\?imported=1$/);
  await expect(page.locator("svg[role=img]").first()).toBeVisible();
  await expect(page.getByRole("table", { name: "Models" })).toBeVisible();

  await page.getByLabel(/Shared — published/).check();
  await page.getByRole("button", { name: "Save" }).click();
  await expect(page.getByText("Library saved.")).toBeVisible();
  await expect(page.getByText("shared with subscribers").first()).toBeVisible();
});
