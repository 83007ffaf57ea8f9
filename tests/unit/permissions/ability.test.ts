import { describe, expect, it } from "vitest";
import { defineAbilityFor, record, type Actor } from "@/lib/permissions";
import { ACTIONS, PERMISSIONS, SUBJECTS } from "@/lib/permissions/table";
import { ROLES } from "@/lib/permissions/roles";

const org = "org-1";
const actor = (role: Actor["role"], extra: Partial<Actor> = {}): Actor => ({
  userId: `u-${role}`,
  orgId: org,
  role,
  firmId: null,
  depotId: null,
  ...extra,
});

// The expected cells are read off the permission table of the product (PERMISSIONS.md):
// every filled cell must work, every empty one must be refused.
const expected: Record<string, Record<string, string[]>> = {
  admin: { OrgSettings: ["manage"], User: ["manage"], Depot: ["manage"], Firm: ["manage"], Quote: ["read"], Cost: ["read"], DevMailbox: ["read"] },
  manager: { OrgSettings: ["read"], User: ["read"], Depot: ["read"], Firm: ["manage"], QuoteDecision: ["decide"], Cost: ["read"] },
  finance: { OrgSettings: ["read"], Depot: ["read"], Firm: ["read"], FinanceApproval: ["approve"], Cost: ["manage"] },
  contractor: { Quote: ["manage"], Job: ["read", "progress"], Evidence: ["create", "read"] },
  driver: { Defect: ["create", "read"], PreTripCheck: ["create", "read"] },
};

describe("permission table", () => {
  it("grants the filled cells of the product's permission table", () => {
    for (const [role, subjects] of Object.entries(expected)) {
      const ability = defineAbilityFor(actor(role as Actor["role"], { firmId: "f1" }));
      for (const [subject, actions] of Object.entries(subjects)) {
        for (const action of actions) {
          expect(ability.can(action as never, subject as never), `${role} ${action} ${subject}`).toBe(true);
        }
      }
    }
  });

  it("refuses what the table leaves empty", () => {
    const refused: [Actor["role"], string, string][] = [
      ["manager", "approve", "FinanceApproval"],
      ["manager", "read", "DevMailbox"],
      ["manager", "manage", "User"],
      ["finance", "decide", "QuoteDecision"],
      ["finance", "update", "Quote"],
      ["finance", "read", "User"],
      ["admin", "decide", "QuoteDecision"],
      ["admin", "create", "Quote"],
      ["contractor", "read", "Cost"],
      ["contractor", "read", "User"],
      ["contractor", "read", "Depot"],
      ["driver", "read", "Quote"],
      ["driver", "read", "Cost"],
      ["driver", "manage", "Grounding"],
      ["driver", "use", "Export"],
    ];
    for (const [role, action, subject] of refused) {
      expect(defineAbilityFor(actor(role)).can(action as never, subject as never), `${role} ${action} ${subject}`).toBe(false);
    }
  });

  it("limits a driver to assigned vehicles and a contractor to their firm's jobs", () => {
    const driver = defineAbilityFor(actor("driver"));
    expect(driver.can("read", record("Vehicle", { orgId: org, driverIds: ["u-driver"] }))).toBe(true);
    expect(driver.can("read", record("Vehicle", { orgId: org, driverIds: ["someone-else"] }))).toBe(false);
    const contractor = defineAbilityFor(actor("contractor", { firmId: "firm-a" }));
    expect(contractor.can("read", record("Job", { orgId: org, firmIds: ["firm-a", "firm-b"] }))).toBe(true);
    expect(contractor.can("read", record("Job", { orgId: org, firmIds: ["firm-b"] }))).toBe(false);
    expect(contractor.can("update", record("Quote", { orgId: org, firmIds: ["firm-b"] }))).toBe(false);
  });

  it("never matches a record of another organisation", () => {
    for (const role of ROLES) {
      const ability = defineAbilityFor(actor(role, { firmId: "f", depotId: "d" }));
      for (const rule of PERMISSIONS[role]) {
        const facts = { orgId: "org-2", ownerId: `u-${role}`, firmIds: ["f"], driverIds: [`u-${role}`], depotId: "d" };
        expect(ability.can(rule.action, record(rule.subject, facts)), `${role} ${rule.action} ${rule.subject}`).toBe(false);
      }
    }
  });

  it("lists only known actions and subjects", () => {
    for (const role of ROLES) {
      for (const rule of PERMISSIONS[role]) {
        expect(ACTIONS).toContain(rule.action);
        expect(SUBJECTS).toContain(rule.subject);
      }
    }
  });
});
