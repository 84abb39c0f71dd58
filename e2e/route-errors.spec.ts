import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

// Each route's ErrorBoundary speaks of what that route shows, inside the shell (navigation stays),
// with the right status (app/components/RouteError.tsx).
test("a missing project or library says what was not found, in the shell", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  for (const [path, words, back] of [
    ["/projects/999999999", "We could not find this project.", "Your projects"],
    ["/projects/abc", "We could not find this project.", "Your projects"],
    ["/libraries/999999999", "We could not find this pump library.", "All pump libraries"],
  ] as const) {
    const res = await page.goto(path);
    expect(res?.status(), path).toBe(404);
    await expect(page.getByRole("alert").getByRole("heading", { name: "Not found" }), path).toBeVisible();
    await expect(page.getByRole("alert"), path).toContainText(words);
    await expect(page.getByRole("alert").getByRole("link", { name: back }), path).toBeVisible();
    await expect(page.getByRole("navigation", { name: "Main" }), path).toBeVisible();
  }
});
