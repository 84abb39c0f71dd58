import { expect, test, type Page } from "@playwright/test";
import { signIn, signOut } from "./helpers";

// Issue 17, item 5 ("Comparing"): the editor asks before unsaved changes are lost, viewers see a
// read-only page that says so, and several pumps of one search are added at once (also without JavaScript).

/** A new project with one system whose duty the demo libraries can meet (as in engineer.spec.ts); returns both paths. */
async function newSystem(page: Page, label: string) {
  await page.goto("/projects");
  const project = `${label} ${Date.now().toString(36)}`;
  await page.getByLabel("Name").fill(project);
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByRole("heading", { name: project })).toBeVisible();
  const projectPath = new URL(page.url()).pathname;
  await page.getByLabel("New system").fill("Compare loop");
  await page.getByRole("button", { name: "Add system" }).click();
  await expect(page.getByRole("heading", { name: "Compare loop" })).toBeVisible();
  return { project, projectPath, systemPath: new URL(page.url()).pathname };
}

test("A save refused without JavaScript (the form posted natively): the page shows the typed values, counts them unsaved and asks before leaving (helpers \"formedges\", \"nojsbaseline\")", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  const { project, systemPath } = await newSystem(page, "Refused typed");
  const editor = page.locator('form[aria-label="System inputs"]');
  await expect(editor).toHaveAttribute("data-unsaved", "no");
  await page.getByLabel("Flow").first().fill("-5"); // refused: a negative duty flow (common practice: a duty flow is > 0)
  // Sent as a browser without scripts sends it (HTMLFormElement.submit: no submit event, so no fetch by React Router).
  await Promise.all([page.waitForEvent("load"), page.evaluate(() => HTMLFormElement.prototype.submit.call(document.querySelector('form[aria-label="System inputs"]')))]);
  await expect(page.getByLabel("Flow").first()).toHaveValue("-5");
  // The typed values are not stored: unsaved once the page comes to life. npm test's browser tests run React's development
  // build, whose StrictMode runs the effect that takes the baseline twice on mount; both runs must say "yes".
  await expect(editor).toHaveAttribute("data-unsaved", "yes");
  // Leaving by a link asks; staying keeps the typed value.
  await page.getByRole("link", { name: project }).click();
  const question = page.getByRole("alertdialog", { name: "Leave without saving?" });
  await expect(question).toBeVisible();
  await question.getByRole("button", { name: "Stay and keep editing" }).click();
  await expect(page).toHaveURL(new RegExp(`${systemPath}$`));
  await expect(page.getByLabel("Flow").first()).toHaveValue("-5");
});

test("Unsaved changes on the system editor: leaving by a link asks, staying keeps the edit, saving lets me leave without a question", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  const { project, projectPath, systemPath } = await newSystem(page, "Unsaved changes");
  const question = page.getByRole("alertdialog", { name: "Leave without saving?" });
  const breadcrumb = page.getByRole("link", { name: project });
  // The editor marks its form once its scripts watch for changes ("no": nothing changed yet).
  const editor = page.locator('form[aria-label="System inputs"]');
  await expect(editor).toHaveAttribute("data-unsaved", "no");

  await page.getByLabel("Flow").first().fill("41");
  await expect(editor).toHaveAttribute("data-unsaved", "yes");
  await breadcrumb.click();
  await expect(question).toBeVisible();
  await question.getByRole("button", { name: "Stay and keep editing" }).click();
  await expect(question).toHaveCount(0);
  await expect(page).toHaveURL(new RegExp(`${systemPath}$`));
  await expect(page.getByLabel("Flow").first()).toHaveValue("41");
  await breadcrumb.click(); // asked again; Escape also means "stay"
  await expect(question).toBeVisible();
  await page.keyboard.press("Escape");
  await expect(question).toHaveCount(0);
  await expect(page).toHaveURL(new RegExp(`${systemPath}$`));

  await page.getByRole("button", { name: "Save system" }).click();
  await expect(page.getByText("System saved.")).toBeVisible();
  await expect(editor).toHaveAttribute("data-unsaved", "no");
  await breadcrumb.click();
  await expect(page).toHaveURL(new RegExp(`${projectPath}$`));
  await expect(page.getByRole("heading", { name: project })).toBeVisible();
  await expect(question).toHaveCount(0);

  // Back with a new edit: closing the page raises the browser's own question (beforeunload).
  await page.goto(systemPath);
  await expect(page.getByLabel("Flow").first()).toHaveValue("41");
  await expect(editor).toHaveAttribute("data-unsaved", "no");
  await page.getByLabel(/^Head/).first().fill("17");
  await expect(editor).toHaveAttribute("data-unsaved", "yes");
  const asked = new Promise<string>((resolve) => page.once("dialog", (d) => (resolve(d.type()), void d.accept())));
  await page.close({ runBeforeUnload: true });
  expect(await asked).toBe("beforeunload");
});

test("A viewer sees a system and its project read-only, with a notice; an engineer sees neither", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  const { projectPath, systemPath } = await newSystem(page, "Read-only look");
  await expect(page.getByTestId("read-only-notice")).toHaveCount(0);
  await expect(page.getByLabel("Name", { exact: true }).first()).toBeEnabled();
  await page.goto(projectPath);
  await expect(page.getByTestId("read-only-notice")).toHaveCount(0);
  await signOut(page);

  await signIn(page, "viewer@kestrel.example");
  await page.goto(systemPath);
  await expect(page.getByTestId("read-only-notice")).toHaveText("You can view this system; your role (viewer) cannot change it.");
  const name = page.getByLabel("Name", { exact: true }).first();
  await expect(name).toBeDisabled();
  // It looks disabled too (app.css: .field's disabled: styles).
  expect(await name.evaluate((el) => getComputedStyle(el).cursor)).toBe("not-allowed");
  await expect(page.getByRole("button", { name: "Save system" })).toHaveCount(0);
  await page.goto(projectPath);
  await expect(page.getByTestId("read-only-notice")).toHaveText("You can view this project; your role (viewer) cannot change it.");
});

/** newSystem with the duty 36 m³/h at 16 m saved (a plain form post: works without JavaScript). */
async function newSystemWithDuty(page: Page, label: string) {
  const made = await newSystem(page, label);
  await page.getByLabel("Flow").first().fill("36");
  await page.getByLabel(/^Head/).first().fill("16");
  await page.getByRole("button", { name: "Save system" }).click();
  await expect(page.getByText("System saved.")).toBeVisible();
  return made;
}

test.describe("without JavaScript", () => {
  test.use({ javaScriptEnabled: false });

  test("Without JavaScript an engineer ticks two pumps in a search and adds them at once", async ({ page }) => {
    await signIn(page, "engineer@kestrel.example"); // a plain form post
    const { systemPath } = await newSystemWithDuty(page, "Tick two");

    await page.goto(`${systemPath}/search`);
    const boxes = page.getByRole("checkbox", { name: /^Tick / });
    const values = await boxes.evaluateAll((els) => els.map((e) => (e as HTMLInputElement).value));
    // Two different curves (a curve may be listed twice, once per way to meet the duty).
    const picked: string[] = [];
    for (const v of values) if (picked.length < 2 && !picked.some((p) => p.split(":")[0] === v.split(":")[0])) picked.push(v);
    expect(picked.length).toBe(2);
    for (const v of picked) await page.locator(`input[name=add][value="${v}"]`).check();
    await page.getByRole("button", { name: "Add the ticked pumps" }).click();
    await expect(page).toHaveURL(new RegExp(`${systemPath}$`));
    await expect(page.getByRole("table", { name: "Candidates compared" }).locator("thead th")).toHaveCount(3);
  });

  test("Without JavaScript a row's own Add adds only its pump, though another row is ticked", async ({ page }) => {
    await signIn(page, "engineer@kestrel.example");
    const { systemPath } = await newSystemWithDuty(page, "Own add");

    await page.goto(`${systemPath}/search`);
    await expect(page.getByTestId("search-stats")).toContainText(/showing #1–\d+ of the \d+ judged/);
    const rows = page.getByRole("table", { name: "Ranked pumps" }).locator("tbody tr");
    await rows.nth(1).getByRole("checkbox").check();
    const chosen = await rows.first().getByRole("button", { name: /^Add / }).getAttribute("aria-label");
    await rows.first().getByRole("button", { name: /^Add / }).click();
    await expect(page).toHaveURL(new RegExp(`${systemPath}$`));
    const compared = page.getByRole("table", { name: "Candidates compared" });
    await expect(compared.locator("thead th")).toHaveCount(2); // the row's pump only, not the ticked one
    expect(chosen).toMatch(/^Add .+ as a candidate$/);
    await expect(compared.locator("thead th").nth(1)).toContainText(chosen!.replace(/^Add (\S+).*$/, "$1"));
  });

  test("Without JavaScript an engineer searches for two pumps in parallel with a standby and adds one so", async ({ page }) => {
    await signIn(page, "engineer@kestrel.example");
    const { systemPath } = await newSystemWithDuty(page, "Two in parallel");

    await page.goto(`${systemPath}/search`);
    await page.getByLabel("How the pumps run").selectOption("parallel");
    await page.getByLabel(/^Duty pumps/).fill("2");
    await page.getByLabel(/^Standby/).fill("1");
    await page.getByRole("button", { name: "Search" }).click(); // a plain GET form
    await expect(page).toHaveURL(/arrangement=parallel&pumps=2&standby=1/);
    await expect(page.getByTestId("search-arrangement-rule")).toContainText("Searched for 2 duty pumps in parallel + 1 standby");
    const first = page.getByRole("table", { name: "Ranked pumps" }).locator("tbody tr").first();
    await expect(first.locator("[data-testid^=search-arrangement-]")).toContainText("2 duty pumps in parallel + 1 standby: together");
    await first.getByRole("button", { name: /^Add / }).click();
    await expect(page).toHaveURL(new RegExp(`${systemPath}$`));
    await expect(page.getByRole("table", { name: "Candidates compared" })).toContainText("2 in parallel + 1 standby");
  });
});
