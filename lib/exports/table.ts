import { InputError } from "@/lib/errors";

/**
 * A sheet to export, independent of the file format: typed columns and rows of cells.
 * Money is carried as integer cents and becomes dollars only in the writer, so totals are exact.
 */
export type ColumnKind = "text" | "integer" | "decimal" | "money" | "date";

export type ExportColumn = {
  header: string;
  kind: ColumnKind;
  /** Column width in characters (XLSX). */
  widthChars: number;
};

/** text → string; integer/decimal → number; money → integer cents; date → Date (a UTC day). */
export type ExportCell = string | number | Date | null;

export type ExportTable = {
  /** Worksheet name (at most 31 characters, no : \ / ? * [ ]). */
  sheetName: string;
  columns: ExportColumn[];
  rows: ExportCell[][];
  /** The totals row under the data, or null for none. */
  totals: ExportCell[] | null;
};

const SHEET_NAME = /^[^:\\/?*[\]]{1,31}$/;

function checkCell(cell: ExportCell, kind: ColumnKind, field: string): void {
  if (cell === null) return;
  switch (kind) {
    case "text":
      if (typeof cell !== "string") throw new InputError(field, `${field} must be text`);
      return;
    case "integer":
    case "money":
      if (typeof cell !== "number" || !Number.isSafeInteger(cell)) {
        throw new InputError(field, `${field} must be a whole number${kind === "money" ? " of cents" : ""}`);
      }
      return;
    case "decimal":
      if (typeof cell !== "number" || !Number.isFinite(cell)) throw new InputError(field, `${field} must be a finite number`);
      return;
    case "date":
      if (!(cell instanceof Date) || Number.isNaN(cell.getTime())) throw new InputError(field, `${field} must be a valid date`);
      return;
  }
}

/** Checks a table's shape and every cell against its column's kind; throws InputError naming the cell. */
export function checkTable(table: ExportTable): ExportTable {
  if (typeof table.sheetName !== "string" || !SHEET_NAME.test(table.sheetName)) {
    throw new InputError("sheetName", "sheetName must be 1–31 characters without : \\ / ? * [ ]");
  }
  if (!Array.isArray(table.columns) || table.columns.length === 0) throw new InputError("columns", "give at least one column");
  table.columns.forEach((c, i) => {
    if (typeof c.header !== "string" || c.header === "") throw new InputError(`columns.${i}.header`, "header must be text");
    if (!Number.isFinite(c.widthChars) || c.widthChars <= 0) throw new InputError(`columns.${i}.widthChars`, "width must be positive");
  });
  const width = table.columns.length;
  const checkRow = (row: ExportCell[], field: string) => {
    if (!Array.isArray(row) || row.length !== width) throw new InputError(field, `${field} must have ${width} cells`);
    row.forEach((cell, c) => checkCell(cell, table.columns[c]!.kind, `${field}.${c}`));
  };
  if (!Array.isArray(table.rows)) throw new InputError("rows", "rows must be a list");
  table.rows.forEach((row, r) => checkRow(row, `rows.${r}`));
  if (table.totals !== null) checkRow(table.totals, "totals");
  return table;
}

/** A calendar day as YYYY-MM-DD (the UTC day the date stands for). */
export function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/** Integer cents as a dollar number (123456 → 1234.56); exact, since cents / 100 prints shortest. */
export function centsToDollars(cents: number): number {
  return cents / 100;
}
