import { defineConfig } from "@playwright/test";

// Debian's Chromium, no browser download. BASE_URL is set by `npm test` (db/cli.mjs).
export default defineConfig({
  testDir: ".",
  testMatch: /.*\.spec\.ts/,
  outputDir: "./artifacts/results",
  timeout: 60_000,
  workers: 1,
  // `npm run test:cluster` allows one retry: a journey in flight when a node is stopped may see a 503.
  retries: Number(process.env.PW_RETRIES ?? 0),
  reporter: [["list"], ["json"]],
  use: {
    baseURL: process.env.BASE_URL ?? "http://127.0.0.1:3100",
    screenshot: "only-on-failure",
    trace: "off",
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
      args: [
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--no-first-run",
      ],
    },
  },
  projects: [{ name: "chromium", use: { browserName: "chromium" } }],
});
