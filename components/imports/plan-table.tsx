import Link from "next/link";
import { StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { ImportRowOutcome } from "@/lib/commands/imports";

const ACTION: Record<ImportRowOutcome["action"], { tone: "ok" | "info" | "neutral"; dry: string; done: string }> = {
  create: { tone: "ok", dry: "New", done: "Created" },
  update: { tone: "info", dry: "Changes", done: "Updated" },
  unchanged: { tone: "neutral", dry: "No change", done: "Unchanged" },
};

const show = (value: string | number | null) => (value === null || value === "" ? "—" : typeof value === "number" ? value.toLocaleString("en-AU") : value);

/** What each good row does (or did) to the register; written vehicles link to their page. */
export function PlanTable({ rows, done, limit = 100 }: { rows: ImportRowOutcome[]; done: boolean; limit?: number }) {
  const shown = rows.slice(0, limit);
  return (
    <div className="flex flex-col gap-2">
      <Table label={done ? "Vehicles imported" : "What the import would do"} data-testid={done ? "result-rows" : "plan-rows"}>
        <THead>
          <Tr>
            <Th numeric>Row</Th>
            <Th>Fleet no.</Th>
            <Th>{done ? "Result" : "Would be"}</Th>
            <Th>Changes</Th>
          </Tr>
        </THead>
        <TBody>
          {shown.map((r) => (
            <Tr key={r.row}>
              <Td numeric>{r.row}</Td>
              <Td className="whitespace-nowrap font-semibold">
                {done && r.vehicleId ? (
                  <Link href={`/vehicles/${r.vehicleId}`} className="text-accent underline-offset-4 hover:underline">
                    {r.fleetNumber}
                  </Link>
                ) : (
                  r.fleetNumber
                )}
              </Td>
              <Td>
                <StatusPill tone={ACTION[r.action].tone} size="sm">
                  {done ? ACTION[r.action].done : ACTION[r.action].dry}
                </StatusPill>
              </Td>
              <Td className="text-sm">
                {r.changes.length === 0 ? (
                  <span className="text-muted">—</span>
                ) : (
                  <ul className="flex flex-col gap-0.5">
                    {r.changes.map((c) => (
                      <li key={c.field}>
                        <span className="font-medium">{c.label}</span>: {show(c.before)} → {show(c.after)}
                      </li>
                    ))}
                    {r.warnings.map((w) => (
                      <li key={w} className="font-medium text-warn-ink">
                        {w}
                      </li>
                    ))}
                  </ul>
                )}
              </Td>
            </Tr>
          ))}
        </TBody>
      </Table>
      {rows.length > shown.length && <p className="text-sm text-muted">…and {rows.length - shown.length} more rows.</p>}
    </div>
  );
}
