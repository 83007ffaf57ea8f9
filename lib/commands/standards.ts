import "server-only";
import { and, asc, eq, inArray, ne, sql } from "drizzle-orm";
import { z } from "zod";
import { db, type DbOrTx } from "@/db/client";
import { editionLines, editions, jobLines, jobOffers, jobs, lineDependencies, standards, vehicles } from "@/db/schema";
import { vehicleScope } from "@/db/scope";
import { findEdition, findStandard, listStandards, loadEditionLines, nextEditionNumber, nextSortOrder } from "@/db/standards";
import { loadVariancesFor } from "@/db/variance";
import {
  compareEditions as compareLines,
  copyEditionLines,
  editionLineInputSchema,
  EditionCycleError,
  rolloutPreview,
  validateDependencies,
  type EditionLineInput,
} from "@/lib/editions";
import { InputError } from "@/lib/errors";
import { parseMoneyToCents } from "@/lib/money";
import { isScoped } from "@/lib/permissions";
import { sequenceWarnings } from "@/lib/sequence";
import type { EditionLine, Fitment, Concession } from "@/lib/variance";
import { AppError, conflict, forbidden, notFound, zodDetails } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { sequenceKindOf } from "./variance";

/**
 * Fit-out standards and their editions: create, edit a draft's lines, publish (frozen from then
 * on: every edit of a published edition answers 409), start a new draft from a published one,
 * retire, compare, and roll an edition out to vehicles with a preview first.
 */

// ─── Line input: one shape for the API's JSON and the line form's fields ───────

const NUMERIC = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)$/;

function toNumber(value: unknown, blank: number | null | undefined): unknown {
  if (typeof value !== "string") return value;
  const text = value.trim().replaceAll(",", "");
  if (text === "") return blank;
  return NUMERIC.test(text) ? Number(text) : value;
}

function toBoolean(value: unknown): unknown {
  if (typeof value !== "string") return value;
  return value === "on" || value === "true" || value === "1";
}

function asList(value: unknown): unknown {
  if (value === undefined || value === null || value === "") return undefined;
  return Array.isArray(value) ? value.filter((v) => v !== "") : [value];
}

/** A criterion value typed in a form: numbers as numbers, lists for "between" and "one_of". */
function criterionValue(op: string, value: string, high: string): unknown {
  const one = (v: string) => {
    const t = v.trim();
    return NUMERIC.test(t.replaceAll(",", "")) ? Number(t.replaceAll(",", "")) : t;
  };
  if (op === "between") return [one(value), one(high)];
  if (op === "one_of") return value.split(/[;,]/).map((v) => v.trim()).filter(Boolean).map(one);
  return one(value);
}

/** Criteria given as `criteria.<n>.<field>` form fields, blank rows dropped. */
function criteriaFromFields(raw: Record<string, unknown>): unknown[] | undefined {
  const rows = new Map<number, Record<string, string>>();
  for (const [name, value] of Object.entries(raw)) {
    const m = /^criteria\.(\d+)\.(attribute|op|value|high|unit|label)$/.exec(name);
    if (!m || typeof value !== "string") continue;
    const index = Number(m[1]);
    const row = rows.get(index) ?? {};
    row[m[2]!] = value;
    rows.set(index, row);
  }
  if (rows.size === 0) return undefined;
  return [...rows.entries()]
    .sort(([a], [b]) => a - b)
    .map(([, r]) => r)
    .filter((r) => (r.attribute ?? "").trim() !== "" || (r.value ?? "").trim() !== "")
    .map((r) => ({
      attribute: (r.attribute ?? "").trim(),
      op: r.op ?? "",
      value: criterionValue(r.op ?? "", r.value ?? "", r.high ?? ""),
      ...(r.unit?.trim() ? { unit: r.unit.trim() } : {}),
      ...(r.label?.trim() ? { label: r.label.trim() } : {}),
    }));
}

/** Form or JSON → the JSON shape of a line; dollar text becomes cents (or an issue on standardCost). */
export function normaliseLineInput(raw: unknown, { fill }: { fill: boolean } = { fill: true }): unknown {
  if (raw === null || typeof raw !== "object" || Array.isArray(raw)) return raw;
  const input = { ...(raw as Record<string, unknown>) };
  input.quantity = toNumber(input.quantity, undefined);
  input.massKg = toNumber(input.massKg, 0);
  input.xMm = toNumber(input.xMm, null);
  input.expiryMonths = toNumber(input.expiryMonths, null);
  if (input.zone === "") input.zone = null;
  if (input.massKind === "" || (fill && input.massKind === undefined)) input.massKind = "constant";
  if (typeof input.checkable === "string") input.checkable = toBoolean(input.checkable);
  else if (fill && input.checkable === undefined) input.checkable = false;
  // A form sends nothing for an empty list or an unticked box: when filling, absent means none.
  for (const name of ["evidenceNeeded", "dependsOn"] as const) {
    const list = asList(input[name]);
    if (list !== undefined || fill) input[name] = list ?? [];
  }
  const fromFields = criteriaFromFields(input);
  if (fromFields) input.criteria = fromFields;
  else if (fill && input.criteria === undefined) input.criteria = [];
  for (const name of ["quantity", "massKg", "xMm", "expiryMonths", "zone"]) if (input[name] === undefined) delete input[name];
  for (const name of Object.keys(input)) if (name.startsWith("criteria.")) delete input[name];
  if (input.standardCostCents === undefined && typeof input.standardCost === "string") {
    const text = input.standardCost.trim();
    try {
      input.standardCostCents = text === "" ? 0 : parseMoneyToCents(text, "standardCost");
      delete input.standardCost;
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      // Left in place, so `costText` below names it beside every other field's error.
      input.standardCostCents = 0;
    }
  } else delete input.standardCost;
  return input;
}

const id = (what: string) => z.string({ error: `${what} is required` }).trim().min(1, { error: `${what} is required` }).max(64);
/** Dollar text that could not be read as an amount is left under this name, and refused here. */
const costText = z.undefined({ error: "Enter the standard cost in dollars, such as 1,250.00" }).optional();

/** A new line of a draft edition (the key is made up when not given, and then never changes). */
export const addLineInputSchema = z.preprocess(
  (raw) => {
    const input = normaliseLineInput(raw);
    if (input === null || typeof input !== "object") return input;
    const r = input as Record<string, unknown>;
    if (r.key === undefined || r.key === "") {
      const code = typeof r.code === "string" ? r.code.trim().toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") : "";
      r.key = `${code || "line"}-${crypto.randomUUID().slice(0, 8)}`;
    }
    return r;
  },
  z.intersection(z.object({ editionId: id("The edition"), standardCost: costText }), editionLineInputSchema),
);

/**
 * A changed line. `full: true` (the line form) replaces every field; otherwise (PATCH) the given
 * fields are laid over the stored line. The key never changes: it is the line's identity across
 * editions.
 */
export const updateLineInputSchema = z.preprocess(
  (raw) => {
    const full = raw !== null && typeof raw === "object" && ["true", true, "on"].includes((raw as Record<string, unknown>).full as string);
    const input = normaliseLineInput(raw, { fill: full });
    return input !== null && typeof input === "object" ? { ...(input as Record<string, unknown>), full } : input;
  },
  z.looseObject({ editionId: id("The edition"), lineId: id("The line"), full: z.boolean().default(false), standardCost: costText }),
);

// ─── Reading ───────────────────────────────────────────────────────────────────

/** Drivers and contractors read lines only through their assigned vehicles and jobs. */
function requireWholeStandards(user: SignedIn): void {
  if (isScoped(user, "read", "Standard")) throw forbidden("Your role sees standard lines only through assigned vehicles and jobs");
}

export const listStandardsQuery = query({
  name: "standard.list",
  input: z.object({}).passthrough(),
  permission: ["read", "Standard"],
  run: async ({ user }) => {
    requireWholeStandards(user);
    return { items: await listStandards(db(), user.orgId) };
  },
});

export const getStandard = query({
  name: "standard.read",
  input: z.object({ id: id("The standard") }),
  permission: ["read", "Standard"],
  run: async ({ user, input }) => {
    requireWholeStandards(user);
    const standard = await findStandard(db(), user.orgId, input.id);
    if (!standard) throw notFound("That standard");
    return standard;
  },
});

/** Line keys a contractor's firm has in jobs (offered or awarded) on vehicles of this edition. */
async function contractorLineKeys(user: SignedIn, editionId: string): Promise<Set<string>> {
  const firm = user.firmId ?? "__none__";
  const rows = await db()
    .selectDistinct({ key: jobLines.lineKey })
    .from(jobLines)
    .innerJoin(jobs, eq(jobs.id, jobLines.jobId))
    .innerJoin(vehicles, eq(vehicles.id, jobs.vehicleId))
    .where(
      and(
        eq(jobs.orgId, user.orgId),
        eq(vehicles.editionId, editionId),
        sql`(${jobs.awardedFirmId} = ${firm} or ${jobs.id} in (select ${jobOffers.jobId} from ${jobOffers} where ${jobOffers.firmId} = ${firm}))`,
      ),
    );
  return new Set(rows.map((r) => r.key).filter((k): k is string => k !== null));
}

export const getEdition = query({
  name: "edition.read",
  input: z.object({ id: id("The edition") }),
  permission: ["read", "Standard"],
  run: async ({ user, input }) => {
    const found = await findEdition(db(), user.orgId, input.id);
    if (!found) throw notFound("That edition");
    let lines = await loadEditionLines(db(), found.edition.id);
    const scoped = isScoped(user, "read", "Standard");
    if (scoped) {
      // Only through an assigned vehicle on this edition; otherwise it does not exist for them.
      const [assigned] = await db()
        .select({ id: vehicles.id })
        .from(vehicles)
        .where(and(vehicleScope(user), eq(vehicles.editionId, found.edition.id)))
        .limit(1);
      if (!assigned) throw notFound("That edition");
      if (user.role === "driver") lines = lines.filter((l) => l.checkable);
      else {
        const keys = await contractorLineKeys(user, found.edition.id);
        lines = lines.filter((l) => keys.has(l.key));
      }
      const kept = new Set(lines.map((l) => l.id));
      lines = lines.map((l) => ({ ...l, dependsOn: l.dependsOn.filter((d) => kept.has(d)) }));
    }
    const siblings = scoped
      ? []
      : await db()
          .select({ id: editions.id, number: editions.number, status: editions.status })
          .from(editions)
          .where(and(eq(editions.orgId, user.orgId), eq(editions.standardId, found.standard.id)))
          .orderBy(asc(editions.number));
    const [fleet] = scoped
      ? [{ n: 0 }]
      : await db()
          .select({ n: sql<number>`count(*)` })
          .from(vehicles)
          .where(and(eq(vehicles.orgId, user.orgId), eq(vehicles.editionId, found.edition.id)));
    let warnings: { code: string; lineId: string; message: string }[] = [];
    if (!scoped && lines.length > 0) {
      try {
        // A must-not-fit line is never fitted, so it needs no alignment after it.
        const prohibited = new Set(lines.filter((l) => l.requirement === "must_not_fit").map((l) => l.id));
        warnings = sequenceWarnings(lines.map(sequenceLine))
          .filter((w) => !prohibited.has(w.line.id))
          .map((w) => ({ code: w.code, lineId: w.line.id, message: w.message }));
      } catch {
        warnings = []; // a draft with a circle is reported when it is saved or published
      }
    }
    return {
      edition: {
        id: found.edition.id,
        number: found.edition.number,
        status: found.edition.status,
        notes: found.edition.notes,
        publishedAt: found.edition.publishedAt,
        copiedFromId: found.edition.copiedFromId,
        createdAt: found.edition.createdAt,
      },
      standard: { id: found.standard.id, name: found.standard.name, description: found.standard.description },
      lines,
      siblings,
      vehicleCount: fleet?.n ?? 0,
      warnings,
    };
  },
});

function sequenceLine(line: EditionLine) {
  return { id: line.id, label: `${line.code} ${line.title}`, category: line.category, dependsOn: line.dependsOn, met: false, kind: sequenceKindOf(line) };
}

export const compareEditionsQuery = query({
  name: "edition.compare",
  input: z.object({ a: id("The first edition"), b: id("The second edition") }),
  permission: ["read", "Standard"],
  run: async ({ user, input }) => {
    requireWholeStandards(user);
    const [a, b] = await Promise.all([findEdition(db(), user.orgId, input.a), findEdition(db(), user.orgId, input.b)]);
    if (!a) throw notFound("The first edition");
    if (!b) throw notFound("The second edition");
    const [linesA, linesB] = await Promise.all([loadEditionLines(db(), a.edition.id), loadEditionLines(db(), b.edition.id)]);
    const comparison = compareLines(linesA, linesB);
    const describe = (e: NonNullable<typeof a>) => ({ id: e.edition.id, number: e.edition.number, status: e.edition.status, standardId: e.standard.id, standardName: e.standard.name });
    // Dependencies compare as keys: name each key by its code (the newer edition's, if both have it).
    const codes = Object.fromEntries([...linesA, ...linesB].map((l) => [l.key, l.code]));
    return { a: describe(a), b: describe(b), ...comparison, codes };
  },
});

// ─── Standards and drafts ──────────────────────────────────────────────────────

const text = (label: string, max: number) =>
  z.string({ error: `${label} is required` }).trim().min(1, { error: `${label} is required` }).max(max, { error: `${label} must be at most ${max} characters` });
const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, { error: `at most ${max} characters` })
    .optional()
    .transform((v) => (v ? v : null));

export const createStandard = command({
  name: "standard.create",
  input: z.object({ name: text("Name", 120), description: optionalText(1000) }),
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit }) => {
    const clash = await tx.query.standards.findFirst({ where: and(eq(standards.orgId, user.orgId), eq(standards.name, input.name)) });
    if (clash) throw new AppError("conflict", "A standard with that name already exists", [{ field: "name", message: `"${input.name}" is already a standard` }]);
    const [standard] = await tx.insert(standards).values({ orgId: user.orgId, name: input.name, description: input.description }).returning();
    const [edition] = await tx.insert(editions).values({ orgId: user.orgId, standardId: standard!.id, number: 1, status: "draft" }).returning();
    await audit({ action: "standard.create", entityType: "standard", entityId: standard!.id, after: { name: input.name, description: input.description } });
    await audit({ action: "edition.create_draft", entityType: "edition", entityId: edition!.id, after: { standardId: standard!.id, number: 1 } });
    return { id: standard!.id, editionId: edition!.id };
  },
});

async function insertLines(tx: DbOrTx, orgId: string, editionId: string, lines: EditionLine[]): Promise<void> {
  if (lines.length === 0) return;
  await tx.insert(editionLines).values(
    lines.map((l, i) => ({
      id: l.id,
      orgId,
      editionId,
      key: l.key,
      code: l.code,
      category: l.category,
      title: l.title,
      requirement: l.requirement,
      quantity: l.quantity,
      massKg: l.massKg,
      xMm: l.xMm,
      zone: l.zone,
      massKind: l.massKind,
      criteria: l.criteria,
      evidenceNeeded: l.evidenceNeeded,
      standardCostCents: l.standardCostCents,
      checkable: l.checkable,
      expiryMonths: l.expiryMonths,
      sortOrder: (i + 1) * 10,
    })),
  );
  const deps = lines.flatMap((l) => l.dependsOn.map((d) => ({ lineId: l.id, dependsOnLineId: d })));
  for (let i = 0; i < deps.length; i += 200) await tx.insert(lineDependencies).values(deps.slice(i, i + 200));
}

export const startDraft = command({
  name: "edition.create_draft",
  input: z.object({ standardId: id("The standard"), fromEditionId: optionalText(64) }),
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit }) => {
    const standard = await tx.query.standards.findFirst({ where: and(eq(standards.id, input.standardId), eq(standards.orgId, user.orgId)) });
    if (!standard) throw notFound("That standard");
    const all = await tx.select().from(editions).where(eq(editions.standardId, standard.id)).orderBy(asc(editions.number));
    const draft = all.find((e) => e.status === "draft");
    if (draft) throw conflict(`Edition ${draft.number} is already a draft. Edit it or publish it before starting another.`);
    const source = input.fromEditionId
      ? all.find((e) => e.id === input.fromEditionId)
      : [...all].reverse().find((e) => e.status === "published") ?? [...all].reverse()[0];
    if (input.fromEditionId && !source) throw notFound("The edition to copy");
    const number = await nextEditionNumber(tx, standard.id);
    const [edition] = await tx
      .insert(editions)
      .values({ orgId: user.orgId, standardId: standard.id, number, status: "draft", copiedFromId: source?.id ?? null, notes: source ? `Copied from edition ${source.number}.` : null })
      .returning();
    const copied = source ? copyEditionLines(await loadEditionLines(tx, source.id), () => crypto.randomUUID()) : [];
    await insertLines(tx, user.orgId, edition!.id, copied);
    await audit({
      action: "edition.create_draft",
      entityType: "edition",
      entityId: edition!.id,
      after: { standardId: standard.id, number, copiedFromId: source?.id ?? null, lines: copied.length },
    });
    return { id: edition!.id, number, lines: copied.length };
  },
});

// ─── Editing a draft's lines ───────────────────────────────────────────────────

async function draftEdition(tx: DbOrTx, orgId: string, editionId: string) {
  const edition = await tx.query.editions.findFirst({ where: and(eq(editions.id, editionId), eq(editions.orgId, orgId)) });
  if (!edition) throw notFound("That edition");
  if (edition.status !== "draft") {
    throw conflict(`Edition ${edition.number} is ${edition.status}; a ${edition.status} edition never changes. Start a new draft to make changes.`);
  }
  return edition;
}

const label = (l: Pick<EditionLine, "code" | "title">) => `${l.code} "${l.title}"`;

/** Refuses dependencies outside the edition and circles of dependencies, naming the lines. */
function checkDependencies(lines: EditionLine[], changedId: string): void {
  try {
    validateDependencies(lines);
  } catch (error) {
    if (error instanceof EditionCycleError) {
      throw new AppError("validation_failed", error.message, [{ field: "dependsOn", message: error.message }]);
    }
    if (error instanceof InputError) {
      const at = /^lines\.(\d+)\./.exec(error.field);
      const line = at ? lines[Number(at[1])] : undefined;
      const field = line && line.id !== changedId ? `lines.${line.code}` : error.field.includes("dependsOn") ? "dependsOn" : error.field;
      throw new AppError("validation_failed", error.message, [{ field, message: error.message }]);
    }
    throw error;
  }
}

async function checkCodeFree(tx: DbOrTx, editionId: string, code: string, exceptId?: string) {
  const clash = await tx.query.editionLines.findFirst({
    where: and(eq(editionLines.editionId, editionId), eq(editionLines.code, code), exceptId ? ne(editionLines.id, exceptId) : undefined),
  });
  if (clash) throw new AppError("conflict", `Code ${code} is already used in this edition`, [{ field: "code", message: `${code} is already "${clash.title}"` }]);
}

function lineColumns(line: EditionLineInput) {
  return {
    code: line.code,
    category: line.category,
    title: line.title,
    requirement: line.requirement,
    quantity: line.quantity,
    massKg: line.massKg,
    xMm: line.xMm,
    zone: line.zone,
    massKind: line.massKind,
    criteria: line.criteria,
    evidenceNeeded: line.evidenceNeeded,
    standardCostCents: line.standardCostCents,
    checkable: line.checkable,
    expiryMonths: line.expiryMonths,
  };
}

async function writeDependencies(tx: DbOrTx, lineId: string, dependsOn: string[]) {
  await tx.delete(lineDependencies).where(eq(lineDependencies.lineId, lineId));
  if (dependsOn.length > 0) await tx.insert(lineDependencies).values(dependsOn.map((d) => ({ lineId, dependsOnLineId: d })));
}

export const addLine = command({
  name: "edition.line_add",
  input: addLineInputSchema,
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit }) => {
    const { editionId, standardCost: _cost, ...line } = input;
    const edition = await draftEdition(tx, user.orgId, editionId);
    await checkCodeFree(tx, edition.id, line.code);
    const existing = await loadEditionLines(tx, edition.id);
    if (existing.some((l) => l.key === line.key)) throw new AppError("conflict", `Key ${line.key} is already used in this edition`, [{ field: "key", message: "Choose another key" }]);
    const newId = crypto.randomUUID();
    checkDependencies([...existing, { ...line, id: newId }], newId);
    await tx.insert(editionLines).values({ id: newId, orgId: user.orgId, editionId: edition.id, key: line.key, sortOrder: await nextSortOrder(tx, edition.id), ...lineColumns(line) });
    await writeDependencies(tx, newId, line.dependsOn);
    await audit({ action: "edition.line_add", entityType: "edition_line", entityId: newId, after: { editionId: edition.id, ...line } });
    return { id: newId, key: line.key, editionId: edition.id };
  },
});

export const updateLine = command({
  name: "edition.line_update",
  input: updateLineInputSchema,
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit }) => {
    const { editionId, lineId, full, standardCost: _cost, ...given } = input;
    const edition = await draftEdition(tx, user.orgId, editionId);
    const existing = await loadEditionLines(tx, edition.id);
    const before = existing.find((l) => l.id === lineId);
    if (!before) throw notFound("That line");
    const { id: _id, key: _key, ...stored } = before;
    const parsed = editionLineInputSchema.safeParse({ ...(full ? {} : stored), ...given, key: before.key });
    if (!parsed.success) throw new AppError("validation_failed", "Some fields need attention", zodDetails(parsed.error));
    const fields = parsed.data;
    await checkCodeFree(tx, edition.id, fields.code, lineId);
    const after: EditionLine = { ...fields, id: lineId, key: before.key };
    checkDependencies(existing.map((l) => (l.id === lineId ? after : l)), lineId);
    await tx.update(editionLines).set(lineColumns(fields)).where(eq(editionLines.id, lineId));
    await writeDependencies(tx, lineId, fields.dependsOn);
    await audit({ action: "edition.line_update", entityType: "edition_line", entityId: lineId, before, after });
    return { id: lineId, key: before.key, editionId: edition.id };
  },
});

export const deleteLine = command({
  name: "edition.line_delete",
  input: z.object({ editionId: id("The edition"), lineId: id("The line") }),
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit }) => {
    const edition = await draftEdition(tx, user.orgId, input.editionId);
    const existing = await loadEditionLines(tx, edition.id);
    const line = existing.find((l) => l.id === input.lineId);
    if (!line) throw notFound("That line");
    const dependents = existing.filter((l) => l.dependsOn.includes(line.id));
    if (dependents.length > 0) {
      // Name each dependent line: in full when there are one or two, by code when there are more.
      const names = dependents.length <= 2 ? dependents.map(label).join(" and ") : `${dependents.length} lines (${dependents.map((d) => d.code).join(", ")})`;
      throw new AppError(
        "conflict",
        `${label(line)} cannot be deleted: ${names} ${dependents.length === 1 ? "depends" : "depend"} on it. Remove that dependency first.`,
        dependents.map((d) => ({ field: "lineId", message: `${label(d)} depends on ${label(line)}` })),
      );
    }
    await tx.delete(editionLines).where(eq(editionLines.id, line.id));
    await audit({ action: "edition.line_delete", entityType: "edition_line", entityId: line.id, before: line });
    return { id: line.id, editionId: edition.id };
  },
});

// ─── Publishing and retiring ───────────────────────────────────────────────────

export const publishEdition = command({
  name: "edition.publish",
  input: z.object({ id: id("The edition") }),
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit, now }) => {
    const edition = await draftEdition(tx, user.orgId, input.id);
    const lines = await loadEditionLines(tx, edition.id);
    if (lines.length === 0) throw conflict(`Edition ${edition.number} has no lines yet; add the lines it asks for before publishing it.`);
    checkDependencies(lines, "");
    // Guarded on the draft status, so two managers publishing at once give one result.
    const updated = await tx
      .update(editions)
      .set({ status: "published", publishedAt: now, publishedBy: user.userId })
      .where(and(eq(editions.id, edition.id), eq(editions.status, "draft")))
      .returning({ id: editions.id });
    if (updated.length === 0) throw conflict(`Edition ${edition.number} was published by someone else a moment ago.`);
    await audit({ action: "edition.publish", entityType: "edition", entityId: edition.id, before: { status: "draft" }, after: { status: "published", lines: lines.length } });
    return { id: edition.id, number: edition.number, status: "published" as const, lines: lines.length };
  },
});

export const retireEdition = command({
  name: "edition.retire",
  input: z.object({ id: id("The edition") }),
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit }) => {
    const edition = await tx.query.editions.findFirst({ where: and(eq(editions.id, input.id), eq(editions.orgId, user.orgId)) });
    if (!edition) throw notFound("That edition");
    if (edition.status !== "published") {
      throw conflict(
        edition.status === "draft"
          ? `Edition ${edition.number} is a draft; only a published edition can be retired.`
          : `Edition ${edition.number} is already retired.`,
      );
    }
    const [inUse] = await tx.select({ n: sql<number>`count(*)` }).from(vehicles).where(eq(vehicles.editionId, edition.id));
    if ((inUse?.n ?? 0) > 0) {
      throw conflict(`${inUse!.n} ${inUse!.n === 1 ? "vehicle is" : "vehicles are"} still on edition ${edition.number}; roll another edition out to ${inUse!.n === 1 ? "it" : "them"} first.`);
    }
    await tx.update(editions).set({ status: "retired" }).where(eq(editions.id, edition.id));
    await audit({ action: "edition.retire", entityType: "edition", entityId: edition.id, before: { status: "published" }, after: { status: "retired" } });
    return { id: edition.id, status: "retired" as const };
  },
});

// ─── Roll-out ──────────────────────────────────────────────────────────────────

export const rolloutInputSchema = z.object({
  editionId: id("The edition"),
  vehicleIds: z
    .preprocess((v) => (typeof v === "string" ? [v] : v), z.array(id("A vehicle"), { error: "Choose the vehicles" }))
    .pipe(z.array(z.string()).min(1, { error: "Choose at least one vehicle" }).max(5000, { error: "At most 5,000 vehicles at once" })),
  dryRun: z
    .union([z.boolean(), z.enum(["true", "false"]).transform((v) => v === "true")], { error: "dryRun must be true or false" })
    .default(true),
});

async function rolloutPlan(user: SignedIn, editionId: string, vehicleIds: string[], now: Date, tx: DbOrTx) {
  const found = await findEdition(tx, user.orgId, editionId);
  if (!found) throw notFound("That edition");
  if (found.edition.status !== "published") {
    throw conflict(`Edition ${found.edition.number} is ${found.edition.status}; only a published edition can be rolled out to vehicles.`);
  }
  const unique = [...new Set(vehicleIds)];
  const [lines, loaded] = await Promise.all([loadEditionLines(tx, editionId), loadVariancesFor(tx, user, unique, now)]);
  const seen = new Set(loaded.map((v) => v.vehicleId));
  const missing = unique.filter((v) => !seen.has(v));
  if (missing.length > 0) {
    throw new AppError("validation_failed", `${missing.length === 1 ? "One vehicle was" : `${missing.length} vehicles were`} not found`, missing.map((m) => ({ field: "vehicleIds", message: `Vehicle ${m} was not found` })));
  }
  const newIdByKey = new Map(lines.map((l) => [l.key, l.id]));
  const preview = rolloutPreview({
    lines,
    now,
    vehicles: loaded.map((v) => {
      const currentIdByKey = new Map(v.lines.map((l) => [l.key, l.id]));
      // A fitment follows its key: to the current line, else straight to the new edition's line.
      const at = (key: string | null) => (key ? (currentIdByKey.get(key) ?? newIdByKey.get(key) ?? null) : null);
      const fitments: Fitment[] = v.fitments.map((f) => ({ ...f, lineId: at(f.lineKey) }));
      const concessions: Concession[] = v.concessionsByKey.flatMap((c) => {
        const lineId = at(c.lineKey);
        return lineId ? [{ lineId, reason: c.reason, expiresAt: c.expiresAt, approvedBy: c.approvedBy }] : [];
      });
      return { vehicleId: v.vehicleId, currentLines: v.editionId ? v.lines : null, fitments, concessions };
    }),
  });
  const currentEditions = await tx
    .select({ id: editions.id, number: editions.number, standardName: standards.name })
    .from(editions)
    .innerJoin(standards, eq(standards.id, editions.standardId))
    .where(and(eq(editions.orgId, user.orgId), inArray(editions.id, [...new Set(loaded.map((v) => v.editionId).filter((x): x is string => x !== null))].concat(["__none__"]))));
  const editionLabel = new Map(currentEditions.map((e) => [e.id, `${e.standardName}, edition ${e.number}`]));
  const byVehicle = new Map(loaded.map((v) => [v.vehicleId, v]));
  return {
    edition: { id: found.edition.id, number: found.edition.number, standardName: found.standard.name },
    totals: preview.totals,
    vehicles: preview.vehicles.map((p) => {
      const v = byVehicle.get(p.vehicleId)!;
      return {
        ...p,
        fleetNumber: v.fleetNumber,
        currentEditionId: v.editionId,
        currentEdition: v.editionId ? (editionLabel.get(v.editionId) ?? null) : null,
      };
    }),
  };
}

/** What a roll-out would add (a read: nothing is written). */
export const previewRollout = query({
  name: "edition.rollout_preview",
  input: rolloutInputSchema,
  permission: ["manage", "Standard"],
  run: async ({ user, input, now }) => ({ dryRun: true, assigned: 0, ...(await rolloutPlan(user, input.editionId, input.vehicleIds, now, db())) }),
});

/** Assigns the edition to the vehicles, all in one transaction, one audit entry per vehicle. */
export const confirmRollout = command({
  name: "edition.rollout",
  input: rolloutInputSchema,
  permission: ["manage", "Standard"],
  run: async ({ user, input, tx, audit, now }) => {
    const plan = await rolloutPlan(user, input.editionId, input.vehicleIds, now, tx);
    const ids = plan.vehicles.map((v) => v.vehicleId);
    for (let i = 0; i < ids.length; i += 500) {
      await tx
        .update(vehicles)
        .set({ editionId: input.editionId, version: sql`${vehicles.version} + 1` })
        .where(and(eq(vehicles.orgId, user.orgId), inArray(vehicles.id, ids.slice(i, i + 500))));
    }
    for (const v of plan.vehicles) {
      await audit({ action: "vehicle.assign_edition", entityType: "vehicle", entityId: v.vehicleId, before: { editionId: v.currentEditionId }, after: { editionId: input.editionId }, reason: `Roll-out of ${plan.edition.standardName}, edition ${plan.edition.number}` });
    }
    await audit({ action: "edition.rollout", entityType: "edition", entityId: input.editionId, after: { vehicles: ids.length, totals: plan.totals } });
    return { dryRun: false, assigned: ids.length, ...plan };
  },
});

export const rolloutOperation = (dryRun: boolean) => (dryRun ? previewRollout : confirmRollout);
