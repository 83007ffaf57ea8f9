/**
 * The calculators' side of the API: post a body, get the result or a CalcError carrying the
 * API's one error shape, and turn its details into messages beside the right fields.
 * No React here, so it can be tested on its own.
 */

export type CalcErrorDetail = { field?: string; message: string };

/** A failed calculator request, in the API's error shape (status 0: the server was not reached). */
export class CalcError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: CalcErrorDetail[];

  constructor(status: number, code: string, message: string, details: CalcErrorDetail[] = []) {
    super(message);
    this.name = "CalcError";
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

function isDetail(value: unknown): value is CalcErrorDetail {
  if (typeof value !== "object" || value === null) return false;
  const d = value as Record<string, unknown>;
  return typeof d.message === "string" && (d.field === undefined || typeof d.field === "string");
}

/** Reads the API's error body; anything else becomes a plain error for that status. */
export function calcErrorFrom(status: number, body: unknown): CalcError {
  const error = (body as { error?: { code?: unknown; message?: unknown; details?: unknown } } | null)?.error;
  if (error && typeof error.code === "string" && typeof error.message === "string") {
    const details = Array.isArray(error.details) ? error.details.filter(isDetail) : [];
    return new CalcError(status, error.code, error.message, details);
  }
  if (status === 401) return new CalcError(status, "unauthenticated", "Your session has ended. Sign in again to use the calculators.");
  return new CalcError(status, "internal", "The calculation could not be done. Nothing was changed; try again.");
}

/** POSTs `body` as JSON to a calculator route and returns its result, or throws CalcError. */
export async function postCalc<T>(path: string, body: unknown, fetcher: typeof fetch = fetch): Promise<T> {
  let response: Response;
  try {
    response = await fetcher(path, {
      method: "POST",
      headers: { "content-type": "application/json", accept: "application/json" },
      body: JSON.stringify(body),
    });
  } catch {
    throw new CalcError(0, "network", "Rigline could not be reached. Check the connection and try again.");
  }
  let json: unknown = null;
  try {
    json = await response.json();
  } catch {
    json = null;
  }
  if (!response.ok) throw calcErrorFrom(response.status, json);
  if (json === null) throw calcErrorFrom(500, null);
  return json as T;
}

/** The first message for each field named in the error's details. */
export function errorsByField(error: CalcError | null | undefined): Record<string, string> {
  const out: Record<string, string> = {};
  for (const d of error?.details ?? []) {
    if (d.field && !(d.field in out)) out[d.field] = d.message;
  }
  return out;
}

/** Details the form cannot show beside a field: no field, or a field it does not show. */
export function unplacedDetails(error: CalcError | null | undefined, shown: (field: string) => boolean): CalcErrorDetail[] {
  return (error?.details ?? []).filter((d) => !d.field || !shown(d.field));
}
