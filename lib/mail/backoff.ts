/** Outbox retry policy: 10 s, 30 s, 90 s … growing threefold, capped at one hour; dead after 8 tries. */
export const MAX_ATTEMPTS = 8;
const FIRST_DELAY_MS = 10_000;
const MAX_DELAY_MS = 60 * 60_000;

export function retryDelayMs(attemptsSoFar: number): number {
  const n = Math.max(1, Math.floor(attemptsSoFar));
  return Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 3 ** (n - 1));
}

export function isDead(attemptsSoFar: number): boolean {
  return attemptsSoFar >= MAX_ATTEMPTS;
}
