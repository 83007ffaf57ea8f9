import { z } from "zod";
import { InputError, requirePositive } from "@/lib/errors";
import { cableRatingA } from "./ampacity";
import { requireConductorTemperature, MAX_CONDUCTOR_TEMPERATURE_C, MIN_CONDUCTOR_TEMPERATURE_C } from "./copper";
import { FUSE_HEADROOM, FUSE_LOCATION, fuseBetween, STANDARD_FUSE_RATINGS_A } from "./fuses";
import { conductorSizes, type ConductorSize, type SizeSeries } from "./sizes";
import { minAreaForDropMm2, voltageDrop } from "./voltage-drop";

export type CircuitKind = "critical" | "other";

/**
 * Acceptable drop by circuit (ABYC E-11 as published guidance): 3 % where a low voltage stops
 * the equipment working properly (fridge compressor, radio, pumps), 10 % for the rest.
 */
export const MAX_DROP_PCT_BY_CIRCUIT: Readonly<Record<CircuitKind, number>> = {
  critical: 3,
  other: 10,
};

/** With neither a limit nor a circuit kind, Rigline assumes the stricter, critical limit. */
export const DEFAULT_CIRCUIT: CircuitKind = "critical";

/** The `POST /api/calc/cable` body. */
export const cableRunInputSchema = z.object({
  currentA: z.number({ error: "currentA must be a number" }).positive({ error: "currentA must be greater than zero" }),
  lengthOneWayM: z
    .number({ error: "lengthOneWayM must be a number" })
    .positive({ error: "lengthOneWayM must be greater than zero" }),
  systemV: z.number({ error: "systemV must be a number" }).positive({ error: "systemV must be greater than zero" }),
  maxDropPct: z
    .number({ error: "maxDropPct must be a number" })
    .positive({ error: "maxDropPct must be greater than zero" })
    .max(100, { error: "maxDropPct must be at most 100" })
    .optional(),
  areaMm2: z.number({ error: "areaMm2 must be a number" }).positive({ error: "areaMm2 must be greater than zero" }).optional(),
  temperatureC: z
    .number({ error: "temperatureC must be a number" })
    .min(MIN_CONDUCTOR_TEMPERATURE_C, { error: `temperatureC must be at least ${MIN_CONDUCTOR_TEMPERATURE_C} °C` })
    .max(MAX_CONDUCTOR_TEMPERATURE_C, { error: `temperatureC must be at most ${MAX_CONDUCTOR_TEMPERATURE_C} °C` })
    .optional(),
  circuit: z.enum(["critical", "other"], { error: 'circuit must be "critical" or "other"' }).optional(),
  sizeSeries: z.enum(["metric", "awg"], { error: 'sizeSeries must be "metric" or "awg"' }).optional(),
});

export type CableRunInput = z.infer<typeof cableRunInputSchema>;

export interface CableCheck {
  areaMm2: number;
  dropV: number;
  dropPct: number;
  withinLimit: boolean;
  ratingA: number;
}

export interface CableRunResult {
  /** Drop of the cable given in `areaMm2`, or of the recommended cable when none was given. */
  dropV: number;
  dropPct: number;
  /** The limit applied and where it came from. */
  maxDropPct: number;
  maxDropFrom: "input" | CircuitKind;
  /** Whether the cable the drop figures describe stays within the limit. */
  withinLimit: boolean;
  /** Smallest cross-section that keeps the drop within the limit (not a standard size). */
  minAreaMm2: number;
  /** Standard size recommended: within the drop limit and able to carry the fuse. */
  recommendedAreaMm2: number;
  recommendedSizeLabel: string;
  recommendedRatingA: number;
  /** The cable the drop figures are for, when `areaMm2` was given. */
  checked: CableCheck | null;
  fuseA: number;
  fuseLocation: string;
  /** True when the drop alone allowed a thinner cable but no standard fuse fitted on it. */
  steppedUpForFuse: boolean;
  /** Plain sentences for the person reading the result. */
  notes: string[];
}

function largestFuseA(): number {
  return STANDARD_FUSE_RATINGS_A[STANDARD_FUSE_RATINGS_A.length - 1] ?? 0;
}

/**
 * Sizes one cable run: the drop limit gives the minimum cross-section, the next standard size
 * is taken, then stepped up until a standard fuse fits between the load (× headroom) and the
 * cable's rating, because the fuse is there to protect the cable.
 */
export function cableRun(input: CableRunInput): CableRunResult {
  const { currentA, lengthOneWayM, systemV } = input;
  requirePositive("currentA", currentA);
  requirePositive("lengthOneWayM", lengthOneWayM);
  requirePositive("systemV", systemV);
  if (input.areaMm2 !== undefined) requirePositive("areaMm2", input.areaMm2);
  if (input.temperatureC !== undefined) requireConductorTemperature("temperatureC", input.temperatureC);
  if (input.circuit !== undefined && !Object.hasOwn(MAX_DROP_PCT_BY_CIRCUIT, input.circuit)) {
    throw new InputError("circuit", 'circuit must be "critical" or "other"');
  }
  const series: SizeSeries = input.sizeSeries ?? "metric";
  const sizes = conductorSizes(series);

  let maxDropPct: number;
  let maxDropFrom: CableRunResult["maxDropFrom"];
  if (input.maxDropPct !== undefined) {
    requirePositive("maxDropPct", input.maxDropPct);
    if (input.maxDropPct > 100) throw new InputError("maxDropPct", "maxDropPct must be at most 100");
    maxDropPct = input.maxDropPct;
    maxDropFrom = "input";
  } else {
    maxDropFrom = input.circuit ?? DEFAULT_CIRCUIT;
    maxDropPct = MAX_DROP_PCT_BY_CIRCUIT[maxDropFrom];
  }

  const minimumFuseA = currentA * FUSE_HEADROOM;
  if (minimumFuseA > largestFuseA()) {
    throw new InputError(
      "currentA",
      `${currentA} A needs a fuse above ${largestFuseA()} A, beyond the standard ratings Rigline sizes; have this circuit designed by an auto-electrician`,
    );
  }

  const temperatureC = input.temperatureC;
  const minAreaMm2 = minAreaForDropMm2({ currentA, lengthOneWayM, systemV, maxDropPct, temperatureC });
  const firstIndex = sizes.findIndex((size) => size.areaMm2 >= minAreaMm2 * (1 - 1e-9));
  if (firstIndex < 0) {
    throw new InputError(
      "lengthOneWayM",
      `no standard cable up to ${sizes[sizes.length - 1]?.label ?? "the largest size"} keeps the drop within ${maxDropPct} % over ${lengthOneWayM} m; shorten the run, raise the system voltage or split the load`,
    );
  }
  const bySizeDrop = sizes[firstIndex] as ConductorSize;

  let recommended: ConductorSize | undefined;
  let fuseA: number | undefined;
  for (const size of sizes.slice(firstIndex)) {
    fuseA = fuseBetween(currentA, cableRatingA(size.areaMm2));
    if (fuseA !== undefined) {
      recommended = size;
      break;
    }
  }
  if (recommended === undefined || fuseA === undefined) {
    throw new InputError(
      "currentA",
      `no standard cable of this series can carry a fuse of at least ${minimumFuseA} A; have this circuit designed by an auto-electrician`,
    );
  }
  const steppedUpForFuse = recommended.areaMm2 > bySizeDrop.areaMm2;
  const recommendedRatingA = cableRatingA(recommended.areaMm2);

  const notes: string[] = [];
  if (steppedUpForFuse) {
    notes.push(
      `${bySizeDrop.label} keeps the drop within ${maxDropPct} %, but no standard fuse fits between the load (${currentA} A × ${FUSE_HEADROOM}) and that cable's rating; stepped up to ${recommended.label}.`,
    );
  }

  let checked: CableCheck | null = null;
  if (input.areaMm2 !== undefined) {
    const drop = voltageDrop({ currentA, lengthOneWayM, areaMm2: input.areaMm2, systemV, temperatureC });
    checked = {
      areaMm2: input.areaMm2,
      dropV: drop.dropV,
      dropPct: drop.dropPct,
      withinLimit: drop.dropPct <= maxDropPct * (1 + 1e-9),
      ratingA: cableRatingA(input.areaMm2),
    };
    if (!checked.withinLimit) {
      notes.push(
        `${input.areaMm2} mm² drops ${drop.dropPct.toFixed(2)} %, over the ${maxDropPct} % limit; use ${recommended.label}.`,
      );
    } else if (checked.ratingA < fuseA) {
      notes.push(
        `${input.areaMm2} mm² is within the drop limit but rated below the ${fuseA} A fuse this load needs; use ${recommended.label}.`,
      );
    }
  }

  const recommendedDrop = voltageDrop({
    currentA,
    lengthOneWayM,
    areaMm2: recommended.areaMm2,
    systemV,
    temperatureC,
  });
  const shown = checked ?? {
    dropV: recommendedDrop.dropV,
    dropPct: recommendedDrop.dropPct,
    withinLimit: true,
  };

  return {
    dropV: shown.dropV,
    dropPct: shown.dropPct,
    maxDropPct,
    maxDropFrom,
    withinLimit: shown.withinLimit,
    minAreaMm2,
    recommendedAreaMm2: recommended.areaMm2,
    recommendedSizeLabel: recommended.label,
    recommendedRatingA,
    checked,
    fuseA,
    fuseLocation: FUSE_LOCATION,
    steppedUpForFuse,
    notes,
  };
}
