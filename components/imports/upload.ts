/**
 * Sends an import file to POST /api/vehicles/import with XMLHttpRequest, which (unlike fetch)
 * reports upload progress. No React here.
 */
import type { ImportResult } from "@/lib/commands/imports";

export type ImportErrorDetail = { field?: string; row?: number; column?: string; message: string };

/** A refused import in the API's one error shape (status 0: the server was not reached). */
export class ImportRequestError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: ImportErrorDetail[];

  constructor(status: number, code: string, message: string, details: ImportErrorDetail[] = []) {
    super(message);
    this.name = "ImportRequestError";
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function importErrorFrom(status: number, body: unknown): ImportRequestError {
  const error = (body as { error?: { code?: unknown; message?: unknown; details?: unknown } } | null)?.error;
  if (error && typeof error.code === "string" && typeof error.message === "string") {
    const details = Array.isArray(error.details)
      ? error.details.filter((d): d is ImportErrorDetail => typeof d === "object" && d !== null && typeof (d as ImportErrorDetail).message === "string")
      : [];
    return new ImportRequestError(status, error.code, error.message, details);
  }
  if (status === 401) return new ImportRequestError(status, "unauthenticated", "Your session has ended. Sign in again, then upload the file again.");
  if (status === 413) return new ImportRequestError(status, "payload_too_large", "The file is larger than the import limit.");
  return new ImportRequestError(status, "internal", "The import could not be done. Nothing was changed; try again.");
}

export type ImportRequest = {
  file: File;
  dryRun: boolean;
  mapping?: Record<string, string | null>;
  mode?: "all_or_nothing" | "good_rows";
};

export type UploadHandle = { promise: Promise<ImportResult>; abort: () => void };

/** Starts the upload; `onProgress` gets the share sent so far (0–1), then 1 when all bytes are out. */
export function sendImport(request: ImportRequest, onProgress: (fraction: number) => void): UploadHandle {
  const xhr = new XMLHttpRequest();
  const body = new FormData();
  body.set("file", request.file, request.file.name);
  if (request.dryRun) body.set("dryRun", "1");
  if (request.mapping) body.set("mapping", JSON.stringify(request.mapping));
  if (request.mode) body.set("mode", request.mode);

  const promise = new Promise<ImportResult>((resolve, reject) => {
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(Math.min(1, event.loaded / event.total));
    };
    xhr.upload.onload = () => onProgress(1);
    xhr.onload = () => {
      let parsed: unknown = null;
      try {
        parsed = JSON.parse(xhr.responseText);
      } catch {
        parsed = null;
      }
      if (xhr.status >= 200 && xhr.status < 300 && parsed) resolve(parsed as ImportResult);
      else reject(importErrorFrom(xhr.status, parsed));
    };
    xhr.onerror = () => reject(new ImportRequestError(0, "network", "The server could not be reached. Check the connection and try again; nothing was changed."));
    xhr.onabort = () => reject(new ImportRequestError(0, "aborted", "The upload was stopped. Nothing was changed."));
    xhr.open("POST", "/api/vehicles/import");
    xhr.setRequestHeader("accept", "application/json");
    xhr.send(body);
  });
  return { promise, abort: () => xhr.abort() };
}
