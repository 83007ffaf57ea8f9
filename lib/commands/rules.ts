import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { findRuleSet, listRuleSets, ruleSetInUse } from "@/db/rule-sets";
import { organisations, ruleSets } from "@/db/schema";
import { ruleSetSchema, type RuleSet } from "@/lib/rules";
import { AppError, conflict, notFound, zodDetails } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";

/**
 * Jurisdiction rule sets: the shipped examples (never changed) and the organisation's own
 * copies, which an administrator edits to the local rules. Every set is example values until a
 * person checks it against the local rules; the screens say so beside every result.
 */

const ruleSetId = z.string({ error: "Choose a rule set" }).trim().min(1, { error: "Choose a rule set" }).max(64);

export const listRuleSetsQuery = query({
  name: "ruleSet.list",
  input: z.object({}).passthrough(),
  permission: ["read", "OrgSettings"],
  run: async ({ user }) => {
    const [sets, inUse] = await Promise.all([listRuleSets(db(), user.orgId), ruleSetInUse(db(), user.orgId)]);
    return { items: sets, inUseId: inUse.id, chosen: inUse.chosen };
  },
});

export const chooseRuleSet = command({
  name: "ruleSet.choose",
  input: z.object({ ruleSetId }),
  permission: ["manage", "OrgSettings"],
  run: async ({ user, input, tx, audit }) => {
    const set = await findRuleSet(tx, user.orgId, input.ruleSetId);
    if (!set) throw notFound("That rule set");
    const before = await tx.query.organisations.findFirst({ where: eq(organisations.id, user.orgId), columns: { ruleSetId: true } });
    await tx.update(organisations).set({ ruleSetId: set.id }).where(eq(organisations.id, user.orgId));
    await audit({
      action: "ruleSet.choose",
      entityType: "organisation",
      entityId: user.orgId,
      before: { ruleSetId: before?.ruleSetId ?? null },
      after: { ruleSetId: set.id, name: set.name },
    });
    return { ruleSetId: set.id, name: set.name };
  },
});

export const copyRuleSet = command({
  name: "ruleSet.copy",
  input: z.object({
    copyFromId: ruleSetId,
    name: z.string().trim().max(120, { error: "The name is too long (at most 120 characters)" }).optional(),
  }),
  permission: ["manage", "OrgSettings"],
  run: async ({ user, input, tx, audit }) => {
    const source = await findRuleSet(tx, user.orgId, input.copyFromId);
    if (!source) throw notFound("That rule set");
    const id = crypto.randomUUID();
    const name = input.name || `${source.name} (our copy)`.slice(0, 120);
    const rules = ruleSetSchema.parse({ ...source.rules, id, name, exampleOnly: true }) as RuleSet;
    await tx.insert(ruleSets).values({ id, orgId: user.orgId, name, exampleOnly: true, limits: { ...rules } });
    await audit({ action: "ruleSet.copy", entityType: "rule_set", entityId: id, after: { copiedFrom: source.id, ...rules } });
    return { id, name };
  },
});

/** Form text → number; absent keeps the stored value, empty text clears the limit (null). */
const numberText = z
  .union([z.number(), z.string()])
  .optional()
  .transform((v, ctx) => {
    if (v === undefined) return undefined;
    if (typeof v === "number") return v;
    const text = v.trim();
    if (text === "") return null;
    // A share of travel may be written as a fraction such as 1/3.
    const fraction = /^(\d+(?:\.\d+)?)\s*\/\s*(\d+(?:\.\d+)?)$/.exec(text);
    const n = fraction ? Number(fraction[1]) / Number(fraction[2]) : Number(text);
    if (!Number.isFinite(n)) {
      ctx.addIssue({ code: "custom", message: "Enter a number" });
      return z.NEVER;
    }
    return n;
  });

export const ruleSetEditSchema = z.object({
  id: ruleSetId,
  name: z.string({ error: "name must be text" }).optional(),
  note: z.string({ error: "note must be text" }).optional(),
  suspensionLiftMaxMm: numberText,
  suspensionLiftMaxTravelFraction: numberText,
  tyreDiameterIncreaseMaxMm: numberText,
  tyreDiameterIncreaseMaxPct: numberText,
  combinedLiftMaxMm: numberText,
  tyreLiftShareMaxMm: numberText,
  maxCertifiedLiftMm: numberText,
  wheelTrackIncreaseMaxMm: numberText,
});

export const updateRuleSet = command({
  name: "ruleSet.update",
  input: ruleSetEditSchema,
  permission: ["manage", "OrgSettings"],
  run: async ({ user, input, tx, audit }) => {
    const row = await tx.query.ruleSets.findFirst({ where: eq(ruleSets.id, input.id) });
    if (!row || (row.orgId !== null && row.orgId !== user.orgId)) {
      if (!(await findRuleSet(tx, user.orgId, input.id))) throw notFound("That rule set");
    }
    if (!row || row.orgId === null) throw conflict("The shipped example sets cannot be changed: copy one and edit the copy");
    const { id, ...fields } = input;
    // Fields left out keep their stored values; a cleared optional limit is removed.
    const given = Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined));
    const merged: Record<string, unknown> = { ...row.limits, name: row.name, ...given, id, exampleOnly: true };
    const candidate = Object.fromEntries(Object.entries(merged).filter(([, v]) => v !== null));
    const parsed = ruleSetSchema.safeParse(candidate);
    if (!parsed.success) throw new AppError("validation_failed", "Some limits need attention", zodDetails(parsed.error));
    const rules = parsed.data as RuleSet;
    await tx
      .update(ruleSets)
      .set({ name: rules.name, limits: { ...rules } })
      .where(and(eq(ruleSets.id, row.id), eq(ruleSets.orgId, user.orgId)));
    await audit({ action: "ruleSet.update", entityType: "rule_set", entityId: row.id, before: row.limits, after: rules });
    return { id: row.id, name: rules.name };
  },
});
