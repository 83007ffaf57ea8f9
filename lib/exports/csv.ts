import { toCsv, type CellValue, type CsvColumn } from "@/lib/spreadsheet";
import { centsToDollars, checkTable, isoDay, type ColumnKind, type ExportCell, type ExportTable } from "./table";

function csvValue(cell: ExportCell, kind: ColumnKind): CellValue {
  if (cell === null) return null;
  if (kind === "money") return centsToDollars(cell as number);
  // A day, not an instant: YYYY-MM-DD opens as a date in every spreadsheet program.
  if (kind === "date") return isoDay(cell as Date);
  return cell;
}

/**
 * The table as CSV: header row, data rows, then the totals row; RFC 4180 quoting and every text
 * cell neutralised against formula injection by lib/spreadsheet. Amounts are numbers in dollars
 * (negative credits stay numbers, never escaped text); a UTF-8 byte order mark leads the file so
 * spreadsheet programs read names with accents correctly.
 */
export function tableToCsv(table: ExportTable): string {
  checkTable(table);
  const columns: CsvColumn<ExportCell[]>[] = table.columns.map((column, index) => ({
    header: column.header,
    value: (row) => csvValue(row[index] ?? null, column.kind),
  }));
  const rows = table.totals ? [...table.rows, table.totals] : table.rows;
  return toCsv(rows, columns, { bom: true });
}
