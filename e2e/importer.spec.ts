import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

// Issue 16: the upload bar turns red with the reason when the server refuses a file; flagged rows
// are corrected in the grid on the mapping page (also without JavaScript, see the second test).

test("A refused upload shows a red bar and the server's reason", async ({ page }) => {
  await signIn(page, "distributor@harrow-vell.example");
  await page.goto("/libraries");
  await page.getByLabel("Name").fill(`Refusals ${Date.now().toString(36)}`);
  await page.getByRole("button", { name: "Create library" }).click();
  await page.getByTestId("upload-input").setInputFiles({ name: "binary.csv", mimeType: "text/csv", buffer: Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 0, 0, 0x14, 0]) });
  const bar = page.getByRole("progressbar", { name: "Upload of binary.csv" });
  await expect(bar).toHaveAttribute("data-status", "failed");
  await expect(page.getByRole("alert").filter({ hasText: "binary.csv looks like a binary file" })).toBeVisible();
});

test.describe("without JavaScript", () => {
  test.use({ javaScriptEnabled: false });
  test("A distributor corrects a blank speed cell in the grid; the corrected copy is checked again and imports", async ({ page }) => {
    await page.goto("/signin");
    await page.getByLabel("E-mail").fill("distributor@harrow-vell.example");
    await page.getByLabel("Password").fill("duty-demo-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.goto("/libraries");
    await page.getByLabel("Name").fill(`Grid fix ${Date.now().toString(36)}`);
    await page.getByRole("button", { name: "Create library" }).click();
    await page.getByLabel("CSV file").setInputFiles("fixtures/csv/blank-speed.csv");
    await page.getByRole("button", { name: "Upload" }).click();
    await expect(page).toHaveURL(/\/uploads\/\d+$/);
    await expect(page.getByTestId("import-stats")).toContainText("1 error");
    await page.getByLabel("Line 4, Speed (rpm)").fill("2900");
    await page.getByRole("button", { name: "Save corrected copy and check again" }).click();
    await expect(page).toHaveURL(/\/uploads\/\d+\?from=\d+$/);
    await expect(page.getByText(/corrected copy of upload \d+/)).toBeVisible();
    await expect(page.getByTestId("import-stats")).toContainText("0 errors");
    await page.getByRole("button", { name: "Import 1 curve" }).click();
    await expect(page).toHaveURL(/\/libraries\/\d+\?imported=1$/);
  });
});
