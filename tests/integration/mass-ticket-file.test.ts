import { createHash } from "node:crypto";
import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { eq } from "drizzle-orm";
import exifr from "exifr";
import sharp from "sharp";
import { afterAll, describe, expect, it, vi } from "vitest";
import { GET as fileRoute } from "@/app/api/vehicles/[id]/weighbridge/[ticketId]/file/route";
import { GET as listRoute, POST as postRoute } from "@/app/api/vehicles/[id]/weighbridge/route";
import { auditEntries, evidence, vehicles, weighbridgeTickets } from "@/db/schema";
import { diskStorage, setStorageForTests } from "@/lib/server/storage";
import { useTestDatabase } from "../helpers/db";
import { callRoute, requestUser } from "../helpers/route";
import { signedInAs } from "../helpers/users";

vi.mock("@/lib/server/session", async (original) => ({
  ...(await original<typeof import("@/lib/server/session")>()),
  currentUser: async () => requestUser.current,
}));

const database = await useTestDatabase();
const storageDir = mkdtempSync(join(tmpdir(), "rigline-tickets-"));
setStorageForTests(diskStorage(storageDir));
afterAll(() => {
  setStorageForTests(undefined);
  rmSync(storageDir, { recursive: true, force: true });
});

const manager = await signedInAs(database, "manager@mirrabel-health.example");
const finance = await signedInAs(database, "finance@mirrabel-health.example");
const driver = await signedInAs(database, "driver@mirrabel-health.example");
const otherManager = await signedInAs(database, "manager@gidgee-trust.example");
const vehicle = (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-037") }))!;

type Recorded = { ticket: { id: string; evidenceId: string | null; file: { id: string; filename: string; contentType: string; sizeBytes: number; sha256: string; href: string } | null } };
type ErrorJson = { error: { code: string; details: { field?: string }[] } };

// Invented ticket figures (front + rear = gross).
let serial = 0;
function ticketForm(file?: { bytes: Uint8Array; name: string; type: string }) {
  serial += 1;
  const body = new FormData();
  body.set("weighedAt", "2026-03-20");
  body.set("ticketNumber", `TF-${serial}`);
  body.set("frontKg", "1420");
  body.set("rearKg", "1180");
  body.set("grossKg", "2600");
  body.set("file", file ? new File([new Uint8Array(file.bytes)], file.name, { type: file.type }) : new File([], "", { type: "application/octet-stream" }));
  return body;
}

const post = (body: FormData, user = manager, id = vehicle.id) => callRoute(postRoute, { user, params: { id }, body, headers: {} });

const pdf = () => Buffer.from("%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n", "latin1");
const photo = (withGps: boolean) => {
  let image = sharp({ create: { width: 80, height: 60, channels: 3, background: { r: 90, g: 120, b: 60 } } }).jpeg();
  if (withGps) image = image.withExif({ IFD0: { Make: "Invented camera" }, IFD3: { GPSLatitudeRef: "S", GPSLatitude: "23/1 42/1 0/1", GPSLongitudeRef: "E", GPSLongitude: "133/1 52/1 0/1" } });
  return image.toBuffer();
};

describe("a weighbridge ticket with its file", () => {
  it("keeps a PDF as it came, records its SHA-256 and serves it back through the app", async () => {
    const bytes = pdf();
    const { status, json } = await post(ticketForm({ bytes, name: "ticket 4471.pdf", type: "application/pdf" }));
    expect(status).toBe(201);
    const { ticket } = json as Recorded;
    expect(ticket.file).toMatchObject({ filename: "ticket 4471.pdf", contentType: "application/pdf", sizeBytes: bytes.length, sha256: createHash("sha256").update(bytes).digest("hex") });
    expect(ticket.file!.href).toBe(`/api/vehicles/${vehicle.id}/weighbridge/${ticket.id}/file`);
    const row = (await database.query.evidence.findFirst({ where: eq(evidence.id, ticket.evidenceId!) }))!;
    expect(row).toMatchObject({ kind: "weighbridge_ticket", jobId: null, status: "accepted", storageKey: `evidence/${manager.orgId}/${row.id}.pdf` });
    expect(readdirSync(join(storageDir, "evidence", manager.orgId))).toContain(`${row.id}.pdf`);
    const audit = await database.query.auditEntries.findFirst({ where: eq(auditEntries.entityId, ticket.id) });
    expect(audit?.after).toMatchObject({ file: { sha256: row.sha256 } });

    const served = await callRoute(fileRoute, { user: finance, params: { id: vehicle.id, ticketId: ticket.id } });
    expect(served.status).toBe(200);
    expect(served.response.headers.get("content-type")).toBe("application/pdf");
    expect(served.response.headers.get("content-disposition")).toContain('attachment; filename="ticket 4471.pdf"');
    expect(Buffer.from(await served.response.arrayBuffer()).equals(bytes)).toBe(true);

    // The list shows the file and where to fetch it.
    const list = await callRoute(listRoute, { user: manager, params: { id: vehicle.id } });
    const listed = (list.json as { items: { id: string; file: { href: string } | null }[] }).items.find((t) => t.id === ticket.id);
    expect(listed?.file?.href).toBe(ticket.file!.href);
  });

  it("strips a JPEG's EXIF and location before storing it", async () => {
    const original = await photo(true);
    expect(await exifr.gps(original)).toMatchObject({ latitude: expect.closeTo(-23.7, 3) });
    const { status, json } = await post(ticketForm({ bytes: original, name: "ticket.jpg", type: "image/jpeg" }));
    expect(status).toBe(201);
    const { ticket } = json as Recorded;
    expect(ticket.file?.contentType).toBe("image/jpeg");
    const served = await callRoute(fileRoute, { user: manager, params: { id: vehicle.id, ticketId: ticket.id } });
    const bytes = Buffer.from(await served.response.arrayBuffer());
    expect(await exifr.gps(bytes)).toBeUndefined();
    expect(await exifr.parse(bytes)).toBeUndefined();
    expect(createHash("sha256").update(bytes).digest("hex")).toBe(ticket.file!.sha256);
  });

  it("records a ticket without a file when none is chosen", async () => {
    const { status, json } = await post(ticketForm());
    expect(status).toBe(201);
    expect((json as Recorded).ticket).toMatchObject({ evidenceId: null, file: null });
  });

  it("takes a WebP photo of the ticket as any evidence photo, stored as JPEG", async () => {
    const webp = await sharp({ create: { width: 8, height: 8, channels: 3, background: "#808080" } }).webp().toBuffer();
    const { status, json } = await post(ticketForm({ bytes: webp, name: "ticket.webp", type: "image/webp" }));
    expect(status).toBe(201);
    expect((json as Recorded).ticket.file).toMatchObject({ contentType: "image/jpeg" });
  });

  it("refuses content of another type with 415 naming file, as evidence uploads do, whatever its name, and records nothing", async () => {
    const before = await database.select().from(weighbridgeTickets).where(eq(weighbridgeTickets.vehicleId, vehicle.id));
    const gif = Buffer.from("R0lGODlhAQABAIAAAAAAAP///yH5BAEAAAAALAAAAAABAAEAAAIBRAA7", "base64");
    for (const file of [
      { bytes: Buffer.from("ticket 4471, front 1420 kg"), name: "ticket.pdf", type: "application/pdf" },
      { bytes: gif, name: "ticket.png", type: "image/png" },
    ]) {
      const { status, json } = await post(ticketForm(file));
      expect(status, file.name).toBe(415);
      expect((json as ErrorJson).error.details.map((d) => d.field)).toContain("file");
    }
    expect(await database.select().from(weighbridgeTickets).where(eq(weighbridgeTickets.vehicleId, vehicle.id))).toHaveLength(before.length);
  });

  it("refuses a file over the 10 MiB limit with 413", async () => {
    const big = Buffer.concat([pdf(), Buffer.alloc(10 * 1024 * 1024, 0x20)]);
    const { status, json } = await post(ticketForm({ bytes: big, name: "big.pdf", type: "application/pdf" }));
    expect(status).toBe(413);
    expect(json).toMatchObject({ error: { code: "payload_too_large", details: [{ field: "file" }] } });
  });

  it("serves the file only to roles that read tickets, and never across organisations", async () => {
    const { json } = await post(ticketForm({ bytes: pdf(), name: "t.pdf", type: "application/pdf" }));
    const { ticket } = json as Recorded;
    expect((await callRoute(fileRoute, { user: null, params: { id: vehicle.id, ticketId: ticket.id } })).status).toBe(401);
    expect((await callRoute(fileRoute, { user: driver, params: { id: vehicle.id, ticketId: ticket.id } })).status).toBe(403);
    expect((await callRoute(fileRoute, { user: otherManager, params: { id: vehicle.id, ticketId: ticket.id } })).status).toBe(404);
    // Another organisation's own vehicle with this organisation's ticket id is not found either.
    const theirs = (await database.query.vehicles.findFirst({ where: eq(vehicles.orgId, otherManager.orgId) }))!;
    expect((await callRoute(fileRoute, { user: otherManager, params: { id: theirs.id, ticketId: ticket.id } })).status).toBe(404);
    // A ticket of another vehicle of the same organisation is not found under this one.
    const sibling = (await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-036") }))!;
    expect((await callRoute(fileRoute, { user: manager, params: { id: sibling.id, ticketId: ticket.id } })).status).toBe(404);
    // Nor can another organisation record a ticket on this vehicle.
    expect((await post(ticketForm({ bytes: pdf(), name: "t.pdf", type: "application/pdf" }), otherManager)).status).toBe(404);
  });
});
