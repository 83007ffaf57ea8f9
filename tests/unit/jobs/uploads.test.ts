import { describe, expect, it } from "vitest";
import { acceptAttribute, acceptedTypesInWords, checkUploadSize, checkUploadType, displayFileName, downloadName, EVIDENCE_MAX_BYTES, evidenceStorageKey } from "@/lib/uploads";

describe("upload size", () => {
  it("refuses a file over the limit with 413 and an empty one with 422", () => {
    expect(checkUploadSize(EVIDENCE_MAX_BYTES)).toBeNull();
    expect(checkUploadSize(EVIDENCE_MAX_BYTES + 1)).toMatchObject({ ok: false, status: 413, code: "too_large" });
    expect(checkUploadSize(0)).toMatchObject({ status: 422, code: "empty" });
    expect(() => checkUploadSize(Number.NaN)).toThrow(RangeError);
  });
});

describe("upload type by content", () => {
  it("accepts only images for photos, PDFs or images for documents", () => {
    expect(checkUploadType("image/jpeg", "photo")).toEqual({ ok: true, type: "image/jpeg", isImage: true });
    expect(checkUploadType("application/pdf", "photo")).toMatchObject({ ok: false, status: 415 });
    expect(checkUploadType("application/pdf", "weighbridge_ticket")).toEqual({ ok: true, type: "application/pdf", isImage: false });
  });

  it("refuses content that is not recognised, whatever the name", () => {
    const result = checkUploadType(undefined, "photo");
    expect(result).toMatchObject({ ok: false, status: 415, code: "unsupported_type" });
    if (!result.ok) expect(result.message).toContain("whatever its name says");
  });
});

describe("file names", () => {
  it("keeps only the last part of a path-like name, without control characters", () => {
    expect(displayFileName("../../etc/passwd")).toBe("passwd");
    expect(displayFileName("C:\\Users\\x\\..\\photo.jpg")).toBe("photo.jpg");
    expect(displayFileName("..")).toBe("upload");
    expect(displayFileName("a\u0000b\nc.pdf")).toBe("abc.pdf");
    expect(displayFileName("")).toBe("upload");
  });

  it("names the download by the stored content's type", () => {
    expect(downloadName("front bar.png.exe", "jpg")).toBe("front bar.png.jpg");
  });

  it("builds storage keys from generated ids only", () => {
    expect(evidenceStorageKey("0f1e2d3c-aaaa", "1234-abcd", "jpg")).toBe("evidence/0f1e2d3c-aaaa/1234-abcd.jpg");
    expect(() => evidenceStorageKey("org", "../../x", "jpg")).toThrow(RangeError);
    expect(() => evidenceStorageKey("org", "id", "j/pg")).toThrow(RangeError);
  });
});

describe("what each kind of upload accepts, as the file inputs and messages say it", () => {
  it("photos take images only; tickets, certificates and sign-offs a PDF too", () => {
    expect(acceptedTypesInWords("photo")).toBe("a JPEG photo, PNG image or WebP image");
    expect(acceptedTypesInWords("weighbridge_ticket")).toBe("a PDF, JPEG photo, PNG image or WebP image");
    expect(acceptAttribute("photo")).toBe("image/jpeg,image/png,image/webp,.jpg,.jpeg,.png,.webp");
    expect(acceptAttribute("weighbridge_ticket")).toBe("application/pdf,image/jpeg,image/png,image/webp,.pdf,.jpg,.jpeg,.png,.webp");
  });
});
