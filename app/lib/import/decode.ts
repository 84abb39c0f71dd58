/**
 * Bytes → text for vendor CSVs. Pure (TextDecoder is in browsers and Node alike).
 *
 * - UTF-16 LE/BE: only with their BOM (FF FE / FE FF).
 * - UTF-8 with or without BOM when the bytes are valid UTF-8.
 * - Otherwise Windows-1252 (a superset of Latin-1's printable range, as WHATWG decodes "latin1"):
 *   a UTF-8 BOM in front of 1252 bytes (an editor that added a BOM to an old export) is dropped
 *   first, so the header does not start with "ï»¿".
 * The user may choose another encoding on the mapping page (decodeBytes(bytes, chosen)).
 */
export const ENCODINGS = ["utf-8", "utf-16le", "utf-16be", "windows-1252"] as const;
export type Encoding = (typeof ENCODINGS)[number];
/** The encoding named by a value from a form, a query or saved JSON, if it is one we decode. */
export const encodingNamed = (x: unknown): Encoding | undefined => (typeof x === "string" && (ENCODINGS as readonly string[]).includes(x) ? (x as Encoding) : undefined);

export interface Decoded {
  text: string;
  encoding: Encoding;
  /** A byte-order mark was found (and removed). */
  bom: boolean;
  /** How the encoding was settled, for the mapping page. */
  how: "bom" | "valid-utf-8" | "fallback" | "chosen";
}

export const ENCODING_LABEL: Record<Encoding, string> = {
  "utf-8": "UTF-8",
  "utf-16le": "UTF-16 LE",
  "utf-16be": "UTF-16 BE",
  "windows-1252": "Windows-1252 (Latin-1)",
};

function bomOf(b: Uint8Array): { encoding: Encoding; length: number } | null {
  if (b.length >= 3 && b[0] === 0xef && b[1] === 0xbb && b[2] === 0xbf) return { encoding: "utf-8", length: 3 };
  if (b.length >= 2 && b[0] === 0xff && b[1] === 0xfe) return { encoding: "utf-16le", length: 2 };
  if (b.length >= 2 && b[0] === 0xfe && b[1] === 0xff) return { encoding: "utf-16be", length: 2 };
  return null;
}

const decode = (enc: Encoding, bytes: Uint8Array, fatal = false) => new TextDecoder(enc, { fatal, ignoreBOM: true }).decode(bytes);

export function decodeBytes(bytes: Uint8Array, chosen?: Encoding): Decoded {
  const bom = bomOf(bytes);
  if (chosen) {
    const skip = bom && (bom.encoding === chosen || (bom.encoding === "utf-8" && chosen === "windows-1252")) ? bom.length : 0;
    return { text: decode(chosen, bytes.subarray(skip)), encoding: chosen, bom: skip > 0, how: "chosen" };
  }
  if (bom && bom.encoding !== "utf-8") return { text: decode(bom.encoding, bytes.subarray(bom.length)), encoding: bom.encoding, bom: true, how: "bom" };
  const rest = bom ? bytes.subarray(bom.length) : bytes;
  try {
    return { text: decode("utf-8", rest, true), encoding: "utf-8", bom: Boolean(bom), how: bom ? "bom" : "valid-utf-8" };
  } catch {
    return { text: decode("windows-1252", rest), encoding: "windows-1252", bom: Boolean(bom), how: "fallback" };
  }
}

/**
 * True when bytes without a byte-order mark look like UTF-16 text (LE or BE): of the first 8 KiB's byte pairs, at least 90 %
 * hold a NUL in one place (the high byte of a Latin character) and none in the other. Such a file is refused as binary
 * (its NULs), and the refusal says how to save it instead.
 */
export function looksUtf16WithoutBom(bytes: Uint8Array): boolean {
  if (bomOf(bytes)) return false;
  const n = Math.min(bytes.length, 8192) >> 1;
  if (n < 2) return false;
  let even = 0;
  let odd = 0;
  for (let i = 0; i < n; i++) {
    if (bytes[2 * i] === 0) even++;
    if (bytes[2 * i + 1] === 0) odd++;
  }
  return (odd >= 0.9 * n && even === 0) || (even >= 0.9 * n && odd === 0);
}

/** True when the bytes look binary (NUL bytes) and are not UTF-16 with a BOM. */
export function looksBinary(bytes: Uint8Array): boolean {
  const b = bomOf(bytes);
  if (b && b.encoding !== "utf-8") return false;
  return bytes.subarray(0, Math.min(bytes.length, 8192)).includes(0);
}
