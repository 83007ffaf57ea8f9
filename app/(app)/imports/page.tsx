import type { Metadata } from "next";
import { ImportHistory } from "@/components/imports/import-history";
import { ImportWizard } from "@/components/imports/import-wizard";
import { Button, Card, CardBody, CardHeader, PageHeader } from "@/components/ui";
import { listImports } from "@/lib/commands/imports";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Import vehicles" };

export default async function ImportsPage() {
  const user = await requirePermission("manage", "Vehicle");
  const history = await execute(listImports, user, {});
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow="Vehicle register"
        title="Import vehicles"
        question="What would this spreadsheet add to the register or change in it?"
        actions={
          <Button asChild variant="secondary">
            <a href="/api/imports/template" download>
              Download template
            </a>
          </Button>
        }
      />
      <ImportWizard />
      <Card>
        <CardHeader title="Import history" description="Every check and import of this organisation, with the file as it was sent." />
        <CardBody>
          <ImportHistory items={history} />
        </CardBody>
      </Card>
    </div>
  );
}
