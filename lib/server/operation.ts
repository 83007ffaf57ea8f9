import "server-only";
import { z } from "zod";
import { db, type Tx } from "@/db/client";
import { writeAudit, type AuditInput } from "@/db/audit";
import type { Action, Subject } from "@/lib/permissions";
import type { RenderedMail } from "@/lib/mail/render";
import { AppError, forbidden, toAppError, zodDetails } from "./errors";
import { enqueueMail } from "./mail/outbox";
import { kickOutboxSender } from "./mail/sender";
import { currentUser, type SignedIn } from "./session";

/**
 * The one way to run anything on behalf of a user, for server actions and route handlers alike:
 * session → ability → zod input → handler (in one transaction) → audit entry.
 * A command that writes no audit entry fails, so no state change goes unrecorded.
 */

export type CommandContext<I> = {
  user: SignedIn;
  input: I;
  tx: Tx;
  now: Date;
  audit: (entry: Omit<AuditInput, "orgId" | "actorId">) => Promise<void>;
  mail: (message: RenderedMail & { to: string; kind: string }) => Promise<void>;
};

export type QueryContext<I> = { user: SignedIn; input: I; now: Date };

type Permission = readonly [Action, Subject];

export type Command<S extends z.ZodType, O> = {
  kind: "command";
  name: string;
  input: S;
  permission: Permission;
  run: (ctx: CommandContext<z.output<S>>) => Promise<O>;
};

export type Query<S extends z.ZodType, O> = {
  kind: "query";
  name: string;
  input: S;
  permission: Permission;
  run: (ctx: QueryContext<z.output<S>>) => Promise<O>;
};

export type Operation<S extends z.ZodType, O> = Command<S, O> | Query<S, O>;

export function command<S extends z.ZodType, O>(spec: Omit<Command<S, O>, "kind">): Command<S, O> {
  return { kind: "command", ...spec };
}

export function query<S extends z.ZodType, O>(spec: Omit<Query<S, O>, "kind">): Query<S, O> {
  return { kind: "query", ...spec };
}

function authorise(user: SignedIn | null, permission: Permission): SignedIn {
  if (!user) throw new AppError("unauthenticated", "Please sign in first");
  if (!user.ability.can(permission[0], permission[1])) throw forbidden();
  return user;
}

function parseInput<S extends z.ZodType>(schema: S, raw: unknown): z.output<S> {
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    throw new AppError("validation_failed", "Some fields need attention", zodDetails(parsed.error));
  }
  return parsed.data;
}

/** Runs an operation for an already resolved user (tests call this directly). */
export async function execute<S extends z.ZodType, O>(
  op: Operation<S, O>,
  user: SignedIn | null,
  raw: unknown,
): Promise<O> {
  const signedIn = authorise(user, op.permission);
  const input = parseInput(op.input, raw);
  const now = new Date();
  if (op.kind === "query") return op.run({ user: signedIn, input, now });

  let mailQueued = false;
  const result = await db().transaction(async (tx) => {
    let audited = 0;
    const ctx: CommandContext<z.output<S>> = {
      user: signedIn,
      input,
      tx,
      now,
      audit: async (entry) => {
        audited++;
        await writeAudit(tx, { ...entry, orgId: signedIn.orgId, actorId: signedIn.userId });
      },
      mail: async (message) => {
        mailQueued = true;
        await enqueueMail(tx, { ...message, orgId: signedIn.orgId });
      },
    };
    const out = await op.run(ctx);
    if (audited === 0) throw new Error(`command ${op.name} changed state without an audit entry`);
    return out;
  });
  if (mailQueued) kickOutboxSender();
  return result;
}

/** Runs an operation for the user of the current request. */
export async function executeForRequest<S extends z.ZodType, O>(
  op: Operation<S, O>,
  raw: unknown,
): Promise<O> {
  return execute(op, await currentUser(), raw);
}

export { toAppError };
