export { renderStatementPdf, StatementDocument, kg as statementKg } from "./render";
export type { StatementData, StatementRow } from "./types";
