import { z } from "zod";
import { InputError } from "@/lib/errors";

/** The codes of the one API error shape: {"error":{"code","message","details"}}. */
export const ERROR_STATUS = {
  bad_request: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unsupported_media_type: 415,
  validation_failed: 422,
  rate_limited: 429,
  internal: 500,
} as const;
export type ErrorCode = keyof typeof ERROR_STATUS;

export type ErrorDetail = { field?: string; row?: number; column?: string; message: string };

export type ErrorBody = { error: { code: ErrorCode; message: string; details: ErrorDetail[] } };

/** An expected failure with a status and a message fit to show the user. */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details: ErrorDetail[];

  constructor(code: ErrorCode, message: string, details: ErrorDetail[] = []) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return ERROR_STATUS[this.code];
  }
}

export const notFound = (what: string) => new AppError("not_found", `${what} was not found`);
export const forbidden = (message = "You are not allowed to do that") =>
  new AppError("forbidden", message);
export const conflict = (message: string) => new AppError("conflict", message);

export function zodDetails(error: z.ZodError): ErrorDetail[] {
  return error.issues.map((issue) => ({
    field: issue.path.join(".") || undefined,
    message: issue.message,
  }));
}

/** Turns anything thrown into the one error shape; unexpected errors never leak their stack. */
export function toAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof z.ZodError) {
    return new AppError("validation_failed", "Some fields need attention", zodDetails(error));
  }
  if (error instanceof InputError) {
    return new AppError("validation_failed", error.message, [
      { field: error.field, message: error.message },
    ]);
  }
  if ((error as Error)?.name === "DatabaseBusyError" || /SQLITE_BUSY/.test(String((error as Error)?.message))) {
    return new AppError("conflict", "Someone else was saving at the same moment; nothing was changed. Try again.");
  }
  if (isUniqueViolation(error)) {
    return new AppError("conflict", "A record with the same unique value already exists");
  }
  console.error("[rigline] unexpected error", error);
  return new AppError("internal", "Something went wrong on our side. Nothing was changed.");
}

export function isUniqueViolation(error: unknown): boolean {
  const text = String((error as { message?: string })?.message ?? "");
  const cause = String((error as { cause?: { message?: string } })?.cause?.message ?? "");
  return /UNIQUE constraint failed/i.test(text) || /UNIQUE constraint failed/i.test(cause);
}

export function errorBody(error: AppError): ErrorBody {
  return { error: { code: error.code, message: error.message, details: error.details } };
}
