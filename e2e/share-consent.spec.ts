import { expect, test } from "@playwright/test";
import { linkFromMailbox, signIn, signOut } from "./helpers";

// A project share needs the receiving workspace's consent, without JavaScript (the forms are plain posts): the engineer
// stops sharing the chilled-water project with Lowmoor Commissioning and offers it again; the contractor does not see it
// while it waits; Lowmoor's admin is mailed, opens "Projects offered to this workspace" and accepts; now the contractor
// sees it. It ends as the demo data began: shared and accepted.
test.use({ javaScriptEnabled: false });

const PROJECT = "Harbourside Offices — chilled water";

test("an offered project opens to the contractor only once their admin accepts it (no JavaScript)", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  await page.goto("/projects");
  const href = await page.getByRole("link", { name: PROJECT }).getAttribute("href");
  expect(href).toMatch(/^\/projects\/\d+$/);
  await page.goto(`${href}/share`);
  const row = page.locator("li", { hasText: "Lowmoor Commissioning (lowmoor)" });
  await expect(row).toContainText("accepted");
  await row.getByRole("button", { name: "Stop sharing" }).click();
  await expect(page.getByRole("status")).toContainText("Share stopped");
  await page.getByLabel("Workspace name or short name").fill("lowmoor");
  await page.getByRole("button", { name: "Share", exact: true }).click();
  await expect(page.getByRole("status")).toContainText("Offered to Lowmoor Commissioning. Nothing is open to its members until one of its admins accepts");
  await expect(page.locator("li", { hasText: "Lowmoor Commissioning (lowmoor)" })).toContainText("waiting for their admins to accept");
  await signOut(page);

  // Waiting: the contractor's field list does not show it.
  await signIn(page, "contractor@lowmoor.example");
  await page.goto("/field");
  await expect(page.getByRole("heading", { name: "Field checks" })).toBeVisible();
  await expect(page.locator("li", { hasText: PROJECT })).toHaveCount(0);
  await signOut(page);

  // Lowmoor's admin: the e-mail's link, then Accept.
  const link = await linkFromMailbox(page, "admin@lowmoor.example", "/workspace/shares");
  await signIn(page, "admin@lowmoor.example");
  await page.goto("/workspace");
  await expect(page.getByRole("link", { name: /1 offer waits for your answer/ })).toBeVisible();
  await page.goto(new URL(link).pathname);
  await expect(page.getByRole("heading", { name: "Projects offered to this workspace" })).toBeVisible();
  const offer = page.locator("tr", { hasText: PROJECT }).filter({ hasText: "Waiting for an admin's answer" });
  await expect(offer).toHaveCount(1);
  await offer.getByRole("button", { name: "Accept" }).click();
  await expect(page.getByRole("status")).toContainText(`Accepted “${PROJECT}” from Kestrel Building Services`);
  await expect(page.locator("tr", { hasText: PROJECT }).first()).toContainText("Accepted by Nell Okafor");
  await signOut(page);

  await signIn(page, "contractor@lowmoor.example");
  await page.goto("/field");
  await expect(page.locator("li", { hasText: PROJECT }).first()).toBeVisible();
});
