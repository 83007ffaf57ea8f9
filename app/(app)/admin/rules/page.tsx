import type { Metadata } from "next";
import { RuleSetList } from "@/components/rules/rule-set-list";
import { Caution, PageHeader } from "@/components/ui";
import { listRuleSetsQuery } from "@/lib/commands/rules";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Rule sets" };

export default async function RuleSetsPage() {
  const user = await requirePermission("read", "OrgSettings");
  const { items, inUseId, chosen } = await execute(listRuleSetsQuery, user, {});
  const canManage = user.ability.can("manage", "OrgSettings");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Rule sets" question="Which limits on lifts and tyre changes do our checks use?" />
      <Caution text="Example values — check your local rules. Limits on lifts, tyre sizes and wheel track differ between jurisdictions and change; a licensed vehicle engineer decides what may be fitted." />
      {!canManage && <p className="text-muted">Only an administrator can choose or edit the rule set.</p>}
      {!chosen && <p className="text-sm">No rule set has been chosen yet: checks use the first example set until an administrator chooses one.</p>}
      <RuleSetList sets={items} inUseId={inUseId} chosen={chosen} canManage={canManage} />
    </div>
  );
}
