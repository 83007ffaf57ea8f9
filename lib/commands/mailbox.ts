import "server-only";
import { desc, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { devMailbox, memberships, users } from "@/db/schema";
import { isProduction } from "@/lib/env";
import { notFound } from "@/lib/server/errors";
import { query } from "@/lib/server/operation";

/** The development mailbox: what the local SMTP stand-in caught for this organisation's people. */
export const readDevMailbox = query({
  name: "dev_mailbox.read",
  input: z.object({ limit: z.coerce.number().int().min(1).max(200).default(50) }),
  permission: ["read", "DevMailbox"],
  run: async ({ user, input }) => {
    if (isProduction()) throw notFound("The development mailbox");
    const addresses = db()
      .select({ email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.orgId, user.orgId));
    return db()
      .select()
      .from(devMailbox)
      .where(inArray(devMailbox.toAddress, addresses))
      .orderBy(desc(devMailbox.receivedAt))
      .limit(input.limit);
  },
});
