import Papa from "papaparse";
import { InputError } from "@/lib/errors";
import { neutraliseCell, neutraliseValue, type CellValue } from "./neutralise";

export type CsvColumn<Row> =
  | { header: string; key: keyof Row & string }
  | { header: string; value: (row: Row) => CellValue };

export interface CsvOptions {
  /** Start with a UTF-8 byte order mark so spreadsheet programs read accents and symbols right. */
  bom?: boolean;
}

export const UTF8_BOM = "\uFEFF";

function cellOf<Row>(row: Row, column: CsvColumn<Row>): CellValue {
  if ("value" in column) return column.value(row);
  return (row as Record<string, unknown>)[column.key] as CellValue;
}

function csvCell(value: CellValue, field: string): string | number | boolean {
  const safe = neutraliseValue(value, field);
  if (safe === null) return "";
  // An ISO date-time starts with a digit, so it needs no neutralising.
  if (safe instanceof Date) return safe.toISOString();
  return safe;
}

/**
 * Rows as CSV (RFC 4180: fields with commas, quotes or line breaks are quoted, quotes doubled;
 * CRLF between records), every text cell and header neutralised against formula injection.
 */
export function toCsv<Row>(rows: readonly Row[], columns: readonly CsvColumn<Row>[], options: CsvOptions = {}): string {
  if (!Array.isArray(columns as unknown) || columns.length === 0) {
    throw new InputError("columns", "give at least one column");
  }
  if (!Array.isArray(rows as unknown)) throw new InputError("rows", "rows must be a list");
  const fields = columns.map((column, index) => {
    if (typeof column.header !== "string") throw new InputError(`columns.${index}.header`, "header must be text");
    return neutraliseCell(column.header);
  });
  const data = rows.map((row, rowIndex) =>
    columns.map((column, columnIndex) =>
      csvCell(cellOf(row, column), `rows.${rowIndex}.${"key" in column ? column.key : columnIndex}`),
    ),
  );
  const written = Papa.unparse(
    { fields, data },
    { newline: "\r\n", quotes: false, quoteChar: '"', escapeChar: '"', delimiter: ",", escapeFormulae: false },
  );
  // With no rows papaparse ends the header with a line break; keep the header-only file like the rest.
  const csv = data.length === 0 && written.endsWith("\r\n") ? written.slice(0, -2) : written;
  return options.bom === true ? UTF8_BOM + csv : csv;
}
