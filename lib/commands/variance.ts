import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { db } from "@/db/client";
import { depots, editions, platforms, standards } from "@/db/schema";
import { loadVehicleVariance, type LoadedVehicleVariance } from "@/db/variance";
import { loadFleetVarianceFigures } from "@/db/variance-summary";
import { buildOrder, type LineKind, type SequenceLine } from "@/lib/sequence";
import { varianceStatus, costToClose, type EditionLine, type LineStatus, type LineVariance } from "@/lib/variance";
import { notFound } from "@/lib/server/errors";
import { query } from "@/lib/server/operation";

/** Rigline's words for the line statuses (shown with a shape and a colour, never colour alone). */
export const STATUS_WORDS: Record<LineStatus, string> = {
  meets: "Meets",
  short: "Short",
  off_spec: "Off-spec",
  unproven: "Unproven",
  concession: "Concession",
  prohibited_fitted: "Prohibited item fitted",
  optional_absent: "Not fitted (optional)",
};

/**
 * What kind of step a line is for the build order (lib/sequence): an engineering sign-off gates
 * what depends on it; an alignment follows suspension and steering work; a tyre size is the
 * first decision (it sets the lift height).
 */
export function sequenceKindOf(line: Pick<EditionLine, "category" | "key" | "title" | "evidenceNeeded" | "criteria">): LineKind {
  if (line.category === "engineering") {
    if (/alignment/i.test(`${line.key} ${line.title}`)) return "alignment";
    if (line.evidenceNeeded.includes("engineering_signoff")) return "engineering";
    return "inspection";
  }
  if (line.category === "tyres" && line.criteria.some((c) => c.attribute === "tyreSize")) return "decision";
  return "fitting";
}

/** A line still needs work unless it meets, is covered by a concession, or is optional and absent. */
export function isDone(status: LineStatus): boolean {
  return status === "meets" || status === "concession" || status === "optional_absent";
}

/** The build order of what is left to do on a vehicle, from its edition's dependencies. */
export function remainingWork(lines: readonly EditionLine[], variance: readonly LineVariance[]) {
  const statusOf = new Map(variance.map((l) => [l.lineId, l.status]));
  const sequence: SequenceLine[] = lines.map((line) => ({
    id: line.id,
    label: `${line.code} ${line.title}`,
    category: line.category,
    dependsOn: line.dependsOn,
    met: isDone(statusOf.get(line.id) ?? "short"),
    kind: sequenceKindOf(line),
  }));
  return buildOrder(sequence);
}

function lineOut(line: LineVariance, edition: EditionLine | undefined, labels: Map<string, string>) {
  return {
    lineId: line.lineId,
    key: line.key,
    code: line.code,
    title: line.title,
    category: line.category,
    requirement: line.requirement,
    status: line.status,
    statusWord: STATUS_WORDS[line.status],
    failing: (line.failing ?? []).map((f) => ({
      attribute: f.criterion.attribute,
      label: f.criterion.label ?? f.criterion.attribute,
      op: f.criterion.op,
      expected: f.criterion.value,
      unit: f.criterion.unit ?? null,
      actual: f.actual,
      fitmentId: f.fitmentId,
    })),
    fittedQuantity: line.fittedQuantity,
    requiredQuantity: line.requiredQuantity,
    missingQuantity: line.missingQuantity,
    fitmentIds: [...line.fitmentIds],
    expiredFitmentIds: [...line.expiredFitmentIds],
    evidenceMissing: line.evidenceMissing ?? [],
    concession: line.concession ? { reason: line.concession.reason, expiresAt: line.concession.expiresAt } : null,
    concessionExpiredAt: line.concessionExpiredAt ?? null,
    massKg: line.massKg,
    standardCostCents: line.standardCostCents,
    checkable: edition?.checkable ?? false,
    expiryMonths: edition?.expiryMonths ?? null,
    dependsOn: (edition?.dependsOn ?? []).map((id) => ({ lineId: id, label: labels.get(id) ?? id })),
  };
}

export type VehicleVarianceView = NonNullable<Awaited<ReturnType<typeof vehicleVarianceView>>>;

/** The variance of one loaded vehicle as the API and the Spec check tab show it. */
export async function vehicleVarianceView(loaded: LoadedVehicleVariance) {
  const [editionRow] = loaded.editionId
    ? await db()
        .select({ id: editions.id, number: editions.number, status: editions.status, standardId: standards.id, standardName: standards.name })
        .from(editions)
        .innerJoin(standards, eq(standards.id, editions.standardId))
        .where(eq(editions.id, loaded.editionId))
        .limit(1)
    : [];
  const variance = loaded.variance;
  const byId = new Map(loaded.lines.map((l) => [l.id, l]));
  const labels = new Map(loaded.lines.map((l) => [l.id, `${l.code} ${l.title}`]));
  const order = variance ? remainingWork(loaded.lines, variance.lines) : null;
  const close = variance ? costToClose(variance) : { costCents: 0, massKg: 0 };
  return {
    vehicleId: loaded.vehicleId,
    editionId: loaded.editionId,
    edition: editionRow ?? null,
    status: varianceStatus(variance),
    summary: variance?.summary ?? null,
    costToCloseCents: close.costCents,
    massToCloseKg: Math.round(close.massKg * 1000) / 1000,
    lines: variance ? variance.lines.map((l) => lineOut(l, byId.get(l.lineId), labels)) : [],
    extras: variance?.extras ?? loaded.fitments.filter((f) => f.lineId === null).map((f) => ({ fitmentId: f.id, label: f.label })),
    buildOrder: order
      ? order.stages.map((stage) => ({
          stage: stage.index + 1,
          lines: stage.lines.map((l) => ({
            lineId: l.id,
            label: l.label,
            kind: l.kind,
            blocked: l.blocked,
            blockedBy: l.blockedBy.map((b) => ({ lineId: b.id, label: b.label })),
            awaitingSignOff: l.awaitingSignOff.map((b) => ({ lineId: b.id, label: b.label })),
          })),
        }))
      : [],
  };
}

export const getVehicleVariance = query({
  name: "variance.vehicle",
  input: z.object({ vehicleId: z.string().trim().min(1, { error: "The vehicle is required" }).max(64) }),
  permission: ["read", "Variance"],
  run: async ({ user, input, now }) => {
    // Drivers and contractors see only their assigned vehicles: vehicleScope inside the loader.
    const loaded = await loadVehicleVariance(db(), user, input.vehicleId, now);
    if (!loaded) throw notFound("That vehicle");
    return vehicleVarianceView(loaded);
  },
});

const optionalId = z
  .string()
  .trim()
  .max(64)
  .optional()
  .transform((v) => (v ? v : undefined));

export const getFleetVariance = query({
  name: "variance.fleet",
  input: z.object({ depotId: optionalId, platformId: optionalId, standardId: optionalId }),
  permission: ["read", "Variance"],
  run: async ({ user, input, now }) => {
    // Counts, status and cost per vehicle only: from the stored summaries (db/variance-summary.ts).
    const fleet = await loadFleetVarianceFigures(db(), user, input, now);
    const depotIds = [...new Set(fleet.byDepot.map((d) => d.depotId).filter((x): x is string => x !== null))];
    const platformIds = [...new Set(fleet.byPlatform.map((p) => p.platformId).filter((x): x is string => x !== null))];
    const [depotRows, platformRows] = await Promise.all([
      depotIds.length
        ? db().select({ id: depots.id, name: depots.name }).from(depots).where(and(eq(depots.orgId, user.orgId), inArray(depots.id, depotIds)))
        : [],
      platformIds.length
        ? db()
            .select({ id: platforms.id, make: platforms.make, model: platforms.model, variant: platforms.variant })
            .from(platforms)
            .where(and(eq(platforms.orgId, user.orgId), inArray(platforms.id, platformIds)))
            .orderBy(asc(platforms.make))
        : [],
    ]);
    const depotName = new Map(depotRows.map((d) => [d.id, d.name]));
    const platformName = new Map(platformRows.map((p) => [p.id, `${p.make} ${p.model}${p.variant ? ` ${p.variant}` : ""}`]));
    const worst = fleet.details
      .filter((d) => d.summary && d.status === "gaps")
      .map((d) => {
        const s = d.summary!;
        return {
          vehicleId: d.vehicleId,
          fleetNumber: d.fleetNumber,
          depotName: d.depotId ? (depotName.get(d.depotId) ?? null) : null,
          gaps: s.short + s.offSpec + s.unproven + s.prohibitedFitted,
          summary: s,
          costToCloseCents: d.costToCloseCents,
          massToCloseKg: d.massToCloseKg,
        };
      })
      .sort((a, b) => b.gaps - a.gaps || a.fleetNumber.localeCompare(b.fleetNumber));
    return {
      overall: fleet.overall,
      byDepot: fleet.byDepot
        .map((d) => ({ ...d, name: d.depotId ? (depotName.get(d.depotId) ?? "Unknown depot") : "No depot" }))
        .sort((a, b) => a.name.localeCompare(b.name)),
      byPlatform: fleet.byPlatform
        .map((p) => ({ ...p, name: p.platformId ? (platformName.get(p.platformId) ?? "Unknown platform") : "No platform" }))
        .sort((a, b) => a.name.localeCompare(b.name)),
      statusCounts: fleet.statusCounts,
      vehicleStatusCounts: fleet.vehicleStatusCounts,
      vehiclesWithGaps: worst,
    };
  },
});
