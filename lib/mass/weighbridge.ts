import { InputError, requireNonNegative } from "../errors";

export type WeighbridgeTolerance = { kg: number } | { pct: number };

export interface ReconcileRow {
  what: "front" | "rear" | "gross";
  computedKg: number;
  measuredKg: number;
  /** Measured minus computed: positive means the vehicle is heavier than the plan says. */
  differenceKg: number;
  differencePct: number;
  toleranceKg: number;
  withinTolerance: boolean;
}

export interface ReconcileResult {
  rows: ReconcileRow[];
  measuredGrossKg: number;
  /** The ticket's gross against its own axle sum, when a gross was weighed. */
  grossVsAxleSum?: { differenceKg: number; toleranceKg: number; consistent: boolean };
  flags: Array<{ code: string; message: string }>;
  ok: boolean;
}

function toleranceKgFor(tol: WeighbridgeTolerance, measuredKg: number): number {
  if ("kg" in tol) return requireNonNegative("tolerance.kg", tol.kg);
  const pct = requireNonNegative("tolerance.pct", tol.pct);
  if (pct > 100) throw new InputError("tolerance.pct", "tolerance.pct must be at most 100");
  return (measuredKg * pct) / 100;
}

/**
 * Compares a weighbridge ticket with the computed masses axle by axle. The measured gross defaults
 * to the axle sum; a weighed gross that disagrees with its own axle sum beyond the tolerance is
 * flagged (the ticket, not the plan, is then in question).
 */
export function reconcileWeighbridge(
  computed: { frontKg: number; rearKg: number; grossKg: number },
  measured: { frontKg: number; rearKg: number; grossKg?: number },
  tolerance: WeighbridgeTolerance,
): ReconcileResult {
  if (!tolerance || typeof tolerance !== "object" || (!("kg" in tolerance) && !("pct" in tolerance))) {
    throw new InputError("tolerance", "tolerance must be { kg } or { pct }");
  }
  const cf = requireNonNegative("computed.frontKg", computed.frontKg);
  const cr = requireNonNegative("computed.rearKg", computed.rearKg);
  const cg = requireNonNegative("computed.grossKg", computed.grossKg);
  const mf = requireNonNegative("measured.frontKg", measured.frontKg);
  const mr = requireNonNegative("measured.rearKg", measured.rearKg);
  const axleSum = mf + mr;
  const mg = measured.grossKg === undefined ? axleSum : requireNonNegative("measured.grossKg", measured.grossKg);

  const row = (what: ReconcileRow["what"], c: number, m: number): ReconcileRow => {
    const toleranceKg = toleranceKgFor(tolerance, m);
    const differenceKg = m - c;
    return {
      what,
      computedKg: c,
      measuredKg: m,
      differenceKg,
      differencePct: c === 0 ? (m === 0 ? 0 : 100) : (differenceKg / c) * 100,
      toleranceKg,
      withinTolerance: Math.abs(differenceKg) <= toleranceKg + 1e-9,
    };
  };
  const rows = [row("front", cf, mf), row("rear", cr, mr), row("gross", cg, mg)];
  const flags: ReconcileResult["flags"] = [];
  for (const r of rows) {
    if (!r.withinTolerance) {
      flags.push({
        code: `${r.what}-differs`,
        message: `${r.what === "gross" ? "Gross" : r.what === "front" ? "Front axle" : "Rear axle"} weighed ${Math.round(r.measuredKg)} kg against ${Math.round(r.computedKg)} kg computed (${r.differenceKg > 0 ? "+" : ""}${Math.round(r.differenceKg)} kg, beyond the ${Math.round(r.toleranceKg)} kg tolerance).`,
      });
    }
  }
  let grossVsAxleSum: ReconcileResult["grossVsAxleSum"];
  if (measured.grossKg !== undefined) {
    const toleranceKg = toleranceKgFor(tolerance, mg);
    const differenceKg = mg - axleSum;
    const consistent = Math.abs(differenceKg) <= toleranceKg + 1e-9;
    grossVsAxleSum = { differenceKg, toleranceKg, consistent };
    if (!consistent) {
      flags.push({
        code: "gross-inconsistent",
        message: `The ticket's gross ${Math.round(mg)} kg differs from its axle sum ${Math.round(axleSum)} kg by ${Math.round(Math.abs(differenceKg))} kg: check the ticket.`,
      });
    }
  }
  return { rows, measuredGrossKg: mg, ...(grossVsAxleSum ? { grossVsAxleSum } : {}), flags, ok: flags.length === 0 };
}
