import { describe, expect, it } from "vitest";
import { ImportFileError, parseSpreadsheet } from "@/imports";
import { csv, fixture } from "./helpers";

// Row numbers: each CSV record is one row, numbered from 1 as a spreadsheet program shows it
// (a quoted line break stays inside its cell; blank rows keep their number).

describe("parseSpreadsheet: CSV", () => {
  it("strips the UTF-8 byte order mark, reads CRLF and detects the semicolon", async () => {
    // U+FEFF as a leading byte order mark is not data (Unicode Standard, from memory)
    const parsed = await parseSpreadsheet(fixture("bom-semicolon-crlf.csv"));
    expect(parsed.format).toBe("csv");
    expect(parsed.delimiter).toBe(";");
    expect(parsed.headers).toEqual(["Fleet number", "Depot", "Odometer (km)"]);
    expect(parsed.headerRowIndex).toBe(0);
    expect(parsed.headerRowNumber).toBe(1);
    expect(parsed.rows).toEqual([
      { rowNumber: 2, cells: { "Fleet number": "RH-014", Depot: "Mulga Creek", "Odometer (km)": "12 345" } },
      { rowNumber: 3, cells: { "Fleet number": "RH-015", Depot: "Gibber Flat", "Odometer (km)": "8,020" } },
    ]);
  });

  it("detects the tab delimiter with LF line ends", async () => {
    const parsed = await parseSpreadsheet(fixture("tab-lf.csv"));
    expect(parsed.delimiter).toBe("\t");
    expect(parsed.headers).toEqual(["Unit", "Rego", "Odo (km)"]);
    expect(parsed.rows.map((row) => row.cells["Rego"])).toEqual(["QX 11 RL", "QX 12 RL"]);
  });

  it("keeps quoted commas, quoted line breaks and doubled quotes inside their cells", async () => {
    // Quoted fields may hold delimiters, line breaks and "" for a quote (RFC 4180, from memory)
    const parsed = await parseSpreadsheet(fixture("quoted-commas-line-breaks.csv"));
    expect(parsed.delimiter).toBe(",");
    expect(parsed.rows).toEqual([
      { rowNumber: 2, cells: { "Fleet #": "RH-014", Depot: "Mulga Creek, East Yard", Notes: "Bull bar fitted,\nwinch to follow" } },
      // The record with the line break is one row, so the next record is row 3.
      { rowNumber: 3, cells: { "Fleet #": "RH-015", Depot: "Gibber Flat", Notes: 'He said "check the tyres"' } },
    ]);
  });

  it("drops blank and trailing rows but keeps the file's row numbers", async () => {
    const parsed = await parseSpreadsheet(fixture("blank-and-trailing-rows.csv"));
    expect(parsed.rows.map((row) => [row.rowNumber, row.cells["Fleet number"]])).toEqual([
      [3, "RH-014"],
      [6, "RH-015"],
    ]);
  });

  it("skips title rows above the header and numbers rows as the file does", async () => {
    const parsed = await parseSpreadsheet(fixture("title-row.csv"));
    expect(parsed.headerRowIndex).toBe(2);
    expect(parsed.headerRowNumber).toBe(3);
    expect(parsed.headers).toEqual(["Fleet No", "Registration", "Status"]);
    expect(parsed.rows).toEqual([{ rowNumber: 4, cells: { "Fleet No": "RH-014", Registration: "QX 11 RL", Status: "in service" } }]);
  });

  it("reads a file that is not UTF-8 as Windows-1252", async () => {
    // 0xE9 is é in Windows-1252 (WHATWG Encoding Standard, from memory)
    const parsed = await parseSpreadsheet(fixture("windows-1252.csv"));
    expect(parsed.rows[0]?.cells["Depot"]).toBe("Mélody Flat");
  });

  it("reads UTF-16 text with its byte order mark", async () => {
    const parsed = await parseSpreadsheet(fixture("utf16-tab.csv"));
    expect(parsed.delimiter).toBe("\t");
    expect(parsed.rows).toEqual([{ rowNumber: 2, cells: { "Fleet number": "RH-014", Depot: "Mulga Creek" } }]);
  });

  it("names unnamed columns that hold data by letter, drops empty ones, and makes repeated headings unique", async () => {
    const parsed = await parseSpreadsheet(csv("Fleet number,,Notes,Notes,,\nRH-014,x,a,b,,\nRH-015,,c,,,\n"));
    expect(parsed.headers).toEqual(["Fleet number", "Column B", "Notes", "Notes (2)"]);
    expect(parsed.rows[0]?.cells).toEqual({ "Fleet number": "RH-014", "Column B": "x", Notes: "a", "Notes (2)": "b" });
    expect(parsed.rows[1]?.cells).toEqual({ "Fleet number": "RH-015", "Column B": null, Notes: "c", "Notes (2)": null });
  });

  it("turns blank cells into null and keeps other text as written", async () => {
    const parsed = await parseSpreadsheet(csv("Fleet number,Depot,Registration\n RH-014 ,   ,QX 11 RL\n"));
    expect(parsed.rows[0]?.cells).toEqual({ "Fleet number": " RH-014 ", Depot: null, Registration: "QX 11 RL" });
  });

  it("keeps a heading called __proto__ as an ordinary column", async () => {
    const parsed = await parseSpreadsheet(csv("Fleet number,__proto__\nRH-014,x\n"));
    expect(parsed.headers).toEqual(["Fleet number", "__proto__"]);
    expect(Object.hasOwn(parsed.rows[0]!.cells, "__proto__")).toBe(true);
    expect(parsed.rows[0]!.cells["__proto__"]).toBe("x");
  });

  it("refuses a quoted cell that is never closed, naming the row", async () => {
    const error = await parseSpreadsheet(fixture("unterminated-quote.csv")).catch((caught: unknown) => caught);
    expect(error).toBeInstanceOf(ImportFileError);
    expect((error as ImportFileError).code).toBe("corrupt");
    expect((error as ImportFileError).message).toContain("Row 3");
  });

  it("refuses an empty file and a file of blank lines", async () => {
    await expect(parseSpreadsheet(Buffer.alloc(0))).rejects.toMatchObject({ code: "empty" });
    await expect(parseSpreadsheet(csv("\n\n ,\n"))).rejects.toMatchObject({ code: "empty" });
  });

  it("accepts a header with no data rows", async () => {
    const parsed = await parseSpreadsheet(csv("Fleet number,VIN\n"));
    expect(parsed.headers).toEqual(["Fleet number", "VIN"]);
    expect(parsed.rows).toEqual([]);
  });
});
