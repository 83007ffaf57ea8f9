import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { and, eq } from "drizzle-orm";
import exifr from "exifr";
import sharp from "sharp";
import { afterAll, describe, expect, it, vi } from "vitest";
import { POST as raiseJobRoute } from "@/app/api/jobs/route";
import { POST as offerRoute } from "@/app/api/jobs/[id]/offers/route";
import { POST as lodgeRoute } from "@/app/api/jobs/[id]/evidence/route";
import { POST as progressRoute } from "@/app/api/jobs/[id]/progress/route";
import { POST as signOffRoute } from "@/app/api/jobs/[id]/sign-off/route";
import { POST as createQuoteRoute } from "@/app/api/quotes/route";
import { POST as submitRoute } from "@/app/api/quotes/[id]/submit/route";
import { POST as decisionRoute } from "@/app/api/quotes/[id]/decision/route";
import { POST as reviewRoute } from "@/app/api/evidence/[id]/review/route";
import { GET as fileRoute } from "@/app/api/evidence/[id]/file/route";
import type { Database } from "@/db/client";
import { loadVehicleVariance } from "@/db/variance";
import { contractorFirms, costs, editionLines, editions, evidence, fitments, jobs, lineDependencies, outboxMessages, standards, vehicles, weighbridgeTickets } from "@/db/schema";
import { diskStorage, setStorageForTests } from "@/lib/server/storage";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const storageDir = mkdtempSync(join(tmpdir(), "rigline-evidence-"));
setStorageForTests(diskStorage(storageDir));
afterAll(() => {
  setStorageForTests(undefined);
  rmSync(storageDir, { recursive: true, force: true });
});

/** An invented edition on one vehicle: off-spec tyres, missing recovery boards, springs after the tyres. */
async function editionOnVehicle(db: Database, fleetNumber: string) {
  const vehicle = (await db.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, fleetNumber) }))!;
  const [standard] = await db.insert(standards).values({ orgId: vehicle.orgId, name: `Evidence test standard ${fleetNumber}` }).returning();
  const [edition] = await db.insert(editions).values({ orgId: vehicle.orgId, standardId: standard!.id, number: 1, status: "published", publishedAt: new Date() }).returning();
  const base = { orgId: vehicle.orgId, editionId: edition!.id, requirement: "must_fit" as const };
  const rows = await db
    .insert(editionLines)
    .values([
      { ...base, key: "ev-tyr", code: "TYR-01", category: "tyres", title: "All-terrain tyres LI ≥ 121", quantity: 4, criteria: [{ attribute: "loadIndex", op: "gte", value: 121 }], evidenceNeeded: ["photo"], standardCostCents: 180_000, sortOrder: 1 },
      { ...base, key: "ev-rec", code: "REC-01", category: "recovery", title: "Recovery boards, pair", evidenceNeeded: ["photo"], standardCostCents: 40_000, sortOrder: 2 },
      { ...base, key: "ev-sus", code: "SUS-01", category: "suspension", title: "Springs for the constant load", evidenceNeeded: ["certificate"], standardCostCents: 250_000, sortOrder: 3 },
    ])
    .returning();
  await db.insert(lineDependencies).values({ lineId: rows.find((r) => r.key === "ev-sus")!.id, dependsOnLineId: rows.find((r) => r.key === "ev-tyr")!.id });
  await db.update(vehicles).set({ editionId: edition!.id, measuredFrontKg: null, measuredRearKg: null, measuredGrossKg: null, measuredAt: null }).where(eq(vehicles.id, vehicle.id));
  await db.insert(fitments).values({ orgId: vehicle.orgId, vehicleId: vehicle.id, lineKey: "ev-tyr", label: "Tyres LI 116", quantity: 4, attributes: { loadIndex: 116 }, fittedAt: new Date("2025-01-01") });
  return vehicle;
}

const manager = await signedInAs(database, "manager@mirrabel-health.example");
const finance = await signedInAs(database, "finance@mirrabel-health.example");
const driver = await signedInAs(database, "driver@mirrabel-health.example");
const contractorA = await signedInAs(database, "contractor@tallowbark-fitout.example");
const contractorB = await signedInAs(database, "contractor@spindleflat-4x4.example");
const firmA = (await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Tallowbark Fit-Out Workshop") }))!;
const firmB = (await database.query.contractorFirms.findFirst({ where: eq(contractorFirms.name, "Spindle Flat 4x4 Works") }))!;
const vehicle = await editionOnVehicle(database, "MH-014");

/** A job on the tyres and recovery boards, awarded to firm A (below the finance threshold). */
async function awardedJob() {
  const raised = await callRoute(raiseJobRoute, { user: manager, body: { vehicleId: vehicle.id, title: "Tyres and recovery gear", lineKeys: ["ev-tyr", "ev-rec"] } });
  const jobId = (raised.json as { id: string }).id;
  await callRoute(offerRoute, { user: manager, params: { id: jobId }, body: { firmIds: [firmA.id, firmB.id] } });
  const validUntil = new Date(Date.now() + 20 * 86_400_000).toISOString();
  const created = await callRoute(createQuoteRoute, {
    user: contractorA,
    body: {
      jobId,
      validUntil,
      lines: [
        { kind: "part", description: "Tyres LI 121 ×4", quantity: 4, unitPriceCents: 41_000, taxable: true, lineKey: "ev-tyr" },
        { kind: "part", description: "Recovery boards", quantity: 1, unitPriceCents: 32_000, taxable: true, lineKey: "ev-rec" },
        { kind: "labour", description: "Fit and balance", hours: 2, rateCents: 12_000, taxable: true },
      ],
    },
  });
  const quoteId = (created.json as { id: string }).id;
  const submitted = await callRoute(submitRoute, { user: contractorA, params: { id: quoteId }, body: {} });
  const accepted = await callRoute(decisionRoute, { user: manager, params: { id: quoteId }, body: { decision: "accept", version: (submitted.json as { version: number }).version } });
  expect(accepted.json).toMatchObject({ status: "accepted" });
  return { jobId, quoteId };
}

const photo = (withGps = false) => {
  let image = sharp({ create: { width: 96, height: 64, channels: 3, background: { r: 160, g: 82, b: 45 } } }).jpeg();
  if (withGps) image = image.withExif({ IFD0: { Make: "Invented camera" }, IFD3: { GPSLatitudeRef: "S", GPSLatitude: "23/1 42/1 0/1", GPSLongitudeRef: "E", GPSLongitude: "133/1 52/1 0/1" } });
  return image.toBuffer();
};
const pdf = () => Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n", "latin1");

function form(fields: Record<string, string>, file: { bytes: Uint8Array; name: string; type: string }) {
  const body = new FormData();
  for (const [k, v] of Object.entries(fields)) body.set(k, v);
  body.set("file", new File([new Uint8Array(file.bytes)], file.name, { type: file.type }));
  return body;
}

async function lodge(jobId: string, fields: Record<string, string>, file: { bytes: Uint8Array; name: string; type: string }, user = contractorA) {
  return callRoute(lodgeRoute, { user, params: { id: jobId }, body: form(fields, file), headers: {} });
}

const statusOf = async (key: string) => {
  const loaded = await loadVehicleVariance(database, manager, vehicle.id, new Date());
  return loaded?.variance?.lines.find((l) => l.key === key)?.status;
};

const { jobId } = await awardedJob();

describe("uploads are checked by content and size", () => {
  it("refuses a text file renamed .jpg with 415, storing nothing", async () => {
    const before = await database.select().from(evidence).where(eq(evidence.jobId, jobId));
    const { status, json } = await lodge(jobId, { kind: "photo", lineKey: "ev-rec" }, { bytes: Buffer.from("just some text, not a picture"), name: "boards.jpg", type: "image/jpeg" });
    expect(status).toBe(415);
    expect(json).toMatchObject({ error: { code: "unsupported_media_type", details: [{ field: "file" }] } });
    expect(await database.select().from(evidence).where(eq(evidence.jobId, jobId))).toHaveLength(before.length);
  });

  it("refuses a file over the limit with 413", async () => {
    const big = Buffer.alloc(10 * 1024 * 1024 + 1, 0xff);
    const { status, json } = await lodge(jobId, { kind: "photo", lineKey: "ev-rec" }, { bytes: big, name: "huge.jpg", type: "image/jpeg" });
    expect(status).toBe(413);
    expect(json).toMatchObject({ error: { code: "payload_too_large" } });
  });

  it("a path-like file name cannot escape storage: the key is ours, the name is kept for display only", async () => {
    const { status, json } = await lodge(jobId, { kind: "photo", lineKey: "ev-rec" }, { bytes: await photo(), name: "../../../../etc/cron.d/boards.jpg", type: "image/jpeg" });
    expect(status).toBe(201);
    const row = (await database.query.evidence.findFirst({ where: eq(evidence.id, (json as { id: string }).id) }))!;
    expect(row.filename).toBe("boards.jpg");
    expect(row.storageKey).toBe(`evidence/${manager.orgId}/${row.id}.jpg`);
    expect(readdirSync(join(storageDir, "evidence", manager.orgId))).toContain(`${row.id}.jpg`);
    expect(readdirSync(storageDir)).toEqual(["evidence"]);
  });

  it("drops the photo's location: GPS is in the upload, gone from what is stored and served", async () => {
    const original = await photo(true);
    expect(await exifr.gps(original)).toMatchObject({ latitude: expect.closeTo(-23.7, 3) });
    const { status, json } = await lodge(jobId, { kind: "photo", lineKey: "ev-tyr", "attr.loadIndex": "121" }, { bytes: original, name: "tyres.jpg", type: "image/jpeg" });
    expect(status).toBe(201);
    const { id, sha256 } = json as { id: string; sha256: string };
    const served = await callRoute(fileRoute, { user: manager, params: { id } });
    expect(served.status).toBe(200);
    expect(served.response.headers.get("content-type")).toBe("image/jpeg");
    const bytes = Buffer.from(await served.response.arrayBuffer());
    expect(await exifr.gps(bytes)).toBeUndefined();
    expect(await exifr.parse(bytes)).toBeUndefined();
    const { createHash } = await import("node:crypto");
    expect(createHash("sha256").update(bytes).digest("hex")).toBe(sha256);
  });

  it("serves the file only to users allowed to see the job", async () => {
    const [row] = await database.select().from(evidence).where(eq(evidence.jobId, jobId)).limit(1);
    expect((await callRoute(fileRoute, { user: finance, params: { id: row!.id } })).status).toBe(200);
    expect((await callRoute(fileRoute, { user: contractorB, params: { id: row!.id } })).status).toBe(404);
    expect((await callRoute(fileRoute, { user: driver, params: { id: row!.id } })).status).toBe(403);
    const other = await signedInAs(database, "admin@gidgee-trust.example");
    expect((await callRoute(fileRoute, { user: other, params: { id: row!.id } })).status).toBe(404);
  });

  it("only the awarded firm lodges evidence", async () => {
    const { status } = await lodge(jobId, { kind: "photo", lineKey: "ev-rec" }, { bytes: await photo(), name: "b.jpg", type: "image/jpeg" }, contractorB);
    // Firm B was offered the job (it may see it) but the work went to firm A.
    expect(status).toBe(403);
    const asManager = await lodge(jobId, { kind: "photo" }, { bytes: await photo(), name: "b.jpg", type: "image/jpeg" }, manager);
    expect(asManager.status).toBe(403);
  });
});

describe("reviewing evidence changes the variance, the masses and the ledger", () => {
  it("the lodged evidence made the lines unproven; the job is in the workshop", async () => {
    expect(await statusOf("ev-rec")).toBe("unproven");
    // The off-spec tyres were replaced by the LI 121 set typed in with the photo.
    expect(await statusOf("ev-tyr")).toBe("unproven");
    const tyreFitments = await database.select().from(fitments).where(and(eq(fitments.vehicleId, vehicle.id), eq(fitments.lineKey, "ev-tyr")));
    expect(tyreFitments.filter((f) => f.removedAt === null).map((f) => f.attributes.loadIndex)).toEqual([121]);
    expect(tyreFitments.filter((f) => f.removedAt !== null).map((f) => f.attributes.loadIndex)).toEqual([116]);
    expect((await database.query.jobs.findFirst({ where: eq(jobs.id, jobId) }))?.state).toBe("in_workshop");
    const lodgedMail = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "evidence.lodged"));
    expect(lodgedMail.some((m) => m.toAddress === "manager@mirrabel-health.example" && m.textBody.includes(`/jobs/${jobId}`))).toBe(true);
  });

  it("a rejected piece needs a reason, tells the contractor, and leaves the line unproven", async () => {
    const extra = await lodge(jobId, { kind: "photo", lineKey: "ev-rec" }, { bytes: await photo(), name: "blurry.jpg", type: "image/jpeg" });
    const id = (extra.json as { id: string }).id;
    expect((await callRoute(reviewRoute, { user: manager, params: { id }, body: { decision: "reject" } })).status).toBe(422);
    const rejected = await callRoute(reviewRoute, { user: manager, params: { id }, body: { decision: "reject", reason: "Too blurry to read the brand plate" } });
    expect(rejected.json).toMatchObject({ status: "rejected" });
    const mail = (await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "evidence.rejected"))).find((m) => m.textBody.includes("Too blurry"));
    expect(mail?.toAddress).toBe("contractor@tallowbark-fitout.example");
    const again = await callRoute(reviewRoute, { user: manager, params: { id }, body: { decision: "accept" } });
    expect(again.status).toBe(409);
    expect(await statusOf("ev-rec")).toBe("unproven");
    expect((await callRoute(reviewRoute, { user: contractorA, params: { id }, body: { decision: "accept" } })).status).toBe(403);
  });

  it("accepting the photos turns the lines to meets", async () => {
    const pending = await database.select().from(evidence).where(and(eq(evidence.jobId, jobId), eq(evidence.status, "lodged")));
    for (const piece of pending) {
      const { status } = await callRoute(reviewRoute, { user: manager, params: { id: piece.id }, body: { decision: "accept" } });
      expect(status).toBe(200);
    }
    expect(await statusOf("ev-rec")).toBe("meets");
    expect(await statusOf("ev-tyr")).toBe("meets");
  });

  it("a weighbridge ticket with its axle masses updates the vehicle's measured masses once accepted", async () => {
    const missing = await lodge(jobId, { kind: "weighbridge_ticket" }, { bytes: pdf(), name: "ticket.pdf", type: "application/pdf" });
    expect(missing.status).toBe(422);
    const fields = (missing.json as { error: { details: { field: string }[] } }).error.details.map((d) => d.field);
    expect(fields).toEqual(expect.arrayContaining(["ticketNumber", "frontKg", "rearKg", "grossKg"]));
    const mismatch = await lodge(jobId, { kind: "weighbridge_ticket", ticketNumber: "WB-1", frontKg: "1400", rearKg: "1500", grossKg: "3100" }, { bytes: pdf(), name: "ticket.pdf", type: "application/pdf" });
    expect(mismatch.json).toMatchObject({ error: { details: [{ field: "grossKg" }] } });

    const ok = await lodge(jobId, { kind: "weighbridge_ticket", ticketNumber: "WB-20417", weighedAt: "2026-06-02", frontKg: "1410", rearKg: "1690", grossKg: "3100" }, { bytes: pdf(), name: "ticket.pdf", type: "application/pdf" });
    expect(ok.status).toBe(201);
    const id = (ok.json as { id: string }).id;
    expect(await database.query.weighbridgeTickets.findFirst({ where: eq(weighbridgeTickets.evidenceId, id) })).toMatchObject({ ticketNumber: "WB-20417", frontKg: 1410, rearKg: 1690, grossKg: 3100 });
    expect((await database.query.vehicles.findFirst({ where: eq(vehicles.id, vehicle.id) }))?.measuredGrossKg).toBeNull();
    const accepted = await callRoute(reviewRoute, { user: manager, params: { id }, body: { decision: "accept" } });
    expect(accepted.json).toMatchObject({ measured: { frontKg: 1410, rearKg: 1690, grossKg: 3100 } });
    expect(await database.query.vehicles.findFirst({ where: eq(vehicles.id, vehicle.id) })).toMatchObject({ measuredFrontKg: 1410, measuredRearKg: 1690, measuredGrossKg: 3100 });
  });

  it("signing off twice at once books the cost exactly once, with the vehicle's cost centre and depot", async () => {
    expect((await callRoute(progressRoute, { user: contractorA, params: { id: jobId }, body: { to: "evidence_lodged" } })).status).toBe(200);
    const [a, b] = await Promise.all([
      callRoute(signOffRoute, { user: manager, params: { id: jobId }, body: {} }),
      callRoute(signOffRoute, { user: manager, params: { id: jobId }, body: {} }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const booked = await database.select().from(costs).where(eq(costs.jobId, jobId));
    expect(booked).toHaveLength(1);
    // Quote: tyres 4 × $410 + boards $320 + labour 2 h × $120 = $2,200.00 excl., GST $220.00 (10 %, hand-worked)
    expect(booked[0]).toMatchObject({
      amountExGstCents: 220_000,
      gstCents: 22_000,
      kind: "capital",
      source: "job",
      category: "tyres",
      costCentre: vehicle.costCentre,
      depotId: vehicle.depotId,
      vehicleId: vehicle.id,
    });
    expect((await database.query.jobs.findFirst({ where: eq(jobs.id, jobId) }))?.state).toBe("signed_off");
    const signedOffMail = await database.select().from(outboxMessages).where(eq(outboxMessages.kind, "job.signed_off"));
    expect(signedOffMail.map((m) => m.toAddress)).toEqual(expect.arrayContaining(["manager@mirrabel-health.example", "finance@mirrabel-health.example", "contractor@tallowbark-fitout.example"]));
  });
});
