// Readings that give the pump a total head at or below zero, sent by the phone's queue (POST /field/selections/:id/checks)
// rather than the page's form (decision "storedattack"): answered as the page answers them — the same field error at the
// discharge pressure (`headRefusal`, head-check.ts), a 4xx — never recorded, never a 5xx; also in a body at the queue's
// size limit (FIELD_CHECK_BODY_BYTES), and as JSON (not a form: refused, 4xx). One byte past the limit is a 413.
// Through the root middleware (route-table `send`). Check values: (200 − 300) kPa / (998.2 kg/m³ × 9.80665 m/s²) = −10.2 m
// (hand, water at 20 °C from IAPWS via the engine); the body limit from body-limits.mjs; RFC 9110 (413). Invented curve
// (fieldcheck-fixture.ts).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { fieldChecks } from "@db/schema";
import { fluidAt } from "~/engine";
import { FIELD_CHECK_BODY_BYTES } from "~/lib/shared/body-limits.mjs";
import * as formPage from "~/routes/field.selections.$id";
import { call, makeMember, type TestMember } from "./harness";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";
import { send, wrongAnswer } from "./route-table";

afterAll(() => closeDb());

const RHO20 = fluidAt({ kind: "water" }, 20).density;
let m: TestMember;
let selectionId = 0;
let fingerprint = "";
beforeAll(async () => {
  m = await makeMember("admin");
  selectionId = (await storeSelection(m.workspaceId, m.userId, undefined, "Queue head")).selectionId;
  const page = await call(formPage.loader as never, { path: `/field/selections/${selectionId}`, cookie: m.cookie, params: { id: String(selectionId) } });
  fingerprint = (page.body as { selection: { fingerprint: string } }).selection.fingerprint;
});

const QUEUE = { path: "field/selections/:id/checks", file: "routes/field.selections.$id.checks.ts" };
const BOUNDARY = "----queuehead7MA4YWxkTrZu0gW";

/** A multipart body of `fields` (in order), padded with a field the form does not read to `size` bytes when given. */
function multipart(fields: Record<string, string>, size?: number): Uint8Array {
  const part = (k: string, v: string) => `--${BOUNDARY}\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${v}\r\n`;
  const head = Object.entries(fields).map(([k, v]) => part(k, v)).join("");
  const end = `--${BOUNDARY}--\r\n`;
  if (size === undefined) return new TextEncoder().encode(head + end);
  const empty = Buffer.byteLength(head + part("padding", "") + end);
  return new TextEncoder().encode(head + part("padding", "x".repeat(size - empty)) + end);
}
const fieldsOf = (extra: Record<string, string>) => ({ ...fieldsForHead(20, RHO20, { flow: "0.012" }), clientId: crypto.randomUUID(), basedOn: fingerprint, pageWorkspaceId: String(m.workspaceId), takenAt: new Date().toISOString(), ...extra });
const toQueue = (body: Uint8Array | string, type = `multipart/form-data; boundary=${BOUNDARY}`) =>
  send(QUEUE, { who: "owner", cookie: m.cookie, headers: { "content-type": type } }, { params: { id: String(selectionId) }, method: "POST", body });
const recorded = async (clientId: string) => (await db().select().from(fieldChecks).where(eq(fieldChecks.clientId, clientId))).length;
/** The page form's answer to the same readings (its errors). */
async function pageErrors(extra: Record<string, string>) {
  const r = await call(formPage.action as never, { path: `/field/selections/${selectionId}/photos`, cookie: m.cookie, form: fieldsOf(extra), params: { id: String(selectionId) } });
  expect(r.status).toBe(400);
  return (r.body as { errors: Record<string, string> }).errors;
}

const NO_HEAD: [string, Record<string, string>][] = [
  ["swapped gauges, −10.2 m", { sPressure: "300", dPressure: "200" }],
  ["equal gauges, 0 m", { sPressure: "200", dPressure: "200" }],
  ["absolute suction, gauge discharge, −0.1 m", { sRef: "absolute", sPressure: String(101.325 + 1), dPressure: "0.02" }],
  ["a discharge gauge 15 m below the suction's", { sPressure: "100", dPressure: "200", sElevation: "15" }],
  ["−0 kPa on both", { sPressure: "-0", dPressure: "-0" }],
];

describe("a total head at or below zero from the queue: the page's field error, a 400, nothing recorded", () => {
  test.each(NO_HEAD)("%s", async (_, extra) => {
    const fields = fieldsOf(extra);
    const a = await toQueue(multipart(fields));
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBe(400);
    const body = JSON.parse(a.text) as { errors: Record<string, string> };
    expect(body.errors.dPressure).toMatch(/^The readings give the pump a total head of (−[\d.]+|0) m?\S*, (below|at) zero/);
    expect(body.errors).toEqual(await pageErrors(extra));
    expect(await recorded(fields.clientId)).toBe(0);
  });
});

describe("no flow meter and a smaller discharge pipe: the check's own head decides (the flow inferred from the curve)", () => {
  // At no flow the velocity heads are 0: 200 kPa on both gauges is 0 m, and no flow on the curve (10–40 m, invented) meets
  // so small a head, so the check's head stays 0 m; 200.001 kPa is 0.001 kPa / (998.2 × 9.80665) = +1.0e-4 m (hand).
  test.each([
    ["swapped gauges, −10.2 m", { flow: "", dDiameter: "50", sPressure: "300", dPressure: "200" }, /total head of −10\.2\d* m, below zero/],
    ["equal gauges, 0 m", { flow: "", dDiameter: "99", sPressure: "200", dPressure: "200" }, /total head of 0 m, at zero/],
  ] as [string, Record<string, string>, RegExp][])("%s: refused at the discharge pressure as the page refuses it, nothing recorded (was: recorded, 201, 'not on the curve')", async (_, extra, words) => {
    const fields = fieldsOf(extra);
    const a = await toQueue(multipart(fields));
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBe(400);
    const body = JSON.parse(a.text) as { errors: Record<string, string> };
    expect(body.errors.dPressure).toMatch(words);
    expect(body.errors.dPressure).toMatch(/no flow reading: at the flow inferred from the curve, or at no flow where the curve gives none/);
    expect(body.errors).toEqual(await pageErrors(extra));
    expect(await recorded(fields.clientId)).toBe(0);
  });
  test("the flip: 0.001 kPa more on the discharge (+1e-4 m) is recorded, its verdict unknown (no flow meter)", async () => {
    const fields = fieldsOf({ flow: "", dDiameter: "99", sPressure: "200", dPressure: "200.001" });
    const a = await toQueue(multipart(fields));
    expect(a.status).toBe(201);
    expect(await recorded(fields.clientId)).toBe(1);
  });
});

describe("at the queue's body limit", () => {
  test(`a body of exactly ${FIELD_CHECK_BODY_BYTES} bytes with no head: the field error, a 400, nothing recorded`, async () => {
    const fields = fieldsOf(NO_HEAD[0][1]);
    const body = multipart(fields, FIELD_CHECK_BODY_BYTES);
    expect(body.byteLength).toBe(FIELD_CHECK_BODY_BYTES);
    const a = await toQueue(body);
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBe(400);
    expect((JSON.parse(a.text) as { errors: Record<string, string> }).errors.dPressure).toMatch(/total head of −10\.2\d* m, below zero/);
    expect(await recorded(fields.clientId)).toBe(0);
  });
  test("one byte more: 413 before the action, nothing recorded", async () => {
    const fields = fieldsOf(NO_HEAD[0][1]);
    const a = await toQueue(multipart(fields, FIELD_CHECK_BODY_BYTES + 1));
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBe(413);
    expect(await recorded(fields.clientId)).toBe(0);
  });
  test("the readings as a JSON object at the limit: refused (not a form), a 4xx, nothing recorded", async () => {
    const fields = fieldsOf(NO_HEAD[0][1]);
    const json = JSON.stringify({ ...fields, padding: "" });
    const padded = JSON.stringify({ ...fields, padding: "x".repeat(FIELD_CHECK_BODY_BYTES - Buffer.byteLength(json)) });
    expect(Buffer.byteLength(padded)).toBe(FIELD_CHECK_BODY_BYTES);
    const a = await toQueue(padded, "application/json");
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBeGreaterThanOrEqual(400);
    expect(a.status).toBeLessThan(500);
    expect(await recorded(fields.clientId)).toBe(0);
  });
});
