import type { Metadata } from "next";
import { FirmForm } from "@/components/admin/firm-form";
import { Card, CardBody, CardHeader, PageHeader, StatusPill } from "@/components/ui";
import { listFirms } from "@/lib/commands/organisation";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Workshops" };

export default async function FirmsPage() {
  const user = await requirePermission("read", "Firm");
  const firms = await execute(listFirms, user, {});
  const canManage = user.ability.can("manage", "Firm");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title={user.role === "contractor" ? "My workshop" : "Workshops"}
        question={user.role === "contractor" ? "Who works under our firm here?" : "Which contractor firms can quote our work, and who works for them?"}
      />
      {firms.map((firm) => (
        <Card key={firm.id}>
          <CardHeader
            title={firm.name}
            description={`${firm.members.length} contractor ${firm.members.length === 1 ? "account" : "accounts"}`}
            actions={firm.active ? <StatusPill tone="ok">Taking work</StatusPill> : <StatusPill tone="neutral">Not taking work</StatusPill>}
          />
          <CardBody className="flex flex-col gap-4">
            {canManage ? (
              <FirmForm firm={firm} />
            ) : (
              <p>
                {firm.email} {firm.phone && `· ${firm.phone}`} {firm.abn && `· ABN ${firm.abn}`}
              </p>
            )}
            <div>
              <h3 className="mb-1 text-sm font-semibold text-muted">People of this workshop</h3>
              {firm.members.length === 0 ? (
                <p className="text-sm text-muted">Nobody yet. An administrator invites contractors on the People page and picks this workshop.</p>
              ) : (
                <ul className="text-sm">
                  {firm.members.map((m) => (
                    <li key={m.email}>
                      {m.name} · {m.email} {!m.active && "(deactivated)"}
                    </li>
                  ))}
                </ul>
              )}
            </div>
          </CardBody>
        </Card>
      ))}
      {canManage && (
        <Card>
          <CardHeader title="Add a workshop" />
          <CardBody>
            <FirmForm />
          </CardBody>
        </Card>
      )}
    </div>
  );
}
