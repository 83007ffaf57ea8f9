import type { Criterion, EditionLine } from "@/lib/variance";
import { indexEdition } from "./lines";

/**
 * What changed from one edition to the next. Lines are matched by `key` (stable across
 * editions), never by id. dependsOn is compared as the set of keys depended on, because a copied
 * edition gives every line a new id. Criteria and evidence kinds are compared as sets (their order
 * on the form means nothing).
 */

export const COMPARED_FIELDS = [
  "code",
  "category",
  "title",
  "requirement",
  "quantity",
  "massKg",
  "xMm",
  "zone",
  "massKind",
  "criteria",
  "evidenceNeeded",
  "standardCostCents",
  "dependsOn",
  "checkable",
  "expiryMonths",
] as const;
export type ComparedField = (typeof COMPARED_FIELDS)[number];

/** One changed field; for dependsOn, before and after are the keys of the lines depended on. */
export type FieldChange = {
  [F in ComparedField]: { field: F; before: EditionLine[F]; after: EditionLine[F] };
}[ComparedField];

export type ChangedLine = {
  key: string;
  code: string;
  title: string;
  before: EditionLine;
  after: EditionLine;
  changes: FieldChange[];
};

export type EditionComparison = {
  /** Lines of b whose key is not in a, in b's order. */
  added: EditionLine[];
  /** Lines of a whose key is not in b, in a's order. */
  removed: EditionLine[];
  /** Lines in both with at least one field changed, in b's order. */
  changed: ChangedLine[];
  counts: { added: number; removed: number; changed: number; unchanged: number };
};

/** A criterion as text, independent of the order its properties were written in. */
function criterionText(c: Criterion): string {
  return JSON.stringify([c.attribute, c.op, c.value, c.unit ?? null, c.label ?? null]);
}

function sameSet<T>(a: readonly T[], b: readonly T[], text: (v: T) => string): boolean {
  if (a.length !== b.length) return false;
  const x = a.map(text).sort();
  const y = b.map(text).sort();
  return x.every((v, i) => v === y[i]);
}

function keysOf(ids: readonly string[], byId: Map<string, EditionLine>): string[] {
  // indexEdition has resolved every id, so the lookup always succeeds.
  return ids.map((id) => byId.get(id)?.key ?? id).sort();
}

export function compareEditions(a: readonly EditionLine[], b: readonly EditionLine[]): EditionComparison {
  const ea = indexEdition("a", a, { resolveDependencies: true });
  const eb = indexEdition("b", b, { resolveDependencies: true });
  const added: EditionLine[] = [];
  const changed: ChangedLine[] = [];
  let unchanged = 0;

  for (const after of b) {
    const before = ea.byKey.get(after.key);
    if (!before) {
      added.push(after);
      continue;
    }
    const changes: FieldChange[] = [];
    for (const field of COMPARED_FIELDS) {
      if (field === "dependsOn") {
        const was = keysOf(before.dependsOn, ea.byId);
        const now = keysOf(after.dependsOn, eb.byId);
        if (!sameSet(was, now, String)) changes.push({ field, before: was, after: now });
      } else if (field === "criteria") {
        if (!sameSet(before.criteria, after.criteria, criterionText)) {
          changes.push({ field, before: before.criteria, after: after.criteria });
        }
      } else if (field === "evidenceNeeded") {
        if (!sameSet(before.evidenceNeeded, after.evidenceNeeded, String)) {
          changes.push({ field, before: before.evidenceNeeded, after: after.evidenceNeeded });
        }
      } else if (before[field] !== after[field]) {
        changes.push({ field, before: before[field], after: after[field] } as FieldChange);
      }
    }
    if (changes.length > 0) changed.push({ key: after.key, code: after.code, title: after.title, before, after, changes });
    else unchanged += 1;
  }
  const removed = a.filter((line) => !eb.byKey.has(line.key));
  return {
    added,
    removed,
    changed,
    counts: { added: added.length, removed: removed.length, changed: changed.length, unchanged },
  };
}
