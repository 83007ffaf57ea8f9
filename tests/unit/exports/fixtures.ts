import type { LedgerEntry } from "@/lib/exports";

/** Invented ledger entries (demo fleet numbers and cost centres). */
export function entry(overrides: Partial<LedgerEntry> = {}): LedgerEntry {
  return {
    id: "c-1",
    incurredOn: new Date(Date.UTC(2026, 2, 14)),
    fleetNumber: "RL-014",
    costCentre: "CC-OCW-COR",
    depotName: "Ochre Well",
    category: "recovery",
    kind: "capital",
    source: "manual",
    description: "Recovery kit and winch rope",
    reference: "INV-2201",
    amountExGstCents: 123_450,
    gstCents: 12_345,
    ...overrides,
  };
}
