// The strict readers of request input: an urlencoded form read as the WHATWG urlencoded parser reads it but refused
// when it is not UTF-8 (readFormSafe), and an API read's query string against the parameters it takes (queryProblem).
// Check values: the URL Standard's application/x-www-form-urlencoded parsing ("+" is a space, a pair without "=" has
// an empty value), RFC 3629 (C3 28 and FF are not UTF-8), RFC 9457 (problem+json) — the standards named.
import { describe, expect, test } from "vitest";
import { readFormSafe } from "./forms.server";
import { queryProblem } from "./api-errors.server";

const post = (body: string, type = "application/x-www-form-urlencoded") => new Request("http://x.test/", { method: "POST", headers: { "content-type": type }, body });
const refusal = async (p: Promise<unknown>) => {
  try {
    await p;
    return null;
  } catch (e) {
    const d = e as { init?: { status?: number }; data?: { errors?: { _form?: string } } };
    return { status: d.init?.status, message: d.data?.errors?._form };
  }
};

describe("readFormSafe, urlencoded", () => {
  test("reads as the URL Standard's parser does: escapes, + as a space, repeats kept in order, a key without =", async () => {
    const f = await readFormSafe(post("name=Caf%C3%A9+No%2B1&a=1&a=2&flag&empty=&=x&%E2%82%AC=%E2%82%AC"));
    expect(f.get("name")).toBe("Café No+1");
    expect(f.getAll("a")).toEqual(["1", "2"]);
    expect(f.get("flag")).toBe("");
    expect(f.get("empty")).toBe("");
    expect(f.get("")).toBe("x");
    expect(f.get("€")).toBe("€");
    expect([...f.keys()]).toEqual([...new URLSearchParams("name=Caf%C3%A9+No%2B1&a=1&a=2&flag&empty=&=x&%E2%82%AC=%E2%82%AC").keys()]);
  });
  test("a typed U+FFFD, sent as its UTF-8 (EF BF BD), is kept", async () => {
    expect((await readFormSafe(post("name=%EF%BF%BD"))).get("name")).toBe("\uFFFD");
  });
  for (const [what, body] of [
    ["a percent escape of a byte that is not UTF-8 (FF)", "name=%FF"],
    ["an escaped sequence that is not UTF-8 (C3 28)", "name=%C3%28"],
    ["a truncated sequence (E2 82)", "name=%E2%82"],
    ["an escape in a key", "%FF=1"],
    ["a broken escape", "name=%zz"],
  ] as const) {
    test(`${what}: 400 with the rule, not U+FFFD in its place`, async () => {
      const r = await refusal(readFormSafe(post(body)));
      expect(r?.status).toBe(400);
      expect(r?.message).toMatch(/not valid UTF-8/);
    });
  }
  test("raw bytes that are not UTF-8: 400", async () => {
    const req = new Request("http://x.test/", { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded; charset=utf-8" }, body: new Uint8Array([0x6e, 0x3d, 0xff, 0xfe]) });
    expect((await refusal(readFormSafe(req)))?.status).toBe(400);
  });
});

describe("readFormSafe, multipart (RFC 7578)", () => {
  const enc = new TextEncoder();
  const join = (chunks: Uint8Array[]) => {
    const out = new Uint8Array(chunks.reduce((n, c) => n + c.byteLength, 0));
    chunks.reduce((at, c) => (out.set(c, at), at + c.byteLength), 0);
    return out;
  };
  /** A multipart body by hand: parts of [headers, content], as bytes; `lead` is written before the first boundary. */
  const multipart = (parts: [Uint8Array, Uint8Array][], lead = "") =>
    new Request("http://x.test/", {
      method: "POST",
      headers: { "content-type": "multipart/form-data; boundary=QQ" },
      body: join([enc.encode(lead), ...parts.flatMap(([h, b]) => [enc.encode("--QQ\r\n"), h, enc.encode("\r\n\r\n"), b, enc.encode("\r\n")]), enc.encode("--QQ--\r\n")]),
    });
  const field = (name: string) => enc.encode(`Content-Disposition: form-data; name="${name}"`);
  test("text fields and files read as the platform reads them (a browser's own FormData body)", async () => {
    const fd = new FormData();
    fd.append("name", "Café €");
    fd.append("file", new File([new Uint8Array([0xff, 0xfe, 0x00, 0x41])], "curve.csv", { type: "text/csv" }));
    const f = await readFormSafe(new Request("http://x.test/", { method: "POST", body: fd }));
    expect(f.get("name")).toBe("Café €");
    expect([...new Uint8Array(await (f.get("file") as File).arrayBuffer())]).toEqual([0xff, 0xfe, 0x00, 0x41]); // a file's bytes are its own, never judged as text
  });
  test("a typed U+FFFD (EF BF BD) in a text field is kept; CRLF before the first boundary is allowed", async () => {
    expect((await readFormSafe(multipart([[field("name"), new Uint8Array([0xef, 0xbf, 0xbd])]], "\r\n"))).get("name")).toBe("\uFFFD");
  });
  for (const [what, parts] of [
    ["a text field's bytes that are not UTF-8 (FF FE C3 28)", [[field("a"), enc.encode("ok")], [field("name"), new Uint8Array([0xff, 0xfe, 0xc3, 0x28])]]],
    ["a truncated sequence (E2 82) at a field's end", [[field("name"), new Uint8Array([0x41, 0xe2, 0x82])]]],
    ["a field name that is not UTF-8 (FF)", [[join([field("n"), new Uint8Array([0xff])]), enc.encode("1")]]],
  ] as [string, [Uint8Array, Uint8Array][]][]) {
    test(`${what}: 400 with the rule, not U+FFFD in its place`, async () => {
      const r = await refusal(readFormSafe(multipart(parts)));
      expect(r?.status).toBe(400);
      expect(r?.message).toMatch(/not valid UTF-8/);
    });
  }
  test("a body that is not multipart at all: 400, not a 500", async () => {
    const r = await refusal(readFormSafe(new Request("http://x.test/", { method: "POST", headers: { "content-type": "multipart/form-data; boundary=QQ" }, body: "no parts here" })));
    expect(r?.status).toBe(400);
  });
});

describe("queryProblem", () => {
  const detail = async (r: Response | null) => (r ? { status: r.status, type: r.headers.get("content-type"), detail: ((await r.json()) as { detail: string }).detail } : null);
  test("the parameters a read takes pass, a many-valued one any number of times", async () => {
    expect(queryProblem("http://x.test/a?page=2&revision=3", { one: ["page", "revision"] })).toBeNull();
    expect(queryProblem("http://x.test/a?method=direct&method=trim&page=1", { one: ["page"], many: ["method"] })).toBeNull();
    expect(queryProblem("http://x.test/a")).toBeNull();
  });
  test("a parameter it does not take: 400 problem+json naming it and what it takes", async () => {
    expect(await detail(queryProblem("http://x.test/a?units=us", { one: ["page"] }))).toEqual({
      status: 400,
      type: "application/problem+json",
      detail: 'Unknown query parameter "units": this address takes page. Answers are in SI units (see /api).',
    });
    expect((await detail(queryProblem("http://x.test/a?x=1")))?.detail).toBe('Unknown query parameter "x": this address takes no query parameters. Answers are in SI units (see /api).');
    expect((await detail(queryProblem("http://x.test/a?Page=1", { one: ["page"] })))?.status).toBe(400); // keys as written
  });
  test("the cache-buster _ is taken by every read, any number of times, and ignored (common practice: clients append ?_=<time>)", async () => {
    expect(queryProblem("http://x.test/a?_=1733230000000", { one: ["page"] })).toBeNull();
    expect(queryProblem("http://x.test/a?_=1&_=2")).toBeNull();
    expect((await detail(queryProblem("http://x.test/a?__=1")))?.status).toBe(400); // only "_" itself
  });
  test("a single-valued parameter twice: 400, even with the same value", async () => {
    expect((await detail(queryProblem("http://x.test/a?page=1&page=1", { one: ["page"] })))?.detail).toBe('The query parameter "page" is given more than once: give it once.');
  });
});
