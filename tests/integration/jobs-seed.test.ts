import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { costs, decisions, evidence, jobs, organisations, quotes } from "@/db/schema";
import { seedDemo } from "@/db/seed";
import { useTestDatabase } from "../helpers/db";

const database = await useTestDatabase();
const org = (await database.query.organisations.findFirst({ where: eq(organisations.slug, "mirrabel-health") }))!;

describe("demo jobs", () => {
  it("has a job in every state, competing, returned and awaiting-finance quotes, reviewed evidence and booked costs", async () => {
    const rows = await database.select().from(jobs).where(eq(jobs.orgId, org.id));
    expect(new Set(rows.map((r) => r.state))).toEqual(new Set(["open", "quoting", "awarded", "in_workshop", "evidence_lodged", "signed_off", "closed", "cancelled"]));
    const quoteRows = await database.select().from(quotes).where(eq(quotes.orgId, org.id));
    const statuses = new Set(quoteRows.map((q) => q.status));
    for (const s of ["submitted", "returned", "awaiting_finance", "accepted", "declined", "draft"]) expect(statuses.has(s as never), s).toBe(true);
    const competing = rows.filter((j) => quoteRows.filter((q) => q.jobId === j.id && q.status === "submitted").length >= 2);
    expect(competing.length).toBeGreaterThan(0);
    const awaiting = quoteRows.find((q) => q.status === "awaiting_finance")!;
    expect(awaiting.totalCents).toBeGreaterThan(org.approvalThresholdCents);
    const pieces = await database.select().from(evidence).where(eq(evidence.orgId, org.id));
    const jobPieces = pieces.filter((e) => e.jobId);
    expect(new Set(jobPieces.map((e) => e.status))).toEqual(new Set(["lodged", "accepted", "rejected"]));
    const booked = (await database.select().from(costs).where(eq(costs.orgId, org.id))).filter((c) => c.source === "job" && c.quoteId);
    expect(booked.length).toBeGreaterThanOrEqual(2);
    const rowsDecided = await database.select().from(decisions).where(eq(decisions.orgId, org.id));
    expect(rowsDecided.some((d) => d.decision === "return" && d.reason)).toBe(true);
  });

  it("seeding again changes nothing", async () => {
    const before = (await database.select().from(jobs)).length;
    await seedDemo(database);
    expect((await database.select().from(jobs)).length).toBe(before);
  });
});
