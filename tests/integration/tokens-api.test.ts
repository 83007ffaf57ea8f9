import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it, vi } from "vitest";
import { GET as exportRoute } from "@/app/api/costs/export/route";
import { GET as listCostsRoute, POST as createCostRoute } from "@/app/api/costs/route";
import { DELETE as revokeRoute } from "@/app/api/tokens/[id]/route";
import { GET as listTokensRoute, POST as createTokenRoute } from "@/app/api/tokens/route";
import { GET as listUsersRoute } from "@/app/api/users/route";
import { GET as varianceExportRoute } from "@/app/api/variance/export/route";
import { apiTokens, auditEntries, memberships } from "@/db/schema";
import { createApiToken, listApiTokens, revokeApiToken } from "@/lib/commands/tokens";
import { sha256Hex } from "@/lib/security/tokens";
import { AppError } from "@/lib/server/errors";
import { execute } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { useTestDatabase } from "../helpers/db";
import { signedInAs } from "../helpers/users";

// The real session module reads the request's Authorization header; no cookie session here.
const requestHeaders: { current: Headers } = { current: new Headers() };
vi.mock("next/headers", () => ({ headers: async () => requestHeaders.current, cookies: async () => ({ getAll: () => [] }) }));

const database = await useTestDatabase();
let finance: SignedIn;
let manager: SignedIn;
let driver: SignedIn;

beforeAll(async () => {
  finance = await signedInAs(database, "finance@mirrabel-health.example");
  manager = await signedInAs(database, "manager@mirrabel-health.example");
  driver = await signedInAs(database, "driver@mirrabel-health.example");
});

async function failure(promise: Promise<unknown>): Promise<AppError> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
  throw new Error("expected the operation to fail");
}

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

/** Calls a route handler the way an integration would: with only a bearer token. */
async function withToken(handler: Handler, token: string | null, options: { url?: string; method?: string; body?: unknown; params?: Record<string, string> } = {}) {
  const headers = new Headers();
  if (token !== null) headers.set("authorization", `Bearer ${token}`);
  if (options.body !== undefined) headers.set("content-type", "application/json");
  requestHeaders.current = headers;
  const request = new Request(options.url ?? "http://localhost/api/test", {
    method: options.method ?? (options.body === undefined ? "GET" : "POST"),
    headers,
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
  });
  const response = await handler(request, { params: Promise.resolve(options.params ?? {}) });
  const type = response.headers.get("content-type") ?? "";
  return { status: response.status, json: type.includes("json") ? ((await response.clone().json()) as unknown) : null, response };
}

const EXPORT_URL = "http://localhost/api/costs/export?format=csv";
const invoice = { incurredOn: "2026-03-01", costCentre: "CC-TOKEN-TEST", category: "safety", kind: "operating", description: "First-aid kit restocked", amount: "84.00" };

describe("making a token", () => {
  it("shows the secret once, stores only its hash and a short prefix, and audits it", async () => {
    const made = await execute(createApiToken, finance, { name: "Ledger pull for the finance system" });
    expect(made.token).toMatch(/^rgl_[A-Za-z0-9_-]{43}$/);
    expect(made.prefix).toBe(made.token.slice(0, 12));
    const row = await database.query.apiTokens.findFirst({ where: eq(apiTokens.id, made.id) });
    expect(row).toMatchObject({ userId: finance.userId, orgId: finance.orgId, tokenHash: sha256Hex(made.token), prefix: made.prefix, revokedAt: null });
    expect(Object.values(row!).some((v) => v === made.token)).toBe(false);
    const listed = await execute(listApiTokens, finance, {});
    expect(listed.items.find((t) => t.id === made.id)).toEqual({
      id: made.id,
      name: "Ledger pull for the finance system",
      prefix: made.prefix,
      createdAt: expect.any(Date),
      lastUsedAt: null,
      revokedAt: null,
    });
    expect(JSON.stringify(listed)).not.toContain(made.token);
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "token.create"), eq(auditEntries.entityId, made.id)) });
    expect(audit?.actorId).toBe(finance.userId);
    expect(JSON.stringify(audit)).not.toContain(made.token);
  });

  it("needs a name", async () => {
    const error = await failure(execute(createApiToken, finance, { name: "  " }));
    expect(error.details[0]?.field).toBe("name");
  });

  it("lists only the user's own tokens", async () => {
    await execute(createApiToken, manager, { name: "Manager's script" });
    const financeList = await execute(listApiTokens, finance, {});
    expect(financeList.items.some((t) => t.name === "Manager's script")).toBe(false);
  });
});

describe("using a token", () => {
  it("pulls the ledger export as its user and records when it was last used", async () => {
    const { token, id } = await execute(createApiToken, finance, { name: "Export" });
    const { status, response } = await withToken(exportRoute, token, { url: EXPORT_URL });
    expect(status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect((await response.text()).split("\r\n")[0]).toContain("Cost centre");
    const row = await database.query.apiTokens.findFirst({ where: eq(apiTokens.id, id) });
    expect(row?.lastUsedAt).toBeInstanceOf(Date);
    const variance = await withToken(varianceExportRoute, token, { url: "http://localhost/api/variance/export?format=xlsx" });
    expect(variance.status).toBe(200);
    expect(variance.response.headers.get("content-type")).toBe("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
  });

  it("does what its user may do: a finance token books a cost", async () => {
    const { token } = await execute(createApiToken, finance, { name: "Booking" });
    const { status, json } = await withToken(createCostRoute, token, { body: invoice });
    expect(status).toBe(201);
    expect(json).toMatchObject({ amountExGstCents: 8_400, gstCents: 840 });
  });

  it("never does more than its user: a manager's token reads but cannot book; a driver's token cannot read costs", async () => {
    const managerToken = (await execute(createApiToken, manager, { name: "Read only" })).token;
    expect((await withToken(listCostsRoute, managerToken, { url: "http://localhost/api/costs" })).status).toBe(200);
    expect((await withToken(exportRoute, managerToken, { url: EXPORT_URL })).status).toBe(200);
    expect((await withToken(createCostRoute, managerToken, { body: invoice })).status).toBe(403);

    const driverToken = (await execute(createApiToken, driver, { name: "Phone" })).token;
    for (const [handler, url] of [
      [listCostsRoute, "http://localhost/api/costs"],
      [exportRoute, EXPORT_URL],
      [varianceExportRoute, "http://localhost/api/variance/export?format=csv"],
      [listUsersRoute, "http://localhost/api/users"],
    ] as const) {
      const { status, json } = await withToken(handler, driverToken, { url });
      expect(status, url).toBe(403);
      expect(json).toMatchObject({ error: { code: "forbidden" } });
    }
    const financeToken = (await execute(createApiToken, finance, { name: "No people" })).token;
    expect((await withToken(listUsersRoute, financeToken, { url: "http://localhost/api/users" })).status).toBe(403);
  });

  it("cannot make or revoke tokens itself", async () => {
    const { token, id } = await execute(createApiToken, finance, { name: "Cannot mint" });
    const minted = await withToken(createTokenRoute, token, { body: { name: "Child token" } });
    expect(minted.status).toBe(403);
    expect((await withToken(revokeRoute, token, { method: "DELETE", params: { id } })).status).toBe(403);
    const listed = await withToken(listTokensRoute, token, { url: "http://localhost/api/tokens" });
    expect(listed.status).toBe(200);
    expect((listed.json as { items: { name: string }[] }).items.some((t) => t.name === "Child token")).toBe(false);
  });

  it("follows its user's role when the role changes", async () => {
    const other = await signedInAs(database, "manager2@mirrabel-health.example");
    const { token } = await execute(createApiToken, other, { name: "Role follows" });
    expect((await withToken(exportRoute, token, { url: EXPORT_URL })).status).toBe(200);
    await database.update(memberships).set({ role: "driver" }).where(and(eq(memberships.userId, other.userId), eq(memberships.orgId, other.orgId)));
    expect((await withToken(exportRoute, token, { url: EXPORT_URL })).status).toBe(403);
    await database.update(memberships).set({ role: "manager" }).where(and(eq(memberships.userId, other.userId), eq(memberships.orgId, other.orgId)));
  });

  it("answers 401 in the one error shape for a missing or unknown token", async () => {
    for (const token of [null, "rgl_not-a-real-token", ""]) {
      const { status, json } = await withToken(exportRoute, token, { url: EXPORT_URL });
      expect(status, String(token)).toBe(401);
      expect(json).toEqual({ error: { code: "unauthenticated", message: expect.any(String), details: [] } });
    }
  });
});

describe("revoking a token", () => {
  it("stops it at once, with an audit entry; a second revoke is a conflict", async () => {
    const { token, id } = await execute(createApiToken, finance, { name: "To revoke" });
    expect((await withToken(exportRoute, token, { url: EXPORT_URL })).status).toBe(200);
    const revoked = await execute(revokeApiToken, finance, { id });
    expect(revoked.revokedAt).toBeInstanceOf(Date);
    expect((await withToken(exportRoute, token, { url: EXPORT_URL })).status).toBe(401);
    expect((await failure(execute(revokeApiToken, finance, { id }))).code).toBe("conflict");
    const audit = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "token.revoke"), eq(auditEntries.entityId, id)) });
    expect(audit?.actorId).toBe(finance.userId);
  });

  it("is refused for someone else's token as if it did not exist", async () => {
    const { id } = await execute(createApiToken, manager, { name: "Not yours" });
    expect((await failure(execute(revokeApiToken, finance, { id }))).code).toBe("not_found");
    const gidgeeFinance = await signedInAs(database, "finance@gidgee-trust.example");
    expect((await failure(execute(revokeApiToken, gidgeeFinance, { id }))).code).toBe("not_found");
    expect((await database.query.apiTokens.findFirst({ where: eq(apiTokens.id, id) }))?.revokedAt).toBeNull();
  });

  it("a deactivated user's tokens are refused with 401, and work again on reactivation", async () => {
    const { token } = await execute(createApiToken, finance, { name: "Deactivation" });
    const where = and(eq(memberships.userId, finance.userId), eq(memberships.orgId, finance.orgId));
    await database.update(memberships).set({ active: false }).where(where);
    try {
      expect((await withToken(exportRoute, token, { url: EXPORT_URL })).status).toBe(401);
      expect((await withToken(listCostsRoute, token, { url: "http://localhost/api/costs" })).status).toBe(401);
    } finally {
      await database.update(memberships).set({ active: true }).where(where);
    }
    expect((await withToken(exportRoute, token, { url: EXPORT_URL })).status).toBe(200);
  });
});
