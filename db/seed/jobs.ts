import { createHash } from "node:crypto";
import { mkdir, writeFile } from "node:fs/promises";
import { dirname, resolve } from "node:path";
import { and, asc, eq, isNull } from "drizzle-orm";
import sharp from "sharp";
import { quoteTotals, type GstMethod } from "@/lib/money";
import { toTotalsLine, type JobState, type QuoteLineDraft, type QuoteState } from "@/lib/jobs";
import type { CriterionRow } from "../schema";
import type { Database } from "../client";
import { loadFleetVariance } from "../variance";
import {
  contractorFirms,
  costs,
  decisions,
  evidence,
  fitments,
  jobLines,
  jobOffers,
  jobs,
  memberships,
  organisations,
  quoteLines,
  quoteRevisions,
  quotes,
  users,
  vehicles,
  weighbridgeTickets,
} from "../schema";

/**
 * Demo jobs of every state, from the gaps the seeded variance shows (or free-text work where no
 * vehicle has an edition yet): competing quotes, a returned quote, a quote awaiting finance,
 * evidence accepted, waiting and rejected, costs booked for signed-off work. Evidence pictures
 * are generated here: plain coloured shapes, no photographs of anything. Idempotent: an
 * organisation that already has jobs is left alone.
 */

const DAY_MS = 86_400_000;
type Gap = { key: string; code: string; title: string; category: string; status: string; quantity: number; standardCostCents: number; criteria: CriterionRow[]; evidenceNeeded: string[] };
type Person = { id: string; role: string; firmId: string | null };

/** A value that meets a criterion, for the fitments of finished demo work. */
function satisfying(criteria: CriterionRow[]): Record<string, number | string> {
  const out: Record<string, number | string> = {};
  for (const c of criteria) {
    const v = Array.isArray(c.value) ? c.value[0] : c.value;
    if (v !== undefined) out[c.attribute] = v;
  }
  return out;
}

/** A picture of our own: a dusk sky, a red-earth ground and a few plain shapes. */
async function demoPicture(seed: number): Promise<Buffer> {
  const hues = [
    ["#1f2f4d", "#9c3d23", "#d9a441"],
    ["#2e4a3f", "#b4542d", "#e0c27a"],
    ["#3a3550", "#8f4a2b", "#c9b27c"],
  ][seed % 3]!;
  const x = 60 + ((seed * 37) % 180);
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="480" height="320">
<rect width="480" height="320" fill="${hues[0]}"/>
<rect y="200" width="480" height="120" fill="${hues[1]}"/>
<circle cx="${x}" cy="120" r="38" fill="${hues[2]}"/>
<rect x="${300 - (seed % 5) * 20}" y="150" width="120" height="60" rx="10" fill="#e8e2d4"/>
<circle cx="${325 - (seed % 5) * 20}" cy="215" r="16" fill="#222"/><circle cx="${395 - (seed % 5) * 20}" cy="215" r="16" fill="#222"/>
</svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

/** A one-page PDF with nothing on it but a frame, standing in for a scanned certificate. */
function demoPdf(): Buffer {
  return Buffer.from(
    "%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 595 842]/Contents 4 0 R>>endobj\n4 0 obj<</Length 33>>stream\n40 40 515 762 re S\nendstream endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n",
    "latin1",
  );
}

/** Demo files go where the disk store keeps them; tests and other stores get the rows only. */
async function storeDemoFile(key: string, bytes: Buffer, contentType: string) {
  if (process.env.VITEST || (process.env.STORAGE_DRIVER && process.env.STORAGE_DRIVER !== "disk")) return;
  const root = resolve(process.env.STORAGE_DIR ?? "./data/files");
  const path = resolve(root, key);
  if (!path.startsWith(root + "/")) throw new Error(`demo key ${key} leaves the store`);
  await mkdir(dirname(path), { recursive: true });
  await writeFile(path, bytes);
  await writeFile(`${path}#meta.json`, JSON.stringify({ contentType }));
}

type Plan = {
  title: string;
  state: JobState;
  gaps: number;
  free?: string[];
  offers: ("a" | "b")[];
  quotes: { firm: "a" | "b"; status: QuoteState; factor: number; reason?: string; extraCents?: number }[];
  evidence?: ("accepted" | "lodged" | "rejected")[];
  ticket?: boolean;
  dueInDays: number;
  cancelReason?: string;
};

const PLANS: Plan[] = [
  { title: "Recovery gear to standard", state: "open", gaps: 2, offers: [], quotes: [], dueInDays: 30 },
  { title: "Protection and recovery upgrade", state: "quoting", gaps: 2, offers: ["a", "b"], quotes: [{ firm: "a", status: "submitted", factor: 0.96 }, { firm: "b", status: "submitted", factor: 1.07 }], dueInDays: 12 },
  { title: "Communications fit-out", state: "quoting", gaps: 2, offers: ["a", "b"], quotes: [{ firm: "a", status: "returned", factor: 1.18, reason: "Quote each item installed and tested, with the fitting hours per item, not as loose parts" }, { firm: "b", status: "draft", factor: 1.02 }], dueInDays: 9 },
  { title: "Long-range touring package", state: "quoting", gaps: 3, free: ["Long-range fuel tank, 140 L"], offers: ["a", "b"], quotes: [{ firm: "a", status: "awaiting_finance", factor: 1, extraCents: 420_000 }, { firm: "b", status: "submitted", factor: 1.12, extraCents: 455_000 }], dueInDays: 20 },
  { title: "Electrical upgrade", state: "awarded", gaps: 2, offers: ["a", "b"], quotes: [{ firm: "b", status: "accepted", factor: 0.98 }, { firm: "a", status: "declined", factor: 1.05, reason: "The work was awarded to another workshop" }], dueInDays: 18 },
  { title: "Water and dust sealing", state: "in_workshop", gaps: 2, offers: ["a"], quotes: [{ firm: "a", status: "accepted", factor: 1 }], evidence: ["lodged", "rejected"], dueInDays: 5 },
  { title: "Storage and load restraint", state: "evidence_lodged", gaps: 2, offers: ["b"], quotes: [{ firm: "b", status: "accepted", factor: 0.99 }], evidence: ["accepted", "lodged"], ticket: true, dueInDays: -2 },
  { title: "Tyres and wheel alignment", state: "signed_off", gaps: 2, offers: ["a", "b"], quotes: [{ firm: "a", status: "accepted", factor: 0.97 }, { firm: "b", status: "declined", factor: 1.1, reason: "The work was awarded to another workshop" }], evidence: ["accepted", "accepted"], ticket: true, dueInDays: -20 },
  { title: "Lighting and roof rack", state: "closed", gaps: 1, offers: ["a"], quotes: [{ firm: "a", status: "accepted", factor: 1.01 }], evidence: ["accepted"], dueInDays: -45 },
  { title: "Side steps (not needed after all)", state: "cancelled", gaps: 1, offers: ["b"], quotes: [{ firm: "b", status: "withdrawn", factor: 1 }], dueInDays: 10, cancelReason: "The vehicle is moving to town duties; side steps are not needed" },
];

export async function seedJobs(tx: Database, orgId: string, now: Date = new Date()): Promise<void> {
  const existing = await tx.query.jobs.findFirst({ where: eq(jobs.orgId, orgId) });
  if (existing) return;
  const [org] = await tx.select().from(organisations).where(eq(organisations.id, orgId));
  if (!org) return;
  const people: Person[] = await tx
    .select({ id: users.id, role: memberships.role, firmId: memberships.firmId })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.orgId, orgId))
    .orderBy(asc(users.email));
  const manager = people.find((p) => p.role === "manager");
  const finance = people.find((p) => p.role === "finance");
  if (!manager) return;
  const firms = await tx.select().from(contractorFirms).where(and(eq(contractorFirms.orgId, orgId), eq(contractorFirms.active, true))).orderBy(asc(contractorFirms.name));
  if (firms.length === 0) return;
  // "a" and "b": workshops with contractor accounts first, so the demo sign-ins have work to see.
  const staffed = [...firms].sort((x, y) => Number(people.some((p) => p.firmId === y.id)) - Number(people.some((p) => p.firmId === x.id)) || y.name.localeCompare(x.name));
  const firmOf = { a: staffed[0]!, b: staffed[staffed.length > 1 ? 1 : 0]! };
  const contractorOf = (firmId: string) => people.find((p) => p.role === "contractor" && p.firmId === firmId)?.id ?? manager.id;

  const fleet = await loadFleetVariance(tx, { userId: manager.id, orgId, role: "manager", firmId: null, depotId: null }, undefined, now);
  const vehicleRows = await tx.select().from(vehicles).where(eq(vehicles.orgId, orgId)).orderBy(asc(vehicles.fleetNumber));
  const withGaps = fleet.details
    .map((d) => ({
      vehicle: vehicleRows.find((v) => v.id === d.vehicleId)!,
      gaps: (d.variance?.lines ?? [])
        .filter((l) => l.status === "short" || l.status === "off_spec" || l.status === "unproven")
        .map((l): Gap => {
          const line = d.lines.find((x) => x.id === l.lineId)!;
          return { key: l.key, code: l.code, title: l.title, category: l.category, status: l.status, quantity: l.status === "short" ? Math.max(1, l.missingQuantity) : line.quantity, standardCostCents: l.standardCostCents || 25_000, criteria: line.criteria as CriterionRow[], evidenceNeeded: line.evidenceNeeded };
        }),
    }))
    .filter((x) => x.vehicle && x.vehicle.state !== "retired" && x.gaps.length > 0);
  const candidates = withGaps.length > 0 ? withGaps : vehicleRows.filter((v) => v.state !== "retired").map((vehicle) => ({ vehicle, gaps: [] as Gap[] }));
  // Keep a few vehicles with gaps free of demo jobs, so a fresh job can be raised from them.
  const plans = slugPlans(org.slug, firms.length);
  const used = candidates.slice(Math.min(3, Math.max(0, candidates.length - plans.length)));
  if (used.length === 0) return;

  let number = 0;
  let pictureSeed = 0;
  for (const [i, plan] of plans.entries()) {
    const { vehicle, gaps } = used[i % used.length]!;
    number += 1;
    const createdAt = new Date(now.getTime() - (60 - i * 4) * DAY_MS);
    const picked = gaps.slice((i * 2) % Math.max(1, gaps.length), ((i * 2) % Math.max(1, gaps.length)) + plan.gaps);
    const free = plan.free ?? (picked.length === 0 ? [plan.title] : []);
    const awarded = plan.quotes.find((q) => q.status === "accepted");
    const [job] = await tx
      .insert(jobs)
      .values({
        orgId,
        number,
        vehicleId: vehicle.id,
        title: plan.title,
        state: plan.state,
        dueAt: new Date(now.getTime() + plan.dueInDays * DAY_MS),
        costKind: plan.title.startsWith("Tyres") ? "operating" : "capital",
        awardedFirmId: awarded ? firmOf[awarded.firm].id : null,
        cancelReason: plan.cancelReason ?? null,
        createdBy: manager.id,
        signedOffAt: plan.state === "signed_off" || plan.state === "closed" ? new Date(now.getTime() - 3 * DAY_MS) : null,
        createdAt,
      })
      .returning();
    const lines = [
      ...picked.map((g) => ({ jobId: job!.id, lineKey: g.key, description: `${g.code} ${g.title}` })),
      ...free.map((description) => ({ jobId: job!.id, lineKey: null, description })),
    ].map((l, sortOrder) => ({ ...l, sortOrder }));
    await tx.insert(jobLines).values(lines);
    for (const f of new Set(plan.offers)) {
      await tx.insert(jobOffers).values({ jobId: job!.id, firmId: firmOf[f].id, dueAt: job!.dueAt, offeredAt: new Date(createdAt.getTime() + DAY_MS) });
    }

    let acceptedQuote: { id: string; subtotalCents: number; gstCents: number; firmId: string } | null = null;
    for (const q of plan.quotes) {
      const firm = firmOf[q.firm];
      const author = contractorOf(firm.id);
      const drafts: QuoteLineDraft[] = [
        ...picked.map((g) => ({ kind: "part" as const, description: g.title, quantity: 1, unitPriceCents: Math.round((g.standardCostCents * q.factor) / 100) * 100, taxable: true, lineKey: g.key })),
        ...free.map((description) => ({ kind: "part" as const, description, quantity: 1, unitPriceCents: q.extraCents ?? 65_000, taxable: true, lineKey: null })),
        { kind: "labour" as const, description: "Fitting and checks", hours: 2 + picked.length, rateCents: Math.round(12_500 * q.factor), taxable: true, lineKey: null },
      ];
      const method = org.gstMethod as GstMethod;
      const priced = quoteTotals(drafts.map(toTotalsLine), method);
      const submitted = q.status !== "draft";
      const decidedVersions: { decision: (typeof decisions.$inferInsert)["decision"]; by: string; reason: string | null }[] = [];
      if (q.status === "returned") decidedVersions.push({ decision: "return", by: manager.id, reason: q.reason ?? "Please add the details" });
      if (q.status === "declined") decidedVersions.push({ decision: "decline", by: manager.id, reason: q.reason ?? "Declined" });
      if (q.status === "awaiting_finance") decidedVersions.push({ decision: "accept", by: manager.id, reason: null });
      if (q.status === "accepted") {
        decidedVersions.push({ decision: "accept", by: manager.id, reason: null });
        if (priced.totals.inclGstCents > org.approvalThresholdCents && finance) decidedVersions.push({ decision: "finance_approve", by: finance.id, reason: null });
      }
      const [quote] = await tx
        .insert(quotes)
        .values({
          orgId,
          jobId: job!.id,
          firmId: firm.id,
          revision: 1,
          status: q.status,
          validUntil: new Date(now.getTime() + (30 - i) * DAY_MS),
          notes: q.status === "submitted" ? "Parts in stock; two days in the workshop." : null,
          gstMethod: method,
          subtotalCents: priced.totals.exGstCents,
          gstCents: priced.totals.gstCents,
          totalCents: priced.totals.inclGstCents,
          submittedBy: submitted ? author : null,
          submittedAt: submitted ? new Date(createdAt.getTime() + 3 * DAY_MS) : null,
          version: 2 + decidedVersions.length,
          createdBy: author,
          createdAt: new Date(createdAt.getTime() + 2 * DAY_MS),
        })
        .returning();
      const rows = drafts.map((d, sortOrder) => ({
        quoteId: quote!.id,
        kind: d.kind,
        description: d.description,
        quantity: d.kind === "labour" ? d.hours : d.quantity,
        unitPriceCents: d.kind === "labour" ? d.rateCents : d.unitPriceCents,
        hours: d.kind === "labour" ? d.hours : null,
        rateCents: d.kind === "labour" ? d.rateCents : null,
        taxable: d.taxable,
        lineKey: d.lineKey,
        amountCents: priced.lines[sortOrder]!.exGstCents,
        gstCents: priced.lines[sortOrder]!.gstCents,
        sortOrder,
      }));
      await tx.insert(quoteLines).values(rows);
      if (submitted) {
        await tx.insert(quoteRevisions).values({
          quoteId: quote!.id,
          revision: 1,
          createdAt: quote!.submittedAt ?? createdAt,
          snapshot: { submittedBy: author, submittedAt: quote!.submittedAt?.toISOString(), totalCents: quote!.totalCents, gstCents: quote!.gstCents, subtotalCents: quote!.subtotalCents, lines: rows.map(({ quoteId: _q, ...r }) => r) },
        });
      }
      for (const [k, d] of decidedVersions.entries()) {
        await tx.insert(decisions).values({ orgId, quoteId: quote!.id, decision: d.decision, reason: d.reason, quoteVersion: 2 + k, decidedBy: d.by, decidedAt: new Date(createdAt.getTime() + (5 + k) * DAY_MS) });
      }
      if (q.status === "accepted") acceptedQuote = { id: quote!.id, subtotalCents: quote!.subtotalCents, gstCents: quote!.gstCents, firmId: firm.id };
    }

    // Evidence for the lines of awarded work, with pictures of our own.
    if (plan.evidence && acceptedQuote) {
      const uploader = contractorOf(acceptedQuote.firmId);
      const finished = plan.state === "signed_off" || plan.state === "closed";
      for (const [k, status] of plan.evidence.entries()) {
        const gap = picked[k % Math.max(1, picked.length)];
        let fitmentId: string | null = null;
        if (gap && (status === "accepted" || finished)) {
          // Off-spec items are replaced by the fitted ones; unproven items are proven as they are.
          if (gap.status === "off_spec") await tx.update(fitments).set({ removedAt: new Date(now.getTime() - 6 * DAY_MS) }).where(and(eq(fitments.vehicleId, vehicle.id), eq(fitments.lineKey, gap.key), isNull(fitments.removedAt)));
          const [fitment] = await tx
            .insert(fitments)
            .values({ orgId, vehicleId: vehicle.id, lineKey: gap.key, label: gap.title, quantity: gap.quantity, attributes: satisfying(gap.criteria), fittedAt: new Date(now.getTime() - 6 * DAY_MS), recordedBy: uploader })
            .returning({ id: fitments.id });
          fitmentId = fitment!.id;
        }
        const kinds = gap?.evidenceNeeded.length ? gap.evidenceNeeded : ["photo"];
        for (const kind of kinds) {
          const isPhoto = kind === "photo";
          const bytes = isPhoto ? await demoPicture(pictureSeed++) : demoPdf();
          const id = crypto.randomUUID();
          const ext = isPhoto ? "jpg" : "pdf";
          const key = `evidence/${orgId}/${id}.${ext}`;
          await storeDemoFile(key, bytes, isPhoto ? "image/jpeg" : "application/pdf");
          await tx.insert(evidence).values({
            id,
            orgId,
            jobId: job!.id,
            fitmentId,
            lineKey: gap?.key ?? null,
            kind: kind as (typeof evidence.$inferInsert)["kind"],
            status,
            filename: `${(gap?.code ?? "job").toLowerCase()}-${kind.replaceAll("_", "-")}.${ext}`,
            contentType: isPhoto ? "image/jpeg" : "application/pdf",
            sizeBytes: bytes.length,
            sha256: createHash("sha256").update(bytes).digest("hex"),
            storageKey: key,
            uploadedBy: uploader,
            reviewedBy: status === "lodged" ? null : manager.id,
            reviewedAt: status === "lodged" ? null : new Date(now.getTime() - 4 * DAY_MS),
            reviewReason: status === "rejected" ? "The photo does not show the fitted item clearly; take it in daylight from the side" : null,
            createdAt: new Date(now.getTime() - 5 * DAY_MS),
          });
        }
      }
      if (plan.ticket) {
        const bytes = demoPdf();
        const id = crypto.randomUUID();
        const key = `evidence/${orgId}/${id}.pdf`;
        await storeDemoFile(key, bytes, "application/pdf");
        const accepted = plan.state !== "evidence_lodged";
        await tx.insert(evidence).values({ id, orgId, jobId: job!.id, kind: "weighbridge_ticket", status: accepted ? "accepted" : "lodged", filename: "weighbridge-ticket.pdf", contentType: "application/pdf", sizeBytes: bytes.length, sha256: createHash("sha256").update(bytes).digest("hex"), storageKey: key, uploadedBy: uploader, reviewedBy: accepted ? manager.id : null, reviewedAt: accepted ? new Date(now.getTime() - 4 * DAY_MS) : null });
        const front = 1_380 + (i % 4) * 20;
        const rear = 1_640 + (i % 3) * 30;
        const weighedAt = new Date(now.getTime() - 5 * DAY_MS);
        await tx.insert(weighbridgeTickets).values({ orgId, vehicleId: vehicle.id, jobId: job!.id, ticketNumber: `WB-${40_100 + i}`, weighedAt, frontKg: front, rearKg: rear, grossKg: front + rear, evidenceId: id, recordedBy: uploader });
        if (accepted) await tx.update(vehicles).set({ measuredFrontKg: front, measuredRearKg: rear, measuredGrossKg: front + rear, measuredAt: weighedAt }).where(eq(vehicles.id, vehicle.id));
      }
    }

    if ((plan.state === "signed_off" || plan.state === "closed") && acceptedQuote) {
      await tx.insert(costs).values({
        orgId,
        vehicleId: vehicle.id,
        costCentre: vehicle.costCentre ?? "UNASSIGNED",
        depotId: vehicle.depotId,
        category: ((picked[0]?.category ?? "engineering") as (typeof costs.$inferInsert)["category"]),
        kind: plan.title.startsWith("Tyres") ? "operating" : "capital",
        amountExGstCents: acceptedQuote.subtotalCents,
        gstCents: acceptedQuote.gstCents,
        incurredOn: new Date(now.getTime() - 3 * DAY_MS),
        source: "job",
        jobId: job!.id,
        quoteId: acceptedQuote.id,
        reference: `Job ${number}`,
        description: plan.title,
        createdBy: manager.id,
      });
    }
  }
}

/** The full set for an organisation with two workshops; a smaller one with a single workshop. */
function slugPlans(_slug: string, firmCount: number): Plan[] {
  if (firmCount > 1) return PLANS;
  return PLANS.filter((p) => ["open", "quoting", "signed_off"].includes(p.state))
    .slice(0, 3)
    .map((p) => ({
      ...p,
      offers: p.offers.length ? ["b" as const] : [],
      quotes: p.quotes.slice(0, 1).map((q) => ({ ...q, firm: "b" as const, status: q.status === "awaiting_finance" ? ("submitted" as const) : q.status })),
    }));
}
