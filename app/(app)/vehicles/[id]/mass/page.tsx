import type { Metadata } from "next";
import { MassWorkspace } from "@/components/mass/mass-workspace";
import { massTabQuery } from "@/lib/commands/mass";
import { requirePermission } from "@/lib/server/guard";
import { execute } from "@/lib/server/operation";

export const metadata: Metadata = { title: "Mass & fit-out" };

export default async function VehicleMassPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePermission("read", "MassPlan");
  const data = await execute(massTabQuery, user, { id });
  return <MassWorkspace data={data} />;
}
