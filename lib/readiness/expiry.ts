import type { EditionLine, Fitment } from "@/lib/variance";
import type { ExpiringItem } from "./readiness";

/** A date plus whole calendar months (31 Jan + 1 month → 28/29 Feb: the month's last day). */
export function addMonths(date: Date, months: number): Date {
  const d = new Date(date.getTime());
  const day = d.getUTCDate();
  d.setUTCDate(1);
  d.setUTCMonth(d.getUTCMonth() + months);
  const lastDay = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0)).getUTCDate();
  d.setUTCDate(Math.min(day, lastDay));
  return d;
}

/** What expires on a vehicle: fitments (own date, else line expiry in months) and registration. */
export function expiringItemsOf(
  lines: readonly EditionLine[],
  fitments: readonly Fitment[],
  registration: { registration: string | null; registrationExpiry: Date | null },
): ExpiringItem[] {
  const lineById = new Map(lines.map((l) => [l.id, l]));
  const items: ExpiringItem[] = [];
  for (const f of fitments) {
    const line = f.lineId ? lineById.get(f.lineId) : undefined;
    let expiresAt = f.expiresAt;
    if (!expiresAt && line?.expiryMonths && line.expiryMonths > 0) expiresAt = addMonths(f.fittedAt, line.expiryMonths);
    if (!expiresAt) continue;
    items.push({ label: line ? `${line.title} (${line.code})` : f.label, expiresAt });
  }
  if (registration.registrationExpiry) {
    items.push({ label: `Registration${registration.registration ? ` ${registration.registration}` : ""}`, expiresAt: registration.registrationExpiry });
  }
  return items.sort((a, b) => a.expiresAt.getTime() - b.expiresAt.getTime());
}
