// A request body is read as JSON only through the project's readers: `readJsonBody` (lib/shared/forms.server.ts) and
// `calcAction`'s `readJson` (lib/calc-api/http.server.ts). Both refuse bytes that are not UTF-8, a name twice in one
// object (strict-json.ts) and a body past its limit, and route-attack-json.test.ts finds the JSON APIs by their names
// (`calcAction(`, `notJsonBody(`, `readJsonBody(`). A route or lib file calling `request.json()` itself, or reading the
// body raw and parsing it, would take JSON.parse's readings (the last of two names, U+FFFD for bad bytes) and escape that
// sweep: it fails here. The scan is textual (common practice for a house rule): `.json()` on anything but a fetch
// response (`res`, `response`, `resp`), and a raw read of `request`/`req` in a file that also parses JSON.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, test } from "vitest";

const ROOT = path.resolve(__dirname, "../..");

/** The readers: a file allowed to read a request body raw and parse it as JSON, and the name the sweep finds it by. */
const READERS: Record<string, string> = {
  "app/lib/shared/forms.server.ts": "readJsonBody",
  "app/lib/calc-api/http.server.ts": "calcAction",
};

/** `x.json()` with no argument: a body read as JSON (Request or Response; `Response.json(value)` takes one). */
const JSON_CALL = /([\w$]+|\))\s*\??\.\s*json\s*\(\s*\)/g;
const FETCH_RESPONSE = /^(?:res|response|resp)$/;
const RAW_BODY_READ = /\b(?:request|req)\s*(?:\??\.\s*clone\s*\(\s*\))?\s*\??\.\s*(?:text|arrayBuffer|blob|bytes|body)\b/;
const PARSES_JSON = /JSON\.parse\s*\(|parseStrictJson\s*\(/;

/** What in `src` reads a request body as JSON by itself (empty when nothing does). */
export function ownJsonReads(src: string): string[] {
  const out: string[] = [];
  for (const m of src.matchAll(JSON_CALL)) if (!FETCH_RESPONSE.test(m[1])) out.push(m[0].replace(/\s+/g, ""));
  if (RAW_BODY_READ.test(src) && PARSES_JSON.test(src)) out.push(`${src.match(RAW_BODY_READ)![0]} then ${src.match(PARSES_JSON)![0]}`);
  return out;
}

const sources = (dir: string): string[] =>
  readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return name === "+types" ? [] : sources(full);
    return /\.(ts|tsx|mjs|js)$/.test(name) && !/\.test\.tsx?$|test-helpers\.ts$/.test(name) ? [full] : [];
  });

describe("request bodies are read as JSON only through the project's readers", () => {
  test("the scan sees request.json(), req.clone().json() and JSON.parse(await request.text()), and not res.json()", () => {
    expect(ownJsonReads("const body = await request.json();")).toEqual(["request.json()"]); // source: the rule above
    expect(ownJsonReads("const b = await req.clone().json();")).toEqual([").json()"]); // source: same
    expect(ownJsonReads("const v = JSON.parse(await request.text());")).toHaveLength(1); // source: same
    expect(ownJsonReads("const t = await args.request.clone().text(); return parseStrictJson(t);")).toHaveLength(1); // source: same
    expect(ownJsonReads("return (await res.json()) as X; return Response.json(out, { status: 200 });")).toEqual([]); // source: a fetch response, a reply
    expect(ownJsonReads("raw = await request.text(); await handleStripeWebhook(raw, sig);")).toEqual([]); // source: a raw read with no JSON parse (the webhook's signature)
  });

  test("no file under app/routes or app/lib reads a request body as JSON but the readers", () => {
    const files = [...sources(path.join(ROOT, "app/routes")), ...sources(path.join(ROOT, "app/lib"))].map((f) => path.relative(ROOT, f));
    expect(files.length).toBeGreaterThan(200);
    const found = files.filter((f) => !(f in READERS)).flatMap((f) => ownJsonReads(readFileSync(path.join(ROOT, f), "utf8")).map((w) => `${f}: ${w}`));
    expect(found, "read the body with readJsonBody (lib/shared/forms.server.ts) or calcAction, so route-attack-json.test.ts sweeps the route").toEqual([]);
  });

  test("each reader exists and the JSON sweep finds its callers by its name", () => {
    const sweep = readFileSync(path.join(ROOT, "app/test/route-attack-json.test.ts"), "utf8");
    for (const [file, name] of Object.entries(READERS)) {
      expect(readFileSync(path.join(ROOT, file), "utf8")).toMatch(new RegExp(`export async function ${name}\\(`));
      expect(sweep).toContain(`${name}\\(`);
    }
  });
});
