// The server holds a check's photos to the limits the phone checks before queueing (photo-limits.ts): each
// at most 8 MiB, and together at most the sync route's 12 MiB body less 512 KiB kept for the form's fields.
import { describe, expect, test } from "vitest";
import { PhotoRejected, readPhotos } from "./photos.server";

const MiB = 1024 * 1024;
const JPEG = Buffer.from([0xff, 0xd8, 0xff, 0xe0]); // a JPEG's first bytes (JFIF marker)
const photo = (name: string, bytes: number) => new File([JPEG, Buffer.alloc(bytes - JPEG.length)], name, { type: "image/jpeg" });

describe("photos as uploaded", () => {
  test("two photos of 6 MiB pass one by one but not together (12.0 MB > 11.5 MB): refused with both numbers", async () => {
    const both = readPhotos([photo("a.jpg", 6 * MiB), photo("b.jpg", 6 * MiB)]);
    await expect(both).rejects.toBeInstanceOf(PhotoRejected);
    await expect(both).rejects.toThrow("The photos come to 12.0 MB together; one check may carry at most 11.5 MB. Leave some out or send smaller ones.");
    expect(await readPhotos([photo("a.jpg", 6 * MiB), photo("b.jpg", 5.5 * MiB)])).toHaveLength(2); // 11.5 MiB exactly
  });
});
