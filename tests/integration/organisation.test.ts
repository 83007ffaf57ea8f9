import { and, desc, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { auditEntries, memberships, outboxMessages, passwordTokens, users, vehicles } from "@/db/schema";
import { changeRole, inviteUser, listMembers, saveDepot, setMemberActive, updateSettings } from "@/lib/commands/organisation";
import { getVehicle } from "@/lib/commands/vehicles";
import { inspectPasswordToken, setPasswordWithToken } from "@/lib/commands/passwords";
import { AppError } from "@/lib/server/errors";
import { execute } from "@/lib/server/operation";
import { useTestDatabase } from "../helpers/db";
import { signedInAs } from "../helpers/users";

const database = await useTestDatabase();
let admin: Awaited<ReturnType<typeof signedInAs>>;

beforeAll(async () => {
  admin = await signedInAs(database, "admin@mirrabel-health.example");
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

describe("inviting people", () => {
  it("creates the membership, an invitation link and its e-mail in one transaction", async () => {
    const result = await execute(inviteUser, admin, { name: "Nell Ashgrove", email: "Nell@Mirrabel-Health.example", role: "manager" });
    expect(result.email).toBe("nell@mirrabel-health.example");
    const mail = await database.query.outboxMessages.findFirst({ where: eq(outboxMessages.toAddress, "nell@mirrabel-health.example") });
    expect(mail?.kind).toBe("invitation");
    expect(mail?.status).toBe("pending");
    const link = /\/password\/([A-Za-z0-9_-]+)/.exec(mail!.textBody)?.[1];
    expect(link).toBeTruthy();
    expect(await inspectPasswordToken(link!)).toMatchObject({ purpose: "invite", email: "nell@mirrabel-health.example" });
    const audit = await database.query.auditEntries.findFirst({ where: eq(auditEntries.action, "user.invite") });
    expect(audit?.actorId).toBe(admin.userId);
    // The link sets the password once; a second use is refused.
    await setPasswordWithToken({ token: link, password: "a-long-password-1", confirm: "a-long-password-1" });
    const second = await failure(setPasswordWithToken({ token: link, password: "a-long-password-2", confirm: "a-long-password-2" }));
    expect(second.code).toBe("not_found");
  });

  it("refuses a duplicate member with 409 and writes nothing", async () => {
    const before = await database.select().from(memberships);
    const error = await failure(execute(inviteUser, admin, { name: "Again", email: "manager@mirrabel-health.example", role: "driver" }));
    expect(error.code).toBe("conflict");
    expect(await database.select().from(memberships)).toHaveLength(before.length);
  });

  it("names the bad field when input is wrong", async () => {
    const error = await failure(execute(inviteUser, admin, { name: "", email: "not-an-email", role: "pilot" }));
    expect(error.code).toBe("validation_failed");
    expect(error.details.map((d) => d.field).sort()).toEqual(["email", "name", "role"]);
  });

  it("requires a firm for a contractor", async () => {
    const error = await failure(execute(inviteUser, admin, { name: "Kit Fenner", email: "kit@elsewhere.example", role: "contractor" }));
    expect(error.details[0]?.field).toBe("firmId");
  });

  it("is refused to a manager (403)", async () => {
    const manager = await signedInAs(database, "manager@mirrabel-health.example");
    const error = await failure(execute(inviteUser, manager, { name: "X Y", email: "x@y.example", role: "driver" }));
    expect(error.code).toBe("forbidden");
  });
});

describe("roles and deactivation", () => {
  it("keeps at least one active administrator", async () => {
    const members = await execute(listMembers, admin, {});
    const self = members.find((m) => m.email === "admin@mirrabel-health.example")!;
    const error = await failure(execute(setMemberActive, admin, { membershipId: self.membershipId, active: false }));
    expect(error.code).toBe("conflict");
  });

  it("ends the sessions of a deactivated user by raising their session version", async () => {
    const members = await execute(listMembers, admin, {});
    const driver2 = members.find((m) => m.email === "driver2@mirrabel-health.example")!;
    const before = await database.query.users.findFirst({ where: eq(users.id, driver2.userId) });
    await execute(setMemberActive, admin, { membershipId: driver2.membershipId, active: "false", reason: "left the service" });
    const after = await database.query.users.findFirst({ where: eq(users.id, driver2.userId) });
    expect(after!.sessionVersion).toBe(before!.sessionVersion + 1);
    const membership = await database.query.memberships.findFirst({ where: eq(memberships.id, driver2.membershipId) });
    expect(membership?.active).toBe(false);
    const [entry] = await database.select().from(auditEntries).where(eq(auditEntries.action, "user.deactivate")).orderBy(desc(auditEntries.at));
    expect(entry?.reason).toBe("left the service");
  });

  it("changes a role and records before and after", async () => {
    const members = await execute(listMembers, admin, {});
    const finance = members.find((m) => m.email === "finance@mirrabel-health.example")!;
    await execute(changeRole, admin, { membershipId: finance.membershipId, role: "manager" });
    const entry = await database.query.auditEntries.findFirst({ where: and(eq(auditEntries.action, "user.change_role"), eq(auditEntries.entityId, finance.membershipId)) });
    expect(entry?.before).toMatchObject({ role: "finance" });
    expect(entry?.after).toMatchObject({ role: "manager" });
    await execute(changeRole, admin, { membershipId: finance.membershipId, role: "finance" });
  });
});

describe("depots and settings", () => {
  it("refuses a depot code that is taken, naming the field", async () => {
    const error = await failure(execute(saveDepot, admin, { name: "Second Ochre", code: "ocw" }));
    expect(error.code).toBe("conflict");
    expect(error.details[0]?.field).toBe("code");
  });

  const settings = {
    name: "Mirrabel Remote Health Service",
    approvalThreshold: "5000",
    personMassKg: "80",
    brakeWarningMarginKg: "500",
    springSoftMarginKg: "0",
    springStiffMarginKg: "500",
    weighbridgeToleranceKg: "50",
    gstMethod: "per-line",
  };

  it("stores the approval threshold in integer cents", async () => {
    const result = await execute(updateSettings, admin, { ...settings, approvalThreshold: "7,500.50" });
    expect(result.approvalThresholdCents).toBe(750_050);
  });

  it("keeps the organisation's time zone, changes it to a known zone, and refuses an unknown one naming the field", async () => {
    expect((await execute(updateSettings, admin, settings)).timeZone).toBe("Australia/Darwin");
    expect((await execute(updateSettings, admin, { ...settings, timeZone: "Australia/Brisbane" })).timeZone).toBe("Australia/Brisbane");
    expect((await signedInAs(database, "manager@mirrabel-health.example")).timeZone).toBe("Australia/Brisbane");
    const error = await failure(execute(updateSettings, admin, { ...settings, timeZone: "Australia/Atlantis" }));
    expect(error.code).toBe("validation_failed");
    expect(error.details[0]?.field).toBe("timeZone");
    await execute(updateSettings, admin, { ...settings, timeZone: "Australia/Darwin" });
  });
});

describe("organisation boundary", () => {
  it("never returns another organisation's vehicle by id", async () => {
    const otherManager = await signedInAs(database, "manager@gidgee-trust.example");
    const mirrabelVehicle = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-001") });
    const error = await failure(execute(getVehicle, otherManager, { id: mirrabelVehicle!.id }));
    expect(error.code).toBe("not_found");
    const own = await execute(getVehicle, admin, { id: mirrabelVehicle!.id });
    expect(own.fleetNumber).toBe("MH-001");
  });

  it("lists only the caller's organisation's people", async () => {
    const otherAdmin = await signedInAs(database, "admin@gidgee-trust.example");
    const members = await execute(listMembers, otherAdmin, {});
    expect(members.every((m) => !m.email.endsWith("mirrabel-health.example"))).toBe(true);
    expect(members.length).toBeGreaterThan(0);
  });

  it("shows a driver only the vehicles assigned to them", async () => {
    const driver = await signedInAs(database, "driver@mirrabel-health.example");
    const unassigned = await database.query.vehicles.findFirst({ where: eq(vehicles.fleetNumber, "MH-040") });
    expect((await failure(execute(getVehicle, driver, { id: unassigned!.id }))).code).toBe("not_found");
  });
});

describe("password links", () => {
  it("expire", async () => {
    const user = await database.query.users.findFirst({ where: eq(users.email, "manager2@mirrabel-health.example") });
    const { createPasswordToken } = await import("@/lib/commands/passwords");
    const past = new Date(Date.now() - 2 * 60 * 60_000);
    const secret = await createPasswordToken(database, user!.id, "reset", past);
    expect(await inspectPasswordToken(secret)).toBeNull();
    const error = await failure(setPasswordWithToken({ token: secret, password: "another-password", confirm: "another-password" }));
    expect(error.code).toBe("not_found");
    const tokens = await database.select().from(passwordTokens).where(eq(passwordTokens.userId, user!.id));
    expect(tokens.length).toBeGreaterThan(0);
  });
});
