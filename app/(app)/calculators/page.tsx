import type { Metadata } from "next";
import { AxleLoadsCalculator } from "@/components/calculators/axle-loads-calculator";
import { BatteryCalculator } from "@/components/calculators/battery-calculator";
import { CableRunCalculator } from "@/components/calculators/cable-run-calculator";
import { TyreChangeCalculator } from "@/components/calculators/tyre-change-calculator";
import { PageHeader } from "@/components/ui";
import { EXAMPLE_RULE_SETS } from "@/lib/rules";
import { requirePermission } from "@/lib/server/guard";

export const metadata: Metadata = { title: "Calculators" };

const SECTIONS = [
  { href: "#axle-loads", label: "Axle loads" },
  { href: "#tyre-change", label: "Tyre change" },
  { href: "#cable-run", label: "Cable run" },
  { href: "#battery", label: "12 V battery" },
];

export default async function CalculatorsPage() {
  await requirePermission("use", "Calculator");
  const ruleSets = EXAMPLE_RULE_SETS.map((r) => ({ id: r.id, name: r.name }));
  return (
    <div className="flex flex-col gap-6">
      <PageHeader title="Calculators" question="Will this change keep the vehicle legal and safe?" />
      <nav aria-label="Calculators on this page">
        <ul className="flex flex-wrap gap-x-5 gap-y-2 text-sm font-semibold">
          {SECTIONS.map((s) => (
            <li key={s.href}>
              <a href={s.href} className="text-accent underline decoration-2 underline-offset-4 hover:text-accent-hover">
                {s.label}
              </a>
            </li>
          ))}
        </ul>
      </nav>
      <div className="flex flex-col gap-6">
        <AxleLoadsCalculator />
        <TyreChangeCalculator ruleSets={ruleSets} />
        <CableRunCalculator />
        <BatteryCalculator />
      </div>
    </div>
  );
}
