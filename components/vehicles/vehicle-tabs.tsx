"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cn } from "@/components/ui";

export type VehicleTab = { segment: string; label: string };

/** The sections of a vehicle's page, one route each under /vehicles/[id]. */
export function VehicleTabs({ vehicleId, tabs }: { vehicleId: string; tabs: VehicleTab[] }) {
  const pathname = usePathname();
  const base = `/vehicles/${vehicleId}`;
  return (
    <nav aria-label="Vehicle sections" className="border-b border-line">
      <ul className="-mb-px flex flex-wrap gap-1">
        {tabs.map((tab) => {
          const href = tab.segment ? `${base}/${tab.segment}` : base;
          const active = tab.segment ? pathname.startsWith(href) : pathname === base;
          return (
            <li key={tab.segment}>
              <Link
                href={href}
                aria-current={active ? "page" : undefined}
                className={cn(
                  "inline-flex min-h-11 items-center border-b-4 px-3 text-sm font-semibold",
                  active ? "border-accent text-ink" : "border-transparent text-muted hover:text-ink",
                )}
              >
                {tab.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
