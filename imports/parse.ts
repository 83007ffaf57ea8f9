import ExcelJS from "exceljs";
import Papa from "papaparse";
import { InputError } from "@/lib/errors";
import { decodeText, detectFormat, type SpreadsheetFormat } from "./detect";
import { ImportFileError } from "./errors";
import { isKnownHeader } from "./headers";
import { putOwn } from "./own";
import { checkZipExpansion, verifyZipEntrySizes, type ZipEntry } from "./zip";

/** What a cell holds once read: text, a number, a date (from a date-formatted cell) or nothing. */
export type CellValue = string | number | Date | null;

export interface ParsedRow {
  /** The row number a spreadsheet program shows for this row (1-based, title rows counted). */
  rowNumber: number;
  /** Every heading of the sheet, null where the cell is empty. */
  cells: Record<string, CellValue>;
}

export interface ParsedSpreadsheet {
  format: SpreadsheetFormat;
  /** 0-based index of the header row among all the file's rows (title and blank rows counted). */
  headerRowIndex: number;
  /** The header row's number as a spreadsheet program shows it: headerRowIndex + 1. */
  headerRowNumber: number;
  /** Column headings, trimmed and unique, in file order. */
  headers: string[];
  /** Data rows below the header, blank rows left out. */
  rows: ParsedRow[];
  /** CSV only: the delimiter found. */
  delimiter?: "," | ";" | "\t";
  /** XLSX only: the worksheet read. */
  sheetName?: string;
  /** True when the workbook counts dates from 1904 (affects raw date serial numbers). */
  date1904: boolean;
}

export interface ParseOptions {
  /** Used only to name the file in messages; the format is read from the content. */
  filename?: string;
  /** Largest accepted upload; default 10 MiB. */
  maxBytes?: number;
  /** Most data rows accepted (header, title and blank rows not counted); default 20,000. */
  maxRows?: number;
}

export const DEFAULT_MAX_BYTES = 10 * 1024 * 1024;
export const DEFAULT_MAX_ROWS = 20_000;
/** The header is looked for among this many non-blank rows at the top of the sheet. */
const HEADER_SEARCH_ROWS = 20;

interface GridRow {
  rowNumber: number;
  values: CellValue[];
}

interface Grid {
  rows: GridRow[];
  /** True when reading stopped because there were certainly too many rows. */
  overflowed: boolean;
  delimiter?: Delimiter;
  sheetName?: string;
  date1904: boolean;
}

/**
 * Reads a vehicle register upload (CSV or XLSX, told apart by content) into headings and rows.
 * Throws ImportFileError for files it refuses and InputError for bad options; nothing thrown by
 * the CSV or workbook libraries escapes raw.
 */
export async function parseSpreadsheet(input: Buffer | Uint8Array, options: ParseOptions = {}): Promise<ParsedSpreadsheet> {
  const maxBytes = positiveInteger("maxBytes", options.maxBytes ?? DEFAULT_MAX_BYTES);
  const maxRows = positiveInteger("maxRows", options.maxRows ?? DEFAULT_MAX_ROWS);
  if (!(input instanceof Uint8Array)) throw new InputError("buffer", "The upload must be a Buffer");
  const buffer = Buffer.isBuffer(input) ? input : Buffer.from(input.buffer, input.byteOffset, input.byteLength);
  try {
    if (buffer.length === 0) throw new ImportFileError("empty", "The file is empty.");
    if (buffer.length > maxBytes) {
      throw new ImportFileError("too_large", `The file is ${describeBytes(buffer.length)}; the limit is ${describeBytes(maxBytes)}.`);
    }
    const format = detectFormat(buffer);
    const grid = format === "csv" ? readCsv(buffer, maxRows) : await readXlsx(buffer, maxRows);
    return shapeSheet(format, grid, maxRows);
  } catch (error) {
    if (error instanceof ImportFileError) {
      if (options.filename === undefined || options.filename === "") throw error;
      throw new ImportFileError(error.code, `${options.filename}: ${error.message}`, { cause: error });
    }
    throw new ImportFileError("corrupt", "The file could not be read as a spreadsheet.", { cause: error });
  }
}

function positiveInteger(field: string, value: number): number {
  if (!Number.isInteger(value) || value <= 0) throw new InputError(field, `${field} must be a whole number above zero`);
  return value;
}

function describeBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toLocaleString("en-AU", { maximumFractionDigits: 1 })} MB`;
  if (bytes >= 1024) return `${(bytes / 1024).toLocaleString("en-AU", { maximumFractionDigits: 1 })} KB`;
  return `${bytes} bytes`;
}

function tooManyRows(maxRows: number, found?: number): ImportFileError {
  const limit = maxRows.toLocaleString("en-AU");
  const count = found === undefined ? `more than ${limit}` : found.toLocaleString("en-AU");
  return new ImportFileError(
    "too_many_rows",
    `The file has ${count} vehicle rows; at most ${limit} can be imported at once. Split it into smaller files.`,
  );
}

// ---------------------------------------------------------------------------------------------
// CSV

type Delimiter = "," | ";" | "\t";
const DELIMITERS: readonly Delimiter[] = [",", ";", "\t"];

/**
 * The delimiter that splits the first rows most consistently into two or more cells; on a tie,
 * the one giving more cells (a semicolon file may hold commas inside its values).
 */
export function detectDelimiter(text: string): Delimiter {
  const sampleLength = 64 * 1024;
  const sample = text.slice(0, sampleLength);
  let best: { delimiter: Delimiter; consistency: number; fields: number } = { delimiter: ",", consistency: 0, fields: 0 };
  for (const delimiter of DELIMITERS) {
    const { data } = Papa.parse<string[]>(sample, { delimiter, preview: 50, skipEmptyLines: "greedy" });
    // The last record of a cut sample may be incomplete.
    const rows = text.length > sampleLength && data.length > 1 ? data.slice(0, -1) : data;
    if (rows.length === 0) continue;
    const counts = new Map<number, number>();
    for (const row of rows) counts.set(row.length, (counts.get(row.length) ?? 0) + 1);
    let fields = 0;
    let often = 0;
    for (const [count, times] of counts) {
      if (times > often || (times === often && count > fields)) {
        fields = count;
        often = times;
      }
    }
    if (fields < 2) continue;
    const consistency = often / rows.length;
    if (consistency > best.consistency || (consistency === best.consistency && fields > best.fields)) {
      best = { delimiter, consistency, fields };
    }
  }
  return best.delimiter;
}

function readCsv(buffer: Buffer, maxRows: number): Grid {
  const text = decodeText(buffer);
  const delimiter = detectDelimiter(text);
  const rows: GridRow[] = [];
  let recordIndex = 0;
  let nonBlank = 0;
  let overflowed = false;
  let unterminatedAt: number | null = null;
  // Each CSV record is one row in a spreadsheet program (a quoted line break stays inside its
  // cell), so the row number is the record's position, blank records included.
  Papa.parse<string[]>(text, {
    delimiter,
    skipEmptyLines: false,
    header: false,
    dynamicTyping: false,
    step: (step, parser) => {
      recordIndex++;
      if (step.errors.some((error) => error.code === "MissingQuotes")) unterminatedAt = recordIndex;
      const values = step.data.map((cell): CellValue => (cell.trim() === "" ? null : cell));
      if (values.every((value) => value === null)) return;
      nonBlank++;
      if (nonBlank > maxRows + HEADER_SEARCH_ROWS) {
        overflowed = true;
        parser.abort();
        return;
      }
      rows.push({ rowNumber: recordIndex, values });
    },
  });
  if (unterminatedAt !== null) {
    throw new ImportFileError("corrupt", `Row ${unterminatedAt} opens a quoted cell that is never closed, so the rest of the file cannot be read.`);
  }
  return { rows, overflowed, delimiter, date1904: false };
}

// ---------------------------------------------------------------------------------------------
// XLSX

function findEntry(entries: readonly ZipEntry[], name: string): boolean {
  const wanted = name.toLowerCase();
  return entries.some((entry) => entry.name.toLowerCase() === wanted);
}

/** A ZIP that is not a workbook is refused by what it is, before any library opens it. */
function requireWorkbook(entries: readonly ZipEntry[]): void {
  if (findEntry(entries, "xl/workbook.xml")) return;
  const notSpreadsheet = (what: string) =>
    new ImportFileError("unsupported_type", `This file is ${what}. Upload a CSV file or an Excel workbook (.xlsx).`);
  if (findEntry(entries, "xl/workbook.bin")) throw notSpreadsheet("a binary workbook (.xlsb); save it as .xlsx or CSV");
  if (findEntry(entries, "content.xml") && findEntry(entries, "mimetype")) {
    throw notSpreadsheet("an OpenDocument file; save it as .xlsx or CSV");
  }
  if (findEntry(entries, "word/document.xml")) throw notSpreadsheet("a word-processor document, not a spreadsheet");
  if (findEntry(entries, "ppt/presentation.xml")) throw notSpreadsheet("a presentation, not a spreadsheet");
  throw notSpreadsheet("a ZIP archive, not a spreadsheet");
}

async function readXlsx(buffer: Buffer, maxRows: number): Promise<Grid> {
  const entries = checkZipExpansion(buffer);
  requireWorkbook(entries);
  verifyZipEntrySizes(buffer, entries);

  const workbook = new ExcelJS.Workbook();
  try {
    // exceljs types its input as its own ArrayBuffer-like interface; a Node Buffer is what it reads.
    await workbook.xlsx.load(buffer as unknown as ArrayBuffer);
  } catch (error) {
    throw new ImportFileError("corrupt", "The workbook is damaged and cannot be opened. Save it again from your spreadsheet program and retry.", {
      cause: error,
    });
  }
  const sheets = workbook.worksheets;
  const sheet = sheets.find((candidate) => candidate.state === "visible" || candidate.state === undefined) ?? sheets[0];
  if (sheet === undefined) throw new ImportFileError("empty", "The workbook has no worksheet.");

  const rows: GridRow[] = [];
  let overflowed = false;
  let nonBlank = 0;
  try {
    sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
      if (overflowed) return;
      const values: CellValue[] = [];
      row.eachCell({ includeEmpty: false }, (cell, columnNumber) => {
        values[columnNumber - 1] = fromWorkbookCell(cell.value);
      });
      for (let i = 0; i < values.length; i++) values[i] ??= null;
      if (values.every((value) => value === null)) return;
      nonBlank++;
      if (nonBlank > maxRows + HEADER_SEARCH_ROWS) {
        overflowed = true;
        return;
      }
      rows.push({ rowNumber, values });
    });
  } catch (error) {
    throw new ImportFileError("corrupt", "The worksheet could not be read.", { cause: error });
  }
  return { rows, overflowed, sheetName: sheet.name, date1904: workbook.properties?.date1904 === true };
}

/** Flattens a workbook cell: formulas give their cached result, rich text its plain text. */
export function fromWorkbookCell(value: ExcelJS.CellValue): CellValue {
  if (value === null || value === undefined) return null;
  if (typeof value === "number") return Number.isFinite(value) ? value : null;
  if (typeof value === "string") return value.trim() === "" ? null : value;
  if (typeof value === "boolean") return value ? "TRUE" : "FALSE";
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? null : value;
  if (typeof value !== "object") return null;
  if ("richText" in value && Array.isArray(value.richText)) {
    return fromWorkbookCell(value.richText.map((run) => run.text ?? "").join(""));
  }
  if ("formula" in value || "sharedFormula" in value) {
    const result = (value as { result?: ExcelJS.CellValue }).result;
    return fromWorkbookCell(result ?? null);
  }
  if ("error" in value && typeof value.error === "string") return value.error;
  if ("hyperlink" in value) {
    const text = (value as { text?: unknown }).text;
    if (typeof text === "string") return fromWorkbookCell(text);
    if (text !== null && typeof text === "object") return fromWorkbookCell(text as ExcelJS.CellValue);
    return fromWorkbookCell(value.hyperlink);
  }
  return null;
}

// ---------------------------------------------------------------------------------------------
// Shared: header row, headings, rows

function headerText(value: CellValue): string {
  if (value === null) return "";
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  return String(value).replace(/\s+/g, " ").trim();
}

/**
 * The header is the first row where most filled cells are headings we know (a title row above
 * it has none). Failing that, the row with the most known headings; failing that, the first row.
 */
function locateHeader(rows: readonly GridRow[]): number {
  const candidates = rows.slice(0, HEADER_SEARCH_ROWS);
  let best = -1;
  let bestKnown = 1;
  for (let i = 0; i < candidates.length; i++) {
    const filled = candidates[i]!.values.filter((value) => value !== null);
    const known = filled.filter((value) => typeof value === "string" && isKnownHeader(value)).length;
    if (known >= 2 && known * 2 > filled.length) return i;
    if (known > bestKnown) {
      best = i;
      bestKnown = known;
    }
  }
  return best >= 0 ? best : 0;
}

function columnLetters(index: number): string {
  let n = index + 1;
  let letters = "";
  while (n > 0) {
    const rem = (n - 1) % 26;
    letters = String.fromCharCode(65 + rem) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

function shapeSheet(format: SpreadsheetFormat, grid: Grid, maxRows: number): ParsedSpreadsheet {
  if (grid.overflowed) throw tooManyRows(maxRows);
  if (grid.rows.length === 0) throw new ImportFileError("empty", "The file has no rows.");
  const headerAt = locateHeader(grid.rows);
  const headerRow = grid.rows[headerAt]!;
  const dataRows = grid.rows.slice(headerAt + 1);
  if (dataRows.length > maxRows) throw tooManyRows(maxRows, dataRows.length);

  const width = dataRows.reduce((widest, row) => Math.max(widest, row.values.length), headerRow.values.length);
  const columns: { index: number; header: string }[] = [];
  const used = new Set<string>();
  for (let index = 0; index < width; index++) {
    let header = headerText(headerRow.values[index] ?? null);
    if (header === "") {
      // An unnamed column is kept only when it holds something, named by its letter.
      if (!dataRows.some((row) => (row.values[index] ?? null) !== null)) continue;
      header = `Column ${columnLetters(index)}`;
    }
    let unique = header;
    for (let n = 2; used.has(unique.toLowerCase()); n++) unique = `${header} (${n})`;
    used.add(unique.toLowerCase());
    columns.push({ index, header: unique });
  }

  const rows: ParsedRow[] = [];
  for (const row of dataRows) {
    const cells: Record<string, CellValue> = {};
    let filled = false;
    for (const column of columns) {
      const value = row.values[column.index] ?? null;
      if (value !== null) filled = true;
      putOwn(cells, column.header, value);
    }
    if (filled) rows.push({ rowNumber: row.rowNumber, cells });
  }

  const sheet: ParsedSpreadsheet = {
    format,
    headerRowIndex: headerRow.rowNumber - 1,
    headerRowNumber: headerRow.rowNumber,
    headers: columns.map((column) => column.header),
    rows,
    date1904: grid.date1904,
  };
  if (grid.delimiter !== undefined) sheet.delimiter = grid.delimiter;
  if (grid.sheetName !== undefined) sheet.sheetName = grid.sheetName;
  return sheet;
}
