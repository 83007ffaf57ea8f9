/**
 * Demo money: a year of invented costs across the organisation's cost centres and categories,
 * budgets per cost centre for the financial years the costs fall in, and half a year of daily
 * fleet figures for the charts over time (run it after the standards, jobs and defects are
 * seeded: the figures lead up to the fleet's live state). Amounts, descriptions and references are invented;
 * they come from a seeded generator, so every run of the seed writes the same figures for the
 * same months.
 */
import { asc, eq } from "drizzle-orm";
import { gstOnExclusive } from "@/lib/money";
import type { Database } from "../client";
import { fleetFiguresNow } from "../costs";
import { budgets, costs, fleetSnapshots, vehicles } from "../schema";

type Category = (typeof costs.category.enumValues)[number];

type Item = { category: Category; kind: "capital" | "operating"; words: string[]; minDollars: number; maxDollars: number; weight: number };

/** What remote-fleet money is spent on: fit-out (capital) and upkeep (operating). */
const ITEMS: Item[] = [
  { category: "tyres", kind: "operating", words: ["Four all-terrain tyres fitted and balanced", "Two replacement tyres after sidewall damage", "Tyre rotation and puncture repair"], minDollars: 180, maxDollars: 2_600, weight: 7 },
  { category: "suspension", kind: "capital", words: ["Suspension upgrade, constant-load springs front and rear", "Rear airbag assist kit fitted", "Shock absorbers replaced, both axles"], minDollars: 900, maxDollars: 5_800, weight: 4 },
  { category: "steering_driveline", kind: "operating", words: ["Wheel alignment after suspension change", "Steering damper replaced", "Front hub bearings serviced"], minDollars: 140, maxDollars: 1_100, weight: 4 },
  { category: "protection", kind: "capital", words: ["Front protection bar with recovery points", "Underbody protection plates", "Rock sliders fitted"], minDollars: 1_200, maxDollars: 4_600, weight: 3 },
  { category: "recovery", kind: "capital", words: ["Recovery kit: snatch strap, shackles, gloves", "Electric winch with synthetic rope", "Recovery boards, pair"], minDollars: 250, maxDollars: 3_200, weight: 3 },
  { category: "water_dust", kind: "capital", words: ["Raised air intake fitted", "Door and tailgate dust seals renewed", "Diff breather extensions"], minDollars: 220, maxDollars: 1_050, weight: 2 },
  { category: "electrical", kind: "capital", words: ["Dual battery system with DC-DC charger", "Auxiliary lithium battery and monitor", "Fridge circuit rewired with 16 mm² cable"], minDollars: 450, maxDollars: 3_900, weight: 5 },
  { category: "communications", kind: "capital", words: ["UHF radio and antenna", "Satellite messenger subscription, annual", "HF radio service and antenna tune"], minDollars: 180, maxDollars: 2_700, weight: 3 },
  { category: "storage", kind: "capital", words: ["Rear drawer system with fridge slide", "Cargo barrier fitted", "Water tank, 60 L, under-tray"], minDollars: 600, maxDollars: 4_200, weight: 2 },
  { category: "lighting_roof", kind: "capital", words: ["Roof platform and load bars", "Driving lights with relay harness", "Work light over tailgate"], minDollars: 300, maxDollars: 2_800, weight: 2 },
  { category: "safety", kind: "operating", words: ["First-aid kit restocked", "Fire extinguisher service and tag", "Reflective triangles and torch replaced"], minDollars: 45, maxDollars: 320, weight: 6 },
  { category: "engineering", kind: "operating", words: ["Vehicle engineer inspection and modification report", "Weighbridge visit and mass report", "GVM upgrade assessment"], minDollars: 150, maxDollars: 1_900, weight: 2 },
];

const TOTAL_WEIGHT = ITEMS.reduce((s, i) => s + i.weight, 0);
const DAY_MS = 86_400_000;

/** A small deterministic generator (mulberry32) so the demo figures repeat run after run. */
function generator(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

function seedOf(text: string): number {
  let h = 2_166_136_261;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 16_777_619);
  return h >>> 0;
}

function pick(random: () => number): Item {
  let r = random() * TOTAL_WEIGHT;
  for (const item of ITEMS) {
    r -= item.weight;
    if (r <= 0) return item;
  }
  return ITEMS[ITEMS.length - 1]!;
}

/** 1 July of the financial year (July to June) that `date` falls in. */
export function financialYearStart(date: Date): Date {
  const year = date.getUTCMonth() >= 6 ? date.getUTCFullYear() : date.getUTCFullYear() - 1;
  return new Date(Date.UTC(year, 6, 1));
}

async function insertInChunks<T>(rows: T[], insert: (chunk: T[]) => Promise<unknown>, size = 200): Promise<void> {
  for (let i = 0; i < rows.length; i += size) await insert(rows.slice(i, i + size));
}

/**
 * Seeds the money of one organisation after its vehicles exist: about a year of costs ending
 * today, budgets for each cost centre and financial year touched, and daily fleet figures.
 */
export async function seedCosts(tx: Database, orgId: string, now = new Date()): Promise<void> {
  const fleet = await tx
    .select({ id: vehicles.id, fleetNumber: vehicles.fleetNumber, costCentre: vehicles.costCentre, depotId: vehicles.depotId, state: vehicles.state })
    .from(vehicles)
    .where(eq(vehicles.orgId, orgId))
    .orderBy(asc(vehicles.fleetNumber));
  if (fleet.length === 0) return;
  const random = generator(seedOf(fleet[0]!.fleetNumber + fleet.length));
  const today = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate());
  const firstMonth = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - 11, 1));

  // ── Costs: each month, roughly two thirds of the fleet gets one or two entries.
  const costRows: (typeof costs.$inferInsert)[] = [];
  let invoice = 4_100;
  for (let m = 0; m < 12; m++) {
    const monthStart = Date.UTC(firstMonth.getUTCFullYear(), firstMonth.getUTCMonth() + m, 1);
    const monthEnd = Math.min(Date.UTC(firstMonth.getUTCFullYear(), firstMonth.getUTCMonth() + m + 1, 1) - DAY_MS, today);
    const days = Math.floor((monthEnd - monthStart) / DAY_MS) + 1;
    const daysInMonth = Math.round((Date.UTC(firstMonth.getUTCFullYear(), firstMonth.getUTCMonth() + m + 1, 1) - monthStart) / DAY_MS);
    // The month under way has only had its first days' invoices.
    const share = days / daysInMonth;
    for (const vehicle of fleet) {
      if (vehicle.state === "retired" && m > 3) continue;
      const entries = random() < 0.62 * share ? (random() < 0.25 ? 2 : 1) : 0;
      for (let e = 0; e < entries; e++) {
        const item = pick(random);
        const dollars = item.minDollars + random() * (item.maxDollars - item.minDollars);
        const exGstCents = Math.round(dollars * 100);
        const incurredOn = new Date(monthStart + Math.floor(random() * days) * DAY_MS);
        invoice += 1 + Math.floor(random() * 7);
        costRows.push({
          orgId,
          vehicleId: vehicle.id,
          costCentre: vehicle.costCentre ?? "CC-FLEET",
          depotId: vehicle.depotId,
          category: item.category,
          kind: item.kind,
          amountExGstCents: exGstCents,
          gstCents: gstOnExclusive(exGstCents),
          incurredOn,
          source: "manual",
          reference: `INV-${invoice}`,
          description: item.words[Math.floor(random() * item.words.length)]!,
        });
      }
    }
  }
  // A few credit notes, so adjustments and negative amounts show up in the ledger.
  for (let k = 0; k < Math.max(2, Math.round(fleet.length / 10)); k++) {
    const source = costRows[Math.floor(random() * costRows.length)]!;
    const credit = -Math.round(source.amountExGstCents * (0.1 + random() * 0.2));
    costRows.push({
      ...source,
      amountExGstCents: credit,
      gstCents: gstOnExclusive(credit),
      incurredOn: new Date(Math.min(source.incurredOn.getTime() + 14 * DAY_MS, today)),
      source: "adjustment",
      reference: `CN-${source.reference!.slice(4)}`,
      description: `Credit note: part returned against ${source.reference}`,
    });
  }
  await insertInChunks(costRows, (chunk) => tx.insert(costs).values(chunk));

  // ── Budgets: each cost centre, each financial year the costs touch. Most are set from the
  // year's spend run-rate with some headroom; a few were set too low, so the demo shows cost
  // centres near their limit and over budget as well as within it.
  const centres = [...new Set(fleet.map((v) => v.costCentre ?? "CC-FLEET"))].sort();
  const years = [...new Set(costRows.map((c) => financialYearStart(c.incurredOn).getTime()))].sort();
  const budgetRows: (typeof budgets.$inferInsert)[] = [];
  for (const startMs of years) {
    const start = new Date(startMs);
    const end = new Date(Date.UTC(start.getUTCFullYear() + 1, 5, 30));
    const covered = Math.max(1, (Math.min(end.getTime(), today) - Math.max(startMs, firstMonth.getTime())) / DAY_MS + 1);
    centres.forEach((centre, i) => {
      const spent = costRows
        .filter((c) => c.costCentre === centre && c.incurredOn.getTime() >= startMs && c.incurredOn.getTime() <= end.getTime())
        .reduce((s, c) => s + c.amountExGstCents, 0);
      const yearly = (spent / covered) * 365;
      let amountCents: number;
      if (i % 6 === 2) amountCents = Math.round((spent * 0.9) / 10_000) * 10_000; // already over
      else if (i % 6 === 4) amountCents = Math.round((spent * 1.05) / 10_000) * 10_000; // near the limit
      else amountCents = Math.round((yearly * [1.25, 1.1, 0, 1.3, 0, 1.15][i % 6]!) / 100_000) * 100_000;
      budgetRows.push({ orgId, costCentre: centre, periodStart: start, periodEnd: end, amountCents: Math.max(100_000, amountCents) });
    });
  }
  await insertInChunks(budgetRows, (chunk) => tx.insert(budgets).values(chunk));

  // ── Daily fleet figures for the last 180 days up to yesterday. They are walked backwards
  // from today's live figures (so the charts meet today's point), each day back a little less
  // ready and with a few more gaps open, with the ups and downs of real weeks.
  const live = await fleetFiguresNow(tx, orgId, now);
  const active = live.ready + live.limited + live.notReady;
  const snapshotRows: (typeof fleetSnapshots.$inferInsert)[] = [];
  let { ready, limited, meetingStandard: meeting, openGaps: gaps } = live;
  for (let d = 1; d <= 180; d++) {
    // Going back in time: a vehicle made ready about every fortnight is one less ready then.
    const step = random();
    if (step < 0.12 && ready > 0) {
      ready -= 1;
      if (random() < 0.5) limited += 1;
    } else if (step < 0.17 && ready + limited < active) ready += 1;
    if (random() < 0.05 && limited > 0) limited -= 1;
    else if (random() < 0.04 && ready + limited < active) limited += 1;
    limited = Math.min(limited, active - ready);
    gaps += random() < 0.5 ? Math.floor(random() * 3) : 0;
    if (random() < 0.08 && gaps > 0) gaps -= 2;
    gaps = Math.max(0, gaps);
    if (random() < 0.14 && meeting > 0) meeting -= 1;
    else if (random() < 0.03 && meeting < active) meeting += 1;
    const day = new Date(today - d * DAY_MS).toISOString().slice(0, 10);
    snapshotRows.push({ orgId, day, ready, limited, notReady: active - ready - limited, meetingStandard: meeting, openGaps: gaps });
  }
  await insertInChunks(snapshotRows, (chunk) => tx.insert(fleetSnapshots).values(chunk));
}
