import type { Concession, EditionLine, Fitment } from "@/lib/variance";

// Invented test data: a fictional fit-out standard for a fictional fleet.

export const NOW = new Date("2026-03-01T00:00:00Z");
export const DAY_MS = 86_400_000;
export const daysFromNow = (days: number): Date => new Date(NOW.getTime() + days * DAY_MS);

export function line(overrides: Partial<EditionLine> & { id: string }): EditionLine {
  return {
    key: `key-${overrides.id}`,
    code: overrides.id.toUpperCase(),
    category: "storage",
    title: `Line ${overrides.id}`,
    requirement: "must_fit",
    quantity: 1,
    massKg: 10,
    xMm: null,
    zone: "tub",
    massKind: "constant",
    criteria: [],
    evidenceNeeded: [],
    standardCostCents: 10_000,
    dependsOn: [],
    checkable: false,
    expiryMonths: null,
    ...overrides,
  };
}

export function fitment(overrides: Partial<Fitment> & { id: string }): Fitment {
  return {
    lineId: null,
    label: `Fitment ${overrides.id}`,
    quantity: 1,
    attributes: {},
    fittedAt: daysFromNow(-100),
    removedAt: null,
    evidence: [],
    expiresAt: null,
    ...overrides,
  };
}

export function concession(overrides: Partial<Concession> & { lineId: string }): Concession {
  return {
    reason: "Part on back order from the supplier; vehicle restricted to depot runs",
    expiresAt: daysFromNow(30),
    approvedBy: "user-fleet-manager-1",
    ...overrides,
  };
}
