// When a field check's readings were taken: the phone's clock at the moment the check was kept on it (`takenAt`,
// sent by the queue), beside the moment the server recorded it (`created_at`, its own clock). A queued check may be
// sent hours later, so the record, the e-mail and the history speak of both, and order by the time taken. The phone's
// clock is not trusted blindly: a time after the server's, or before the selection existed, is flagged. Pure.
import { fmtUtc } from "../shared/format";

/** How far the phone's clock may read past the server's before it is flagged: phones and servers keep network time to within seconds (common practice). */
export const CLOCK_SLACK_S = 60;

/** The device time as the queue sends it (`Date.prototype.toISOString`, UTC with milliseconds). */
const ISO_UTC = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2})(\.\d{1,3})?Z$/;

/** The form's `takenAt`: absent or blank is none (the page's own form); anything but an ISO time from year 1000 on is refused. */
export function readTakenAt(raw: string | null | undefined): { ok: true; takenAt: Date | null } | { ok: false; message: string } {
  if (raw == null || raw === "") return { ok: true, takenAt: null };
  const m = ISO_UTC.exec(raw);
  const at = m ? new Date(raw) : null;
  // A date the calendar does not have (month 13, 31 April) comes back different from what was sent.
  if (!m || !at || Number.isNaN(at.getTime()) || at.toISOString().slice(0, 19) !== raw.slice(0, 19) || Number(m[1]) < 1000)
    return { ok: false, message: `The time the readings were taken, as the phone sent it (“${raw.slice(0, 40)}”), is not a time (expected e.g. 2026-12-03T09:14:05.120Z).` };
  return { ok: true, takenAt: at };
}

/** A span of time in words, e.g. "9 min 59 s", "3 h 0 min", "2 d 4 h". */
export function spanText(ms: number): string {
  const s = Math.floor(Math.abs(ms) / 1000);
  if (s < 3600) return `${Math.floor(s / 60)} min ${s % 60} s`;
  if (s < 86_400) return `${Math.floor(s / 3600)} h ${Math.floor((s % 3600) / 60)} min`;
  return `${Math.floor(s / 86_400)} d ${Math.floor((s % 86_400) / 3600)} h`;
}

export type CheckTimes = {
  /** The phone's clock when the readings were taken (ISO), or null for a check without it. */
  takenAt: string | null;
  /** The server's clock when it recorded the check (ISO). */
  recordedAt: string;
  /** "taken 2026-12-03 09:14 UTC (device clock) · recorded 2026-12-03 09:52 UTC", or "recorded …" alone. */
  text: string;
  /** Why the device time cannot be right, each with its rule and numbers; empty when nothing is wrong with it. */
  warnings: string[];
};

type When = Date | string;
const iso = (w: When) => (w instanceof Date ? w : new Date(w)).toISOString();

/** The times of one check, said and judged against the server's clock and the selection's creation. */
export function checkTimes(takenAt: When | null, recordedAt: When, selectionCreatedAt: When): CheckTimes {
  const recorded = iso(recordedAt);
  if (takenAt == null) return { takenAt: null, recordedAt: recorded, text: `recorded ${fmtUtc(recorded)}`, warnings: [] };
  const taken = iso(takenAt);
  const warnings: string[] = [];
  const ahead = Date.parse(taken) - Date.parse(recorded);
  if (ahead > CLOCK_SLACK_S * 1000)
    warnings.push(
      `The device clock read ${fmtUtc(taken, { seconds: true })} when the readings were taken, ${spanText(ahead)} after the server recorded the check at ` +
        `${fmtUtc(recorded, { seconds: true })} (more than the ${CLOCK_SLACK_S} s allowed for clocks that differ): the phone's clock was wrong, so the time taken is not reliable.`,
    );
  const made = iso(selectionCreatedAt);
  const early = Date.parse(made) - Date.parse(taken);
  if (early > 0)
    warnings.push(
      `The device clock read ${fmtUtc(taken, { seconds: true })} when the readings were taken, ${spanText(early)} before the selection was made (${fmtUtc(made, { seconds: true })}): ` +
        "readings cannot predate the selection they are checked against, so the phone's clock was wrong (or the readings belong to another selection).",
    );
  return { takenAt: taken, recordedAt: recorded, text: `taken ${fmtUtc(taken)} (device clock) · recorded ${fmtUtc(recorded)}`, warnings };
}
