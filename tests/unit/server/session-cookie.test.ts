import { encode } from "next-auth/jwt";
import { afterEach, describe, expect, it, vi } from "vitest";
import { sessionClaimsFrom } from "@/lib/server/session-cookie";

// Tokens are made with Auth.js's own `encode` (the same JWE it writes at sign-in), so these
// checks hold the reader to the library's format rather than to a copy of it.

const SECRET = "unit-test-secret-unit-test-secret-0001";
const NAME = "authjs.session-token";
const claims = { sub: "user-1", orgId: "org-1", role: "manager", sv: 3 };
const jar = (cookies: Record<string, string>) => ({ getAll: () => Object.entries(cookies).map(([name, value]) => ({ name, value })) });

afterEach(() => {
  vi.useRealTimers();
});

describe("sessionClaimsFrom", () => {
  it("reads the claims of a current session cookie", async () => {
    const token = await encode({ token: claims, secret: SECRET, salt: NAME, maxAge: 3600 });
    expect(await sessionClaimsFrom(jar({ [NAME]: token }), SECRET)).toEqual({ id: "user-1", orgId: "org-1", role: "manager", sv: 3 });
  });

  it("reads the secure-prefixed cookie used over HTTPS", async () => {
    const secure = "__Secure-authjs.session-token";
    const token = await encode({ token: claims, secret: SECRET, salt: secure, maxAge: 3600 });
    expect(await sessionClaimsFrom(jar({ [secure]: token }), SECRET)).toMatchObject({ id: "user-1" });
  });

  it("joins a cookie split into chunks, in their numbered order", async () => {
    const token = await encode({ token: claims, secret: SECRET, salt: NAME, maxAge: 3600 });
    const third = Math.ceil(token.length / 3);
    const chunks = { [`${NAME}.2`]: token.slice(2 * third), [`${NAME}.0`]: token.slice(0, third), [`${NAME}.1`]: token.slice(third, 2 * third) };
    expect(await sessionClaimsFrom(jar(chunks), SECRET)).toMatchObject({ id: "user-1", orgId: "org-1" });
  });

  it("treats an expired, tampered, foreign or misnamed token as signed out", async () => {
    const expired = await encode({ token: claims, secret: SECRET, salt: NAME, maxAge: -60 });
    expect(await sessionClaimsFrom(jar({ [NAME]: expired }), SECRET)).toBeNull();
    const good = await encode({ token: claims, secret: SECRET, salt: NAME, maxAge: 3600 });
    const tampered = good.slice(0, -4) + (good.endsWith("AAAA") ? "BBBB" : "AAAA");
    expect(await sessionClaimsFrom(jar({ [NAME]: tampered }), SECRET)).toBeNull();
    expect(await sessionClaimsFrom(jar({ [NAME]: good }), "another-secret-another-secret-another-01")).toBeNull();
    // A token encoded for one cookie name does not open under the other.
    expect(await sessionClaimsFrom(jar({ "__Secure-authjs.session-token": good }), SECRET)).toBeNull();
    expect(await sessionClaimsFrom(jar({}), SECRET)).toBeNull();
  });

  it("a token read once is refused for its tampered copies, another secret or another name", async () => {
    const good = await encode({ token: { ...claims, sub: "user-kept" }, secret: SECRET, salt: NAME, maxAge: 3600 });
    expect(await sessionClaimsFrom(jar({ [NAME]: good }), SECRET)).toMatchObject({ id: "user-kept" });
    expect(await sessionClaimsFrom(jar({ [NAME]: good }), SECRET)).toMatchObject({ id: "user-kept" });
    const tampered = good.slice(0, -4) + (good.endsWith("AAAA") ? "BBBB" : "AAAA");
    expect(await sessionClaimsFrom(jar({ [NAME]: tampered }), SECRET)).toBeNull();
    expect(await sessionClaimsFrom(jar({ [NAME]: good }), "another-secret-another-secret-another-01")).toBeNull();
    expect(await sessionClaimsFrom(jar({ "__Secure-authjs.session-token": good }), SECRET)).toBeNull();
  });

  it("a token read while current is refused once its own expiry passes", async () => {
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(new Date("2026-12-02T08:00:00Z"));
    const token = await encode({ token: { ...claims, sub: "user-brief" }, secret: SECRET, salt: NAME, maxAge: 60 });
    expect(await sessionClaimsFrom(jar({ [NAME]: token }), SECRET)).toMatchObject({ id: "user-brief" });
    vi.setSystemTime(new Date("2026-12-02T08:00:59Z"));
    expect(await sessionClaimsFrom(jar({ [NAME]: token }), SECRET)).toMatchObject({ id: "user-brief" });
    // Past the expiry and Auth.js's 15 s clock tolerance.
    vi.setSystemTime(new Date("2026-12-02T08:01:20Z"));
    expect(await sessionClaimsFrom(jar({ [NAME]: token }), SECRET)).toBeNull();
  });

  it("refuses a token without the organisation claim", async () => {
    const token = await encode({ token: { sub: "user-1" }, secret: SECRET, salt: NAME, maxAge: 3600 });
    expect(await sessionClaimsFrom(jar({ [NAME]: token }), SECRET)).toBeNull();
  });
});
