import { expect, test } from "@playwright/test";
import { watchNetwork } from "./helpers";

test("a visitor sees the Dutymark shell, and the page asks nothing of any host but 127.0.0.1", async ({ page, baseURL }) => {
  const offHost: string[] = [];
  const network = watchNetwork(page);
  page.on("request", (req) => {
    const u = new URL(req.url());
    if (!["http:", "https:", "ws:", "wss:"].includes(u.protocol)) return; // data:, blob:
    if (u.hostname !== "127.0.0.1") offHost.push(req.url());
  });
  const res = await page.goto("/");
  expect(res?.status()).toBe(200);
  await expect(page.getByRole("link", { name: "Dutymark" })).toBeVisible();
  await expect(page.getByRole("navigation", { name: "Main" })).toBeVisible();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Size the pump");
  // The font ships with the app.
  const font = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
  expect(font).toContain("Source Sans 3");
  await network.quiet();
  await page.screenshot({ path: "e2e/artifacts/shell.png", fullPage: true });
  expect(offHost, `requests off 127.0.0.1 from ${baseURL}`).toEqual([]);
});

test("an unknown address answers 404 with our page", async ({ page }) => {
  const res = await page.goto("/no-such-place");
  expect(res?.status()).toBe(404);
  await expect(page.getByRole("heading", { name: "Page not found" })).toBeVisible();
});

test("/healthz reports the database", async ({ request }) => {
  const res = await request.get("/healthz");
  expect(res.status()).toBe(200);
  const body = await res.json();
  expect(body).toMatchObject({ status: "ok", db: "ok" });
  expect(typeof body.version).toBe("string");
});

test("every response carries our security headers", async ({ request }) => {
  for (const path of ["/", "/signin", "/healthz", "/api/v1/me", "/no-such-place"]) {
    const res = await request.get(path);
    const h = res.headers();
    expect(h["content-security-policy"], path).toContain("frame-ancestors 'none'");
    expect(h["content-security-policy"], path).toContain("default-src 'self'");
    expect(h["x-content-type-options"], path).toBe("nosniff");
    expect(h["referrer-policy"], path).toBe("strict-origin-when-cross-origin");
    expect(h["x-frame-options"], path).toBe("DENY");
    expect(h["x-powered-by"], path).toBeUndefined();
  }
});

test("the public calculator answers anonymously through the app server, with our headers (worked example: V ≈ 3.18 m/s)", async ({ request }) => {
  // Source: common practice, worked example (0.1 m³/s, 200 mm, ν = 1.12e-6 m²/s).
  const res = await request.post("/api/v1/calc/pipe-loss", {
    data: { flow_m3s: 0.1, diameter_m: 0.2, length_m: 100, roughness_m: 0.00026, kinematic_viscosity_m2s: 1.12e-6 },
  });
  expect(res.status()).toBe(200);
  expect(res.headers()["x-content-type-options"]).toBe("nosniff");
  const body = await res.json();
  expect(body.velocity_ms).toBeCloseTo(3.18, 2);
  const bad = await request.post("/api/v1/calc/pipe-loss", { data: { flow_m3s: -1 } });
  expect(bad.status()).toBe(400);
  expect(bad.headers()["content-type"]).toBe("application/problem+json");
});
