import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

// On a phone the chart's readout stays where the finger lifted (useChartCursor.ts: a touch
// pointer leaving the chart keeps the cursor; a mouse leaving hides it). Read-only: opens a demo
// system and taps its chart.
test.use({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 });

test("on a phone, a tap on the chart leaves the crosshair and readout where the finger was", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  await page.goto("/projects");
  await page.getByRole("link", { name: "Copse Hill reservoir booster" }).click();
  await page.locator('a[href^="/systems/"]').first().click();
  await expect(page).toHaveURL(/\/systems\/\d+$/);

  const chart = page.locator("svg[data-chart=duty]").first();
  await chart.scrollIntoViewIfNeeded();
  const box = (await chart.boundingBox())!;
  const crosshair = chart.locator("[data-mark=crosshair]");
  const flowTag = crosshair.locator("text").first();
  await expect(crosshair).toHaveCount(0);

  // Tap at a third of the width; repeated until the page has hydrated and the handlers are live.
  await expect(async () => {
    await page.touchscreen.tap(box.x + box.width / 3, box.y + box.height / 4);
    await expect(crosshair).toHaveCount(1, { timeout: 1000 });
  }).toPass();
  const first = (await flowTag.textContent()) ?? "";
  expect(first).toMatch(/^\d+(\.\d+)? \S+$/);

  // A second tap further right moves it there, and it stays after the finger lifts.
  await page.touchscreen.tap(box.x + (box.width * 2) / 3, box.y + box.height / 4);
  await expect(flowTag).not.toHaveText(first);
  await expect(crosshair).toHaveCount(1);
  const second = Number.parseFloat((await flowTag.textContent()) ?? "");
  expect(second).toBeGreaterThan(Number.parseFloat(first));
});
