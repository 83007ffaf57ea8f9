import "server-only";
import { and, count, desc, eq, isNull } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { apiTokens } from "@/db/schema";
import { newSecret, sha256Hex } from "@/lib/security/tokens";
import { conflict, forbidden, notFound } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";

/**
 * Personal API tokens. A token is shown once when it is made; only its SHA-256 is stored, with a
 * short prefix so its owner can recognise it in the list. A request with the token acts as its
 * user with that user's current role and membership (lib/server/session.ts), so a token never
 * does more than its user, and a revoked token or a deactivated user's token is refused at once.
 */

/** Every token starts with this, so a leaked one is easy to spot in logs and code. */
export const TOKEN_PREFIX = "rgl_";
/** Characters of the secret kept in clear to recognise a token: "rgl_" + 8. */
export const VISIBLE_PREFIX_LENGTH = TOKEN_PREFIX.length + 8;
export const MAX_ACTIVE_TOKENS = 20;

/** Tokens are managed from a signed-in session only: a token cannot mint or revoke tokens. */
function requireSession(user: SignedIn) {
  if (user.via !== "session") throw forbidden("API tokens are managed from a signed-in session, not with a token");
}

export const tokenListSchema = z.object({}).meta({ id: "TokenListQuery" });

export type ApiTokenSummary = {
  id: string;
  name: string;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
};

const summaryColumns = {
  id: apiTokens.id,
  name: apiTokens.name,
  prefix: apiTokens.prefix,
  createdAt: apiTokens.createdAt,
  lastUsedAt: apiTokens.lastUsedAt,
  revokedAt: apiTokens.revokedAt,
};

/** GET /api/tokens — the signed-in user's own tokens, newest first (never the secrets). */
export const listApiTokens = query({
  name: "token.list",
  input: tokenListSchema,
  permission: ["manage", "ApiToken"],
  run: async ({ user }): Promise<{ items: ApiTokenSummary[] }> => {
    const items = await db()
      .select(summaryColumns)
      .from(apiTokens)
      .where(and(eq(apiTokens.userId, user.userId), eq(apiTokens.orgId, user.orgId)))
      .orderBy(desc(apiTokens.createdAt));
    return { items };
  },
});

export const tokenCreateSchema = z
  .object({
    name: z
      .string({ error: "Give the token a name" })
      .trim()
      .min(1, { error: "Give the token a name, such as the system that will use it" })
      .max(80, { error: "Keep the name under 80 characters" })
      .meta({ description: "What the token is for, e.g. the finance system that pulls the ledger" }),
  })
  .meta({ id: "TokenCreateInput" });

/** POST /api/tokens — makes a token; the answer holds the secret, the only time it is shown. */
export const createApiToken = command({
  name: "token.create",
  input: tokenCreateSchema,
  permission: ["manage", "ApiToken"],
  run: async ({ user, input, tx, audit }) => {
    requireSession(user);
    const [active] = await tx
      .select({ n: count() })
      .from(apiTokens)
      .where(and(eq(apiTokens.userId, user.userId), eq(apiTokens.orgId, user.orgId), isNull(apiTokens.revokedAt)));
    if ((active?.n ?? 0) >= MAX_ACTIVE_TOKENS) {
      throw conflict(`You already have ${MAX_ACTIVE_TOKENS} active tokens; revoke one you no longer use first`);
    }
    const secret = `${TOKEN_PREFIX}${newSecret(32)}`;
    const [row] = await tx
      .insert(apiTokens)
      .values({ orgId: user.orgId, userId: user.userId, name: input.name, prefix: secret.slice(0, VISIBLE_PREFIX_LENGTH), tokenHash: sha256Hex(secret) })
      .returning(summaryColumns);
    if (!row) throw new Error("token insert returned nothing");
    await audit({ action: "token.create", entityType: "api_token", entityId: row.id, after: { name: row.name, prefix: row.prefix } });
    return { ...row, token: secret };
  },
});

export const tokenIdSchema = z.object({ id: z.string().trim().min(1, { error: "id is required" }).max(64) }).meta({ id: "TokenId" });

/** DELETE /api/tokens/{id} — revokes one of the user's own tokens; it stops working at once. */
export const revokeApiToken = command({
  name: "token.revoke",
  input: tokenIdSchema,
  permission: ["manage", "ApiToken"],
  run: async ({ user, input, tx, audit, now }) => {
    requireSession(user);
    // Someone else's token is simply not found: ids reveal nothing.
    const token = await tx.query.apiTokens.findFirst({
      where: and(eq(apiTokens.id, input.id), eq(apiTokens.userId, user.userId), eq(apiTokens.orgId, user.orgId)),
    });
    if (!token) throw notFound("That token");
    if (token.revokedAt) throw conflict("That token is already revoked");
    await tx.update(apiTokens).set({ revokedAt: now }).where(and(eq(apiTokens.id, token.id), isNull(apiTokens.revokedAt)));
    await audit({
      action: "token.revoke",
      entityType: "api_token",
      entityId: token.id,
      before: { name: token.name, prefix: token.prefix, revokedAt: null },
      after: { revokedAt: now.toISOString() },
    });
    return { id: token.id, revokedAt: now };
  },
});
