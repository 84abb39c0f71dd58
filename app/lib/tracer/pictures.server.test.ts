// Tracer pictures and traced uploads against the real MariaDB (issue 20): type by magic bytes, size
// limit, checksum kept; the traced CSV becomes an ordinary upload whose import records its source.
import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { libraryRevisions, tracePictures, uploads } from "@db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, UploadRejected, type Viewer } from "~/lib/libraries";
import { makeMember } from "~/test/harness";
import { saveCorrectedUpload } from "~/lib/libraries/upload-fix.server";
import { MAX_PICTURE_BYTES, MAX_TRACED_CSV_BYTES, storePicture, storeTracedCsv, pictureBytes } from "./pictures.server";
import { sniffPicture, TRACE_CAUTION } from "./sniff";
import { chartPdf } from "./test-chart";

let viewer: Viewer;
let lib: number;
beforeAll(async () => {
  const d = await makeMember("distributor");
  viewer = { userId: d.userId, workspace: { id: d.workspaceId, name: "w", slug: "w", plan: "free" }, role: "distributor" };
  lib = await createLibrary(viewer, { name: `trace ${Date.now()}`, description: "" });
});
afterAll(() => closeDb());

const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
const JPEG = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16]);

describe("sniffPicture (magic bytes: ISO 32000-1 §7.5.2, RFC 2083 §3.1, ITU T.81 Annex B)", () => {
  test("PDF, PNG and JPEG by their first bytes; anything else (or too short) is null", () => {
    expect(sniffPicture(chartPdf())).toBe("application/pdf");
    expect(sniffPicture(PNG)).toBe("image/png");
    expect(sniffPicture(JPEG)).toBe("image/jpeg");
    expect(sniffPicture(new TextEncoder().encode("model,flow\n"))).toBeNull();
    expect(sniffPicture(PNG.subarray(0, 7))).toBeNull();
    expect(sniffPicture(new Uint8Array())).toBeNull();
  });
});

describe("storePicture", () => {
  test("keeps the bytes with their SHA-256 and the type found from the bytes, not the name", async () => {
    const bytes = chartPdf();
    const id = await storePicture(viewer, lib, new File([bytes], "sheet.png", { type: "image/png" }));
    const { picture, content } = await pictureBytes(viewer, lib, id);
    expect(picture.contentType).toBe("application/pdf");
    expect(picture.sha256).toBe(createHash("sha256").update(bytes).digest("hex"));
    expect(Buffer.compare(content, Buffer.from(bytes))).toBe(0);
  });

  test("refuses an empty file, a file that is not a picture, and one over the size limit", async () => {
    const before = (await db().select().from(tracePictures).where(eq(tracePictures.libraryId, lib))).length;
    await expect(storePicture(viewer, lib, new File([], "e.pdf"))).rejects.toThrow(/is empty/);
    await expect(storePicture(viewer, lib, new File(["model,flow\n1,2\n"], "fake.pdf", { type: "application/pdf" }))).rejects.toThrow(/not a PDF, PNG or JPEG/);
    const big = new Uint8Array(MAX_PICTURE_BYTES + 1);
    big.set(PNG);
    await expect(storePicture(viewer, lib, new File([big], "big.png"))).rejects.toThrow(UploadRejected);
    const atLimit = new Uint8Array(MAX_PICTURE_BYTES);
    atLimit.set(PNG);
    await expect(storePicture(viewer, lib, new File([atLimit], "limit.png"))).resolves.toBeGreaterThan(0);
    expect((await db().select().from(tracePictures).where(eq(tracePictures.libraryId, lib))).length).toBe(before + 1);
  });
});

describe("storeTracedCsv → the ordinary import", () => {
  const csv = "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m\nTraced 1,,,2900,250,0,52,,,\nTraced 1,,,2900,250,40,47.2,70,,\nTraced 1,,,2900,250,80,32.8,78,,\n";

  test("stores the CSV as an upload with its source; importing it records source and caution in the revision", async () => {
    const pic = await storePicture(viewer, lib, new File([chartPdf()], "datasheet.pdf"));
    const up = await storeTracedCsv(viewer, lib, pic, csv, 3);
    const [row] = await db().select().from(uploads).where(eq(uploads.id, up));
    expect(row.source).toBe("traced from datasheet.pdf, page 3");
    expect(row.tracePictureId).toBe(pic);
    expect(row.filename).toBe("traced-datasheet-p3.csv");
    const { text, lib: l } = await getUpload(viewer, lib, up);
    const r = await importUpload(viewer, lib, up, analyseStored(text, l).mapping, "checked by hand");
    expect(r.curves).toBe(1);
    const [rev] = await db().select().from(libraryRevisions).where(eq(libraryRevisions.id, r.revisionId));
    expect(rev.note).toBe(`traced from datasheet.pdf, page 3. ${TRACE_CAUTION} checked by hand`);
  });

  test("the page's note on the peak it did not trace goes into the source line and the revision's note", async () => {
    const pic = await storePicture(viewer, lib, new File([chartPdf()], "islands.pdf"));
    const note = "peak not traced, efficiency blank inside the innermost contour: 210 mm, 2900 rpm above 78 % at 31.4–59.8 m³/h";
    const up = await storeTracedCsv(viewer, lib, pic, csv, 1, note);
    const [row] = await db().select().from(uploads).where(eq(uploads.id, up));
    expect(row.source).toBe(`traced from islands.pdf, page 1; ${note}`);
    const { text, lib: l } = await getUpload(viewer, lib, up);
    const r = await importUpload(viewer, lib, up, analyseStored(text, l).mapping, "");
    const [rev] = await db().select().from(libraryRevisions).where(eq(libraryRevisions.id, r.revisionId));
    expect(rev.note).toBe(`traced from islands.pdf, page 1; ${note}. ${TRACE_CAUTION}`);
  });

  test("a corrected copy of a traced upload (the mapping page's grid) keeps its source", async () => {
    const pic = await storePicture(viewer, lib, new File([chartPdf()], "fix.pdf"));
    const up = await storeTracedCsv(viewer, lib, pic, csv, 1);
    const fixed = await saveCorrectedUpload(viewer, lib, up, [{ line: 2, index: 6, value: "52.5" }]);
    expect(fixed).not.toBeNull();
    const [row] = await db().select().from(uploads).where(eq(uploads.id, fixed!));
    expect(row.source).toBe("traced from fix.pdf, page 1");
    expect(row.tracePictureId).toBe(pic);
  });

  test("a PNG has no page; an empty or oversized CSV is refused", async () => {
    const pic = await storePicture(viewer, lib, new File([PNG], "scan.png"));
    const up = await storeTracedCsv(viewer, lib, pic, csv, 2);
    const [row] = await db().select().from(uploads).where(eq(uploads.id, up));
    expect(row.source).toBe("traced from scan.png");
    await expect(storeTracedCsv(viewer, lib, pic, "  \n", null)).rejects.toThrow(/Nothing was traced/);
    await expect(storeTracedCsv(viewer, lib, pic, "x".repeat(MAX_TRACED_CSV_BYTES + 1), null)).rejects.toThrow(UploadRejected);
  });
});
