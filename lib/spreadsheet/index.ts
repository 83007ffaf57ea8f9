export { neutraliseCell, neutraliseValue, type CellValue } from "./neutralise";
export { toCsv, UTF8_BOM, type CsvColumn, type CsvOptions } from "./csv";
