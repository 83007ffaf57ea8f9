import type { Metadata } from "next";
import { InviteForm } from "@/components/admin/invite-form";
import { MemberActiveForm, MemberRoleForm } from "@/components/admin/member-row-actions";
import { Card, CardBody, CardHeader, PageHeader, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { listDepots, listFirms, listMembers } from "@/lib/commands/organisation";
import { ROLE_LABELS } from "@/lib/permissions";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "People" };

export default async function UsersPage() {
  const user = await requirePermission("read", "User");
  const canManage = user.ability.can("manage", "User");
  const [members, firms, depots] = await Promise.all([
    execute(listMembers, user, {}),
    execute(listFirms, user, {}),
    execute(listDepots, user, {}),
  ]);
  const firmOptions = firms.map((f) => ({ id: f.id, name: f.name }));
  const depotOptions = depots.map((d) => ({ id: d.id, name: d.name }));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="People" question="Who can use Rigline here, and in what role?" />
      {canManage && (
        <Card>
          <CardHeader title="Invite someone" description="They get an e-mail with a link to choose a password. The link works once, for seven days." />
          <CardBody>
            <InviteForm firms={firmOptions} depots={depotOptions} />
          </CardBody>
        </Card>
      )}
      <Table label="People in the organisation">
        <THead>
          <Tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>Status</Th>
            {canManage && <Th>Change</Th>}
          </Tr>
        </THead>
        <TBody>
          {members.map((m) => (
            <Tr key={m.membershipId} data-testid={`member-${m.email}`}>
              <Td className="font-semibold">{m.name}</Td>
              <Td>{m.email}</Td>
              <Td>
                {ROLE_LABELS[m.role]}
                {m.firmName && <span className="block text-sm text-muted">{m.firmName}</span>}
                {m.depotName && <span className="block text-sm text-muted">{m.depotName}</span>}
              </Td>
              <Td>
                {!m.active ? (
                  <StatusPill tone="neutral">Deactivated</StatusPill>
                ) : m.invited ? (
                  <StatusPill tone="info">Invited</StatusPill>
                ) : (
                  <StatusPill tone="ok">Active</StatusPill>
                )}
              </Td>
              {canManage && (
                <Td>
                  {m.userId === user.userId ? (
                    <span className="text-sm text-muted">You</span>
                  ) : (
                    <div className="flex flex-col gap-2">
                      <MemberRoleForm
                        membershipId={m.membershipId}
                        role={m.role}
                        firmId={m.firmId}
                        depotId={m.depotId}
                        firms={firmOptions}
                        depots={depotOptions}
                        label={m.name}
                      />
                      <MemberActiveForm membershipId={m.membershipId} active={m.active} label={m.name} />
                    </div>
                  )}
                </Td>
              )}
            </Tr>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
