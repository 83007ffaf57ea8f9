import { Badge, Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { EditionLine } from "@/lib/variance";
import { CATEGORY_LABELS, EVIDENCE_LABELS, REQUIREMENT_LABELS, ZONE_LABELS, criterionText, dollars } from "./labels";
import { LineActions } from "./line-actions";

type Props = {
  standardId: string;
  editionId: string;
  lines: EditionLine[];
  /** A draft edited by someone allowed to: shows the edit and delete actions. */
  editable: boolean;
};

/** The lines of an edition, grouped by category, every field on show. */
export function LinesTable({ standardId, editionId, lines, editable }: Props) {
  const byId = new Map(lines.map((l) => [l.id, l]));
  const others = lines.map((l) => ({ id: l.id, code: l.code, title: l.title }));
  const categories = Object.keys(CATEGORY_LABELS).filter((c) => lines.some((l) => l.category === c)) as EditionLine["category"][];
  return (
    <Table label="Lines of this edition">
      <THead>
        <Tr>
          <Th>Code</Th>
          <Th>Line</Th>
          <Th>Requirement</Th>
          <Th numeric>Qty</Th>
          <Th numeric>Mass</Th>
          <Th>Where</Th>
          <Th>Criteria and evidence</Th>
          <Th numeric>Standard cost</Th>
          <Th>Depends on</Th>
          {editable && <Th className="text-right">Actions</Th>}
        </Tr>
      </THead>
      {categories.map((category) => (
        <TBody key={category}>
          <Tr className="bg-surface-sunken hover:bg-surface-sunken">
            <Th scope="row" colSpan={editable ? 10 : 9}>
              {CATEGORY_LABELS[category]}
            </Th>
          </Tr>
          {lines
            .filter((l) => l.category === category)
            .map((l) => (
              <Tr key={l.id} data-testid={`line-${l.code}`}>
                <Td className="font-semibold whitespace-nowrap">{l.code}</Td>
                <Td>
                  <div className="font-medium">{l.title}</div>
                  <div className="flex flex-wrap gap-1 pt-0.5">
                    {l.checkable && <Badge tone="info">Pre-trip check</Badge>}
                    {l.expiryMonths && <Badge>Expires after {l.expiryMonths} months</Badge>}
                    {l.massKind === "variable" && <Badge>Variable mass</Badge>}
                  </div>
                </Td>
                <Td className="whitespace-nowrap">{REQUIREMENT_LABELS[l.requirement]}</Td>
                <Td numeric>{l.quantity}</Td>
                <Td numeric>
                  <Quantity value={l.massKg} unit="kg" digits={l.massKg % 1 === 0 ? 0 : 1} />
                </Td>
                <Td className="whitespace-nowrap">
                  {l.xMm !== null && <Quantity value={l.xMm} unit="mm" />}
                  {l.xMm !== null && l.zone && " · "}
                  {l.zone && ZONE_LABELS[l.zone]}
                  {l.xMm === null && !l.zone && <span className="text-muted">—</span>}
                </Td>
                <Td>
                  <ul className="text-sm">
                    {l.criteria.map((c, i) => (
                      <li key={i}>{criterionText(c)}</li>
                    ))}
                    {l.evidenceNeeded.length > 0 && <li className="text-muted">Evidence: {l.evidenceNeeded.map((k) => EVIDENCE_LABELS[k] ?? k).join(", ")}</li>}
                  </ul>
                </Td>
                <Td numeric>{dollars(l.standardCostCents)}</Td>
                <Td className="text-sm">{l.dependsOn.map((d) => byId.get(d)?.code ?? "?").join(", ") || <span className="text-muted">—</span>}</Td>
                {editable && (
                  <Td>
                    <LineActions standardId={standardId} editionId={editionId} line={l} others={others.filter((o) => o.id !== l.id)} />
                  </Td>
                )}
              </Tr>
            ))}
        </TBody>
      ))}
    </Table>
  );
}
