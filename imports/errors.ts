/**
 * Why an uploaded file was refused before any row was read. The API maps each code to an HTTP
 * status with `importFileErrorStatus` so every route answers the same way.
 */
export type ImportFileErrorCode =
  | "too_large"
  | "too_many_rows"
  | "unsupported_type"
  | "corrupt"
  | "too_expanded"
  | "empty";

/** HTTP status for each refusal: 413 for size, 415 for type, 422 for content. */
export const IMPORT_FILE_ERROR_STATUS: Readonly<Record<ImportFileErrorCode, number>> = {
  too_large: 413,
  too_expanded: 413,
  unsupported_type: 415,
  too_many_rows: 422,
  corrupt: 422,
  empty: 422,
};

/** The one typed error `parseSpreadsheet` throws; `message` is plain words for the uploader. */
export class ImportFileError extends Error {
  readonly code: ImportFileErrorCode;

  constructor(code: ImportFileErrorCode, message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = "ImportFileError";
    this.code = code;
  }
}

export function importFileErrorStatus(code: ImportFileErrorCode): number {
  return IMPORT_FILE_ERROR_STATUS[code];
}
