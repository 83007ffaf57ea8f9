import ExcelJS from "exceljs";
import { neutraliseCell, neutraliseValue } from "@/lib/spreadsheet";
import { centsToDollars, checkTable, type ColumnKind, type ExportCell, type ExportTable } from "./table";

export const XLSX_CONTENT_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

const NUMBER_FORMATS: Record<ColumnKind, string | undefined> = {
  text: "@",
  integer: "0",
  decimal: "#,##0.0##",
  money: "#,##0.00",
  date: "yyyy-mm-dd",
};

function xlsxValue(cell: ExportCell, kind: ColumnKind): ExcelJS.CellValue {
  if (cell === null) return null;
  if (kind === "money") return centsToDollars(cell as number);
  // Text is neutralised like the CSV (OWASP CSV Injection), so a copy pasted or saved as CSV stays safe.
  return neutraliseValue(cell) as ExcelJS.CellValue;
}

/**
 * The table as an XLSX workbook: one sheet with a bold header row frozen at the top and
 * filterable, widths per column, real number and date cells with their formats, and a bold
 * totals row written as values (no formulas in the file at all).
 */
export async function tableToXlsx(table: ExportTable, options: { created?: Date } = {}): Promise<Buffer> {
  checkTable(table);
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "Rigline";
  workbook.created = options.created ?? new Date();
  const sheet = workbook.addWorksheet(table.sheetName, { views: [{ state: "frozen", ySplit: 1 }] });
  sheet.columns = table.columns.map((column) => ({
    header: neutraliseCell(column.header),
    width: column.widthChars,
    style: { numFmt: NUMBER_FORMATS[column.kind] },
  }));
  const header = sheet.getRow(1);
  header.font = { bold: true };
  header.alignment = { vertical: "bottom", wrapText: true };
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: table.columns.length } };

  const kinds = table.columns.map((c) => c.kind);
  for (const row of table.rows) {
    sheet.addRow(row.map((cell, i) => xlsxValue(cell, kinds[i]!)));
  }
  if (table.totals) {
    const totals = sheet.addRow(table.totals.map((cell, i) => xlsxValue(cell, kinds[i]!)));
    totals.font = { bold: true };
    totals.border = { top: { style: "thin" } } as Partial<ExcelJS.Borders>;
  }
  const written = await workbook.xlsx.writeBuffer();
  return Buffer.from(written as ArrayBuffer);
}
