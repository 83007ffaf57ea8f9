import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { IMPORT_FILE_ERROR_STATUS, ImportFileError, parseSpreadsheet, type ImportFileErrorCode } from "@/imports";
import { checkZipExpansion, readZipDirectory } from "@/imports/zip";
import { WORKBOOK_SKELETON, csv, fixture, makeZip, workbookOf } from "./helpers";

async function refusal(buffer: Buffer, options?: Parameters<typeof parseSpreadsheet>[1]): Promise<ImportFileError> {
  const caught = await parseSpreadsheet(buffer, options).then(
    () => null,
    (error: unknown) => error,
  );
  expect(caught).toBeInstanceOf(ImportFileError);
  return caught as ImportFileError;
}

const MB = 1024 * 1024;

describe("parseSpreadsheet refuses what it cannot safely read", () => {
  it("maps each refusal to the HTTP status the API answers with", () => {
    const expected: Record<ImportFileErrorCode, number> = {
      too_large: 413,
      too_expanded: 413,
      unsupported_type: 415,
      too_many_rows: 422,
      corrupt: 422,
      empty: 422,
    };
    expect(IMPORT_FILE_ERROR_STATUS).toEqual(expected);
  });

  it("refuses a PNG renamed .csv, judging by content not name", async () => {
    // PNG signature 89 50 4E 47 0D 0A 1A 0A (PNG specification, ISO/IEC 15948, from memory)
    const error = await refusal(fixture("photo-renamed.csv"), { filename: "photo-renamed.csv" });
    expect(error.code).toBe("unsupported_type");
    expect(error.message).toContain("photo-renamed.csv");
    expect(error.message).toContain("PNG image");
  });

  it("refuses a PDF, an old .xls and other binary data", async () => {
    expect((await refusal(Buffer.from("%PDF-1.7\n1 0 obj\n<<>>\nendobj\n"))).code).toBe("unsupported_type");
    // Compound File Binary signature D0 CF 11 E0 A1 B1 1A E1 ([MS-CFB], from memory)
    const xls = Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), Buffer.alloc(504)]);
    const old = await refusal(xls);
    expect(old.code).toBe("unsupported_type");
    expect(old.message).toContain(".xls");
    expect((await refusal(Buffer.from([0x01, 0x02, 0x00, 0x41, 0x42, 0x03]))).code).toBe("unsupported_type");
  });

  it("refuses a ZIP archive that is not a workbook", async () => {
    const zip = makeZip([{ name: "word/document.xml", data: Buffer.from("<w:document/>") }]);
    const error = await refusal(zip);
    expect(error.code).toBe("unsupported_type");
    expect(error.message).toContain("word-processor");
    expect((await refusal(makeZip([{ name: "photo.jpg", data: Buffer.alloc(10) }]))).code).toBe("unsupported_type");
  });

  it("refuses a truncated workbook as corrupt", async () => {
    const whole = await workbookOf([["Fleet number"], ["RH-014"]]);
    for (const keep of [0.25, 0.5, 0.9, 0.99]) {
      const error = await refusal(whole.subarray(0, Math.floor(whole.length * keep)));
      expect(error.code).toBe("corrupt");
    }
  });

  it("refuses a workbook whose parts are damaged without leaking the library's error", async () => {
    const zip = makeZip([
      ...WORKBOOK_SKELETON,
      { name: "xl/worksheets/sheet1.xml", data: Buffer.from("<worksheet><sheetData><row><c") },
    ]);
    const error = await refusal(zip);
    expect(error.code).toBe("corrupt");
  });

  it("refuses a ZIP bomb whose directory claims a huge size, without inflating it", async () => {
    // Central directory sizes are 32-bit little-endian fields (PKWARE APPNOTE.TXT, from memory)
    const claimed = 4_000_000_000;
    const bomb = makeZip([...WORKBOOK_SKELETON, { name: "xl/worksheets/sheet1.xml", data: Buffer.from("<x/>"), claimUncompressed: claimed }]);
    expect(readZipDirectory(bomb).find((entry) => entry.name === "xl/worksheets/sheet1.xml")?.uncompressedSize).toBe(claimed);
    const error = await refusal(bomb);
    expect(error.code).toBe("too_expanded");
    expect(error.message).toContain("MB");
  });

  it("refuses a real, highly compressible archive by its ratio", async () => {
    // 30 MB of one repeated byte deflates about a thousandfold: under the size cap, over 200×.
    const zeros = Buffer.alloc(30 * MB, 0x20);
    const bomb = makeZip([...WORKBOOK_SKELETON, { name: "xl/sharedStrings.xml", data: zeros }]);
    expect(bomb.length).toBeLessThan(MB);
    const error = await refusal(bomb);
    expect(error.code).toBe("too_expanded");
    expect(error.message).toMatch(/grow \d+ times/);
  });

  it("refuses an archive whose directory lies small about an entry that inflates large", async () => {
    const data = Buffer.alloc(512 * 1024, 0x41);
    const liar = makeZip([...WORKBOOK_SKELETON, { name: "xl/worksheets/sheet1.xml", data, claimUncompressed: 1000 }]);
    // The directory alone looks harmless...
    expect(() => checkZipExpansion(liar)).not.toThrow();
    // ...but inflating past the claimed size is stopped.
    expect((await refusal(liar)).code).toBe("too_expanded");
  });

  it("refuses an archive with absurdly many parts", async () => {
    const parts = Array.from({ length: 2001 }, (_, i) => ({ name: `xl/p${i}.xml`, data: Buffer.from("x"), store: true }));
    expect((await refusal(makeZip([...WORKBOOK_SKELETON, ...parts]))).code).toBe("too_expanded");
  });

  it("refuses a file over the byte limit before reading it", async () => {
    const error = await refusal(csv("Fleet number\n" + "RH-014\n".repeat(200)), { maxBytes: 1000 });
    expect(error.code).toBe("too_large");
    expect(error.message).toContain("1000 bytes");
    // The default limit is 10 MiB.
    expect((await refusal(Buffer.alloc(10 * MB + 1, 0x41))).code).toBe("too_large");
  });

  it("refuses too many rows in a CSV, counting data rows only", async () => {
    const rows = (count: number) => csv("Fleet number,Depot\n\n" + Array.from({ length: count }, (_, i) => `RH-${i},Red Gully\n\n`).join(""));
    await expect(parseSpreadsheet(rows(50), { maxRows: 50 })).resolves.toMatchObject({ rows: expect.any(Array) });
    const error = await refusal(rows(51), { maxRows: 50 });
    expect(error.code).toBe("too_many_rows");
    expect(error.message).toContain("51");
    // Far over the limit, reading stops early.
    expect((await refusal(rows(5000), { maxRows: 50 })).code).toBe("too_many_rows");
  });

  it("refuses too many rows in a workbook", async () => {
    const buffer = await workbookOf([["Fleet number"], ...Array.from({ length: 30 }, (_, i) => [`RH-${i}`])]);
    expect((await parseSpreadsheet(buffer, { maxRows: 30 })).rows).toHaveLength(30);
    expect((await refusal(buffer, { maxRows: 29 })).code).toBe("too_many_rows");
  });

  it("throws only ImportFileError for arbitrary bytes, never a raw library error", async () => {
    await fc.assert(
      fc.asyncProperty(fc.uint8Array({ maxLength: 400 }), fc.boolean(), async (bytes, asZip) => {
        const body = asZip ? Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04]), Buffer.from(bytes)]) : Buffer.from(bytes);
        await parseSpreadsheet(body).then(
          (parsed) => expect(parsed.format).toBe("csv"),
          (error: unknown) => expect(error).toBeInstanceOf(ImportFileError),
        );
      }),
      { numRuns: 300 },
    );
  });

  it("rejects bad limits as input errors", async () => {
    await expect(parseSpreadsheet(csv("a"), { maxRows: 0 })).rejects.toMatchObject({ name: "InputError", field: "maxRows" });
    await expect(parseSpreadsheet(csv("a"), { maxBytes: 1.5 })).rejects.toMatchObject({ name: "InputError", field: "maxBytes" });
  });
});
