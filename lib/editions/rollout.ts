import { InputError } from "@/lib/errors";
import {
  vehicleVariance,
  type Concession,
  type EditionLine,
  type Fitment,
  type LineVariance,
  type Requirement,
} from "@/lib/variance";
import { indexEdition } from "./lines";

/**
 * What rolling a new edition out to a set of vehicles would add, before anyone commits to it.
 *
 * Rigline rules:
 * - Each vehicle's fitments and concessions point at lines of its current edition. They are
 *   carried to the new edition by line key (stable across editions); a fitment whose key the new
 *   edition does not have becomes an extra. A concession carries over too: it still covers its
 *   line until it expires.
 * - A short line under the new edition is work: its standard cost is counted, and for a must-fit
 *   line its mass × missing quantity is added mass (may-fit lines add no planned mass).
 * - Off-spec lines under the new edition (e.g. a raised tyre load index) are listed and costed
 *   on their own, so the short-line cost stays what it says.
 * - `alreadyShort` / `alreadyOffSpec` tell whether the vehicle has that gap under its current
 *   edition too, so the roll-out's own addition can be told apart.
 */

export type RolloutVehicleInput = {
  vehicleId: string;
  /** The vehicle's current edition lines; absent when it has none. */
  currentLines?: readonly EditionLine[] | null;
  fitments: readonly Fitment[];
  concessions: readonly Concession[];
};

export type RolloutInput = {
  lines: readonly EditionLine[];
  vehicles: readonly RolloutVehicleInput[];
  now: Date;
};

export type RolloutGap = {
  lineId: string;
  key: string;
  code: string;
  title: string;
  requirement: Requirement;
  missingQuantity: number;
  costCents: number;
  addedMassKg: number;
  /** The vehicle has the same gap (short, or off-spec) under its current edition. */
  already: boolean;
};

export type RolloutVehicle = {
  vehicleId: string;
  shortLines: RolloutGap[];
  offSpecLines: RolloutGap[];
  /** Standard cost of the short lines. */
  costCents: number;
  /** Standard cost of the off-spec lines (rework), reported apart from costCents. */
  offSpecCostCents: number;
  /** massKg × missing quantity of the short must-fit lines. */
  addedMassKg: number;
};

export type RolloutTotals = {
  vehicles: number;
  vehiclesWithShortLines: number;
  shortLines: number;
  /** Short lines that are short under the vehicle's current edition too. */
  alreadyShortLines: number;
  offSpecLines: number;
  costCents: number;
  offSpecCostCents: number;
  addedMassKg: number;
};

export type RolloutPreview = { vehicles: RolloutVehicle[]; totals: RolloutTotals };

const roundKg = (kg: number) => Math.round(kg * 1000) / 1000;

/** Current line id → new line id, through the key both editions share. */
function carryOver(currentLines: readonly EditionLine[], newIdByKey: Map<string, string>): Map<string, string> {
  const map = new Map<string, string>();
  for (const line of currentLines) {
    const id = newIdByKey.get(line.key);
    if (id !== undefined) map.set(line.id, id);
  }
  return map;
}

function gapKeys(lines: readonly LineVariance[], status: "short" | "off_spec"): Set<string> {
  const keys = new Set<string>();
  for (const l of lines) if (l.status === status) keys.add(l.key);
  return keys;
}

/** Runs one vehicle's variance, re-pointing an InputError at that vehicle's part of the input. */
function forVehicle<T>(field: string, linesField: string, run: () => T): T {
  try {
    return run();
  } catch (e) {
    if (!(e instanceof InputError)) throw e;
    const path = e.field === "lines" || e.field.startsWith("lines.")
      ? linesField + e.field.slice("lines".length)
      : `${field}.${e.field}`;
    throw new InputError(path, e.message.split(e.field).join(path));
  }
}

export function rolloutPreview(input: RolloutInput): RolloutPreview {
  if (input === null || typeof input !== "object") throw new InputError("input", "input is required");
  const { lines, vehicles, now } = input;
  if (!(now instanceof Date) || !Number.isFinite(now.getTime())) throw new InputError("now", "now must be a valid date");
  const edition = indexEdition("lines", lines, { resolveDependencies: false });
  const newIdByKey = new Map([...edition.byKey].map(([key, line]) => [key, line.id]));
  if (!Array.isArray(vehicles as unknown)) throw new InputError("vehicles", "vehicles must be a list");

  // Vehicles on the same current edition share one lines array: work out its carry-over once.
  const carryCache = new WeakMap<readonly EditionLine[], Map<string, string>>();
  const seen = new Set<string>();
  const totals: RolloutTotals = {
    vehicles: 0,
    vehiclesWithShortLines: 0,
    shortLines: 0,
    alreadyShortLines: 0,
    offSpecLines: 0,
    costCents: 0,
    offSpecCostCents: 0,
    addedMassKg: 0,
  };

  const results = vehicles.map((v, i): RolloutVehicle => {
    const field = `vehicles.${i}`;
    if (v === null || typeof v !== "object") throw new InputError(field, `${field} must be a vehicle`);
    if (typeof v.vehicleId !== "string" || v.vehicleId === "") {
      throw new InputError(`${field}.vehicleId`, `${field}.vehicleId must be non-empty text`);
    }
    if (seen.has(v.vehicleId)) throw new InputError(`${field}.vehicleId`, `vehicle ${v.vehicleId} appears twice`);
    seen.add(v.vehicleId);
    if (!Array.isArray(v.fitments as unknown)) throw new InputError(`${field}.fitments`, "fitments must be a list");
    if (!Array.isArray(v.concessions as unknown)) throw new InputError(`${field}.concessions`, "concessions must be a list");

    let alreadyShort = new Set<string>();
    let alreadyOffSpec = new Set<string>();
    let carry: Map<string, string> | undefined;
    const current = v.currentLines ?? null;
    if (current !== null) {
      carry = carryCache.get(current);
      if (!carry) {
        indexEdition(`${field}.currentLines`, current, { resolveDependencies: false });
        carry = carryOver(current, newIdByKey);
        carryCache.set(current, carry);
      }
      const now0 = forVehicle(field, `${field}.currentLines`, () =>
        vehicleVariance({ lines: current, fitments: v.fitments, concessions: v.concessions, now }),
      );
      alreadyShort = gapKeys(now0.lines, "short");
      alreadyOffSpec = gapKeys(now0.lines, "off_spec");
    }

    // A fitment already pointing at a new-edition line keeps it; one pointing at a current line
    // moves by key; anything else stays as it is and shows as an extra.
    const moveId = (lineId: string): string => (edition.byId.has(lineId) ? lineId : (carry?.get(lineId) ?? lineId));
    const fitments = v.fitments.map((f) => (f?.lineId ? { ...f, lineId: moveId(f.lineId) } : f));
    const concessions = v.concessions.map((c) => (typeof c?.lineId === "string" ? { ...c, lineId: moveId(c.lineId) } : c));
    const after = forVehicle(field, "lines", () => vehicleVariance({ lines, fitments, concessions, now }));

    const shortLines: RolloutGap[] = [];
    const offSpecLines: RolloutGap[] = [];
    let costCents = 0;
    let offSpecCostCents = 0;
    let addedMassKg = 0;
    for (const l of after.lines) {
      if (l.status === "short") {
        const mass = l.requirement === "must_fit" ? l.massKg * l.missingQuantity : 0;
        shortLines.push({
          lineId: l.lineId,
          key: l.key,
          code: l.code,
          title: l.title,
          requirement: l.requirement,
          missingQuantity: l.missingQuantity,
          costCents: l.standardCostCents,
          addedMassKg: roundKg(mass),
          already: alreadyShort.has(l.key),
        });
        costCents += l.standardCostCents;
        addedMassKg += mass;
      } else if (l.status === "off_spec") {
        offSpecLines.push({
          lineId: l.lineId,
          key: l.key,
          code: l.code,
          title: l.title,
          requirement: l.requirement,
          missingQuantity: 0,
          costCents: l.standardCostCents,
          addedMassKg: 0,
          already: alreadyOffSpec.has(l.key),
        });
        offSpecCostCents += l.standardCostCents;
      }
    }
    totals.vehicles += 1;
    if (shortLines.length > 0) totals.vehiclesWithShortLines += 1;
    totals.shortLines += shortLines.length;
    totals.alreadyShortLines += shortLines.filter((g) => g.already).length;
    totals.offSpecLines += offSpecLines.length;
    totals.costCents += costCents;
    totals.offSpecCostCents += offSpecCostCents;
    totals.addedMassKg += addedMassKg;
    return { vehicleId: v.vehicleId, shortLines, offSpecLines, costCents, offSpecCostCents, addedMassKg: roundKg(addedMassKg) };
  });
  totals.addedMassKg = roundKg(totals.addedMassKg);
  return { vehicles: results, totals };
}
