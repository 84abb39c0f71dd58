// JSON read strictly, pure: `JSON.parse` and then a refusal of a key twice in one object. RFC 8259 §4 says names "SHOULD
// be unique" and leaves duplicates to the implementation: `JSON.parse` keeps the last silently (ECMA-262 JSON.parse), so
// {"flow":1,"flow":2} was read as flow 2 while another reader of the same text (a proxy, a log, the sender's own check)
// may read 1 (the "JSON interoperability" problem; I-JSON, RFC 7493 §2.3, MUST NOT have duplicate names). A reviver cannot
// see them (it gets the object already merged), so the text is scanned once more after the parse succeeded — the
// text is then known to be JSON, and the scan only has to find strings in key position, decode them (escapes
// included: "a" and "\u0061" are the same name) and keep one set of names per open object. No recursion: a body 10 000
// levels deep is scanned like a flat one.

/** `problem` is worded to follow "the body": "is not valid JSON (…)", "has the name "flow" twice in …". */
export type StrictJson = { ok: true; value: unknown } | { ok: false; problem: string };

/** `text` parsed as JSON; a syntax error or a name twice in one object is a `problem` (the name, and the object as a JSON Pointer). */
export function parseStrictJson(text: string): StrictJson {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (e) {
    return { ok: false, problem: `is not valid JSON (${(e as Error).message.slice(0, 120)})` };
  }
  const twice = duplicateName(text);
  if (twice) return { ok: false, problem: `has the name ${JSON.stringify(twice.name).slice(0, 120)} twice in ${twice.at ? `the object at ${twice.at.slice(0, 200)} (a JSON Pointer)` : "its top object"}: give each name once` };
  return { ok: true, value };
}

type Open = { names: Set<string> | null; key: string | number };

/**
 * The first name found twice in one object of `text`, which must be valid JSON (JSON.parse accepted it), with the JSON
 * Pointer (RFC 6901) of that object; null when every object's names are distinct.
 */
export function duplicateName(text: string): { name: string; at: string } | null {
  const stack: Open[] = [];
  let keyNext = false;
  const pointer = () =>
    stack
      .slice(0, -1)
      .map((o) => "/" + String(o.key).replaceAll("~", "~0").replaceAll("/", "~1"))
      .join("");
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x7b /* { */) {
      stack.push({ names: new Set(), key: "" });
      keyNext = true;
    } else if (c === 0x5b /* [ */) {
      stack.push({ names: null, key: 0 });
    } else if (c === 0x7d /* } */ || c === 0x5d /* ] */) {
      stack.pop();
      keyNext = false;
    } else if (c === 0x2c /* , */) {
      const top = stack.at(-1);
      if (top?.names) keyNext = true;
      else if (top) top.key = (top.key as number) + 1;
    } else if (c === 0x22 /* " */) {
      let j = i + 1;
      let escaped = false;
      for (; j < text.length; j++) {
        const d = text.charCodeAt(j);
        if (d === 0x5c /* \ */) {
          j++; // the escaped character, a quote included
          escaped = true;
        } else if (d === 0x22) break;
      }
      if (keyNext) {
        const top = stack[stack.length - 1];
        const name = escaped ? (JSON.parse(text.slice(i, j + 1)) as string) : text.slice(i + 1, j);
        if (top.names!.has(name)) return { name, at: pointer() };
        top.names!.add(name);
        top.key = name;
        keyNext = false;
      }
      i = j;
    }
  }
  return null;
}
