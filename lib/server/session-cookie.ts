import { LRUCache } from "lru-cache";
import { decode } from "next-auth/jwt";

/**
 * Reads the signed-in user's claims straight from the Auth.js session cookie.
 *
 * Auth.js's own `auth()` in a server component or route handler runs its whole session endpoint
 * for each call: decrypt, callbacks, re-encrypt a renewed cookie — which it then throws away,
 * because a server component cannot set cookies. Decrypting the cookie is the only part that
 * matters here; whether the user may still act is decided against the database afterwards
 * (lib/server/session.ts). `decode` checks the token's integrity and expiry (JWE, jose).
 */

export type SessionClaims = {
  id: string;
  orgId: string;
  role: string;
  sv: number;
};

/** The cookie names Auth.js uses: with the `__Secure-` prefix over HTTPS, without over HTTP. */
export const SESSION_COOKIE_NAMES = ["__Secure-authjs.session-token", "authjs.session-token"] as const;

type CookieJar = { getAll(): { name: string; value: string }[] };

/** A cookie's value, joined from Auth.js's `.0`, `.1` … chunks when it was too large for one. */
function cookieValue(jar: CookieJar, name: string): string | null {
  const parts = jar
    .getAll()
    .filter((c) => c.value && (c.name === name || c.name.startsWith(`${name}.`)))
    .map((c) => ({ index: c.name === name ? 0 : Number.parseInt(c.name.slice(name.length + 1), 10), value: c.value }))
    .filter((c) => Number.isInteger(c.index))
    .sort((a, b) => a.index - b.index);
  return parts.length ? parts.map((p) => p.value).join("") : null;
}

/**
 * Tokens already opened, with their claims, until the token's own expiry: a browser sends the
 * same cookie with every request, and opening it (key derivation, decryption) is the largest
 * part of reading it. A token string only maps to the claims sealed in it, so this changes
 * nothing of what is accepted; the database re-check still runs for every request.
 */
const opened = new LRUCache<string, { claims: SessionClaims; expiresAtMs: number }>({ max: 10_000 });

export async function sessionClaimsFrom(jar: CookieJar, secret: string): Promise<SessionClaims | null> {
  for (const name of SESSION_COOKIE_NAMES) {
    const token = cookieValue(jar, name);
    if (!token) continue;
    const key = `${secret}\u0000${name}\u0000${token}`;
    const kept = opened.get(key);
    if (kept) {
      if (Date.now() < kept.expiresAtMs) return kept.claims;
      opened.delete(key);
    }
    try {
      // The salt is the cookie's name, as Auth.js encodes it: a token only opens under its own name.
      const payload = await decode({ token, secret, salt: name });
      if (!payload?.sub || typeof payload.orgId !== "string") return null;
      const claims: SessionClaims = { id: payload.sub, orgId: payload.orgId, role: String(payload.role), sv: Number(payload.sv) };
      if (typeof payload.exp === "number") opened.set(key, { claims, expiresAtMs: payload.exp * 1000 });
      return claims;
    } catch {
      // Tampered, expired or encrypted with another secret: not signed in.
      return null;
    }
  }
  return null;
}
