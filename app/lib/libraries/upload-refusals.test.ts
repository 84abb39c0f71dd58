// What the upload refuses, in words a distributor can act on, against the real MariaDB (storeUpload, the route's service).
// (1) The size limit: a file one byte over 20 MB was refused as "is 20.0 MB; the limit is 20 MB" — the refused size read
// as the limit. Now both carry their bytes, "20.0 MB (20,971,521 bytes)" against "20 MB (20,971,520 bytes)"; a file at
// the limit is kept. (2) UTF-16 text without a byte-order mark (every other byte 0) was refused as "looks like a binary
// file, not CSV text"; it is still refused (its NULs cannot be told from binary data), but the words say what it is and
// how to save it. UTF-16 with its mark is kept as before. (3) A name of any length is never echoed whole. Invented rows.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, storeUpload, type Viewer } from "./index";
import { MAX_UPLOAD_BYTES } from "./uploads.server";
import { looksUtf16WithoutBom } from "../import";
import { makeMember } from "~/test/harness";
import { viewerOfUser } from "../projects/test-kit";

afterAll(() => closeDb());

const TEXT = "Model,Speed (rpm),Flow (m3/h),Head (m)\nA,2900,0,30\nA,2900,10,29\nA,2900,20,27\n";
const utf16 = (t: string, be: boolean, bom: boolean) => {
  const out: number[] = bom ? (be ? [0xfe, 0xff] : [0xff, 0xfe]) : [];
  for (const ch of t) out.push(...(be ? [0, ch.charCodeAt(0)] : [ch.charCodeAt(0), 0]));
  return Uint8Array.from(out);
};
/** A CSV of exactly `n` bytes (the invented rows, then one repeated row, then spaces). */
const ofSize = (n: number) => {
  const line = "B,2900,10,29\n";
  const body = line.repeat(Math.floor((n - TEXT.length) / line.length));
  return TEXT + body + " ".repeat(n - TEXT.length - body.length);
};
const file = (bytes: Uint8Array | string, name = "curves.csv") => new File([bytes as BlobPart], name, { type: "text/csv" });

let v: Viewer;
let lib = 0;
beforeAll(async () => {
  const m = await makeMember("distributor");
  v = await viewerOfUser(m.userId, "distributor");
  lib = await createLibrary(v, { name: "Refusals", description: "" });
});

describe("the size limit, both sides", () => {
  test("the limit is 20 MiB", () => expect(MAX_UPLOAD_BYTES).toBe(20 * 1024 * 1024));
  test("one byte over: refused with both sizes in bytes, apart (old code: “is 20.0 MB; the limit is 20 MB”)", async () => {
    const e = await storeUpload(v, lib, file(ofSize(MAX_UPLOAD_BYTES + 1), "big.csv")).catch((x: Error) => x);
    expect(String((e as Error).message)).toBe("big.csv is 20.0 MB (20,971,521 bytes); the limit is 20 MB (20,971,520 bytes)."); // source: 20 × 1,048,576 = 20,971,520
  });
  test("at the limit: kept", async () => {
    expect(await storeUpload(v, lib, file(ofSize(MAX_UPLOAD_BYTES), "at.csv"))).toBeGreaterThan(0);
  }, 120_000);
});

describe("UTF-16 without its byte-order mark", () => {
  test.each([["LE", false], ["BE", true]] as const)("UTF-16 %s without the mark: refused, named as such with the way out (old code: “looks like a binary file”)", async (_, be) => {
    const e = await storeUpload(v, lib, file(utf16(TEXT, be, false))).catch((x: Error) => x);
    expect((e as Error).message).toBe("curves.csv looks like UTF-16 text without a byte-order mark (every other byte is 0), which cannot be told from binary data: save it as UTF-8, or as UTF-16 with its byte-order mark, and upload it again.");
  });
  test.each([["LE", false], ["BE", true]] as const)("UTF-16 %s with the mark: kept", async (_, be) => {
    expect(await storeUpload(v, lib, file(utf16(TEXT, be, true)))).toBeGreaterThan(0);
  });
  test("binary with NULs here and there is still “a binary file”", async () => {
    const e = await storeUpload(v, lib, file(Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0, 0, 1, 2, 3, 0, 5]))).catch((x: Error) => x);
    expect((e as Error).message).toBe("curves.csv looks like a binary file, not CSV text.");
    expect(looksUtf16WithoutBom(Uint8Array.from([0x41, 0]))).toBe(false); // one pair is no evidence
  });
});

test("a 10 000-character name is cut to 120 characters in the refusal", async () => {
  const e = await storeUpload(v, lib, file("", `${"n".repeat(10_000)}.csv`)).catch((x: Error) => x);
  expect((e as Error).message).toBe(`${"n".repeat(117)}… is empty.`);
});
