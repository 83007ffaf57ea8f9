import { InputError } from "@/lib/errors";
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

export function fleetVariance(vehicles: readonly FleetVehicleInput[]): FleetVariance {
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
    if (input === null || typeof input !== "object") throw new InputError(field, `${field} must be a vehicle`);
    if (typeof input.vehicleId !== "string" || input.vehicleId === "") {
      throw new InputError(`${field}.vehicleId`, `${field}.vehicleId must be non-empty text`);
    }
    if (seen.has(input.vehicleId)) {
      throw new InputError(`${field}.vehicleId`, `vehicle ${input.vehicleId} appears twice`);
    }
    seen.add(input.vehicleId);
    const depotId = input.depotId ?? null;
    const platformId = input.platformId ?? null;
    let status: VehicleVarianceStatus = "no_edition";
    let cost = { costCents: 0, massKg: 0 };
    if (input.variance !== null && input.variance !== undefined) {
      checkVariance(`${field}.variance`, input.variance);
      const v = input.variance;
      status = varianceStatus(v);
      cost = costToClose(v);
      const s = v.summary;
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
      costToCloseCents: cost.costCents,
      massToCloseKg: Math.round(cost.massKg * 1000) / 1000,
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
