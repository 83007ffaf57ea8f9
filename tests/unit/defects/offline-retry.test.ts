import { describe, expect, it } from "vitest";
import { FIRST_RETRY_MS, MAX_RETRY_MS, classifyAttempt, isDue, newClientId, retryDelayMs } from "@/lib/offline";

// HTTP status meanings per RFC 9110 (200 OK, 201 Created, 401 Unauthorized, 408 Request
// Timeout, 429 Too Many Requests per RFC 6585, 5xx server errors) — from memory. What the
// phone does with each, and the back-off, are Rigline's own rules.

describe("what a send attempt comes to", () => {
  it("is done on 201 (new) and on 200 (a repeat the server already holds)", () => {
    expect(classifyAttempt(201)).toEqual({ kind: "sent" });
    expect(classifyAttempt(200)).toEqual({ kind: "sent" });
  });

  it("tries again with no answer, on 408, 429 and server errors", () => {
    expect(classifyAttempt(null)).toEqual({ kind: "retry", reason: "No signal" });
    for (const status of [408, 429, 500, 502, 503]) expect(classifyAttempt(status).kind, String(status)).toBe("retry");
  });

  it("waits for a sign-in on 401 and gives up on other refusals, keeping the server's words", () => {
    expect(classifyAttempt(401)).toEqual({ kind: "signed_out" });
    expect(classifyAttempt(404, "That vehicle was not found")).toEqual({ kind: "refused", reason: "That vehicle was not found" });
    expect(classifyAttempt(422).kind).toBe("refused");
    expect(classifyAttempt(415).kind).toBe("refused");
  });
});

describe("when to try again", () => {
  it("doubles the wait from 10 s up to 10 minutes", () => {
    expect(retryDelayMs(0)).toBe(0);
    expect(retryDelayMs(1)).toBe(FIRST_RETRY_MS);
    expect(retryDelayMs(2)).toBe(20_000);
    expect(retryDelayMs(4)).toBe(80_000);
    expect(retryDelayMs(7)).toBe(MAX_RETRY_MS);
    expect(retryDelayMs(500)).toBe(MAX_RETRY_MS);
  });

  it("is due once its time has come, at once when forced, never when refused", () => {
    expect(isDue({ nextAttemptAt: 1000, status: "waiting" }, 999)).toBe(false);
    expect(isDue({ nextAttemptAt: 1000, status: "waiting" }, 1000)).toBe(true);
    expect(isDue({ nextAttemptAt: 1000, status: "waiting" }, 0, true)).toBe(true);
    expect(isDue({ nextAttemptAt: 0, status: "refused" }, 5000, true)).toBe(false);
  });
});

describe("report ids made on the phone", () => {
  it("are version 4 UUIDs (RFC 9562 §5.4, from memory), different each time", () => {
    const ids = new Set(Array.from({ length: 200 }, () => newClientId()));
    expect(ids.size).toBe(200);
    for (const id of ids) expect(id).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });

  it("are made the same way without crypto.randomUUID (an insecure page)", () => {
    const original = globalThis.crypto.randomUUID;
    Object.defineProperty(globalThis.crypto, "randomUUID", { value: undefined, configurable: true });
    try {
      expect(newClientId()).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    } finally {
      Object.defineProperty(globalThis.crypto, "randomUUID", { value: original, configurable: true });
    }
  });
});
