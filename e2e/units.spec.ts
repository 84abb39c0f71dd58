import { expect, test, type Page } from "@playwright/test";
import { linkFromMailbox, signIn, signOut, signUpAndConfirm, uniqueEmail } from "./helpers";

// Issue 17, units: a member who chose US units walks every page (home, projects, a project, the
// system editor with candidates, the pump search, the selection report, field checks, a library,
// the mapping page, the account page) and finds no SI unit word next to a number; then a mixed
// choice (L/s, m, kPa, kW) shows those words and not the preset's others. The member is a new
// admin invited into the demo firm, so the demo accounts' own settings never change.

const NUM = String.raw`\d(?:[\d.,]*\d)?`;
// An SI unit word after a number ("12.3 m", "40 m³/h", "Ø250 mm", "20 °C"), or as a field's unit in brackets ("(m³/h)").
// The number starts a word (or follows Ø) and the unit ends one: "12 months", "DN80 mm", "mm" in a model name or "m" inside "max" do not count.
const SI_WORDS = ["m³/h", "m³/s", "L/s", "L/min", "kPa", "kW", "mm", "m", "°C", "m/s", "kg/m³", "mm²/s", "m²/s", "mPa·s", "bar", "Pa"];
// The one SI figure a US reader is shown: a trimmed impeller's whole mm in brackets right after its inches ("Ø6.65 in
// [169 mm]"), where a text says the trim was rounded up to the next whole mm or gives the setting a site makes (the search
// row's How, the field page's Impeller) — the step a site sets (setting-step.ts, DEVELOPERS.md decisions "surfaces2",
// "npshtrim"). Taken out before the scan; a mm figure anywhere else still counts.
const TRIM_STEP_MM = /(?<=Ø\d[\d.]* in) \[\d+(?:\.\d+)? mm\]/g;
const esc = (s: string) => s.replace(/[.*+?^${}()|[\]\\/]/g, "\\$&");
const UNIT_AFTER_NUMBER = (words: string[]) => new RegExp(String.raw`(?<![\p{L}\d](?<!Ø))${NUM}\s?(?:${words.map(esc).join("|")})(?![\p{L}\p{N}²³/])`, "gu");
const UNIT_IN_BRACKETS = (words: string[]) => new RegExp(String.raw`\((?:${words.map(esc).join("|")})\)`, "gu");

/**
 * The page's text as a reader sees it (`innerText`) with every <details> opened, plus the charts' SVG
 * text (axes, readouts); without the options of the account page's unit pickers (they list every unit by design).
 */
async function pageText(page: Page): Promise<string> {
  return page.evaluate(() => {
    const clone = document.body.cloneNode(true) as HTMLElement;
    clone.querySelectorAll("[data-testid=units] select").forEach((s) => s.remove());
    clone.querySelectorAll("details").forEach((d) => (d.open = true));
    clone.style.position = "absolute";
    clone.style.left = "-99999px";
    document.body.append(clone);
    const svgText = [...clone.querySelectorAll("svg text, svg title, svg desc")].map((t) => t.textContent ?? "").join("\n");
    const text = `${clone.innerText}\n${svgText}`;
    clone.remove();
    return text;
  });
}

function found(text: string, words: string[]): string[] {
  return [...text.matchAll(UNIT_AFTER_NUMBER(words)), ...text.matchAll(UNIT_IN_BRACKETS(words))].map((m) => {
    const i = m.index ?? 0;
    return text.slice(Math.max(0, i - 40), i + m[0].length + 10).replace(/\s+/g, " ");
  });
}

async function newAdminInKestrel(page: Page): Promise<{ email: string; password: string }> {
  const email = uniqueEmail("units");
  const password = "a long enough password";
  await signIn(page, "admin@kestrel.example");
  await page.goto("/workspace");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Role", { exact: true }).selectOption("admin"); // admin: libraries too (the mapping page needs an upload of its own)
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByText(`Invitation sent to ${email}`)).toBeVisible();
  await signOut(page);
  await page.goto(await linkFromMailbox(page, email, "/invite/"));
  await page.getByRole("link", { name: "Create an account" }).click();
  await signUpAndConfirm(page, email, "Uma Units", password);
  await page.getByRole("button", { name: "Accept and join" }).click();
  await expect(page.getByText("You are admin here")).toBeVisible();
  return { email, password };
}

async function setUnits(page: Page, preset: "SI" | "US", picks: Record<string, string> = {}) {
  await page.goto("/account");
  const units = page.getByTestId("units");
  await units.getByLabel("Preset").selectOption(preset);
  for (const sel of await units.locator("select[name^='unit.']").all()) {
    const q = ((await sel.getAttribute("name")) ?? "").slice(5);
    await sel.selectOption(picks[q] ?? "");
  }
  await page.getByRole("button", { name: "Save profile" }).click();
  await expect(page.getByText("Profile saved.")).toBeVisible();
}

/** The pages of the walk, found from the demo data: returns [label, path]. */
async function walkPaths(page: Page): Promise<[string, string][]> {
  const hrefOf = async (path: string, selector: string) => {
    await page.goto(path);
    const h = await page.locator(selector).first().getAttribute("href");
    expect(h, `a link ${selector} on ${path}`).toBeTruthy();
    return h!;
  };
  const project = await hrefOf("/projects", "a:has-text('Copse Hill reservoir booster')");
  const system = await hrefOf(project, "a[href^='/systems/']");
  const selection = await hrefOf(project, "a[href^='/selections/']");
  const fieldSelection = `/field${selection}`;
  const fieldCheck = await hrefOf(fieldSelection, "a[href^='/field/checks/']");
  const library = await hrefOf("/libraries", "a[href^='/libraries/']:not([href$='/new'])");
  // The mapping page of a fresh upload in a library of the new member's own.
  await page.goto("/libraries");
  await page.getByLabel("Name").fill(`Units walk ${Date.now().toString(36)}`);
  await page.getByRole("button", { name: "Create library" }).click();
  await expect(page).toHaveURL(/\/libraries\/\d+$/);
  await page.getByTestId("upload-input").setInputFiles("fixtures/demo/tallowmere.csv");
  await expect(page).toHaveURL(/\/uploads\/\d+$/, { timeout: 20_000 });
  const mapping = new URL(page.url()).pathname;
  return [
    ["home", "/"],
    ["projects", "/projects"],
    ["project", project],
    ["system editor with candidates", system],
    ["pump search", `${system}/search`],
    ["selection report", selection],
    ["field checks", "/field"],
    ["field check page of the selection", fieldSelection],
    ["field check record", fieldCheck],
    ["library", library],
    ["mapping page", mapping],
    ["account", "/account"],
  ];
}

test("Units: a member in US units sees no SI unit word on any page; a mixed choice shows its own words", async ({ page }) => {
  test.setTimeout(180_000);
  await newAdminInKestrel(page);
  await setUnits(page, "US");
  const paths = await walkPaths(page);
  const problems: string[] = [];
  let usWords = 0;
  for (const [label, path] of paths) {
    await page.goto(path);
    await expect(page.locator("main, body").first()).toBeVisible();
    const text = (await pageText(page)).replace(TRIM_STEP_MM, "");
    expect(text.length, `${label} has text`).toBeGreaterThan(50);
    for (const hit of found(text, SI_WORDS)) problems.push(`${label} (${path}): …${hit}…`);
    usWords += (text.match(/\d\s?(?:gpm|ft|psi|hp|in|°F|ft\/s)(?![\p{L}])/gu) ?? []).length;
  }
  expect(problems).toEqual([]);
  expect(usWords, "the walk saw US units (it is not vacuous)").toBeGreaterThan(20);

  // A mixed choice over the US preset: L/s, m (head and lengths), kPa, kW. The system page, the search, the report and the field check use exactly these.
  await setUnits(page, "US", { flow: "L/s", head: "m", length: "m", pressure: "kPa", power: "kW" });
  const mixed = new Map(paths);
  const wanted: [string, RegExp[]][] = [
    ["system editor with candidates", [/\d\s?L\/s/, /\d\s?m(?![\p{L}²³/])/u, /\d\s?kW/]],
    ["pump search", [/\d\s?L\/s/, /\d\s?m(?![\p{L}²³/])/u]],
    ["selection report", [/\d\s?L\/s/, /\d\s?m(?![\p{L}²³/])/u, /\d\s?kW/, /\d\s?kPa/]],
    ["field check record", [/\d\s?L\/s/, /\d\s?m(?![\p{L}²³/])/u, /\d\s?kPa/]],
  ];
  for (const [label, words] of wanted) {
    await page.goto(mixed.get(label)!);
    const text = await pageText(page);
    for (const w of words) expect(text, `${label} shows ${w}`).toMatch(w);
    expect(found(text, ["m³/h", "m³/s", "gpm", "hp", "ft", "psi"]), `${label}: only the chosen flow, head, length, power and pressure units`).toEqual([]);
  }
});
