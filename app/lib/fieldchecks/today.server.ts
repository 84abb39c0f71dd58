// Today's verdict on the checks of a list, cheap on a long one: each check's readings are worked out with today's engine
// (judged-today.ts `ruledToday`, about 0.7 ms a check) once per process and kept (promise-cache.ts, least recently used out
// first), keyed by all that decides the verdict — the frozen document, the grade and the stored readings as stored — so a
// record or document that changed is never answered from an old key, and a new build (new rules) starts empty.
import { createHash } from "node:crypto";
import { promiseCache } from "../shared/promise-cache";
import type { FrozenSelection } from "./frozen-curve";
import type { Readings } from "./form";
import { ruledToday } from "./judged-today";
import type { RuledVerdict } from "./listed-verdict";

/** A selection's frozen document as the lists judge against it: the document and a digest of it as stored. */
export type FrozenForToday = { key: string; doc: FrozenSelection };

/**
 * The frozen document with its key (a SHA-256 of its JSON as stored).
 * @param frozenJson the selection's frozen document as stored
 * @param doc the same document, read
 */
export function frozenForToday(frozenJson: string, doc: FrozenSelection): FrozenForToday {
  return { key: createHash("sha256").update(frozenJson).digest("base64url"), doc };
}

const kept = promiseCache<string, { today: RuledVerdict | null }>({ max: 20_000 });

/**
 * Today's verdict with its rule and numbers on one recorded check, or null where today's rules cannot judge it (or no
 * frozen document reads).
 * @param frozen the selection's frozen document with its key, or null where it does not read
 * @param readingsJson the check's readings as stored (the key)
 * @param grade the grade the check was recorded under
 * @param readings its readings read against their schema (called only when not kept), or null where they fail it
 */
export async function ruledTodayKept(frozen: FrozenForToday | null, readingsJson: string, grade: string, readings: () => Readings | null): Promise<RuledVerdict | null> {
  if (!frozen) return null;
  const key = createHash("sha256").update(frozen.key).update("\n").update(grade).update("\n").update(readingsJson).digest("base64url");
  return (
    await kept.get(key, async () => {
      const r = readings();
      return { today: r ? ruledToday(frozen.doc, r, grade) : null };
    })
  ).today;
}
