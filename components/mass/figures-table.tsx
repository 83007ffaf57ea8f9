import { Badge, Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr, type StatusTone } from "@/components/ui";
import type { MassCheck, MassLimit } from "@/lib/mass";
import { LIMIT_LABELS, type MassFigures } from "./model";

/** Within, tight (less than 5 % of the limit left) or over. */
export function checkStatus(check: Pick<MassCheck, "ok" | "headroomKg" | "capacityKg">): { tone: StatusTone; word: string } {
  if (!check.ok) return { tone: "danger", word: "Over" };
  if (check.headroomKg < check.capacityKg * 0.05) return { tone: "warn", word: "Tight" };
  return { tone: "ok", word: "Within" };
}

const ORDER: MassLimit[] = ["front", "rear", "gvm", "gcm", "frontTyres", "rearTyres", "roof", "towing", "towball"];

/**
 * Every limit checked, with its load, rating, headroom and status, the binding one marked; the
 * change column compares with the vehicle as fitted (without the plan).
 */
export function FiguresTable({ figures, fittedOnly }: { figures: MassFigures; fittedOnly: MassFigures | null }) {
  const checks = [...figures.checks].sort((a, b) => ORDER.indexOf(a.limit) - ORDER.indexOf(b.limit));
  const before = new Map((fittedOnly?.checks ?? []).map((c) => [c.limit, c]));
  return (
    <Table label="Loads, limits and headroom">
      <THead>
        <Tr>
          <Th>Limit</Th>
          <Th numeric>Load</Th>
          <Th numeric>Rating</Th>
          <Th numeric>Headroom</Th>
          <Th numeric>Plan changes load by</Th>
          <Th>Status</Th>
        </Tr>
      </THead>
      <TBody>
        {checks.map((c) => {
          const status = checkStatus(c);
          const binding = figures.binding?.limit === c.limit;
          const was = before.get(c.limit);
          const change = was ? c.loadKg - was.loadKg : null;
          return (
            <Tr key={c.limit} selected={binding} data-testid={`check-${c.limit}`}>
              <Th scope="row">
                <span className="flex flex-wrap items-center gap-2">
                  {LIMIT_LABELS[c.limit]}
                  {binding && <Badge tone="accent">Binding</Badge>}
                </span>
              </Th>
              <Td numeric>
                <Quantity value={c.loadKg} unit="kg" data-testid={`load-${c.limit}`} />
              </Td>
              <Td numeric>
                <Quantity value={c.capacityKg} unit="kg" />
              </Td>
              <Td numeric className={c.ok ? undefined : "font-semibold text-danger"}>
                <Quantity value={c.headroomKg} unit="kg" signed data-testid={`headroom-${c.limit}`} />
              </Td>
              <Td numeric>{change === null || Math.abs(change) < 0.5 ? <span className="text-muted">—</span> : <Quantity value={change} unit="kg" signed />}</Td>
              <Td>
                <StatusPill tone={status.tone} size="sm">
                  {status.word}
                </StatusPill>
              </Td>
            </Tr>
          );
        })}
        {checks.length === 0 && (
          <Tr>
            <Td colSpan={6} className="text-muted">
              No limit can be checked until the maker&apos;s figures are entered for this platform.
            </Td>
          </Tr>
        )}
      </TBody>
    </Table>
  );
}
