import "server-only";
import bcrypt from "bcryptjs";
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { z } from "zod";
import { db, type DbOrTx } from "@/db/client";
import { writeAudit } from "@/db/audit";
import { hit, retryAfterMs } from "@/db/rate-limit";
import { passwordTokens, users } from "@/db/schema";
import { activeMemberships, findUserByEmail } from "@/db/users";
import { renderMail } from "@/lib/mail/render";
import { newSecret, sha256Hex } from "@/lib/security/tokens";
import { AppError } from "@/lib/server/errors";
import { enqueueMail } from "@/lib/server/mail/outbox";
import { kickOutboxSender } from "@/lib/server/mail/sender";
import { appUrl } from "./links";

export const RESET_LINK_TTL_MS = 60 * 60_000;
export const INVITE_LINK_TTL_MS = 7 * 24 * 60 * 60_000;

export const passwordSchema = z
  .string({ error: "Enter a password" })
  .min(10, { error: "Use at least 10 characters" })
  .max(200, { error: "Use at most 200 characters" });

/** Creates a single-use link token and returns the secret part (only its hash is stored). */
export async function createPasswordToken(
  tx: DbOrTx,
  userId: string,
  purpose: "invite" | "reset",
  now = new Date(),
): Promise<string> {
  const secret = newSecret();
  // A new link replaces older unused ones of the same purpose.
  await tx
    .update(passwordTokens)
    .set({ usedAt: now })
    .where(and(eq(passwordTokens.userId, userId), eq(passwordTokens.purpose, purpose), isNull(passwordTokens.usedAt)));
  await tx.insert(passwordTokens).values({
    userId,
    purpose,
    tokenHash: sha256Hex(secret),
    expiresAt: new Date(now.getTime() + (purpose === "invite" ? INVITE_LINK_TTL_MS : RESET_LINK_TTL_MS)),
  });
  return secret;
}

const RESET_LIMIT = { max: 3, windowMs: 60 * 60_000 };

/**
 * Sends a reset link when the e-mail belongs to an active account. The answer is the same
 * either way, so the form never tells a stranger which e-mails exist.
 */
export async function requestPasswordReset(rawEmail: unknown): Promise<void> {
  const email = z.string().trim().toLowerCase().email({ error: "Enter a valid e-mail address" }).parse(rawEmail);
  const database = db();
  const key = `reset:email:${email}`;
  if ((await retryAfterMs(database, key, RESET_LIMIT)) > 0) return;
  await hit(database, key, RESET_LIMIT);
  const user = await findUserByEmail(database, email);
  if (!user) return;
  const [membership] = await activeMemberships(database, user.id);
  if (!membership) return;
  await database.transaction(async (tx) => {
    const secret = await createPasswordToken(tx, user.id, "reset");
    await enqueueMail(tx, {
      orgId: membership.orgId,
      to: user.email,
      kind: "password_reset",
      ...renderMail({
        subject: "Reset your Rigline password",
        heading: "Reset your password",
        paragraphs: [
          `Hello ${user.name},`,
          "Someone (we hope you) asked to reset the password of your Rigline account. The link works once and for one hour.",
          "If you did not ask for this, ignore this e-mail: your password stays as it is.",
        ],
        action: { label: "Choose a new password", url: appUrl(`/password/${secret}`) },
      }),
    });
    await writeAudit(tx, {
      orgId: membership.orgId,
      actorId: user.id,
      action: "user.password_reset_requested",
      entityType: "user",
      entityId: user.id,
    });
  });
  kickOutboxSender();
}

export type TokenInfo = { purpose: "invite" | "reset"; email: string; name: string };

/** What a link is for, or null when it is unknown, used or expired. */
export async function inspectPasswordToken(secret: string, now = new Date()): Promise<TokenInfo | null> {
  const [row] = await db()
    .select({ purpose: passwordTokens.purpose, email: users.email, name: users.name })
    .from(passwordTokens)
    .innerJoin(users, eq(users.id, passwordTokens.userId))
    .where(and(eq(passwordTokens.tokenHash, sha256Hex(secret)), isNull(passwordTokens.usedAt), gt(passwordTokens.expiresAt, now)))
    .limit(1);
  return row ?? null;
}

const setPasswordSchema = z
  .object({ token: z.string().min(10), password: passwordSchema, confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ" });

/** Uses a link exactly once: sets the password and ends every other session of the user. */
export async function setPasswordWithToken(raw: unknown, now = new Date()): Promise<{ email: string }> {
  const parsed = setPasswordSchema.safeParse(raw);
  if (!parsed.success) {
    throw new AppError(
      "validation_failed",
      "Some fields need attention",
      parsed.error.issues.map((i) => ({ field: i.path.join("."), message: i.message })),
    );
  }
  const { token, password } = parsed.data;
  const passwordHash = await bcrypt.hash(password, 10);
  return db().transaction(async (tx) => {
    const [used] = await tx
      .update(passwordTokens)
      .set({ usedAt: now })
      .where(and(eq(passwordTokens.tokenHash, sha256Hex(token)), isNull(passwordTokens.usedAt), gt(passwordTokens.expiresAt, now)))
      .returning();
    if (!used) throw new AppError("not_found", "This link has expired or has already been used. Ask for a new one.");
    const [user] = await tx
      .update(users)
      .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, used.userId))
      .returning();
    if (!user) throw new AppError("not_found", "The account of this link no longer exists.");
    const [membership] = await activeMemberships(tx, user.id);
    if (membership) {
      await writeAudit(tx, {
        orgId: membership.orgId,
        actorId: user.id,
        action: used.purpose === "invite" ? "user.invitation_accepted" : "user.password_reset",
        entityType: "user",
        entityId: user.id,
      });
    }
    return { email: user.email };
  });
}
