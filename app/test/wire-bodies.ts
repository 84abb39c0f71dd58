// Test helpers (tests only): request bodies built byte by byte for the route-attack and server-hardening tests —
// a multipart/form-data body with the boundary "QQ", and a POST sent in 64 KB chunks that stops at the first answer.
import http from "node:http";

/** A multipart/form-data body, boundary "QQ": each part [name, value, file name (a text/csv file part)?]. */
export function multipart(parts: [string, string | Uint8Array, string?][]): Uint8Array<ArrayBuffer> {
  const enc = new TextEncoder();
  const chunks = parts.flatMap(([k, v, file]) => [enc.encode(`--QQ\r\nContent-Disposition: form-data; name="${k}"${file ? `; filename="${file}"\r\nContent-Type: text/csv` : ""}\r\n\r\n`), typeof v === "string" ? enc.encode(v) : v, enc.encode("\r\n")]);
  chunks.push(enc.encode("--QQ--\r\n"));
  const out = new Uint8Array(chunks.reduce((n, c) => n + c.byteLength, 0));
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

export type WireAnswer = { status: number; type: string; body: string; sent: number };

/**
 * Sends `total` bytes of `fill` to 127.0.0.1:`port` in 64 KB chunks — Transfer-Encoding: chunked unless the headers
 * declare a Content-Length — stopping at the first answer. The answer's body, or its Location where it has none;
 * a request error before any answer rejects with the bytes sent so far (`sent` on the error).
 */
export function chunkedPost(port: number, pathname: string, total: number, headers: Record<string, string>, fill = "1"): Promise<WireAnswer> {
  return new Promise((resolve, reject) => {
    let sent = 0;
    let answered = false;
    const req = http.request({ host: "127.0.0.1", port, path: pathname, method: "POST", agent: false, headers }, (res) => {
      answered = true;
      let body = "";
      res.on("data", (b) => (body += b));
      const done = () => resolve({ status: res.statusCode ?? 0, type: String(res.headers["content-type"] ?? ""), body: body || String(res.headers.location ?? ""), sent });
      res.on("end", done);
      res.on("error", done);
    });
    req.on("error", (e) => (answered ? undefined : reject(Object.assign(e, { sent }))));
    const chunk = Buffer.alloc(64 * 1024, fill);
    const pump = () => {
      while (!answered && sent < total) {
        const piece = chunk.subarray(0, Math.min(chunk.length, total - sent));
        sent += piece.length;
        if (!req.write(piece)) return void req.once("drain", pump);
      }
      if (!answered) req.end();
    };
    pump();
  });
}
