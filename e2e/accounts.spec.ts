import { expect, test } from "@playwright/test";
import { linkFromMailbox, signIn, signOut, signUpAndConfirm, uniqueEmail } from "./helpers";

test("As a new admin I sign up, confirm my address from the mailbox, sign in again, invite a contractor, and the contractor joins", async ({ page }) => {
  const admin = uniqueEmail("admin");
  const contractor = uniqueEmail("site");
  const password = "a long enough password";

  await page.goto("/signup");
  await page.getByLabel("E-mail").fill(admin);
  await page.getByLabel("Workspace name").fill("Olu Engineering");
  await signUpAndConfirm(page, admin, "Olu Admin", password);
  await expect(page.getByText("Your address is confirmed")).toBeVisible();
  await page.goto("/account");
  await expect(page.getByText("address confirmed")).toBeVisible();

  await page.goto("/");
  await signOut(page);
  await signIn(page, admin, password);

  await page.goto("/workspace");
  await expect(page.getByRole("heading", { name: "Olu Engineering" })).toBeVisible();
  await page.getByLabel("E-mail").fill(contractor);
  await page.getByLabel("Role", { exact: true }).selectOption("contractor");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${contractor}`)).toBeVisible();
  await page.screenshot({ path: "e2e/artifacts/workspace-invite.png", fullPage: true });
  await signOut(page);

  const invite = await linkFromMailbox(page, contractor, "/invite/");
  await page.goto(invite);
  await expect(page.getByRole("heading", { name: "Join Olu Engineering" })).toBeVisible();
  await page.getByRole("link", { name: "Create an account" }).click();
  await expect(page.getByLabel("E-mail")).toHaveValue(contractor);
  await signUpAndConfirm(page, contractor, "Sam Site", password);
  await expect(page.getByRole("heading", { name: "Join Olu Engineering" })).toBeVisible();
  await page.getByRole("button", { name: "Accept and join" }).click();
  await expect(page).toHaveURL(/\/workspace$/);
  await expect(page.getByText("You are contractor here")).toBeVisible();
});

test("A forged cross-site form post is refused and changes nothing", async ({ page }) => {
  await signIn(page, "admin@kestrel.example");
  // As a document request (React Router's own origin check answers 400) and as a data request
  // (our middleware answers 403); and with no Origin at all.
  for (const [path, headers] of [
    ["/workspace", { Origin: "http://evil.example" }],
    ["/workspace.data", { Origin: "http://evil.example" }],
    ["/workspace.data", {}],
  ] as const) {
    const res = await page.request.post(path, { form: { intent: "rename", name: "Hijacked" }, headers });
    expect([400, 403]).toContain(res.status());
  }
  await page.goto("/workspace");
  await expect(page.getByRole("heading", { name: "Kestrel Building Services" })).toBeVisible();
});

test("A wrong password gets a plain message, not an error page", async ({ page }) => {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill("nobody-here@example.test");
  await page.getByLabel("Password").fill("wrong password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("That e-mail and password do not match an account.")).toBeVisible();
});

test("As someone who forgot a password I ask for a reset link, follow it from the mailbox, choose a new password once, and sign in with it", async ({ page }) => {
  const email = uniqueEmail("forgetful");
  await page.goto("/signup");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Your name").fill("Fen Forgetful");
  await page.getByLabel("Password").fill("the first password");
  await page.getByLabel("Workspace name").fill("Fen Works");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByText("Check your inbox")).toBeVisible();

  await page.goto("/forgot");
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "Send me a reset link" }).click();
  await expect(page.getByText("If that address has an account")).toBeVisible();
  const link = await linkFromMailbox(page, email, "/reset");
  await page.goto(link);
  await page.getByLabel("New password").fill("the second password");
  await page.getByRole("button", { name: "Save the new password" }).click();
  await expect(page.getByText("Your password was changed")).toBeVisible();
  await signIn(page, email, "the second password");
  await signOut(page);
  // The link works once.
  await page.goto(link);
  await page.getByLabel("New password").fill("a third password!");
  await page.getByRole("button", { name: "Save the new password" }).click();
  await expect(page.getByText("expired or was already used")).toBeVisible();
});
