import "server-only";
import { and, eq } from "drizzle-orm";
import { z } from "zod";
import { PLATFORM_FIGURES, missingRatings, platformName, type PlatformFigureKey } from "@/components/platforms/figures";
import { db, type DbOrTx } from "@/db/client";
import { findPlatform, listPlatformsWithUse, type PlatformRow } from "@/db/platforms";
import { platforms } from "@/db/schema";
import { InputError } from "@/lib/errors";
import { AppError, notFound, type ErrorDetail } from "@/lib/server/errors";
import { command, query } from "@/lib/server/operation";
import { parseTyreSize } from "@/lib/tyres";

const nf = new Intl.NumberFormat("en-AU", { maximumFractionDigits: 1 });
const kg = (n: number) => `${nf.format(n)} kg`;

/**
 * A number typed in a form or sent as JSON: "" and null clear it, "3,100" is 3100; absent
 * means "leave as it is" (for PATCH).
 */
const figure = (label: string, unit: string) =>
  z
    .union([z.number(), z.string(), z.null()], { error: `${label} must be a number in ${unit}` })
    .transform((v, ctx) => {
      if (v === null) return null;
      if (typeof v === "string") {
        const text = v.replace(/[,\s]/g, "");
        if (text === "") return null;
        v = Number(text);
      }
      if (!Number.isFinite(v)) {
        ctx.addIssue({ code: "custom", message: `${label} must be a number in ${unit}` });
        return z.NEVER;
      }
      return v;
    })
    .optional();

const nameText = (label: string, max: number) =>
  z
    .string({ error: `${label} is required` })
    .trim()
    .min(1, { error: `${label} is required` })
    .max(max, { error: `${label} is too long (at most ${max} characters)` });

const figureShape = Object.fromEntries(PLATFORM_FIGURES.map((f) => [f.key, figure(f.label, f.unit)])) as Record<
  PlatformFigureKey,
  ReturnType<typeof figure>
>;

const tyreSizeField = z
  .union([z.string(), z.null()])
  .transform((v) => (v === null || v.trim() === "" ? null : v.trim()))
  .optional();

/** Input of POST /api/platforms: every maker's figure of the platform. */
export const platformCreateSchema = z.object({
  make: nameText("Make", 60),
  model: nameText("Model", 60),
  variant: z.string().trim().max(80, { error: "Variant is too long (at most 80 characters)" }).optional().default(""),
  standardTyreSize: tyreSizeField,
  ...figureShape,
});

/** Input of PATCH /api/platforms/{id}: any subset of the same fields. */
export const platformPatchSchema = z.object({
  id: z.string().min(1).max(64),
  make: nameText("Make", 60).optional(),
  model: nameText("Model", 60).optional(),
  variant: z.string().trim().max(80, { error: "Variant is too long (at most 80 characters)" }).optional(),
  standardTyreSize: tyreSizeField,
  ...figureShape,
});

export type PlatformValues = Pick<PlatformRow, "make" | "model" | "variant" | "standardTyreSize" | PlatformFigureKey>;

/**
 * The maker's figures must agree with each other. Every present mass is positive (zero only
 * where it means "none allowed"); the axle ratings together carry at least the GVM; the GVM is
 * above the kerb mass; the GCM is at least the GVM. With `complete`, every rating is required.
 * Returns the problems with the field each belongs to; empty when the figures are sound.
 */
export function platformProblems(values: PlatformValues, options: { complete: boolean }): ErrorDetail[] {
  const problems: ErrorDetail[] = [];
  const add = (field: string, message: string) => problems.push({ field, message });
  for (const f of PLATFORM_FIGURES) {
    const v = values[f.key];
    if (v === null || v === undefined) {
      if (options.complete && f.rating) add(f.key, `${f.label} is required`);
      continue;
    }
    if (f.zeroAllowed ? v < 0 : v <= 0) {
      add(f.key, f.zeroAllowed ? `${f.label} cannot be negative` : `${f.label} must be more than 0 ${f.unit}`);
    } else if (v > 100_000) {
      add(f.key, `${f.label} of ${nf.format(v)} ${f.unit} is not a believable figure`);
    }
  }
  if (problems.length > 0) return problems;
  const { kerbMassKg: kerb, kerbFrontKg: kerbFront, gvmKg: gvm, gcmKg: gcm, frontAxleRatingKg: front, rearAxleRatingKg: rear } = values;
  if (front !== null && rear !== null && gvm !== null && front + rear < gvm) {
    const message = `The axle ratings add up to ${kg(front + rear)}, below the GVM of ${kg(gvm)}`;
    add("frontAxleRatingKg", message);
    add("rearAxleRatingKg", message);
  }
  if (gvm !== null && kerb !== null && gvm <= kerb) add("gvmKg", `The GVM of ${kg(gvm)} must be above the kerb mass of ${kg(kerb)}`);
  if (gcm !== null && gvm !== null && gcm < gvm) add("gcmKg", `The GCM of ${kg(gcm)} is below the GVM of ${kg(gvm)}; it must be at least the GVM`);
  if (kerbFront !== null && kerb !== null && kerbFront >= kerb) {
    add("kerbFrontKg", `The front axle's share of ${kg(kerbFront)} must be less than the kerb mass of ${kg(kerb)}`);
  }
  if (kerbFront !== null && front !== null && kerbFront > front) {
    add("kerbFrontKg", `The front axle already carries ${kg(kerbFront)} at kerb, above its rating of ${kg(front)}`);
  }
  if (values.towballLimitKg !== null && values.towingCapacityKg !== null && values.towballLimitKg > values.towingCapacityKg) {
    add("towballLimitKg", `The towball limit of ${kg(values.towballLimitKg)} is above the towing capacity of ${kg(values.towingCapacityKg)}`);
  }
  if (values.standardTyreSize !== null) {
    try {
      parseTyreSize(values.standardTyreSize, "standardTyreSize");
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      add("standardTyreSize", `Tyre size: ${error.message}`);
    }
  }
  return problems;
}

function normalisedTyreSize(size: string | null): string | null {
  return size === null ? null : parseTyreSize(size, "standardTyreSize").designation;
}

function refuseIfProblems(problems: ErrorDetail[]) {
  if (problems.length > 0) {
    const first = problems[0]!;
    throw new AppError("validation_failed", problems.length === 1 ? first.message : "Some figures need attention", problems);
  }
}

async function refuseDuplicateName(tx: DbOrTx, orgId: string, values: { make: string; model: string; variant: string }, exceptId?: string) {
  const clash = await tx.query.platforms.findFirst({
    where: and(eq(platforms.orgId, orgId), eq(platforms.make, values.make), eq(platforms.model, values.model), eq(platforms.variant, values.variant)),
  });
  if (clash && clash.id !== exceptId) {
    throw new AppError("conflict", `${platformName(values)} is already a platform`, [
      { field: "model", message: `${platformName(values)} is already in the list; edit that one instead` },
    ]);
  }
}

function view(p: PlatformRow & { vehicleCount: number }) {
  return { ...p, missingRatings: p.ratingsMissing ? missingRatings(p).map((f) => f.key) : [] };
}

export type PlatformView = ReturnType<typeof view>;

// ─── Reads ─────────────────────────────────────────────────────────────────────

export const listPlatforms = query({
  name: "platform.list",
  input: z.object({}).passthrough(),
  permission: ["read", "Platform"],
  run: async ({ user }) => (await listPlatformsWithUse(db(), user)).map(view),
});

export const getPlatform = query({
  name: "platform.read",
  input: z.object({ id: z.string().min(1).max(64) }),
  permission: ["read", "Platform"],
  run: async ({ user, input }) => {
    const found = await findPlatform(db(), user, input.id);
    if (!found) throw notFound("That platform");
    return view(found);
  },
});

// ─── Writes ────────────────────────────────────────────────────────────────────

const figuresOf = (input: Partial<Record<PlatformFigureKey, number | null | undefined>>) =>
  Object.fromEntries(PLATFORM_FIGURES.map((f) => [f.key, input[f.key] ?? null])) as Record<PlatformFigureKey, number | null>;

export const createPlatform = command({
  name: "platform.create",
  input: platformCreateSchema,
  permission: ["manage", "Platform"],
  run: async ({ user, input, tx, audit }) => {
    const values: PlatformValues = {
      make: input.make,
      model: input.model,
      variant: input.variant,
      standardTyreSize: input.standardTyreSize ?? null,
      ...figuresOf(input),
    };
    refuseIfProblems(platformProblems(values, { complete: true }));
    await refuseDuplicateName(tx, user.orgId, values);
    const [created] = await tx
      .insert(platforms)
      .values({ ...values, standardTyreSize: normalisedTyreSize(values.standardTyreSize), orgId: user.orgId, ratingsMissing: false })
      .returning();
    await audit({ action: "platform.create", entityType: "platform", entityId: created!.id, after: values });
    return { id: created!.id, name: platformName(created!) };
  },
});

export const updatePlatform = command({
  name: "platform.update",
  input: platformPatchSchema,
  permission: ["manage", "Platform"],
  run: async ({ user, input, tx, audit }) => {
    const before = await tx.query.platforms.findFirst({ where: and(eq(platforms.id, input.id), eq(platforms.orgId, user.orgId)) });
    if (!before) throw notFound("That platform");
    const merged: PlatformValues = {
      make: input.make ?? before.make,
      model: input.model ?? before.model,
      variant: input.variant ?? before.variant,
      standardTyreSize: input.standardTyreSize === undefined ? before.standardTyreSize : input.standardTyreSize,
      ...figuresOf(Object.fromEntries(PLATFORM_FIGURES.map((f) => [f.key, input[f.key] === undefined ? before[f.key] : input[f.key]]))),
    };
    // A platform that came in from an import may be saved with figures still missing; one
    // with full ratings may not lose them.
    refuseIfProblems(platformProblems(merged, { complete: !before.ratingsMissing }));
    await refuseDuplicateName(tx, user.orgId, merged, before.id);
    const ratingsMissing = missingRatings(merged).length > 0;
    const after = { ...merged, standardTyreSize: normalisedTyreSize(merged.standardTyreSize), ratingsMissing };
    await tx.update(platforms).set(after).where(eq(platforms.id, before.id));
    const changedBefore: Record<string, unknown> = {};
    const changedAfter: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(after)) {
      if (before[k as keyof PlatformRow] !== v) {
        changedBefore[k] = before[k as keyof PlatformRow];
        changedAfter[k] = v;
      }
    }
    await audit({ action: "platform.update", entityType: "platform", entityId: before.id, before: changedBefore, after: changedAfter });
    return { id: before.id, name: platformName(merged), ratingsMissing, ratingsCompleted: before.ratingsMissing && !ratingsMissing };
  },
});
