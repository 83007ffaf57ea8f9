import { EVIDENCE_LABELS, ZONE_LABELS } from "@/components/standards/labels";
import { EmptyState, Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { FitmentListItem } from "@/db/fitments";
import { RemoveFitmentButton } from "./remove-fitment-button";
import { Instant } from "@/components/providers/time-zone";

const EVIDENCE_TONES = { accepted: "ok", lodged: "info", rejected: "danger" } as const;
const EVIDENCE_WORDS = { accepted: "accepted", lodged: "waiting for review", rejected: "rejected" } as const;

/** What is on the vehicle now: each item, what it answers, its measured values and its proof. */
export function FitmentsTable({ items, codeOfKey, attributeLabels, canManage, now }: { items: FitmentListItem[]; codeOfKey: Map<string, string>; attributeLabels: Map<string, string>; canManage: boolean; now: Date }) {
  if (items.length === 0) return <EmptyState title="Nothing recorded yet">Record what the workshop fitted, and what was already on the vehicle.</EmptyState>;
  return (
    <Table label="Fitted items">
      <THead>
        <Tr>
          <Th>Item</Th>
          <Th>Answers</Th>
          <Th numeric>Qty</Th>
          <Th>Measured</Th>
          <Th>Fitted</Th>
          <Th>Expires</Th>
          <Th>Evidence</Th>
          <Th>Recorded by</Th>
          {canManage && <Th className="text-right">Remove</Th>}
        </Tr>
      </THead>
      <TBody>
        {items.map((f) => {
          const expired = f.expiresAt !== null && f.expiresAt.getTime() <= now.getTime();
          return (
            <Tr key={f.id} data-testid={`fitment-${f.id}`}>
              <Td className="font-medium">
                {f.label}
                {f.lineKey === null && (
                  <div className="text-sm text-muted">
                    Extra
                    {f.massKg !== null && (
                      <>
                        {" · "}
                        <Quantity value={f.massKg} unit="kg" digits={f.massKg % 1 === 0 ? 0 : 1} />
                      </>
                    )}
                    {f.xMm !== null && (
                      <>
                        {" · "}
                        <Quantity value={f.xMm} unit="mm" />
                      </>
                    )}
                    {f.zone ? ` · ${ZONE_LABELS[f.zone]}` : ""}
                  </div>
                )}
              </Td>
              <Td>{f.lineKey ? (codeOfKey.get(f.lineKey) ?? <span className="text-muted">not in this edition</span>) : <span className="text-muted">—</span>}</Td>
              <Td numeric>{f.quantity}</Td>
              <Td className="text-sm">
                {Object.entries(f.attributes).map(([k, v]) => (
                  <div key={k}>
                    {attributeLabels.get(k) ?? k}: <span className="font-medium tabular-nums">{String(v)}</span>
                  </div>
                ))}
              </Td>
              <Td className="whitespace-nowrap"><Instant at={f.fittedAt} show="day" /></Td>
              <Td className="whitespace-nowrap">
                {f.expiresAt ? (
                  expired ? (
                    <StatusPill tone="danger" size="sm">
                      Expired <Instant at={f.expiresAt} show="day" />
                    </StatusPill>
                  ) : (
                    <Instant at={f.expiresAt} show="day" />
                  )
                ) : (
                  <span className="text-muted">—</span>
                )}
              </Td>
              <Td className="text-sm">
                {f.evidence.length === 0 ? (
                  <span className="text-muted">None</span>
                ) : (
                  <ul className="flex flex-col gap-1">
                    {f.evidence.map((e, i) => (
                      <li key={i}>
                        <StatusPill tone={EVIDENCE_TONES[e.status as keyof typeof EVIDENCE_TONES] ?? "neutral"} size="sm">
                          {EVIDENCE_LABELS[e.kind] ?? e.kind} {EVIDENCE_WORDS[e.status as keyof typeof EVIDENCE_WORDS] ?? e.status}
                        </StatusPill>
                      </li>
                    ))}
                  </ul>
                )}
              </Td>
              <Td className="text-sm">{f.recordedByName ?? "—"}</Td>
              {canManage && (
                <Td>
                  <RemoveFitmentButton fitmentId={f.id} label={f.label} />
                </Td>
              )}
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}
