import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ComparePicker } from "@/components/standards/compare-picker";
import { ComparisonView } from "@/components/standards/comparison-view";
import { PageHeader } from "@/components/ui";
import { compareEditionsQuery, getStandard } from "@/lib/commands/standards";
import { AppError } from "@/lib/server/errors";
import { execute } from "@/lib/server/operation";
import { requireStandardsReader } from "../../guard";

export const metadata: Metadata = { title: "Compare editions" };

export default async function ComparePage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ a?: string; b?: string }> }) {
  const [{ id }, query] = await Promise.all([params, searchParams]);
  const user = await requireStandardsReader();
  const missing = (error: unknown) => {
    if (error instanceof AppError && (error.code === "not_found" || error.code === "validation_failed")) notFound();
    throw error;
  };
  const standard = await execute(getStandard, user, { id }).catch(missing);
  const sorted = [...standard.editions].sort((x, y) => x.number - y.number);
  const a = query.a ?? sorted[sorted.length - 2]?.id;
  const b = query.b ?? sorted[sorted.length - 1]?.id;
  if (!a || !b) notFound();
  const comparison = await execute(compareEditionsQuery, user, { a, b }).catch(missing);
  const codeOfKey = new Map(Object.entries(comparison.codes));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        eyebrow={<Link href={`/standards/${standard.id}`} className="hover:underline">{standard.name}</Link>}
        title={`Edition ${comparison.a.number} → edition ${comparison.b.number}`}
        question="What does the newer edition ask for that the older one did not?"
      />
      <ComparePicker standardId={standard.id} editions={standard.editions} a={a} b={b} />
      <ComparisonView comparison={comparison} aLabel={`Edition ${comparison.a.number}`} bLabel={`Edition ${comparison.b.number}`} codeOfKey={codeOfKey} />
    </div>
  );
}
