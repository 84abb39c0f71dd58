// The device time of a field check read and judged (pure): what the form takes, the words shown, the flags.
import { describe, expect, test } from "vitest";
import { CLOCK_SLACK_S, checkTimes, readTakenAt, spanText } from "./taken-at";

describe("the time the readings were taken", () => {
  test("the form's takenAt: none, an ISO UTC time, or refused", () => {
    expect(readTakenAt(undefined)).toEqual({ ok: true, takenAt: null });
    expect(readTakenAt("")).toEqual({ ok: true, takenAt: null });
    expect(readTakenAt("2026-12-03T09:14:05.120Z")).toEqual({ ok: true, takenAt: new Date(Date.UTC(2026, 11, 3, 9, 14, 5, 120)) });
    expect(readTakenAt("2026-12-03T09:14:05Z")).toMatchObject({ ok: true });
    for (const bad of ["yesterday", "2026-12-03 09:14", "2026-12-03T09:14:05+01:00", "2026-13-01T00:00:00Z", "2026-04-31T00:00:00Z", "0999-01-01T00:00:00Z"])
      expect(readTakenAt(bad), bad).toMatchObject({ ok: false });
  });

  test("spans in words", () => {
    expect(spanText(599_400)).toBe("9 min 59 s");
    expect(spanText(3 * 3_600_000)).toBe("3 h 0 min");
    expect(spanText(-(2 * 86_400_000 + 4 * 3_600_000))).toBe("2 d 4 h");
  });

  test("said as 'taken … (device clock) · recorded …', or 'recorded …' alone", () => {
    const made = "2026-12-01T08:00:00.000Z";
    expect(checkTimes(null, "2026-12-03T09:52:10.000Z", made)).toEqual({ takenAt: null, recordedAt: "2026-12-03T09:52:10.000Z", text: "recorded 2026-12-03 09:52 UTC", warnings: [] });
    expect(checkTimes("2026-12-03T09:14:05.120Z", new Date("2026-12-03T09:52:10.000Z"), made)).toEqual({
      takenAt: "2026-12-03T09:14:05.120Z",
      recordedAt: "2026-12-03T09:52:10.000Z",
      text: "taken 2026-12-03 09:14 UTC (device clock) · recorded 2026-12-03 09:52 UTC",
      warnings: [],
    });
  });

  test("flagged: more than the slack after the server's time, or before the selection was made", () => {
    const made = "2026-12-01T08:00:00.000Z";
    const rec = Date.parse("2026-12-03T09:52:10.000Z");
    expect(CLOCK_SLACK_S).toBe(60);
    expect(checkTimes(new Date(rec + 60_000), new Date(rec), made).warnings).toEqual([]); // at the slack: not flagged
    const ahead = checkTimes(new Date(rec + 61_000), new Date(rec), made).warnings;
    expect(ahead).toEqual([
      "The device clock read 2026-12-03 09:53:11 UTC when the readings were taken, 1 min 1 s after the server recorded the check at 2026-12-03 09:52:10 UTC " +
        "(more than the 60 s allowed for clocks that differ): the phone's clock was wrong, so the time taken is not reliable.",
    ]);
    const early = checkTimes("2026-11-30T08:00:00.000Z", new Date(rec), made).warnings;
    expect(early).toHaveLength(1);
    expect(early[0]).toMatch(/^The device clock read 2026-11-30 08:00:00 UTC when the readings were taken, 1 d 0 h before the selection was made \(2026-12-01 08:00:00 UTC\): readings cannot predate/);
  });
});
