import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { expect, type Page } from "@playwright/test";

const require = createRequire(import.meta.url);

export const DEMO_PASSWORD = "duty-demo-2026";

export const uniqueEmail = (prefix: string) => `${prefix}-${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@example.test`;

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  // Generous: the password hash (argon2) and the session write on a busy shared machine, or a Galera cluster whose node was
  // just killed, took over the default 5 s twice in the cluster run (the sign-in page still showing, then passing on retry).
  await expect(page.getByRole("button", { name: "Sign out" })).toBeVisible({ timeout: 20_000 });
}

export async function signOut(page: Page) {
  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/signin/);
}

/** Opens the newest message to `to` in the development mailbox and returns the first link containing `path`. */
export async function linkFromMailbox(page: Page, to: string, path: string): Promise<string> {
  let href: string | null = null;
  for (let i = 0; i < 30 && !href; i++) {
    await page.goto(`/dev/mailbox?to=${encodeURIComponent(to)}`);
    const first = page.locator("details").first();
    if ((await first.count()) > 0) {
      await first.locator("summary").click();
      const link = first.locator(`a[href*="${path}"]`).first();
      if ((await link.count()) > 0) href = await link.getAttribute("href");
    }
    if (!href) await page.waitForTimeout(300);
  }
  if (!href) throw new Error(`no ${path} link in the mailbox of ${to}`);
  return href;
}

/**
 * On the sign-up form (the e-mail, and a workspace name where asked, already filled or given by an
 * invitation): name and password, then the mailed link confirms the address.
 */
export async function signUpAndConfirm(page: Page, email: string, name: string, password: string) {
  await page.getByLabel("Your name").fill(name);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Create account" }).click();
  // The same words as for an address that already has an account; the mailed link signs in.
  await expect(page.getByText("Check your inbox")).toBeVisible();
  await page.goto(await linkFromMailbox(page, email, "/verify"));
  await page.getByRole("button", { name: "Confirm my address" }).click();
}

/** Runs axe-core (injected from the package, no network) and returns serious and critical violations. */
export async function axeViolations(page: Page) {
  // Evaluated, not added as a <script>: the page's CSP (a nonce per response) rightly refuses an inline script tag.
  const axeSource = readFileSync(require.resolve("axe-core/axe.min.js"), "utf8");
  await page.evaluate(axeSource);
  const result = await page.evaluate(async () => {
    // @ts-expect-error axe is injected above
    const r = await window.axe.run(document, { resultTypes: ["violations"] });
    return r.violations.map((v: { id: string; impact: string; help: string; nodes: { target: string[] }[] }) => ({ id: v.id, impact: v.impact, help: v.help, targets: v.nodes.slice(0, 3).map((n) => n.target.join(" ")) }));
  });
  return result.filter((v: { impact: string }) => v.impact === "serious" || v.impact === "critical");
}

/**
 * Watches the page's requests from now on. `quiet()` waits until none has been in flight for `idleMs`
 * (Playwright's "networkidle", but its failure names the requests still open and how long they have
 * been, so a hang says where it is instead of only timing out).
 */
export function watchNetwork(page: Page) {
  const open = new Map<object, { url: string; since: number }>();
  let lastChange = Date.now();
  page.on("request", (r) => {
    open.set(r, { url: `${r.method()} ${r.url()}`, since: Date.now() });
    lastChange = Date.now();
  });
  const done = (r: object) => {
    if (open.delete(r)) lastChange = Date.now();
  };
  page.on("requestfinished", done);
  page.on("requestfailed", done);
  return {
    async quiet(idleMs = 500, timeoutMs = 20_000) {
      const t0 = Date.now();
      for (;;) {
        if (open.size === 0 && Date.now() - lastChange >= idleMs) return;
        if (Date.now() - t0 > timeoutMs) {
          const now = Date.now();
          const list = [...open.values()].map((o) => `${o.url} (open ${now - o.since} ms)`);
          throw new Error(`network not quiet after ${timeoutMs} ms; still open: ${list.join("; ") || "none (kept busy)"}`);
        }
        await page.waitForTimeout(100);
      }
    },
  };
}
