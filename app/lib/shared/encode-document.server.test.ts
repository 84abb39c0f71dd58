// The document encoder: what Accept-Encoding asks for (RFC 9110 §12.5.3: q-values, "*", q=0 refuses)
// and that the bytes decode back to the page.
import { brotliDecompressSync, gunzipSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { encodeDocument, ENCODE_MIN_BYTES, ENCODE_SYNC_MAX_BYTES } from "./encode-document.server";

const page = Buffer.from(`<!DOCTYPE html><html><body>${"<p>duty point 40 m³/h at 35 m</p>".repeat(200)}</body></html>`);

describe("encodeDocument", () => {
  it.each([
    ["gzip, deflate, br", "br"], // a browser's header: brotli first (same preference as the middleware)
    ["gzip, deflate", "gzip"], // Node's fetch
    ["br;q=0.5, gzip", "gzip"], // source: RFC 9110 §12.5.3, the higher q-value wins
    ["gzip;q=0, br;q=0", null], // source: RFC 9110 §12.5.3, q=0 means "not acceptable"
    ["*", "br"], // source: RFC 9110 §12.5.3, "*" matches any coding
    ["identity", null],
    ["", null], // no preference stated: sent as it is
    [null, null],
    ["compress, x-unknown", null], // codings we do not offer
  ])("Accept-Encoding %j → %s", async (header, expected) => {
    const out = await encodeDocument(header, page);
    expect(out.encoding).toBe(expected);
    const back = out.encoding === "br" ? brotliDecompressSync(out.body) : out.encoding === "gzip" ? gunzipSync(out.body) : out.body;
    expect(back.equals(page)).toBe(true);
    if (out.encoding) expect(out.body.length).toBeLessThan(page.length / 5); // a repetitive page shrinks a lot (common practice)
  });

  it("leaves a document under the threshold as it is, and compresses one at the threshold", async () => {
    const small = page.subarray(0, ENCODE_MIN_BYTES - 1);
    expect(await encodeDocument("gzip", small)).toEqual({ body: small, encoding: null });
    expect((await encodeDocument("gzip", page.subarray(0, ENCODE_MIN_BYTES))).encoding).toBe("gzip");
  });

  it("a document past the inline limit is compressed too (on the thread pool), to the same bytes", async () => {
    const big = Buffer.from(`<!DOCTYPE html><html><body>${Array.from({ length: 9000 }, (_, i) => `<tr><td>${i}</td><td>${(i * 0.37).toFixed(3)}</td></tr>`).join("")}</body></html>`);
    expect(big.length).toBeGreaterThan(ENCODE_SYNC_MAX_BYTES);
    for (const [header, decode] of [["gzip", gunzipSync], ["br", brotliDecompressSync]] as const) {
      const out = await encodeDocument(header, big);
      expect(out.encoding).toBe(header);
      expect(decode(out.body).equals(big)).toBe(true);
    }
  });
});
