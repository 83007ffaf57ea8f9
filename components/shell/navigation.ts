import type { Action, AppAbility, Role, Subject } from "@/lib/permissions";

export type NavItem = { href: string; label: string; need: readonly [Action, Subject]; roles?: Role[]; devOnly?: boolean };

/** The app's navigation; each role sees the items its permissions allow. */
export const NAV_ITEMS: NavItem[] = [
  { href: "/vehicles", label: "Vehicles", need: ["read", "Vehicle"] },
  { href: "/standards", label: "Standards", need: ["read", "Standard"], roles: ["admin", "manager", "finance"] },
  { href: "/variance", label: "Variance", need: ["read", "Variance"], roles: ["admin", "manager", "finance"] },
  { href: "/jobs", label: "Jobs", need: ["read", "Job"], roles: ["admin", "manager", "finance", "contractor"] },
  { href: "/drive", label: "My checks", need: ["create", "PreTripCheck"], roles: ["driver"] },
  { href: "/drive/report", label: "Report a defect", need: ["create", "Defect"], roles: ["driver"] },
  { href: "/defects", label: "Defects", need: ["triage", "Defect"], roles: ["manager"] },
  { href: "/approvals", label: "Approvals", need: ["approve", "FinanceApproval"] },
  { href: "/platforms", label: "Platforms", need: ["read", "Platform"], roles: ["admin", "manager", "finance"] },
  { href: "/imports", label: "Import", need: ["manage", "Vehicle"] },
  { href: "/costs", label: "Costs", need: ["read", "Cost"] },
  { href: "/budgets", label: "Budgets", need: ["read", "Cost"] },
  { href: "/calculators", label: "Calculators", need: ["use", "Calculator"] },
  { href: "/admin/users", label: "People", need: ["read", "User"] },
  { href: "/admin/depots", label: "Depots", need: ["read", "Depot"], roles: ["admin", "manager", "finance"] },
  { href: "/admin/firms", label: "Workshops", need: ["read", "Firm"] },
  { href: "/admin/settings", label: "Settings", need: ["read", "OrgSettings"] },
  { href: "/admin/rules", label: "Rule sets", need: ["read", "OrgSettings"] },
  { href: "/admin/mailbox", label: "Mailbox", need: ["read", "DevMailbox"], devOnly: true },
];

export function navFor(ability: AppAbility, role: Role, production: boolean): NavItem[] {
  return NAV_ITEMS.filter(
    (item) =>
      ability.can(item.need[0], item.need[1]) &&
      (!item.roles || item.roles.includes(role)) &&
      !(item.devOnly && production),
  );
}
