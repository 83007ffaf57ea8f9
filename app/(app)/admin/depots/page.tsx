import type { Metadata } from "next";
import { DepotForm } from "@/components/admin/depot-form";
import { Card, CardBody, CardHeader, PageHeader, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { listDepots } from "@/lib/commands/organisation";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Depots" };

export default async function DepotsPage() {
  const user = await requirePermission("read", "Depot");
  const depots = await execute(listDepots, user, {});
  const canManage = user.ability.can("manage", "Depot");
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Depots" question="Where are the vehicles based?" />
      {canManage ? (
        <Card>
          <CardHeader title="Depots" description="Each vehicle and driver belongs to a depot. Codes are short and unique." />
          <CardBody className="flex flex-col gap-4">
            {depots.map((d) => (
              <DepotForm key={d.id} depot={d} />
            ))}
            <hr className="border-line" />
            <DepotForm />
          </CardBody>
        </Card>
      ) : (
        <Table label="Depots">
          <THead>
            <Tr>
              <Th>Name</Th>
              <Th>Code</Th>
              <Th>Region</Th>
            </Tr>
          </THead>
          <TBody>
            {depots.map((d) => (
              <Tr key={d.id}>
                <Td>{d.name}</Td>
                <Td>{d.code}</Td>
                <Td>{d.region}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
