export {
  COST_CATEGORIES,
  COST_KINDS,
  COST_SOURCES,
  CATEGORY_LABELS,
  KIND_LABELS,
  SOURCE_LABELS,
  type CostCategory,
  type CostKind,
  type CostSource,
} from "./labels";
export { checkTable, isoDay, centsToDollars, type ColumnKind, type ExportCell, type ExportColumn, type ExportTable } from "./table";
export { LEDGER_COLUMNS, ledgerRow, ledgerTable, ledgerTotals, type LedgerEntry, type LedgerTotals } from "./ledger";
export { VARIANCE_COLUMNS, VARIANCE_STATUS_LABELS, varianceRow, varianceTable, type VarianceExportVehicle } from "./variance";
export { tableToCsv } from "./csv";
export { tableToXlsx, XLSX_CONTENT_TYPE } from "./xlsx";
