import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

// Every route with an action refuses a cross-site POST carrying the signed-in user's cookie with 403:
// our own check (app/lib/auth/csrf.server.ts), run by app/serve.mjs before React Router (whose own origin
// check on document and `.data` POSTs answered 400 and logged two stacks a request) and again by the root
// middleware. The public calculators (no cookies) and the Stripe webhook (signature) are the only exemptions.
const UI_ACTIONS = [
  "/signup", "/signin", "/signout", "/verify", "/forgot", "/reset", "/account", "/workspace", "/workspace/new", "/workspace/shares",
  "/workspace/billing", "/invite/abc", "/dev/mailbox", "/libraries", "/libraries/1", "/libraries/1/uploads/1",
  "/projects", "/projects/1", "/projects/1/share", "/systems/1", "/systems/1/search", "/libraries/1/trace",
];
const RESOURCE_ACTIONS = ["/libraries/1/upload", "/libraries/1/trace/upload", "/field/selections/1/photos", "/api/v1/systems/1/preview", "/api/v1/libraries/1/upload"];

test("every action refuses a cross-site POST (foreign Origin, or none at all)", async ({ page }) => {
  await signIn(page, "admin@kestrel.example");
  const refused: string[] = [];
  const accepted: string[] = [];
  const post = async (path: string, headers: Record<string, string>) => {
    const res = await page.request.post(path, { form: { intent: "rename", name: "x" }, headers, maxRedirects: 0 });
    (res.status() === 403 ? refused : accepted).push(`${path} ${JSON.stringify(headers)} → ${res.status()}`);
  };
  for (const p of UI_ACTIONS) {
    await post(`${p}.data`, { Origin: "http://evil.example" });
    await post(`${p}.data`, {});
    await post(p, { Origin: "http://evil.example" });
  }
  for (const p of RESOURCE_ACTIONS) {
    await post(p, { Origin: "http://evil.example" });
    await post(p, {});
  }
  expect(accepted).toEqual([]);
  expect(refused.length).toBe(UI_ACTIONS.length * 3 + RESOURCE_ACTIONS.length * 2);
  await page.goto("/workspace");
  await expect(page.getByRole("heading", { name: "Kestrel Building Services" })).toBeVisible();
});

test("uploads above the limit are refused before anything reads them", async ({ page }) => {
  await signIn(page, "distributor@harrow-vell.example");
  const big = Buffer.alloc(26 * 1024 * 1024, 0x41);
  const res = await page.request.post("/libraries/1/upload", {
    multipart: { file: { name: "huge.csv", mimeType: "text/csv", buffer: big } },
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(res.status()).toBe(413);
  const small = await page.request.post("/workspace.data", {
    form: { intent: "rename", name: "x".repeat(2 * 1024 * 1024) },
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(small.status()).toBe(413);
});
