import { expect, test } from "@playwright/test";

// Forms work without JavaScript (progressive enhancement): sign in, create a project and a system,
// add a pipe run and save it, and upload a vendor CSV through the plain multipart form.
test.use({ javaScriptEnabled: false });

test("Without JavaScript an engineer builds and saves a system, and a distributor uploads a CSV", async ({ page }) => {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill("engineer@kestrel.example");
  await page.getByLabel("Password").fill("duty-demo-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible();

  await page.goto("/projects");
  await page.getByLabel("Name").fill(`No-script ${Date.now().toString(36)}`);
  await page.getByRole("button", { name: "Create project" }).click();
  await page.getByLabel("New system").fill("Plain form loop");
  await page.getByRole("button", { name: "Add system" }).click();
  await expect(page.getByRole("heading", { name: "Plain form loop" })).toBeVisible();
  const runsBefore = await page.locator("fieldset fieldset").count();
  await page.getByRole("button", { name: "+ discharge run" }).click();
  await expect(page.getByText("Pipe runs updated and saved.")).toBeVisible();
  expect(await page.locator("fieldset fieldset").count()).toBe(runsBefore + 1);
  await page.getByLabel("Flow").first().fill("30");
  await page.getByRole("button", { name: "Save system" }).click();
  await expect(page.getByText("System saved.")).toBeVisible();
  await expect(page.getByLabel("Flow").first()).toHaveValue("30");
  // The server rendered the chart without any script.
  await expect(page.locator("svg[role=img]").first()).toBeVisible();

  await page.getByRole("button", { name: "Sign out" }).click();
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill("distributor@harrow-vell.example");
  await page.getByLabel("Password").fill("duty-demo-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.goto("/libraries");
  await page.getByLabel("Name").fill(`No-script lib ${Date.now().toString(36)}`);
  await page.getByRole("button", { name: "Create library" }).click();
  await page.getByLabel("CSV file").setInputFiles("fixtures/csv/long-si.csv");
  await page.getByRole("button", { name: "Upload" }).click();
  await expect(page).toHaveURL(/\/uploads\/\d+$/);
  await expect(page.getByTestId("import-stats")).toContainText("curves");
});
