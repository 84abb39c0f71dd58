import { expect, test } from "@playwright/test";
import { linkFromMailbox, signIn, signOut } from "./helpers";

// Journey 4 on a phone: the engineer shares the project with the contractor's workspace; the
// contractor opens the selection under Field checks, enters readings, records the check and sees
// the verdict; the engineer reads the notice in the mailbox, follows its link and sees the same
// verdict and the same numbers.
test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

// A 1×1 PNG (magic bytes checked by the server).
const PNG_1PX = Buffer.from(
  "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==",
  "base64",
);

// The mail template's words for each verdict (app/lib/mail/templates.ts) and ours for "unknown".
const MAIL_WORDS: Record<string, string> = {
  pass: "within tolerance",
  marginal: "at the tolerance limit",
  fail: "outside tolerance",
  unknown: "no tolerance verdict",
};

test("a contractor records a field check on a phone; the engineer gets the notice and sees the same verdict and numbers", async ({ page }) => {
  // The engineer shares the reservoir booster project with Lowmoor Commissioning (idempotent).
  await signIn(page, "engineer@kestrel.example");
  await page.goto("/projects");
  const project = page.getByRole("link", { name: "Copse Hill reservoir booster" });
  const projectHref = await project.getAttribute("href");
  expect(projectHref).toMatch(/^\/projects\/\d+$/);
  await page.goto(`${projectHref}/share`);
  await expect(page.getByRole("heading", { name: "Share with a contractor" })).toBeVisible();
  await page.getByLabel("Workspace name or short name").fill("lowmoor");
  await page.getByRole("button", { name: "Share", exact: true }).click();
  await expect(page.getByRole("status")).toContainText(/(Shared with|Already shared with) Lowmoor Commissioning/);
  await expect(page.getByText("Lowmoor Commissioning (lowmoor)")).toBeVisible();
  await signOut(page);

  // The contractor, on a phone.
  await signIn(page, "contractor@lowmoor.example");
  await page.goto("/field");
  await expect(page.getByRole("heading", { name: "Field checks" })).toBeVisible();
  await expect(page.getByText(/qualified people/).first()).toBeVisible();
  const item = page.locator("li", { hasText: "Copse Hill reservoir booster" }).first();
  await item.getByRole("link").first().click();
  await expect(page).toHaveURL(/\/field\/selections\/\d+$/);

  // Readings near the design duty (40 m³/h at about 36.5 m on this demo system):
  // suction 30 kPa at 0.3 m, discharge 381 kPa at 0.9 m → TDH ≈ 351 kPa / (999.5 × 9.81) + 0.6 m ≈ 36.4 m.
  const designSpeed = (await page.locator("dt", { hasText: "Design speed" }).locator("xpath=following-sibling::dd[1]").textContent()) ?? "";
  await page.getByLabel("Suction reading").fill("30");
  await page.getByLabel("Discharge reading").fill("381");
  await page.getByLabel("Suction accuracy ±").fill("2.5");
  await page.getByLabel("Discharge accuracy ±").fill("2.5");
  await page.getByLabel("Suction gauge elevation").fill("0.3");
  await page.getByLabel("Discharge gauge elevation").fill("0.9");
  await expect(page.getByLabel("Suction pipe inner diameter")).not.toHaveValue(""); // prefilled from the selection's pipe runs
  await page.getByLabel("Flow meter reading").fill("40");
  const rpm = /(\d+) rpm/.exec(designSpeed)?.[1];
  if (rpm) await page.getByLabel("Pump speed, rpm").fill(rpm);
  await page.getByLabel("Notes").fill("Readings at handover, strainer cleaned this morning.");
  await page.getByLabel("Photos").setInputFiles({ name: "gauges.png", mimeType: "image/png", buffer: PNG_1PX });
  await page.screenshot({ path: "e2e/artifacts/fieldcheck-form-phone.png", fullPage: true });
  await page.getByRole("button", { name: "Record the check" }).click();

  await expect(page).toHaveURL(/\/field\/checks\/\d+\?recorded=1$/);
  await expect(page.getByRole("status")).toContainText("Check recorded");
  const badge = page.locator("[data-verdict]").first();
  await expect(badge).toBeVisible();
  const verdict = (await badge.getAttribute("data-verdict")) ?? "";
  expect(Object.keys(MAIL_WORDS)).toContain(verdict);
  const badgeText = (await badge.textContent()) ?? "";
  const flowText = (await page.getByTestId("delivered-flow").textContent()) ?? "";
  const headText = (await page.getByTestId("delivered-head").textContent()) ?? "";
  expect(flowText).toContain("40.0 m³/h");
  expect(headText).toMatch(/^3\d\.\d m$/);
  await expect(page.getByRole("img", { name: "gauges.png" })).toBeVisible();
  // The chart fits the phone: no sideways scrolling.
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow).toBeLessThanOrEqual(1);
  await page.screenshot({ path: "e2e/artifacts/fieldcheck-record-phone.png", fullPage: true });
  const checkPath = new URL(page.url()).pathname;
  await signOut(page);

  // The engineer's notice, read from the development mailbox.
  const link = await linkFromMailbox(page, "engineer@kestrel.example", "/field/checks/");
  expect(new URL(link).pathname).toBe(checkPath);
  const message = page.locator("details").first();
  await expect(message.locator("summary")).toContainText(MAIL_WORDS[verdict]);
  await expect(message).toContainText("Tom Lowmoor");
  await signIn(page, "engineer@kestrel.example");
  await page.goto(link);
  await expect(page.locator("[data-verdict]").first()).toHaveText(badgeText);
  await expect(page.getByTestId("delivered-flow")).toHaveText(flowText);
  await expect(page.getByTestId("delivered-head")).toHaveText(headText);
  // The engineer reads; only the recording workspace amends.
  await expect(page.getByRole("link", { name: "Amend (new version)" })).toHaveCount(0);
});
