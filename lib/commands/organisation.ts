import "server-only";
import { and, asc, count, eq, ne, sql } from "drizzle-orm";
import { z } from "zod";
import { isTimeZone } from "@/lib/format/dates";
import { db, type DbOrTx, type Tx } from "@/db/client";
import { contractorFirms, depots, memberships, organisations, users } from "@/db/schema";
import { renderMail } from "@/lib/mail/render";
import { GST_METHODS } from "@/lib/money/quote";
import { ROLES, ROLE_LABELS } from "@/lib/permissions";
import { AppError, conflict, notFound } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import { appUrl } from "./links";
import { createPasswordToken } from "./passwords";

const text = (label: string, max = 120) =>
  z.string({ error: `${label} is required` }).trim().min(1, { error: `${label} is required` }).max(max, { error: `${label} is too long (at most ${max} characters)` });
const optionalText = (max = 200) =>
  z.string().trim().max(max).optional().transform((v) => (v ? v : null));
const optionalId = z.string().trim().optional().transform((v) => (v ? v : null));
const email = z.string({ error: "E-mail is required" }).trim().toLowerCase().email({ error: "Enter a valid e-mail address" });

// ─── Users ─────────────────────────────────────────────────────────────────────

export const listMembers = query({
  name: "user.list",
  input: z.object({}).passthrough(),
  permission: ["read", "User"],
  run: async ({ user }) =>
    db()
      .select({
        membershipId: memberships.id,
        userId: users.id,
        name: users.name,
        email: users.email,
        role: memberships.role,
        active: memberships.active,
        firmId: memberships.firmId,
        firmName: contractorFirms.name,
        depotId: memberships.depotId,
        depotName: depots.name,
        invited: sql<boolean>`${users.passwordHash} IS NULL`,
        lastSignInAt: users.lastSignInAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .leftJoin(contractorFirms, eq(contractorFirms.id, memberships.firmId))
      .leftJoin(depots, eq(depots.id, memberships.depotId))
      .where(eq(memberships.orgId, user.orgId))
      .orderBy(asc(users.name)),
});

const roleFields = {
  role: z.enum(ROLES, { error: "Choose a role" }),
  firmId: optionalId,
  depotId: optionalId,
};

async function checkRoleLinks(orgId: string, role: string, firmId: string | null, depotId: string | null, tx: DbOrTx) {
  if (role === "contractor") {
    if (!firmId) throw new AppError("validation_failed", "A contractor must belong to a firm", [{ field: "firmId", message: "Choose the contractor's firm" }]);
    const firm = await tx.query.contractorFirms.findFirst({ where: and(eq(contractorFirms.id, firmId), eq(contractorFirms.orgId, orgId)) });
    if (!firm) throw new AppError("validation_failed", "That firm does not exist", [{ field: "firmId", message: "Choose a firm of this organisation" }]);
  }
  if (depotId) {
    const depot = await tx.query.depots.findFirst({ where: and(eq(depots.id, depotId), eq(depots.orgId, orgId)) });
    if (!depot) throw new AppError("validation_failed", "That depot does not exist", [{ field: "depotId", message: "Choose a depot of this organisation" }]);
  }
}

export const inviteUser = command({
  name: "user.invite",
  input: z.object({ name: text("Name"), email, ...roleFields }),
  permission: ["manage", "User"],
  run: async ({ user, input, tx, audit, mail, now }) => {
    await checkRoleLinks(user.orgId, input.role, input.firmId, input.depotId, tx);
    let invitee = await tx.query.users.findFirst({ where: eq(users.email, input.email) });
    if (invitee) {
      const existing = await tx.query.memberships.findFirst({
        where: and(eq(memberships.userId, invitee.id), eq(memberships.orgId, user.orgId)),
      });
      if (existing) throw conflict(`${input.email} is already a member of this organisation`);
    } else {
      [invitee] = await tx.insert(users).values({ email: input.email, name: input.name }).returning();
    }
    if (!invitee) throw new Error("user insert returned nothing");
    const [membership] = await tx
      .insert(memberships)
      .values({
        orgId: user.orgId,
        userId: invitee.id,
        role: input.role,
        firmId: input.role === "contractor" ? input.firmId : null,
        depotId: input.depotId,
      })
      .returning();
    const needsPassword = !invitee.passwordHash;
    const secret = needsPassword ? await createPasswordToken(tx, invitee.id, "invite", now) : null;
    await mail({
      to: invitee.email,
      kind: "invitation",
      ...renderMail({
        subject: `You are invited to ${user.orgName} on Rigline`,
        heading: `Join ${user.orgName} on Rigline`,
        paragraphs: [
          `Hello ${invitee.name},`,
          `${user.name} has invited you to ${user.orgName} as ${ROLE_LABELS[input.role].toLowerCase()}.`,
          needsPassword
            ? "Choose a password to finish setting up your account. The link works once and for seven days."
            : "Sign in with your existing Rigline password to see the organisation.",
        ],
        action: secret
          ? { label: "Choose your password", url: appUrl(`/password/${secret}`) }
          : { label: "Sign in", url: appUrl("/sign-in") },
      }),
    });
    await audit({ action: "user.invite", entityType: "membership", entityId: membership!.id, after: { email: invitee.email, role: input.role } });
    return { membershipId: membership!.id, email: invitee.email };
  },
});

async function loadMembership(tx: Tx, orgId: string, membershipId: string) {
  const row = await tx.query.memberships.findFirst({ where: and(eq(memberships.id, membershipId), eq(memberships.orgId, orgId)) });
  if (!row) throw notFound("That user");
  return row;
}

async function assertAnotherActiveAdmin(tx: Tx, orgId: string, membershipId: string) {
  const [row] = await tx
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.orgId, orgId), eq(memberships.role, "admin"), eq(memberships.active, true), ne(memberships.id, membershipId)));
  if (!row || row.n === 0) throw conflict("The organisation needs at least one active administrator");
}

export const changeRole = command({
  name: "user.change_role",
  input: z.object({ membershipId: z.string().min(1), ...roleFields }),
  permission: ["manage", "User"],
  run: async ({ user, input, tx, audit }) => {
    const before = await loadMembership(tx, user.orgId, input.membershipId);
    if (before.userId === user.userId && input.role !== before.role) throw conflict("You cannot change your own role");
    if (before.role === "admin" && input.role !== "admin") await assertAnotherActiveAdmin(tx, user.orgId, before.id);
    await checkRoleLinks(user.orgId, input.role, input.firmId, input.depotId, tx);
    const firmId = input.role === "contractor" ? input.firmId : null;
    await tx.update(memberships).set({ role: input.role, firmId, depotId: input.depotId }).where(eq(memberships.id, before.id));
    // A role change takes effect at once: end the user's current sessions.
    await tx.update(users).set({ sessionVersion: sql`${users.sessionVersion} + 1` }).where(eq(users.id, before.userId));
    await audit({
      action: "user.change_role",
      entityType: "membership",
      entityId: before.id,
      before: { role: before.role, firmId: before.firmId, depotId: before.depotId },
      after: { role: input.role, firmId, depotId: input.depotId },
    });
    return { membershipId: before.id };
  },
});

export const setMemberActive = command({
  name: "user.set_active",
  input: z.object({
    membershipId: z.string().min(1),
    active: z.union([z.boolean(), z.enum(["true", "false"]).transform((v) => v === "true")]),
    reason: optionalText(300),
  }),
  permission: ["manage", "User"],
  run: async ({ user, input, tx, audit }) => {
    const before = await loadMembership(tx, user.orgId, input.membershipId);
    if (before.userId === user.userId) throw conflict("You cannot deactivate yourself");
    if (!input.active && before.role === "admin") await assertAnotherActiveAdmin(tx, user.orgId, before.id);
    await tx.update(memberships).set({ active: input.active }).where(eq(memberships.id, before.id));
    // Deactivation ends every session of that user at once.
    if (!input.active) {
      await tx.update(users).set({ sessionVersion: sql`${users.sessionVersion} + 1` }).where(eq(users.id, before.userId));
    }
    await audit({
      action: input.active ? "user.reactivate" : "user.deactivate",
      entityType: "membership",
      entityId: before.id,
      before: { active: before.active },
      after: { active: input.active },
      reason: input.reason,
    });
    return { membershipId: before.id, active: input.active };
  },
});

// ─── Depots ────────────────────────────────────────────────────────────────────

export const listDepots = query({
  name: "depot.list",
  input: z.object({}).passthrough(),
  permission: ["read", "Depot"],
  run: async ({ user }) =>
    db().select().from(depots).where(eq(depots.orgId, user.orgId)).orderBy(asc(depots.name)),
});

const depotFields = {
  name: text("Name", 80),
  code: text("Code", 12).transform((v) => v.toUpperCase()).pipe(z.string().regex(/^[A-Z0-9-]+$/, { error: "Use letters, digits and dashes only" })),
  region: optionalText(80),
};

export const saveDepot = command({
  name: "depot.save",
  input: z.object({ id: optionalId, ...depotFields }),
  permission: ["manage", "Depot"],
  run: async ({ user, input, tx, audit }) => {
    const clash = await tx.query.depots.findFirst({ where: and(eq(depots.orgId, user.orgId), eq(depots.code, input.code)) });
    if (clash && clash.id !== input.id) {
      throw new AppError("conflict", "Another depot already uses that code", [{ field: "code", message: `Code ${input.code} is taken by ${clash.name}` }]);
    }
    if (input.id) {
      const before = await tx.query.depots.findFirst({ where: and(eq(depots.id, input.id), eq(depots.orgId, user.orgId)) });
      if (!before) throw notFound("That depot");
      await tx.update(depots).set({ name: input.name, code: input.code, region: input.region }).where(eq(depots.id, before.id));
      await audit({ action: "depot.update", entityType: "depot", entityId: before.id, before, after: input });
      return { id: before.id };
    }
    const [created] = await tx.insert(depots).values({ orgId: user.orgId, name: input.name, code: input.code, region: input.region }).returning();
    await audit({ action: "depot.create", entityType: "depot", entityId: created!.id, after: input });
    return { id: created!.id };
  },
});

// ─── Contractor firms ──────────────────────────────────────────────────────────

export const listFirms = query({
  name: "firm.list",
  input: z.object({}).passthrough(),
  permission: ["read", "Firm"],
  run: async ({ user }) => {
    const where =
      user.role === "contractor"
        ? and(eq(contractorFirms.orgId, user.orgId), eq(contractorFirms.id, user.firmId ?? "__none__"))
        : eq(contractorFirms.orgId, user.orgId);
    const firms = await db().select().from(contractorFirms).where(where).orderBy(asc(contractorFirms.name));
    const members = await db()
      .select({ firmId: memberships.firmId, name: users.name, email: users.email, active: memberships.active })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.orgId, user.orgId), eq(memberships.role, "contractor")));
    return firms.map((f) => ({ ...f, members: members.filter((m) => m.firmId === f.id) }));
  },
});

export const saveFirm = command({
  name: "firm.save",
  input: z.object({
    id: optionalId,
    name: text("Name", 120),
    email,
    phone: optionalText(40),
    abn: z
      .string()
      .trim()
      .optional()
      .transform((v) => (v ? v.replace(/\s+/g, "") : null))
      .pipe(z.string().regex(/^\d{11}$/, { error: "An ABN has 11 digits" }).nullable()),
    active: z.union([z.boolean(), z.enum(["true", "false", "on"]).transform((v) => v !== "false")]).default(true),
  }),
  permission: ["manage", "Firm"],
  run: async ({ user, input, tx, audit }) => {
    const clash = await tx.query.contractorFirms.findFirst({ where: and(eq(contractorFirms.orgId, user.orgId), eq(contractorFirms.name, input.name)) });
    if (clash && clash.id !== input.id) {
      throw new AppError("conflict", "Another firm already has that name", [{ field: "name", message: "Choose a different name" }]);
    }
    const values = { name: input.name, email: input.email, phone: input.phone, abn: input.abn, active: input.active };
    if (input.id) {
      const before = await tx.query.contractorFirms.findFirst({ where: and(eq(contractorFirms.id, input.id), eq(contractorFirms.orgId, user.orgId)) });
      if (!before) throw notFound("That firm");
      await tx.update(contractorFirms).set(values).where(eq(contractorFirms.id, before.id));
      await audit({ action: "firm.update", entityType: "firm", entityId: before.id, before, after: values });
      return { id: before.id };
    }
    const [created] = await tx.insert(contractorFirms).values({ orgId: user.orgId, ...values }).returning();
    await audit({ action: "firm.create", entityType: "firm", entityId: created!.id, after: values });
    return { id: created!.id };
  },
});

// ─── Settings ──────────────────────────────────────────────────────────────────

export const readSettings = query({
  name: "settings.read",
  input: z.object({}).passthrough(),
  permission: ["read", "OrgSettings"],
  run: async ({ user }) => {
    const org = await db().query.organisations.findFirst({ where: eq(organisations.id, user.orgId) });
    if (!org) throw notFound("The organisation");
    return org;
  },
});

const dollarsToCents = z
  .union([z.number(), z.string()])
  .transform((v, ctx) => {
    const n = typeof v === "number" ? v : Number(String(v).replace(/[$,\s]/g, ""));
    if (!Number.isFinite(n) || n < 0) {
      ctx.addIssue({ code: "custom", message: "Enter an amount in dollars, such as 5000 or 5,000.00" });
      return z.NEVER;
    }
    return Math.round(n * 100);
  });
const kg = (label: string, max: number) =>
  z.coerce.number({ error: `${label} must be a number` }).min(0, { error: `${label} cannot be negative` }).max(max, { error: `${label} is above ${max} kg` });

export const updateSettings = command({
  name: "settings.update",
  input: z.object({
    name: text("Organisation name", 120),
    approvalThreshold: dollarsToCents,
    personMassKg: kg("Mass per person", 200),
    brakeWarningMarginKg: kg("Brake warning margin", 2000),
    springSoftMarginKg: kg("Soft spring margin", 1000),
    springStiffMarginKg: kg("Stiff spring margin", 2000),
    weighbridgeToleranceKg: kg("Weighbridge tolerance", 500),
    gstMethod: z.enum(GST_METHODS, { error: "Choose how GST is rounded" }),
    /** Absent: left as it is. */
    timeZone: z
      .string({ error: "Choose the time zone" })
      .trim()
      .refine(isTimeZone, { error: "Choose a time zone from the list (such as Australia/Darwin)" })
      .optional(),
  }),
  permission: ["manage", "OrgSettings"],
  run: async ({ user, input, tx, audit }) => {
    const before = await tx.query.organisations.findFirst({ where: eq(organisations.id, user.orgId) });
    if (!before) throw notFound("The organisation");
    const after = {
      name: input.name,
      approvalThresholdCents: input.approvalThreshold,
      personMassKg: input.personMassKg,
      brakeWarningMarginKg: input.brakeWarningMarginKg,
      springSoftMarginKg: input.springSoftMarginKg,
      springStiffMarginKg: input.springStiffMarginKg,
      weighbridgeToleranceKg: input.weighbridgeToleranceKg,
      gstMethod: input.gstMethod,
      timeZone: input.timeZone ?? before.timeZone,
    };
    await tx.update(organisations).set(after).where(eq(organisations.id, user.orgId));
    await audit({ action: "settings.update", entityType: "organisation", entityId: user.orgId, before, after });
    return after;
  },
});
