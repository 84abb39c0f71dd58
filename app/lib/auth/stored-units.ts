// A user's stored unit settings read honestly: the preset (`users.unit_system`) and the per-quantity picks (`users.units`,
// JSON text) checked against what the account form writes (routes/account.tsx: SI or US, and for some of the quantities
// it lists, one of that quantity's unit ids). A unit setting is a preference, not data: a part that cannot be read is set
// aside — the preset's units are shown (SI when the preset itself cannot be read) — and the account page says so, where
// and what is stored (`unitsNotice`), as the stored documents do (projects/stored-doc.ts). Saving the form writes sound
// settings in their place. Read on every signed-in request (the session's user, session.server.ts). Pure.
import * as v from "valibot";
import { UNITS, type Quantity } from "~/engine";
import { MAX_PROBLEMS_LISTED, problemsSummary, readStoredDoc, type DocProblem, type DocWords } from "../projects/stored-doc";
import { isPreset, PRESET_IDS, PRESETS, QUANTITY_NAMES, SETTABLE, type PresetId, type UnitChoice } from "../shared/units";

const nameOf = (q: Quantity) => QUANTITY_NAMES[q].toLowerCase();
const NOT_A_GROUP = "Should be a group of unit settings, a unit per quantity, as the account page saves them.";

/** What the account form writes in `users.units`: for some of the quantities it lists (`SETTABLE`), one of that quantity's unit ids; nothing else. */
export const StoredUnitPicksSchema = v.pipe(
  v.custom<Record<string, unknown>>((x) => !!x && typeof x === "object" && !Array.isArray(x), NOT_A_GROUP),
  v.strictObject(
    Object.fromEntries(
      SETTABLE.map((q) => [q, v.optional(v.picklist(UNITS[q].map((d) => d.id), `Should be one of the units of ${nameOf(q)}: ${UNITS[q].map((d) => d.label).join(", ")}.`))]),
    ) as Record<Quantity, v.OptionalSchema<v.PicklistSchema<string[], string>, undefined>>,
    (issue) => (issue.expected === "never" ? "Is not a quantity whose unit the account page sets." : NOT_A_GROUP),
  ),
);

const WORDS: DocWords = {
  whole: "the stored unit settings",
  labels: Object.fromEntries(SETTABLE.map((q) => [q, `unit of ${nameOf(q)}`])),
  items: {},
  quantities: {},
};

/** The settings as read: the units every page uses, the preset and picks the account form shows, and what could not be read. */
export type StoredUnits = { units: UnitChoice; preset: PresetId; picks: Partial<Record<Quantity, string>>; problems: DocProblem[] };

/** The stored preset and picks (JSON text, as stored), each part that cannot be read set aside with its problems. */
export function readStoredUnits(unitSystem: unknown, unitsJson: string): StoredUnits {
  const problems: DocProblem[] = [];
  const presetOk = isPreset(unitSystem);
  if (!presetOk) {
    const stored = typeof unitSystem === "string" ? JSON.stringify(unitSystem) : unitSystem == null ? "empty (null)" : String(unitSystem);
    problems.push({ keys: ["unitSystem"], path: "unitSystem", label: "unit preset", message: `Should be ${PRESET_IDS.join(" or ")}.`, stored });
  }
  const preset: PresetId = presetOk ? unitSystem : "SI";
  const doc = readStoredDoc(unitsJson, StoredUnitPicksSchema, WORDS);
  if (!doc.ok) problems.push(...doc.problems);
  // Any part unreadable: the defaults everywhere (the preset as read, no picks), as the notice says, until the form is saved.
  const picks = doc.ok && !problems.length ? (doc.value as Partial<Record<Quantity, string>>) : {};
  return { units: { ...PRESETS[preset], ...picks }, preset, picks, problems };
}

/** What the account page says of settings that cannot be read (null when they can): the places, then the first problems of `count` (StoredProblems). */
export function unitsNotice(s: Pick<StoredUnits, "preset" | "problems">): { text: string; problems: Pick<DocProblem, "label" | "message" | "stored">[]; count: number } | null {
  if (!s.problems.length) return null;
  return {
    text:
      `The unit settings stored with your account cannot be read (${problemsSummary(s.problems)}), so the defaults are shown — ` +
      `the ${s.preset} preset's units on every page — until you save your profile below.`,
    problems: s.problems.slice(0, MAX_PROBLEMS_LISTED).map(({ label, message, stored }) => ({ label, message, stored })),
    count: s.problems.length,
  };
}
