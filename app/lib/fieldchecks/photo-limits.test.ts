// The photo limits a check is held to, one source for the phone (before a check is queued) and the server:
// at most 6 photos, 8 MiB each, and together no more than the body the sync route takes (body-limits.mjs,
// 12 MiB) less the room kept for the form's fields and the multipart framing (512 KiB).
import { describe, expect, test } from "vitest";
import { bodyLimitFor } from "../shared/body-limits.mjs";
import { FORM_ROOM_BYTES, MAX_CHECK_PHOTO_BYTES, MAX_PHOTO_BYTES, MAX_PHOTOS, photoLimitsText, photoProblem } from "./photo-limits";

const MiB = 1024 * 1024;

describe("photo limits", () => {
  test("the limits are the server's: 8 MiB each, the sync and form routes' 12 MiB body less 512 KiB for the fields", () => {
    expect(MAX_PHOTO_BYTES).toBe(8 * MiB);
    expect(MAX_PHOTOS).toBe(6);
    expect(FORM_ROOM_BYTES).toBe(MiB / 2);
    // The same table app/serve.mjs counts bodies against: both ways a check is posted.
    expect(MAX_CHECK_PHOTO_BYTES).toBe(bodyLimitFor("/field/selections/7/checks") - FORM_ROOM_BYTES);
    expect(MAX_CHECK_PHOTO_BYTES).toBe(bodyLimitFor("/field/selections/7/photos") - FORM_ROOM_BYTES);
    expect(photoLimitsText()).toBe("up to 6 photos, 8 MB each, 11.5 MB in one check");
  });

  test("each photo's size, the total and the count are checked, each refusal with its numbers", () => {
    const f = (name: string, size: number) => ({ name, size });
    expect(photoProblem([])).toBeNull();
    expect(photoProblem([f("a.jpg", 8 * MiB)])).toBeNull(); // at the limit is allowed
    expect(photoProblem([f("a.jpg", 8 * MiB + 1)])).toBe("a.jpg is 8.000001 MB; each photo may be at most 8 MB.") // 1 byte over reads apart from the limit;
    expect(photoProblem([f("a.jpg", 9.5 * MiB)])).toBe("a.jpg is 9.5 MB; each photo may be at most 8 MB.");
    // Two photos of 6 MiB each pass one by one but not together: 12.0 MB > 11.5 MB.
    expect(photoProblem([f("a.jpg", 6 * MiB), f("b.jpg", 6 * MiB)])).toBe("The photos come to 12.0 MB together; one check may carry at most 11.5 MB. Leave some out or send smaller ones.");
    expect(photoProblem([f("a.jpg", 6 * MiB), f("b.jpg", 5.5 * MiB)])).toBeNull(); // exactly 11.5 MiB
    expect(photoProblem(Array.from({ length: 7 }, (_, i) => f(`p${i}.jpg`, 1000)))).toBe("At most 6 photos per check (7 chosen).");
    expect(photoProblem([f("p.jpg", 1000)], 6)).toBe("At most 6 photos per check (1 chosen, 6 carried from the earlier version).");
  });

});
