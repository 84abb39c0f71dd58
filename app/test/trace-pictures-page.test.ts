// The tracer's picture list and its Delete: a picture nothing was traced from can be deleted; one an upload was
// traced from is kept (it is the source its revisions name) and the page says so, 409; another workspace's picture is a
// 404; an unknown action a 400; a refused import of traced points a 422. Real route module, guards and MariaDB (app/test/harness.ts). Check values: our rules.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { tracePictures, uploads } from "@db/schema";
import { createLibrary, type Viewer } from "~/lib/libraries";
import { viewerOfUser } from "~/lib/projects/test-kit";
import { storePicture, storeTracedCsv } from "~/lib/tracer/pictures.server";
import { chartPdf } from "~/lib/tracer/test-chart";
import * as tracePage from "~/routes/libraries.$id.trace";
import * as tracePicturePage from "~/routes/libraries.$id.trace.$pictureId";
import { call, makeMember, type TestMember } from "./harness";
import { describeOnTheWire } from "./on-the-wire";
import { plainHtml } from "./render-page";

afterAll(() => closeDb());

let dist: TestMember;
let v: Viewer;
let lib = 0;
const ids = { trial: 0, used: 0 };
beforeAll(async () => {
  dist = await makeMember("distributor");
  v = await viewerOfUser(dist.userId, "distributor");
  lib = await createLibrary(v, { name: `Pictures ${Date.now()}`, description: "" });
  ids.trial = await storePicture(v, lib, new File([chartPdf()], "wrong-sheet.pdf"));
  ids.used = await storePicture(v, lib, new File([chartPdf()], "sheet.pdf"));
  await storeTracedCsv(v, lib, ids.used, "model,flow_m3h,head_m\nT 1,0,20\nT 1,10,18\n", 1);
});

const post = (m: TestMember, form: Record<string, string>, libId = lib) =>
  call(tracePage.action as never, { path: `/libraries/${libId}/trace`, cookie: m.cookie, params: { id: String(libId) }, form });
const exists = async (id: number) => (await db().select({ id: tracePictures.id }).from(tracePictures).where(eq(tracePictures.id, id))).length === 1;

describe("the tracer's pictures", () => {
  test("the list says which pictures uploads were traced from", async () => {
    const r = await call(tracePage.loader as never, { path: `/libraries/${lib}/trace`, cookie: dist.cookie, params: { id: String(lib) } });
    const pictures = (r.body as { pictures: { id: number; traced: number }[]; total: number }).pictures;
    expect(Object.fromEntries(pictures.map((p) => [p.id, p.traced]))).toEqual({ [ids.trial]: 0, [ids.used]: 1 });
    expect((r.body as { total: number }).total).toBe(2);
  });

  test("one traced from is kept, saying why (409); one nothing was traced from is deleted", async () => {
    const kept = await post(dist, { intent: "delete", pictureId: String(ids.used) });
    expect(kept.status).toBe(409); // a conflict with the picture's state, as the search page's refused add (helper "refusals200"; was 200)
    expect(kept.body).toMatchObject({ notice: null, error: "sheet.pdf is kept: 1 upload was traced from it, and it is the source the revisions made from it name." });
    expect(await exists(ids.used)).toBe(true);
    const gone = await post(dist, { intent: "delete", pictureId: String(ids.trial) });
    expect(gone.body).toMatchObject({ notice: "wrong-sheet.pdf deleted." });
    expect(await exists(ids.trial)).toBe(false);
  });

  test("another workspace's member gets a 404 and deletes nothing; an unknown action or a bad id is a 400", async () => {
    const other = await makeMember("distributor");
    const extra = await storePicture(v, lib, new File([chartPdf()], "extra.pdf"));
    expect((await post(other, { intent: "delete", pictureId: String(extra) })).status).toBe(404);
    expect(await exists(extra)).toBe(true);
    expect((await post(dist, { intent: "rename", pictureId: String(extra) })).status).toBe(400);
    expect((await post(dist, { intent: "delete", pictureId: "abc" })).status).toBe(400);
    expect((await post(dist, { intent: "delete", pictureId: "999999999" })).status).toBe(404);
    expect(await exists(extra)).toBe(true);
  });
});

// The trace page's import (POST /libraries/:id/trace/:pictureId intent=import) refusing the traced points: 422, as the
// upload routes answer an UploadRejected (helper "refusals200"; it answered 200), with the refusal's words for the page.
describe("the trace page's refused import", () => {
  test("traced points of only blanks: 422 \"Nothing was traced yet.\", no upload stored", async () => {
    const uploadsOf = async () => (await db().select({ id: uploads.id }).from(uploads).where(eq(uploads.libraryId, lib))).length;
    const n = await uploadsOf();
    const r = await call(tracePicturePage.action as never, {
      path: `/libraries/${lib}/trace/${ids.used}`, cookie: dist.cookie, params: { id: String(lib), pictureId: String(ids.used) },
      form: { intent: "import", csv: " \n  \n", page: "1" },
    });
    expect([r.status, (r.body as { error?: string }).error]).toEqual([422, "Nothing was traced yet."]); // source: our rule (storeTracedCsv's words)
    expect(await uploadsOf()).toBe(n);
  });
});

describeOnTheWire("on the wire, the trace pages' refusals", (wire) => {
  test("posted as a browser posts it: 422, the trace page itself with the refusal", async () => {
    const res = await wire.postAsBrowser(`/libraries/${lib}/trace/${ids.used}`, dist.cookie, { intent: "import", csv: " \n  \n", page: "1" });
    const html = plainHtml(await res.text());
    expect([res.status, res.headers.get("content-type")]).toEqual([422, "text/html; charset=utf-8"]);
    expect(html).toContain('role="alert">Nothing was traced yet.</p>'); // source: our rule (storeTracedCsv's words, in FormError)
    expect(html).toContain("Trace: sheet.pdf"); // the page itself, not an error page
  }, 60_000);
  test("a Delete of a picture traced from, posted as a browser posts it: 409, the picture list with the reason", async () => {
    const res = await wire.postAsBrowser(`/libraries/${lib}/trace`, dist.cookie, { intent: "delete", pictureId: String(ids.used) });
    const html = plainHtml(await res.text());
    expect([res.status, res.headers.get("content-type")]).toEqual([409, "text/html; charset=utf-8"]);
    expect(html).toContain('role="alert">sheet.pdf is kept: 1 upload was traced from it'); // source: our rule (deletePicture's words, in FormError)
    expect(html).toContain("Pictures of this library"); // the page itself, not an error page
    expect(await exists(ids.used)).toBe(true);
  }, 60_000);
});
