import { and, asc, eq, isNull, or } from "drizzle-orm";
import { EXAMPLE_RULE_SETS, ruleSetSchema, type RuleSet } from "@/lib/rules";
import type { DbOrTx } from "./client";
import { organisations, ruleSets } from "./schema";

/** A rule set as the app shows it: the limits, whether it is a shipped example, who owns it. */
export type RuleSetRecord = {
  id: string;
  name: string;
  /** null for the shipped examples; the organisation's id for its own edited copies. */
  orgId: string | null;
  shipped: boolean;
  rules: RuleSet;
};

/**
 * Puts the shipped example rule sets in the database (organisation null). Idempotent: a set
 * already there is left as it is.
 */
export async function seedRuleSets(db: DbOrTx): Promise<void> {
  for (const set of EXAMPLE_RULE_SETS) {
    await db
      .insert(ruleSets)
      .values({ id: set.id, orgId: null, name: set.name, exampleOnly: true, limits: { ...set } })
      .onConflictDoNothing();
  }
}

function shippedFromCode(): RuleSetRecord[] {
  return EXAMPLE_RULE_SETS.map((set) => ({ id: set.id, name: set.name, orgId: null, shipped: true, rules: { ...set } }));
}

/** Reads a stored row's limits back into a RuleSet; a row that no longer validates is skipped. */
function fromRow(row: typeof ruleSets.$inferSelect): RuleSetRecord | null {
  const parsed = ruleSetSchema.safeParse({ ...row.limits, id: row.id, name: row.name, exampleOnly: true });
  if (!parsed.success) return null;
  return { id: row.id, name: row.name, orgId: row.orgId, shipped: row.orgId === null, rules: parsed.data as RuleSet };
}

/** The shipped examples (from the database, or the code when not seeded) and the organisation's own sets. */
export async function listRuleSets(db: DbOrTx, orgId: string): Promise<RuleSetRecord[]> {
  const rows = await db
    .select()
    .from(ruleSets)
    .where(or(isNull(ruleSets.orgId), eq(ruleSets.orgId, orgId)))
    .orderBy(asc(ruleSets.createdAt), asc(ruleSets.name));
  const records = rows.map(fromRow).filter((r): r is RuleSetRecord => r !== null);
  const shippedIds = new Set(records.filter((r) => r.shipped).map((r) => r.id));
  const missingShipped = shippedFromCode().filter((r) => !shippedIds.has(r.id));
  const shipped = [...records.filter((r) => r.shipped), ...missingShipped].sort((a, b) => a.name.localeCompare(b.name));
  const own = records.filter((r) => !r.shipped);
  return [...shipped, ...own];
}

/** One rule set the organisation may use: a shipped example or its own; null otherwise. */
export async function findRuleSet(db: DbOrTx, orgId: string, id: string): Promise<RuleSetRecord | null> {
  const row = await db.query.ruleSets.findFirst({
    where: and(eq(ruleSets.id, id), or(isNull(ruleSets.orgId), eq(ruleSets.orgId, orgId))),
  });
  if (row) return fromRow(row);
  return shippedFromCode().find((r) => r.id === id) ?? null;
}

/** The rule set the organisation has chosen, or the first shipped example when none is chosen. */
export async function ruleSetInUse(db: DbOrTx, orgId: string): Promise<RuleSetRecord & { chosen: boolean }> {
  const org = await db.query.organisations.findFirst({ where: eq(organisations.id, orgId), columns: { ruleSetId: true } });
  if (org?.ruleSetId) {
    const found = await findRuleSet(db, orgId, org.ruleSetId);
    if (found) return { ...found, chosen: true };
  }
  const fallback = shippedFromCode()[0];
  if (!fallback) throw new Error("no example rule sets are shipped");
  return { ...fallback, chosen: false };
}
