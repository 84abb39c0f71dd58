// The system editor's save (POST /systems/:id, the default intent) refusing a field: 400, as every other form answers its
// field errors (DEVELOPERS.md "Add a route"; it answered 200 until the "wirereq" helper), with the errors for the page and
// nothing saved; and on the wire to the built app, posted as a browser without JavaScript posts it, the editor page
// itself with the message beside the field. A good save stays 200.
import { afterAll, beforeAll, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates, systems } from "@db/schema";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import * as systemPage from "~/routes/systems.$id";
import { call, makeMember } from "./harness";
import { describeOnTheWire } from "./on-the-wire";
import { walkRecords, type WalkRecords } from "./route-table";
import { editorPost } from "./editor-post";
import { plainHtml } from "./render-page";

let owner: WalkRecords;
beforeAll(async () => {
  owner = await walkRecords(await makeMember("admin"));
}, 120_000);
afterAll(() => closeDb());

const stored = async () => (await db().select().from(systems).where(eq(systems.id, owner.system)))[0].inputJson;
const post = (form: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${owner.system}`, params: { id: String(owner.system) }, cookie: owner.m.cookie, form });

test("a field the save refuses (a negative duty flow, a duty head of letters): 400 with the field's error and nothing saved; the same form with good values 200 and saved", async () => {
  const good = editorPost(defaultSystemInput(), "Save status");
  const ok = await post(good);
  expect([ok.status, (ok.body as { saved?: boolean }).saved]).toEqual([200, true]);
  const before = await stored();
  for (const [field, value] of [["dutyFlow", "-5"], ["dutyHead", "abc"]]) {
    const r = await post({ ...good, [field]: value });
    const errors = (r.body as { errors?: Record<string, string> }).errors ?? {};
    expect([field, r.status, typeof errors[field]]).toEqual([field, 400, "string"]);
    expect((r.body as { saved?: boolean }).saved).toBeUndefined();
  }
  expect(await stored()).toBe(before);
});

// The candidate forms of the same page (helper "formedges"): a refused adjustment or purchase price answered 200 until then.
const adjustForm = (over: Record<string, string>) => ({ intent: "adjust", candidateId: String(owner.candidate), method: "speed", ratio: "", arrangement: "single", dutyPumps: "1", standbyPumps: "0", motorRating: "", serviceFactor: "1", ieClass: "IE3", ...over });
const storedCandidate = async () => (await db().select().from(candidates).where(eq(candidates.id, owner.candidate)))[0];

test("a refused adjustment (a ratio of letters, 0 duty pumps) or purchase price (letters, below 0): 400 with the form's error and its fields as typed, nothing saved", async () => {
  const before = await storedCandidate();
  for (const over of [{ ratio: "abc" }, { dutyPumps: "0" }] as Record<string, string>[]) {
    const r = await post(adjustForm(over));
    const body = r.body as { errors?: Record<string, string>; typedForm?: { key: string; fields: Record<string, string> } };
    expect([r.status, typeof body.errors?.[`adj.${owner.candidate}`]]).toEqual([400, "string"]);
    expect(body.typedForm).toEqual({ key: `adj.${owner.candidate}`, fields: expect.objectContaining(over) });
  }
  for (const price of ["abc", "-5"]) {
    const r = await post({ intent: "price", candidateId: String(owner.candidate), purchasePrice: price });
    const body = r.body as { errors?: Record<string, string>; typedForm?: { key: string; fields: Record<string, string> } };
    expect([price, r.status, typeof body.errors?.[`price.${owner.candidate}`]]).toEqual([price, 400, "string"]);
    expect(body.typedForm).toEqual({ key: `price.${owner.candidate}`, fields: { purchasePrice: price } });
  }
  expect(await storedCandidate()).toEqual(before);
  // The same forms with good values: 200 (a price of 1234.5 in the workspace's currency; a speed ratio of 95 %).
  expect((await post({ intent: "price", candidateId: String(owner.candidate), purchasePrice: "1234.5" })).status).toBe(200);
  expect((await post(adjustForm({ ratio: "95" }))).status).toBe(200);
});

describeOnTheWire("on the wire, without JavaScript", (wire) => {
  /** The editor's form posted as a browser without JavaScript posts it (a signed-in owner, same origin). */
  const postAsBrowser = (form: Record<string, string>) => wire.postAsBrowser(`/systems/${owner.system}`, owner.m.cookie, form);

  test("a form post with a negative duty flow: 400, the editor page again (its form, the field marked and its message beside it)", async () => {
    const form = { ...editorPost(defaultSystemInput(), "Save status"), dutyFlow: "-5" };
    const message = ((await post(form)).body as { errors: Record<string, string> }).errors.dutyFlow;
    const res = await postAsBrowser(form);
    const html = plainHtml(await res.text());
    expect([res.status, res.headers.get("content-type")]).toEqual([400, "text/html; charset=utf-8"]);
    expect(html).toContain(message);
    expect(html).toMatch(/<form[^>]*method="post"/);
    expect(html).toMatch(/<input id="f-dutyFlow"[^>]*aria-invalid="true"/);
  }, 60_000);

  test("a refused form post shows every field as typed in it (helper \"typedback\"): the bad duty flow -5 and the good edits beside it, not the stored values", async () => {
    const good = editorPost(defaultSystemInput(), "Save status");
    const form = { ...good, dutyFlow: "-5", "run.1.length": "75", tolPlus: "12", name: "Typed back", "run.0.remove": "on" };
    expect([good.dutyFlow, good["run.1.length"]]).not.toEqual(["-5", "75"]); // the stored values differ from the typed ones
    const res = await postAsBrowser(form);
    const html = plainHtml(await res.text());
    expect(res.status).toBe(400);
    expect(html).toMatch(/<input id="f-dutyFlow"[^>]*value="-5"/);
    expect(html).toMatch(/<input id="f-run\.1\.length"[^>]*value="75"/);
    expect(html).toMatch(/<input id="f-tolPlus"[^>]*value="12"/);
    expect(html).toMatch(/<input id="f-name"[^>]*value="Typed back"/);
    expect(html).toMatch(/<input type="checkbox" name="run\.0\.remove" checked=""/);
    // The page loaded afresh (no action) shows the stored values again: nothing of the refused post was kept.
    const again = plainHtml(await (await wire.get(`/systems/${owner.system}`, owner.m.cookie)).text());
    expect(again).toMatch(new RegExp(`<input id="f-dutyFlow"[^>]*value="${good.dutyFlow}"`));
    expect(again).not.toMatch(/<input id="f-run\.1\.length"[^>]*value="75"/);
  }, 60_000);

  test("a refused save that also pressed \"+ suction run\" (no JavaScript): 400, the added run shown after the posted ones, a fitting count typed kept", async () => {
    const good = editorPost(defaultSystemInput(), "Save status");
    const form = { ...good, dutyFlow: "-5", addRun: "suction", "run.1.fit.tee-run": "3" };
    const res = await postAsBrowser(form);
    const html = plainHtml(await res.text());
    expect(res.status).toBe(400);
    expect(good.runCount).toBe("2"); // the default system's runs: the added run is the third (run.2)
    expect(html).toMatch(/<input type="hidden" name="runCount" value="3"/);
    expect(html).toMatch(/<input id="f-run\.2\.name"[^>]*value="Suction run"/); // readSystemForm's name for it
    expect(html).toMatch(/<input id="f-run\.1\.fit\.tee-run"[^>]*value="3"/);
  }, 60_000);

  test("a refused adjustment or price posted without JavaScript: 400, the page with the error beside that form and its fields as typed", async () => {
    const adj = await postAsBrowser(adjustForm({ ratio: "9x9", serviceFactor: "1.15" }));
    const adjHtml = plainHtml(await adj.text());
    expect(adj.status).toBe(400);
    expect(adjHtml).toMatch(/<input[^>]*name="ratio" value="9x9"/);
    expect(adjHtml).toMatch(/<input[^>]*name="serviceFactor" value="1.15"/);
    expect(adjHtml).toContain(`<p class="text-fail">`);
    const price = await postAsBrowser({ intent: "price", candidateId: String(owner.candidate), purchasePrice: "12x" });
    const priceHtml = plainHtml(await price.text());
    expect(price.status).toBe(400);
    expect(priceHtml).toMatch(/<input[^>]*name="purchasePrice"[^>]*value="12x"/);
  }, 60_000);
});
