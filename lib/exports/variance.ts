import { InputError } from "@/lib/errors";
import type { VarianceSummary, VehicleVarianceStatus } from "@/lib/variance/types";
import { checkTable, type ExportCell, type ExportColumn, type ExportTable } from "./table";

/** One vehicle's variance against its edition, as the fleet variance export lists it. */
export type VarianceExportVehicle = {
  fleetNumber: string;
  depotName: string | null;
  platformName: string | null;
  /** "Standard name, edition 3", or null when no edition is assigned. */
  editionName: string | null;
  status: VehicleVarianceStatus;
  /** Line counts by status; null when the vehicle has no edition. */
  summary: VarianceSummary | null;
  costToCloseCents: number;
  massToCloseKg: number;
};

export const VARIANCE_STATUS_LABELS: Record<VehicleVarianceStatus, string> = {
  meets_standard: "Meets standard",
  gaps: "Has gaps",
  no_edition: "No standard assigned",
};

const COUNT_KEYS = ["meets", "short", "offSpec", "unproven", "concession", "prohibitedFitted", "extra"] as const satisfies readonly (keyof VarianceSummary)[];

export const VARIANCE_COLUMNS: ExportColumn[] = [
  { header: "Fleet no.", kind: "text", widthChars: 11 },
  { header: "Depot", kind: "text", widthChars: 18 },
  { header: "Platform", kind: "text", widthChars: 30 },
  { header: "Standard and edition", kind: "text", widthChars: 32 },
  { header: "Status", kind: "text", widthChars: 20 },
  { header: "Lines meeting", kind: "integer", widthChars: 10 },
  { header: "Short", kind: "integer", widthChars: 8 },
  { header: "Off-spec", kind: "integer", widthChars: 9 },
  { header: "Unproven", kind: "integer", widthChars: 10 },
  { header: "Concession", kind: "integer", widthChars: 11 },
  { header: "Prohibited item fitted", kind: "integer", widthChars: 12 },
  { header: "Extra", kind: "integer", widthChars: 8 },
  { header: "Cost to close ($)", kind: "money", widthChars: 16 },
  { header: "Mass to close (kg)", kind: "decimal", widthChars: 16 },
];

/** Kilograms to the gram, so sums of decimal masses do not show binary noise. */
const toGram = (kg: number) => Math.round(kg * 1000) / 1000;

export function varianceRow(v: VarianceExportVehicle, index = 0): ExportCell[] {
  if (!Number.isSafeInteger(v.costToCloseCents)) {
    throw new InputError(`vehicles.${index}.costToCloseCents`, "costToCloseCents must be a whole number of cents");
  }
  if (!Number.isFinite(v.massToCloseKg)) throw new InputError(`vehicles.${index}.massToCloseKg`, "massToCloseKg must be a finite number");
  return [
    v.fleetNumber,
    v.depotName,
    v.platformName,
    v.editionName,
    VARIANCE_STATUS_LABELS[v.status] ?? v.status,
    ...COUNT_KEYS.map((k) => (v.summary ? v.summary[k] : null)),
    v.costToCloseCents,
    toGram(v.massToCloseKg),
  ];
}

/** The fleet variance as an export table, one row per vehicle and a totals row. */
export function varianceTable(vehicles: readonly VarianceExportVehicle[]): ExportTable {
  if (!Array.isArray(vehicles as unknown)) throw new InputError("vehicles", "vehicles must be a list");
  const rows = vehicles.map((v, i) => varianceRow(v, i));
  const meeting = vehicles.filter((v) => v.status === "meets_standard").length;
  const withEdition = vehicles.filter((v) => v.status !== "no_edition").length;
  const totals: ExportCell[] = VARIANCE_COLUMNS.map(() => null);
  totals[0] = `${vehicles.length} vehicles`;
  totals[4] = `${meeting} of ${withEdition} meet`;
  COUNT_KEYS.forEach((k, i) => {
    totals[5 + i] = vehicles.reduce((sum, v) => sum + (v.summary ? v.summary[k] : 0), 0);
  });
  totals[12] = vehicles.reduce((sum, v) => sum + v.costToCloseCents, 0);
  totals[13] = toGram(vehicles.reduce((sum, v) => sum + v.massToCloseKg, 0));
  return checkTable({ sheetName: "Fleet variance", columns: VARIANCE_COLUMNS, rows, totals });
}
