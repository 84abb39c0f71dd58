import { expect, test } from "@playwright/test";
import { signIn } from "./helpers";

// The printed selection report fits the selected pump, not the largest candidate: with another
// candidate set to four pumps in parallel, the report's flow axis and curve table still end near the
// selected pump's curve, and the report prints on two pages (A4 and US Letter) with its curve table.
test("A selection report prints on two pages with its curve table, scaled to the selected pump although another candidate runs four in parallel", async ({ page }) => {
  await signIn(page, "engineer@kestrel.example");
  // Work on a copy of the demo chilled-water project (three candidates), so the demo stays as seeded.
  await page.goto("/projects/1");
  await page.getByRole("button", { name: "Copy project" }).click();
  await expect(page.getByRole("heading", { name: /\(copy\)/ })).toBeVisible({ timeout: 20_000 });
  await page.locator("a[href^='/systems/']").first().click();
  await expect(page).toHaveURL(/\/systems\/\d+$/, { timeout: 20_000 });

  // Second candidate: four pumps in parallel (the case that used to stretch every scale).
  const second = page.locator("form:has(select[name=arrangement])").nth(1);
  await second.locator("select[name=arrangement]").selectOption("parallel");
  await second.locator("input[name=dutyPumps]").fill("4");
  await second.getByRole("button", { name: "Apply" }).click();
  // Generous waits after each form post: the test machine is shared and busy.
  await expect(page.getByText("Candidate adjusted.")).toBeVisible({ timeout: 20_000 });
  await expect(page.getByRole("table", { name: "Candidates compared" })).toContainText("4 in parallel");

  await page.getByRole("button", { name: "Select this pump" }).first().click();
  await expect(page).toHaveURL(/\/selections\/\d+$/, { timeout: 20_000 });
  await expect(page.getByText("Pump selection report")).toBeVisible({ timeout: 20_000 });

  // The printed curve table: rows beyond the selected pump's curve (every pump cell "—") are at most two.
  await page.emulateMedia({ media: "print" });
  const printed = page.locator("div.hidden.print\\:block table").first();
  await expect(printed).toBeVisible();
  const rows = await printed.locator("tbody tr").evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll("td")].map((td) => td.textContent?.trim() ?? "")));
  expect(rows.length).toBeGreaterThanOrEqual(5);
  const pumpCells = (cells: string[]) => cells.slice(1, -1); // system head first, NPSHa last
  expect(rows.filter((cells) => pumpCells(cells).every((x) => x === "—")).length).toBeLessThanOrEqual(2);
  await page.screenshot({ path: "e2e/artifacts/selection-report-print-parallel.png", fullPage: true });

  // Two pages, counted in the PDF Chromium prints (page objects of the document).
  for (const format of ["A4", "Letter"] as const) {
    const pdf = (await page.pdf({ format, printBackground: true })).toString("latin1");
    const pages = (pdf.match(/\/Type\s*\/Page(?!s)/g) ?? []).length;
    expect(pages, `${format} pages`).toBeGreaterThanOrEqual(1);
    expect(pages, `${format} pages`).toBeLessThanOrEqual(2);
  }
});
