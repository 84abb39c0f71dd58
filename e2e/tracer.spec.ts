import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";
import { CHART, IMPELLERS, chartPdf, headOf, paper } from "../app/lib/tracer/test-chart";

// Issue 20: a distributor traces an invented chart from a PDF (rendered by pdf.js in the page):
// calibrate → follow each impeller curve by its colour → check the CSV → import through the upload
// checks into a revision that records its source. The recovered head must be within 0.5 % of the
// head axis span (the acceptance figure).

test("A distributor traces three impeller curves from a PDF and imports them as a revision", async ({ page }) => {
  // pdf.js must run under our CSP as it is (its worker from our origin, no eval).
  const refused: string[] = [];
  page.on("console", (m) => {
    if (/Content Security Policy|Setting up fake worker/i.test(m.text())) refused.push(m.text());
  });
  await signIn(page, "distributor@harrow-vell.example");
  await page.goto("/libraries");
  await page.getByLabel("Name").fill(`Traced ${Date.now().toString(36)}`);
  await page.getByRole("button", { name: "Create library" }).click();
  await page.getByTestId("trace-link").click();
  await expect(page).toHaveURL(/\/trace$/);
  await page.getByTestId("picture-file").setInputFiles({ name: "invented-chart.pdf", mimeType: "application/pdf", buffer: Buffer.from(chartPdf()) });
  await page.getByRole("button", { name: "Store and open" }).click();
  await expect(page).toHaveURL(/\/trace\/\d+$/);
  // Hydrated first (the no-script notice is gone and the first render is done): a choice made before
  // React takes over the page would be reset by it.
  await expect(page.getByText("needs JavaScript")).toHaveCount(0);
  await expect(page.getByTestId("tracer")).toHaveAttribute("data-ready", "yes");
  const canvas = page.getByTestId("trace-canvas");
  await expect(async () => {
    await page.getByTestId("render-scale").selectOption("1"); // one picture pixel per PDF point
    await expect(canvas).toHaveAttribute("width", String(CHART.width), { timeout: 2000 });
  }).toPass();
  await expect(page.getByTestId("tracer")).toHaveAttribute("data-ready", "yes");
  const click = async (q: number, h: number) => {
    const [x, y] = paper(q, h);
    await canvas.click({ position: { x, y } });
  };

  expect(refused).toEqual([]);

  // Calibrate: two ticks on the flow axis, two on the head axis.
  await page.getByTestId("tool-xref").click();
  await click(10, 0);
  await page.getByTestId("xref-0").fill("10");
  await click(90, 0);
  await page.getByTestId("xref-1").fill("90");
  await page.getByTestId("tool-yref").click();
  await click(0, 10);
  await page.getByTestId("yref-1-0").fill("10");
  await click(0, 50);
  await page.getByTestId("yref-1-1").fill("50");
  await expect(page.getByTestId("residual")).toContainText("residual flow 0.00 %");

  // Trace each impeller curve by its colour, seeded by a click on it.
  await page.getByTestId("trace-model").fill("Invented 65-250");
  for (const [i, imp] of IMPELLERS.entries()) {
    if (i > 0) await page.getByTestId("add-curve").click();
    await page.getByTestId(`impeller-${i + 1}`).fill(String(imp.mm));
    await page.getByTestId("tool-colour").click();
    await click(20, headOf(imp.h0, 20));
    await expect(page.getByTestId("picked-colour")).toBeVisible();
    await page.getByTestId("trace-colour").click();
    await expect(page.getByRole("status").filter({ hasText: "points taken" })).toBeVisible();
  }

  // The CSV the page will send: every head point within 0.5 % of the head span of the invented curve.
  const csv = await page.getByTestId("traced-csv").inputValue();
  const rows = csv.trim().split("\n").slice(1).map((l) => l.split(","));
  expect(rows).toHaveLength(45);
  let worst = 0;
  for (const r of rows) {
    const imp = IMPELLERS.find((x) => x.mm === Number(r[4]));
    expect(imp).toBeDefined();
    worst = Math.max(worst, (100 * Math.abs(Number(r[6]) - headOf(imp!.h0, Number(r[5])))) / (CHART.head[1] - CHART.head[0]));
  }
  console.log(`tracer recovery in the browser (PDF via pdf.js, 45 CSV points): max |error| ${worst.toFixed(3)} % of head span`);
  expect(worst).toBeLessThan(0.5);

  // Into the library through the upload checks.
  await page.getByTestId("trace-import").click();
  await expect(page).toHaveURL(/\/uploads\/\d+$/);
  await expect(page.getByTestId("traced-source")).toContainText("traced from invented-chart.pdf, page 1");
  await expect(page.getByTestId("import-stats")).toContainText("0 errors");
  await page.getByRole("button", { name: "Import 3 curves" }).click();
  await expect(page).toHaveURL(/\/libraries\/\d+\?imported=1$/);
  await expect(page.getByText("traced from invented-chart.pdf, page 1. Traced data is approximate")).toBeVisible();
});

test.describe("without JavaScript", () => {
  test.use({ javaScriptEnabled: false });
  test("A picture is stored by a plain form post; the tracer page says it needs JavaScript; a CSV is refused as a picture", async ({ page }) => {
    await page.goto("/signin");
    await page.getByLabel("E-mail").fill("distributor@harrow-vell.example");
    await page.getByLabel("Password").fill("duty-demo-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.goto("/libraries");
    await page.getByLabel("Name").fill(`Traced no-JS ${Date.now().toString(36)}`);
    await page.getByRole("button", { name: "Create library" }).click();
    await page.getByRole("link", { name: "Trace a curve" }).click();
    await page.getByTestId("picture-file").setInputFiles({ name: "not-a-picture.pdf", mimeType: "application/pdf", buffer: Buffer.from("model,flow\n1,2\n") });
    await page.getByRole("button", { name: "Store and open" }).click();
    await expect(page.getByText("not-a-picture.pdf is not a PDF, PNG or JPEG file.")).toBeVisible();
    await page.goBack();
    await page.getByTestId("picture-file").setInputFiles({ name: "invented-chart.pdf", mimeType: "application/pdf", buffer: Buffer.from(chartPdf()) });
    await page.getByRole("button", { name: "Store and open" }).click();
    await expect(page).toHaveURL(/\/trace\/\d+$/);
    await expect(page.getByText("The tracer runs in the browser and needs JavaScript")).toBeVisible();
  });
});
