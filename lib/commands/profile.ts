import "server-only";
import { eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { notFound } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";

export const readProfile = query({
  name: "profile.read",
  input: z.object({}).passthrough(),
  permission: ["manage", "Profile"],
  run: async ({ user }) => {
    const row = await db().query.users.findFirst({ where: eq(users.id, user.userId) });
    if (!row) throw notFound("Your account");
    return { name: row.name, email: row.email, notifyNonEssential: row.notifyNonEssential };
  },
});

export const updateProfile = command({
  name: "profile.update",
  input: z.object({
    name: z.string().trim().min(1, { error: "Name is required" }).max(120, { error: "Name is too long" }),
    // An unticked checkbox sends nothing.
    notifyNonEssential: z.union([z.literal("on"), z.literal("true"), z.literal("false"), z.boolean()]).optional().transform((v) => v === "on" || v === "true" || v === true),
  }),
  permission: ["manage", "Profile"],
  run: async ({ user, input, tx, audit }) => {
    const before = await tx.query.users.findFirst({ where: eq(users.id, user.userId) });
    await tx.update(users).set({ name: input.name, notifyNonEssential: input.notifyNonEssential }).where(eq(users.id, user.userId));
    await audit({
      action: "profile.update",
      entityType: "user",
      entityId: user.userId,
      before: { name: before?.name, notifyNonEssential: before?.notifyNonEssential },
      after: input,
    });
    return input;
  },
});
