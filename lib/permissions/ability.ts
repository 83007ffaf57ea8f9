import {
  createMongoAbility,
  subject as tagSubject,
  type MongoAbility,
  type RawRuleOf,
} from "@casl/ability";
import type { Role } from "./roles";
import { PERMISSIONS, type Action, type PermissionRule, type Subject } from "./table";

/** Who is asking: the signed-in user inside one organisation. */
export type Actor = {
  userId: string;
  orgId: string;
  role: Role;
  /** The contractor firm of a contractor user. */
  firmId: string | null;
  /** The home depot of a driver. */
  depotId: string | null;
};

/**
 * What a record tells the ability about itself. Loaders in db/ fill these from the record:
 * `firmIds` – firms the record is offered/awarded/quoted to; `driverIds` – drivers assigned;
 * `ownerId` – the user who owns or reported it.
 */
export type RecordFacts = {
  orgId: string;
  ownerId?: string | null;
  firmIds?: string[];
  driverIds?: string[];
  depotId?: string | null;
};

export type AppAbility = MongoAbility<[Action, Subject | ({ __caslSubjectType__: Subject } & RecordFacts)]>;

function conditionsFor(rule: PermissionRule, actor: Actor): Record<string, unknown> {
  const base = { orgId: actor.orgId };
  switch (rule.scope) {
    case undefined:
      return base;
    case "own":
      return { ...base, ownerId: actor.userId };
    case "ownDepot":
      return { ...base, depotId: actor.depotId ?? "__none__" };
    case "ownFirm":
      return { ...base, firmIds: { $in: [actor.firmId ?? "__none__"] } };
    case "assigned":
    case "checkable":
      return actor.role === "contractor"
        ? { ...base, firmIds: { $in: [actor.firmId ?? "__none__"] } }
        : { ...base, driverIds: { $in: [actor.userId] } };
  }
}

export function defineAbilityFor(actor: Actor): AppAbility {
  const rules: RawRuleOf<AppAbility>[] = PERMISSIONS[actor.role].map((rule) => ({
    action: rule.action,
    subject: rule.subject,
    conditions: conditionsFor(rule, actor),
  }));
  return createMongoAbility<AppAbility>(rules);
}

/** Tags a record with its subject type so conditional rules can be checked against it. */
export function record(type: Subject, facts: RecordFacts) {
  return tagSubject(type, { ...facts }) as { __caslSubjectType__: Subject } & RecordFacts;
}

/** True when the role's rule for this action is limited to assigned/own records. */
export function isScoped(actor: Actor, action: Action, subject: Subject): boolean {
  const rules = PERMISSIONS[actor.role].filter(
    (r) => r.subject === subject && (r.action === action || r.action === "manage"),
  );
  return rules.length > 0 && rules.every((r) => r.scope !== undefined);
}
