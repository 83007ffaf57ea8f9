export const ROLES = ["admin", "manager", "finance", "contractor", "driver"] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Administrator",
  manager: "Fleet manager",
  finance: "Finance",
  contractor: "Contractor",
  driver: "Driver",
};
