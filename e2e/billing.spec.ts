import { expect, test, type Page } from "@playwright/test";
import { signUpAndConfirm, uniqueEmail } from "./helpers";

// Journey 3: a free workspace sees shared libraries locked; the admin upgrades through checkout on
// the local Stripe stand-in; the webhook lands and the libraries open; cancellation locks them
// again while a selection made earlier keeps its frozen data. A fresh workspace (signed up here)
// keeps the demo workspaces' plans untouched for the other specs.
const STRIPE = process.env.STRIPE_API_BASE ?? "http://127.0.0.1:12211";
const KEY = process.env.STRIPE_SECRET_KEY ?? "";
const SHARED = "Harrow & Vell stock range"; // demo data (fixtures/demo/generate.ts), shared by Harrow & Vell Pumps

async function stripeGet(path: string) {
  const res = await fetch(`${STRIPE}${path}`, { headers: { authorization: `Bearer ${KEY}` } });
  expect(res.status).toBe(200);
  return res.json();
}

async function newAdmin(page: Page, workspace: string) {
  const email = uniqueEmail("billing");
  await page.goto("/signup");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Workspace name").fill(workspace);
  await signUpAndConfirm(page, email, "Bea Billing", "a long enough password");
  await expect(page.getByText("Your address is confirmed")).toBeVisible();
  return email;
}

async function openSharedLibrary(page: Page) {
  await page.goto("/libraries");
  await page.getByRole("link", { name: SHARED }).first().click();
  await expect(page.getByRole("heading", { name: SHARED })).toBeVisible();
}

const LOCKED_TEXT = "Its curves open when your workspace upgrades.";

test("A free workspace upgrades through checkout, the webhook opens shared libraries, cancellation locks them again and the selection keeps its data", async ({ page }) => {
  test.setTimeout(150_000);
  const email = await newAdmin(page, `Billing Journey ${Date.now().toString(36)}`);

  // Starter: the shared library is listed, locked, with no curves (our product rule).
  await openSharedLibrary(page);
  await expect(page.getByText(LOCKED_TEXT)).toBeVisible();
  await expect(page.getByRole("heading", { name: "Pump models" })).toHaveCount(0);

  await page.goto("/workspace/billing");
  await expect(page.getByTestId("plan-name")).toHaveText("Starter");
  // The price before checkout, read from Stripe (the stand-in's price: 49.00 EUR a month, fixtures/stripe/README.md).
  await expect(page.getByTestId("paid-price")).toContainText("49.00 EUR per month");

  // A declined card: the stand-in's page says so; our plan is unchanged (Stripe docs: test card 4000 0000 0000 0002).
  await page.getByRole("button", { name: "Upgrade to Network" }).click();
  await expect(page).toHaveURL(new RegExp(`^${STRIPE}/pay/cs_test_`));
  await page.getByLabel("Card number").fill("4000 0000 0000 0002");
  await page.getByRole("button", { name: /^Pay/ }).click();
  await expect(page.getByRole("alert")).toHaveText("Your card was declined.");
  await page.goto("/workspace/billing");
  await expect(page.getByTestId("plan-name")).toHaveText("Starter");
  await openSharedLibrary(page);
  await expect(page.getByText(LOCKED_TEXT)).toBeVisible();

  // A good card: back on our billing page, the plan is Network once the webhook has landed.
  await page.goto("/workspace/billing");
  await page.getByRole("button", { name: "Upgrade to Network" }).click();
  await expect(page).toHaveURL(new RegExp(`^${STRIPE}/pay/cs_test_`));
  await page.getByLabel("Card number").fill("4242 4242 4242 4242");
  await page.getByRole("button", { name: /^Pay/ }).click();
  await expect(page).toHaveURL(/\/workspace\/billing\?checkout=done/);
  await expect(page.getByTestId("plan-name")).toHaveText("Network");
  await expect(page.getByText("Payment received")).toBeVisible();
  await expect(page.getByRole("heading", { name: "Invoices" })).toBeVisible();
  await expect(page.getByRole("cell", { name: "49.00 EUR" })).toBeVisible();
  await page.screenshot({ path: "e2e/artifacts/billing-network.png", fullPage: true });

  await openSharedLibrary(page);
  await expect(page.getByText(LOCKED_TEXT)).toHaveCount(0);
  await expect(page.getByRole("heading", { name: "Pump models" })).toBeVisible();

  // A selection from a shared library, made while on Network.
  await page.goto("/projects");
  await page.getByLabel("Name").fill("Billing journey project");
  await page.getByRole("button", { name: "Create project" }).click();
  await page.getByLabel("New system").fill("Booster set");
  await page.getByRole("button", { name: "Add system" }).click();
  await expect(page).toHaveURL(/\/systems\/\d+$/);
  const systemUrl = page.url();
  await page.goto(`${systemUrl}/search`);
  await page.getByRole("button", { name: /^Add .* as a candidate$/ }).first().click();
  await expect(page).toHaveURL(/\/systems\/\d+$/);
  await page.getByRole("button", { name: "Select this pump" }).first().click();
  await expect(page).toHaveURL(/\/selections\/\d+$/);
  const selectionUrl = page.url();
  const before = await (await page.request.get(`${selectionUrl}/export.json`)).json();
  expect(before.pump.points.length).toBeGreaterThan(2);

  // Cancel at period end: still Network until the period ends.
  await page.goto("/workspace/billing");
  await page.getByRole("button", { name: "Cancel at the end of the period" }).click();
  await expect(page.getByText("Cancellation sent.")).toBeVisible();
  await page.reload();
  await expect(page.getByTestId("plan-name")).toHaveText("Network");
  await expect(page.getByText(/^Ends on \d{4}-\d{2}-\d{2}\./)).toBeVisible();

  // The period ends on the stand-in → customer.subscription.deleted → Starter.
  const customers = await stripeGet(`/v1/customers?email=${encodeURIComponent(email)}`);
  const subs = await stripeGet(`/v1/subscriptions?customer=${customers.data[0].id}`);
  expect(subs.data[0].cancel_at_period_end).toBe(true);
  const adv = await fetch(`${STRIPE}/_test/advance?subscription=${subs.data[0].id}`, { method: "POST" });
  expect(adv.status).toBe(200);
  await page.goto("/workspace/billing");
  await expect(page.getByTestId("plan-name")).toHaveText("Starter");
  await expect(page.getByRole("button", { name: "Upgrade to Network" })).toBeVisible();

  await openSharedLibrary(page);
  await expect(page.getByText(LOCKED_TEXT)).toBeVisible();
  await expect(page.getByRole("heading", { name: "Pump models" })).toHaveCount(0);

  // The selection keeps its frozen curve points (our product rule: old selections keep their revision).
  const after = await (await page.request.get(`${selectionUrl}/export.json`)).json();
  expect(after.pump.points).toEqual(before.pump.points);
  await page.goto(selectionUrl);
  await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
});

test("Members who are not admins see the plan but not the controls", async ({ page }) => {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill("engineer@kestrel.example");
  await page.getByLabel("Password").fill("duty-demo-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible();
  await page.goto("/workspace/billing");
  await expect(page.getByTestId("plan-name")).toHaveText("Starter");
  await expect(page.getByText("Only an admin of Kestrel Building Services changes the plan.")).toBeVisible();
  await expect(page.getByRole("button", { name: "Upgrade to Network" })).toHaveCount(0);
  // The server decides too: a forged post is refused (403).
  const res = await page.request.post("/workspace/billing.data", { form: { intent: "upgrade" }, headers: { Origin: new URL(page.url()).origin } });
  expect(res.status()).toBe(403);
});
