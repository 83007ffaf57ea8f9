import type { Metadata } from "next";
import { SettingsForm } from "@/components/admin/settings-form";
import { Card, CardBody, PageHeader } from "@/components/ui";
import { readSettings } from "@/lib/commands/organisation";
import { timeZoneChoices } from "@/lib/format/dates";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage() {
  const user = await requirePermission("read", "OrgSettings");
  const settings = await execute(readSettings, user, {});
  const readOnly = !user.ability.can("manage", "OrgSettings");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Settings" question="Which thresholds and margins does our organisation work to?" />
      {readOnly && <p className="text-muted">Only an administrator can change these.</p>}
      <Card>
        <CardBody>
          <SettingsForm settings={settings} readOnly={readOnly} timeZones={timeZoneChoices(settings.timeZone)} />
        </CardBody>
      </Card>
    </div>
  );
}
