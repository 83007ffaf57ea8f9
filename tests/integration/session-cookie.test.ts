import { and, eq, sql } from "drizzle-orm";
import { encode } from "next-auth/jwt";
import { describe, expect, it, vi } from "vitest";
import { memberships, users } from "@/db/schema";
import { currentUser } from "@/lib/server/session";
import { useTestDatabase } from "../helpers/db";

// The real session module on a real database: the session cookie is made with Auth.js's own
// `encode`, exactly as sign-in writes it; only next/headers is stood in for (no request here).
const jar: { cookies: { name: string; value: string }[] } = { cookies: [] };
vi.mock("next/headers", () => ({ headers: async () => new Headers(), cookies: async () => ({ getAll: () => jar.cookies }) }));

const database = await useTestDatabase();
const COOKIE = "authjs.session-token";

async function signInCookie(email: string) {
  const user = (await database.query.users.findFirst({ where: eq(users.email, email) }))!;
  const membership = (await database.query.memberships.findFirst({ where: eq(memberships.userId, user.id) }))!;
  const token = await encode({
    token: { sub: user.id, orgId: membership.orgId, role: membership.role, sv: user.sessionVersion },
    secret: process.env.AUTH_SECRET!,
    salt: COOKIE,
    maxAge: 3600,
  });
  jar.cookies = [{ name: COOKIE, value: token }];
  return { user, membership };
}

describe("currentUser from the session cookie", () => {
  it("signs in the cookie's user with the role of their membership", async () => {
    const { user } = await signInCookie("finance@mirrabel-health.example");
    const signedIn = await currentUser();
    expect(signedIn).toMatchObject({ userId: user.id, role: "finance", via: "session" });
    expect(signedIn?.ability.can("read", "Cost")).toBe(true);
  });

  it("ends the session at once when the session version is raised (sign out everywhere, password change)", async () => {
    const { user } = await signInCookie("manager2@mirrabel-health.example");
    expect(await currentUser()).not.toBeNull();
    await database.update(users).set({ sessionVersion: sql`${users.sessionVersion} + 1` }).where(eq(users.id, user.id));
    expect(await currentUser()).toBeNull();
  });

  it("ends the session at once when the membership is deactivated", async () => {
    const { user, membership } = await signInCookie("driver2@mirrabel-health.example");
    expect(await currentUser()).not.toBeNull();
    await database.update(memberships).set({ active: false }).where(and(eq(memberships.userId, user.id), eq(memberships.orgId, membership.orgId)));
    expect(await currentUser()).toBeNull();
  });

  it("is signed out with no cookie or a cookie that does not decrypt", async () => {
    jar.cookies = [];
    expect(await currentUser()).toBeNull();
    jar.cookies = [{ name: COOKIE, value: "not-a-token" }];
    expect(await currentUser()).toBeNull();
  });
});
