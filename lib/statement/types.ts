/** What the printable mass statement of one vehicle shows. Plain data: the renderer only lays it out. */
export type StatementRow = { label: string; loadKg: number; capacityKg: number; headroomKg: number; ok: boolean };

export type StatementData = {
  orgName: string;
  generatedAt: Date;
  /** The organisation's zone: the preparation date reads in it. */
  timeZone: string;
  generatedBy: string;
  vehicle: {
    fleetNumber: string;
    registration: string | null;
    vin: string | null;
    platform: string;
    depot: string | null;
  };
  /** The loading the figures are for, in words ("2 occupants, 40 L water, …"). */
  loadingText: string;
  includePlanned: boolean;
  baseText: string;
  axles: { frontKg: number | null; rearKg: number | null; grossKg: number | null; combinationKg: number | null };
  checks: StatementRow[];
  binding: { label: string; marginKg: number } | null;
  payload: { capacityKg: number; usedKg: number; leftKg: number } | null;
  aboveStandardKg: number | null;
  warnings: string[];
  missing: string[];
  tyres: { size: string | null; source: string; loadIndex: number | null; capacityText: string[] };
  suspension: Array<{
    axle: "Front" | "Rear";
    constantKg: number;
    variableKg: number;
    suggestedMinKg: number;
    suggestedMaxKg: number;
  }>;
  fitted: Array<{ code: string; label: string; quantity: number; massKg: number | null; position: string; evidence: string }>;
  planned: Array<{ label: string; massKg: number; position: string; kind: string }>;
  /** The vehicle's saved 12 V plan, summarised; null when none is saved. */
  electrical: {
    systemV: number;
    chemistry: string;
    daysAutonomy: number;
    consumers: number;
    dailyAh: number;
    dailyWh: number;
    requiredCapacityAh: number;
    usableDepthPct: number;
    suggestedBattery: string;
    rechargeText: string | null;
    runs: Array<{ label: string; circuit: string; currentA: number; lengthOneWayM: number; size: string; dropV: number; dropPct: number; withinLimit: boolean; fuseA: number; fuseLocation: string }>;
    savedText: string;
  } | null;
  measured: { frontKg: number; rearKg: number; grossKg: number | null; measuredAt: Date | null } | null;
  ruleSet: { name: string; note: string; label: string };
  cautions: string[];
};
