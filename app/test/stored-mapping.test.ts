// A library's saved column mapping (libraries.mapping_json) damaged in the database — cut off, a field the importer does not
// know, a layout that is neither long nor wide — was set aside without a word (a bare try/catch): the mapping page then
// proposed a fresh mapping and said nothing, as if the library had never been imported. The saved mapping is a convenience,
// not data, so it is still set aside — the page proposes the mapping from the file's headers, as for a first upload — but
// now the page says so and what is wrong with it; the next import saves the mapping it used in its place.
// The upload API (POST /api/v1/libraries/:id/upload) set it aside as silently while the page spoke: its answer now carries
// the same notice (`savedMappingUnreadable`: detail and errors, as the API lists a stored document's problems), also on the
// 422 of an import that the proposed mapping could not make.
// Real route module, guards and MariaDB (app/test/harness.ts). Check values: our product rules (upload-analysis.ts,
// stored-doc.ts), MappingSchema's own messages (app/lib/import/mapping.ts); the demo CSV is invented (fixtures/demo/).
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { libraries } from "@db/schema";
import { importUpload, storeUpload, type Viewer } from "~/lib/libraries";
import { analyseStored } from "~/lib/libraries/upload-analysis";
import { demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import * as uploadApi from "~/routes/api.v1.libraries.$id.upload";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";

afterAll(() => closeDb());

const FILE = "tallowmere.csv";
const text = readFileSync(`fixtures/demo/${FILE}`, "utf8");
let m: TestMember;
let v: Viewer;
let token = "";

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "mapping", scope: "write" })).token;
});

type ApiNotice = { detail: string; errors: { field: string; message: string }[] } | null;
type ApiAnswer = { report?: { mapping: unknown }; revision?: unknown; savedMappingUnreadable?: ApiNotice };
/** The same file through the API, no mapping given (so the saved one is looked at); with import=1 when `importIt`. */
const viaApi = (lib: number, importIt: boolean) => {
  const fd = new FormData();
  fd.append("file", new File([text], FILE, { type: "text/csv" }));
  if (importIt) fd.append("import", "1");
  return call(uploadApi.action as never, { path: `/api/v1/libraries/${lib}/upload`, params: { id: String(lib) }, method: "POST", body: fd, headers: { authorization: `Bearer ${token}` } });
};

type Page = { mappingSource: string; mapping: unknown; savedMappingUnreadable: { text: string; lines: string[] } | null };
const savedOf = async (lib: number) => (await db().select({ mappingJson: libraries.mappingJson }).from(libraries).where(eq(libraries.id, lib)))[0].mappingJson;

/** A library that imported the demo file (its mapping saved) and a second upload of the same file, as a new revision would start. */
async function libraryWithUpload(name: string) {
  const lib = await demoLibrary(v, name, FILE);
  const upload = await storeUpload(v, lib, new File([text], FILE, { type: "text/csv" }));
  const page = () => call(uploadPage.loader as never, { path: `/libraries/${lib}/uploads/${upload}`, params: { id: String(lib), uploadId: String(upload) }, cookie: m.cookie });
  return { lib, upload, page };
}

test("control: a sound saved mapping is used, and no notice", async () => {
  const { lib, page } = await libraryWithUpload("Saved mapping, sound");
  expect(await savedOf(lib)).toBeTruthy(); // the import saved its mapping (import-write.server.ts)
  const r = await page();
  expect(r.status).toBe(200);
  expect((r.body as Page).mappingSource).toBe("saved");
  expect((r.body as Page).savedMappingUnreadable).toBeNull();
  const api = await viaApi(lib, false);
  expect([api.status, (api.body as ApiAnswer).savedMappingUnreadable]).toEqual([201, null]);
});

type Corruption = { name: string; corrupt: (saved: string) => string; label: string; message: RegExp; stored: string | null };
const CASES: Corruption[] = [
  { name: "cut off (not JSON)", corrupt: (saved) => saved.slice(0, 40), label: "the saved mapping", message: /^Is not valid JSON/, stored: null },
  {
    name: "a column mapped to a field the importer does not know",
    corrupt: (saved) => {
      const mp = JSON.parse(saved);
      return JSON.stringify({ ...mp, columns: mp.columns.map((c: object, i: number) => (i === 1 ? { ...c, field: "flw" } : c)) });
    },
    label: "column 2, field",
    message: /^Should be one of "model", /,
    stored: '"flw"',
  },
  { name: "a layout that is neither long nor wide", corrupt: (saved) => JSON.stringify({ ...JSON.parse(saved), layout: "diagonal" }), label: "layout (long or wide)", message: /^Should be "long" or "wide"\.$/, stored: '"diagonal"' },
];

describe.each(CASES)("a saved mapping $name", (c) => {
  let page: Page;
  let ctx: Awaited<ReturnType<typeof libraryWithUpload>>;
  let damaged = "";
  beforeAll(async () => {
    ctx = await libraryWithUpload(`Saved mapping ${c.name}`);
    damaged = c.corrupt((await savedOf(ctx.lib))!);
    await db().update(libraries).set({ mappingJson: damaged }).where(eq(libraries.id, ctx.lib));
    const r = await ctx.page();
    expect(r.status).toBe(200);
    page = r.body as Page;
  });

  test("is set aside: the mapping proposed is the first upload's (from the headers), never the damaged one", () => {
    expect(page.mappingSource).toBe("suggested");
    expect(page.mapping).toEqual(analyseStored(text, { mappingJson: null }).mapping);
  });

  test("and the page says so, where and what is wrong (was: nothing said)", () => {
    const notice = page.savedMappingUnreadable;
    expect(notice?.text).toMatch(/^The column mapping saved with this library from its last import cannot be read \(1 problem: /);
    expect(notice?.text).toContain(`: ${c.label}), so it is not used: the mapping below is proposed from this file's headers, as for a first upload.`);
    const line = notice?.lines.find((l) => l.startsWith(`${c.label}: `)) ?? JSON.stringify(notice);
    const stored = c.stored ? ` (stored: ${c.stored})` : "";
    expect(line.endsWith(stored), line).toBe(true);
    expect(line.slice(c.label.length + 2, line.length - stored.length)).toMatch(c.message);
    const data = page; // the loader's own answer
    const html = renderPage("/libraries/:id/uploads/:uploadId", uploadPage.default, `/libraries/${ctx.lib}/uploads/${ctx.upload}`, data).replace(/<!-- -->/g, "");
    expect(html).toContain('data-testid="saved-mapping-unreadable">The column mapping saved with this library from its last import cannot be read');
    expect(html).not.toContain("Using the column mapping saved with this library");
  });

  test("the upload API says the same in its answer (was: set aside without a word), report and import alike", async () => {
    for (const importIt of [false, true]) {
      const r = await viaApi(ctx.lib, importIt);
      expect([importIt, r.status]).toEqual([importIt, 201]);
      const body = r.body as ApiAnswer;
      expect(body.report?.mapping).toEqual(page.mapping); // the mapping proposed from the headers, as the page's
      const notice = body.savedMappingUnreadable;
      expect(notice?.detail).toMatch(/^The column mapping saved with this library from its last import cannot be read \(1 problem: /);
      expect(notice?.detail).toContain(`: ${c.label}), so it is not used: report.mapping was proposed from this file's headers, as for a first upload.`);
      // problemErrors (stored-doc.ts): the dotted path, and the page's line (label, message, value stored).
      expect(notice?.errors).toHaveLength(1);
      expect(notice?.errors[0].message).toBe(page.savedMappingUnreadable!.lines[0]);
      if (importIt) expect(body.revision).toBeDefined();
      // The import saved its mapping in the damaged one's place: put the damage back for the next round.
      await db().update(libraries).set({ mappingJson: damaged }).where(eq(libraries.id, ctx.lib));
    }
  });

  test("the next import saves the mapping it used in its place", async () => {
    await importUpload(v, ctx.lib, ctx.upload, page.mapping, "after a damaged saved mapping");
    const r = await ctx.page();
    expect((r.body as Page).savedMappingUnreadable).toBeNull();
    expect((r.body as Page).mappingSource).toBe("saved");
  });
});
