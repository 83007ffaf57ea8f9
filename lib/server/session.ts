import "server-only";
import { eq } from "drizzle-orm";
import { cookies, headers } from "next/headers";
import { cache } from "react";
import { db } from "@/db/client";
import { apiTokens } from "@/db/schema";
import { findApiToken, loadStanding } from "@/db/users";
import { defineAbilityFor, type Actor, type AppAbility } from "@/lib/permissions";
import { sha256Hex } from "@/lib/security/tokens";
import { env } from "@/lib/env";
import { sessionClaimsFrom } from "./session-cookie";

export type SignedIn = Actor & {
  email: string;
  name: string;
  orgName: string;
  /** The organisation's time zone: instants on screens and in mail read in it. */
  timeZone: string;
  via: "session" | "token";
  ability: AppAbility;
};

async function standingToSignedIn(
  userId: string,
  orgId: string,
  via: SignedIn["via"],
  sessionVersion?: number,
): Promise<SignedIn | null> {
  const row = await loadStanding(db(), userId, orgId);
  if (!row || !row.active) return null;
  if (sessionVersion !== undefined && row.sessionVersion !== sessionVersion) return null;
  const actor: Actor = {
    userId: row.userId,
    orgId: row.orgId,
    role: row.role,
    firmId: row.firmId,
    depotId: row.depotId,
  };
  return {
    ...actor,
    email: row.email,
    name: row.name,
    orgName: row.orgName,
    timeZone: row.orgTimeZone,
    via,
    ability: defineAbilityFor(actor),
  };
}

/**
 * The signed-in user for this request, re-checked against the database every time: a
 * deactivated membership or a raised session version ends the session at once.
 * An `Authorization: Bearer` API token is accepted as well (for integrations).
 */
export const currentUser = cache(async (): Promise<SignedIn | null> => {
  const authorization = (await headers()).get("authorization");
  if (authorization?.toLowerCase().startsWith("bearer ")) {
    return userFromApiToken(authorization.slice(7).trim());
  }
  const claims = await sessionClaimsFrom(await cookies(), env().AUTH_SECRET);
  if (!claims) return null;
  return standingToSignedIn(claims.id, claims.orgId, "session", claims.sv);
});

async function userFromApiToken(token: string): Promise<SignedIn | null> {
  if (!token) return null;
  const row = await findApiToken(db(), sha256Hex(token));
  if (!row || row.revokedAt) return null;
  const signedIn = await standingToSignedIn(row.userId, row.orgId, "token");
  if (signedIn) {
    await db().update(apiTokens).set({ lastUsedAt: new Date() }).where(eq(apiTokens.id, row.id));
  }
  return signedIn;
}
