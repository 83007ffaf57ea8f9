import type { Metadata } from "next";
import Link from "next/link";
import { ReadinessOverTimeChart, VarianceClosingChart, type TrendPoint } from "@/components/charts";
import { ExportLinks } from "@/components/costs/export-links";
import { Card, CardBody, PageHeader } from "@/components/ui";
import { fleetTrends } from "@/lib/commands/costs";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Fleet over time" };

/** The last figures of each week (weeks end on Sunday), and the latest day as the last point. */
function weekly(points: TrendPoint[]): TrendPoint[] {
  const out: TrendPoint[] = [];
  points.forEach((p, i) => {
    const isSunday = new Date(`${p.day}T00:00:00Z`).getUTCDay() === 0;
    if (isSunday || i === points.length - 1) out.push(p);
  });
  return out;
}

export default async function FleetTrendsPage() {
  const user = await requirePermission("read", "Cost");
  const { items } = await execute(fleetTrends, user, {});
  const points = weekly(items);
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        title="Fleet over time"
        question="Is the fleet getting readier, and are the gaps to the standard closing?"
        actions={<ExportLinks values={{}} base="/api/variance/export" what="fleet variance, vehicle by vehicle" testIdPrefix="variance-export" />}
      />
      <nav aria-label="Cost views" className="flex gap-4 text-sm font-semibold">
        <Link href="/costs" className="pb-1 text-accent hover:underline">
          Ledger
        </Link>
        <Link href="/budgets" className="pb-1 text-accent hover:underline">
          Budgets
        </Link>
        <span aria-current="page" className="border-b-4 border-accent pb-1">
          Fleet over time
        </span>
      </nav>
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        <Card>
          <CardBody>
            <ReadinessOverTimeChart points={points} />
          </CardBody>
        </Card>
        <Card>
          <CardBody>
            <VarianceClosingChart points={points} />
          </CardBody>
        </Card>
      </div>
      <p className="text-sm text-muted">
        Figures are recorded once a day for the whole fleet; retired vehicles are not counted. The downloads list today&apos;s variance of each vehicle against its edition.
      </p>
    </div>
  );
}
