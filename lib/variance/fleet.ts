import { InputError, requireNonNegative } from "@/lib/errors";
import { emptySummary } from "./variance";
import type { VarianceSummary, VehicleVariance, VehicleVarianceStatus } from "./types";

/**
 * Fleet-wide roll-up of vehicle variances.
 *
 * Rigline rules:
 * - A vehicle fully meets its standard when no line is short, off_spec, unproven or
 *   prohibited_fitted. Concessions and extras do not stop it meeting.
 * - A vehicle with no edition assigned is "no_edition": it is left out of the share (there is
 *   nothing to meet) and counted on its own, so a share is never diluted or inflated by it.
 * - Cost to close = the standard cost of every short and off_spec line (a line's standard cost
 *   covers its whole quantity). Mass to close = massKg × missing quantity of every short line.
 */

export type FleetVehicleInput = {
  vehicleId: string;
  depotId: string | null;
  platformId: string | null;
  /** The vehicle's variance, or null/undefined when it has no edition assigned. */
  variance?: VehicleVariance | null;
};

export type ShareOfFleet = {
  vehicles: number;
  withEdition: number;
  noEdition: number;
  fullyMeeting: number;
  /** fullyMeeting ÷ withEdition, 0 to 1; null when no vehicle in the group has an edition. */
  shareFullyMeeting: number | null;
  costToCloseCents: number;
  massToCloseKg: number;
};

export type FleetVehicleResult = {
  vehicleId: string;
  depotId: string | null;
  platformId: string | null;
  status: VehicleVarianceStatus;
  costToCloseCents: number;
  massToCloseKg: number;
};

export type FleetVariance = {
  overall: ShareOfFleet;
  byDepot: (ShareOfFleet & { depotId: string | null })[];
  byPlatform: (ShareOfFleet & { platformId: string | null })[];
  /** Line counts by status summed over every vehicle with an edition (extras are fitments). */
  statusCounts: VarianceSummary;
  vehicleStatusCounts: Record<VehicleVarianceStatus, number>;
  vehicles: FleetVehicleResult[];
};

function fullyMeets(s: VarianceSummary): boolean {
  return s.short === 0 && s.offSpec === 0 && s.unproven === 0 && s.prohibitedFitted === 0;
}

/** The filter status of one vehicle: meets_standard, gaps, or no_edition. */
export function varianceStatus(variance: VehicleVariance | null | undefined): VehicleVarianceStatus {
  if (variance === null || variance === undefined) return "no_edition";
  return fullyMeets(variance.summary) ? "meets_standard" : "gaps";
}

/** Cost and mass to close one vehicle's gaps. */
export function costToClose(variance: VehicleVariance): { costCents: number; massKg: number } {
  let costCents = 0;
  let massKg = 0;
  for (const line of variance.lines) {
    if (line.status === "short") {
      costCents += line.standardCostCents;
      massKg += line.massKg * line.missingQuantity;
    } else if (line.status === "off_spec") {
      costCents += line.standardCostCents;
    }
  }
  return { costCents, massKg };
}

function emptyShare(): ShareOfFleet {
  return {
    vehicles: 0,
    withEdition: 0,
    noEdition: 0,
    fullyMeeting: 0,
    shareFullyMeeting: null,
    costToCloseCents: 0,
    massToCloseKg: 0,
  };
}

function add(share: ShareOfFleet, v: FleetVehicleResult): void {
  share.vehicles += 1;
  if (v.status === "no_edition") share.noEdition += 1;
  else share.withEdition += 1;
  if (v.status === "meets_standard") share.fullyMeeting += 1;
  share.costToCloseCents += v.costToCloseCents;
  share.massToCloseKg += v.massToCloseKg;
}

function finish(share: ShareOfFleet): void {
  share.shareFullyMeeting = share.withEdition === 0 ? null : share.fullyMeeting / share.withEdition;
  // Sums of decimal kilograms drift in binary floating point; report to the gram.
  share.massToCloseKg = Math.round(share.massToCloseKg * 1000) / 1000;
}

function checkVariance(field: string, v: unknown): asserts v is VehicleVariance {
  const s = (v as VehicleVariance | null)?.summary;
  if (typeof v !== "object" || v === null || typeof s !== "object" || s === null || !Array.isArray((v as VehicleVariance).lines)) {
    throw new InputError(field, `${field} must be a vehicle variance or null`);
  }
}

/**
 * One vehicle's figures as the fleet roll-up adds them: judged just now, or read back from a
 * stored summary of the same judgement.
 */
export type FleetVehicleFigures = {
  vehicleId: string;
  depotId: string | null;
  platformId: string | null;
  /** Line counts by status, or null when the vehicle has no edition assigned. */
  summary: VarianceSummary | null;
  costToCloseCents: number;
  /** Mass to close, already rounded to the gram. */
  massToCloseKg: number;
};

/** The status, counts and cost of one vehicle's variance (null: no edition assigned). */
export function vehicleFigures(variance: VehicleVariance | null | undefined): Omit<FleetVehicleFigures, "vehicleId" | "depotId" | "platformId"> & {
  status: VehicleVarianceStatus;
} {
  if (variance === null || variance === undefined) return { status: "no_edition", summary: null, costToCloseCents: 0, massToCloseKg: 0 };
  const cost = costToClose(variance);
  return {
    status: varianceStatus(variance),
    summary: variance.summary,
    costToCloseCents: cost.costCents,
    massToCloseKg: Math.round(cost.massKg * 1000) / 1000,
  };
}

/** The filter status from a vehicle's line counts alone (null: no edition assigned). */
export function statusOfSummary(summary: VarianceSummary | null): VehicleVarianceStatus {
  if (summary === null) return "no_edition";
  return fullyMeets(summary) ? "meets_standard" : "gaps";
}

function checkVehicleId(field: string, input: { vehicleId?: unknown } | null, seen: Set<string>): void {
  if (input === null || typeof input !== "object") throw new InputError(field, `${field} must be a vehicle`);
  if (typeof input.vehicleId !== "string" || input.vehicleId === "") {
    throw new InputError(`${field}.vehicleId`, `${field}.vehicleId must be non-empty text`);
  }
  if (seen.has(input.vehicleId)) {
    throw new InputError(`${field}.vehicleId`, `vehicle ${input.vehicleId} appears twice`);
  }
  seen.add(input.vehicleId);
}

export function fleetVariance(vehicles: readonly FleetVehicleInput[]): FleetVariance {
  if (!Array.isArray(vehicles as unknown)) throw new InputError("vehicles", "vehicles must be a list");
  const seen = new Set<string>();
  const figures = vehicles.map((input, i): FleetVehicleFigures => {
    const field = `vehicles.${i}`;
    checkVehicleId(field, input, seen);
    if (input.variance !== null && input.variance !== undefined) checkVariance(`${field}.variance`, input.variance);
    const { summary, costToCloseCents, massToCloseKg } = vehicleFigures(input.variance);
    return { vehicleId: input.vehicleId, depotId: input.depotId ?? null, platformId: input.platformId ?? null, summary, costToCloseCents, massToCloseKg };
  });
  return rollUpFleet(figures, false);
}

/**
 * The fleet roll-up from each vehicle's figures (fleetVariance judges them first; the fleet view
 * reads them from stored summaries). The same figures give the same result either way.
 */
export function rollUpFleet(vehicles: readonly FleetVehicleFigures[], check = true): FleetVariance {
  if (!Array.isArray(vehicles as unknown)) throw new InputError("vehicles", "vehicles must be a list");
  const overall = emptyShare();
  const byDepot = new Map<string | null, ShareOfFleet>();
  const byPlatform = new Map<string | null, ShareOfFleet>();
  const statusCounts = emptySummary();
  const vehicleStatusCounts: Record<VehicleVarianceStatus, number> = { meets_standard: 0, gaps: 0, no_edition: 0 };
  const seen = new Set<string>();
  const results: FleetVehicleResult[] = [];

  vehicles.forEach((input, i) => {
    const field = `vehicles.${i}`;
    if (check) {
      checkVehicleId(field, input, seen);
      requireNonNegative(`${field}.costToCloseCents`, input.costToCloseCents);
      requireNonNegative(`${field}.massToCloseKg`, input.massToCloseKg);
    }
    const depotId = input.depotId ?? null;
    const platformId = input.platformId ?? null;
    const status = statusOfSummary(input.summary);
    const s = input.summary;
    if (s !== null) {
      statusCounts.meets += s.meets;
      statusCounts.short += s.short;
      statusCounts.offSpec += s.offSpec;
      statusCounts.unproven += s.unproven;
      statusCounts.concession += s.concession;
      statusCounts.prohibitedFitted += s.prohibitedFitted;
      statusCounts.extra += s.extra;
    }
    vehicleStatusCounts[status] += 1;
    const result: FleetVehicleResult = {
      vehicleId: input.vehicleId,
      depotId,
      platformId,
      status,
      costToCloseCents: input.costToCloseCents,
      massToCloseKg: input.massToCloseKg,
    };
    results.push(result);
    add(overall, result);
    let d = byDepot.get(depotId);
    if (!d) byDepot.set(depotId, (d = emptyShare()));
    add(d, result);
    let p = byPlatform.get(platformId);
    if (!p) byPlatform.set(platformId, (p = emptyShare()));
    add(p, result);
  });

  finish(overall);
  for (const s of byDepot.values()) finish(s);
  for (const s of byPlatform.values()) finish(s);
  return {
    overall,
    byDepot: [...byDepot].map(([depotId, s]) => ({ depotId, ...s })),
    byPlatform: [...byPlatform].map(([platformId, s]) => ({ platformId, ...s })),
    statusCounts,
    vehicleStatusCounts,
    vehicles: results,
  };
}
