/**
 * A finding is one plain-language result of a check, with how much it matters:
 * - "ok": within the limit;
 * - "check": cannot be decided from the figures given, or close enough that a person should look;
 * - "exceeds": outside the limit (needs certification, a different part, or is not allowed).
 * `code` is a stable key a screen can use for icons and grouping; `message` is what a person reads.
 */
export type Severity = "ok" | "check" | "exceeds";

export interface Finding {
  code: string;
  severity: Severity;
  message: string;
}

const ORDER: Record<Severity, number> = { ok: 0, check: 1, exceeds: 2 };

/** The most serious severity among the findings ("ok" when there are none). */
export function worstSeverity(findings: readonly Finding[]): Severity {
  let worst: Severity = "ok";
  for (const f of findings) if (ORDER[f.severity] > ORDER[worst]) worst = f.severity;
  return worst;
}

/** Rounds for display in messages only (computations keep full precision). */
export function fmt(value: number, digits = 0): string {
  const rounded = Number(value.toFixed(digits));
  return (Object.is(rounded, -0) ? 0 : rounded).toFixed(digits);
}
