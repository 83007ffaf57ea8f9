import { Badge, Card, CardBody, CardHeader, EmptyState, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { Criterion, EditionLine } from "@/lib/variance";
import { CATEGORY_LABELS, EVIDENCE_LABELS, REQUIREMENT_LABELS, ZONE_LABELS, criterionText, dollars } from "./labels";

type Change = { field: string; before: unknown; after: unknown };
type Comparison = {
  added: EditionLine[];
  removed: EditionLine[];
  changed: { key: string; code: string; title: string; changes: Change[] }[];
  counts: { added: number; removed: number; changed: number; unchanged: number };
};

const FIELD_LABELS: Record<string, string> = {
  code: "Code",
  category: "Category",
  title: "Title",
  requirement: "Requirement",
  quantity: "Quantity",
  massKg: "Mass",
  xMm: "Behind front axle",
  zone: "Zone",
  massKind: "Mass kind",
  criteria: "Criteria",
  evidenceNeeded: "Evidence",
  standardCostCents: "Standard cost",
  dependsOn: "Depends on",
  checkable: "Pre-trip check",
  expiryMonths: "Expiry",
};

function show(field: string, value: unknown, codeOfKey: Map<string, string>): string {
  if (value === null || value === undefined || (Array.isArray(value) && value.length === 0)) return "—";
  switch (field) {
    case "category":
      return CATEGORY_LABELS[value as keyof typeof CATEGORY_LABELS] ?? String(value);
    case "requirement":
      return REQUIREMENT_LABELS[value as keyof typeof REQUIREMENT_LABELS] ?? String(value);
    case "zone":
      return ZONE_LABELS[value as keyof typeof ZONE_LABELS] ?? String(value);
    case "massKg":
      return `${value} kg`;
    case "xMm":
      return `${value} mm`;
    case "standardCostCents":
      return dollars(Number(value));
    case "checkable":
      return value ? "Yes" : "No";
    case "expiryMonths":
      return `${value} months`;
    case "criteria":
      return (value as Criterion[]).map(criterionText).join("; ");
    case "evidenceNeeded":
      return (value as string[]).map((k) => EVIDENCE_LABELS[k] ?? k).join(", ");
    case "dependsOn":
      return (value as string[]).map((k) => codeOfKey.get(k) ?? k).join(", ");
    default:
      return String(value);
  }
}

function LineList({ lines }: { lines: EditionLine[] }) {
  return (
    <ul className="divide-y divide-line">
      {lines.map((l) => (
        <li key={l.key} className="flex flex-wrap gap-x-3 py-2">
          <span className="font-semibold">{l.code}</span>
          <span>{l.title}</span>
          <span className="text-muted">
            {REQUIREMENT_LABELS[l.requirement]} · {l.quantity} × {l.massKg} kg · {dollars(l.standardCostCents)}
          </span>
        </li>
      ))}
    </ul>
  );
}

/** Added, removed and changed lines between two editions, each change before → after. */
export function ComparisonView({ comparison, aLabel, bLabel, codeOfKey }: { comparison: Comparison; aLabel: string; bLabel: string; codeOfKey: Map<string, string> }) {
  const { counts } = comparison;
  if (counts.added + counts.removed + counts.changed === 0) {
    return <EmptyState title="No differences">{`${aLabel} and ${bLabel} ask for the same lines.`}</EmptyState>;
  }
  return (
    <div className="flex flex-col gap-4">
      <p className="flex flex-wrap gap-2" data-testid="compare-counts">
        <Badge tone="ok">{counts.added} added</Badge>
        <Badge tone="danger">{counts.removed} removed</Badge>
        <Badge tone="warn">{counts.changed} changed</Badge>
        <Badge>{counts.unchanged} unchanged</Badge>
      </p>
      {comparison.changed.length > 0 && (
        <Card>
          <CardHeader title={`Changed lines (${counts.changed})`} description={`Each change reads ${aLabel} → ${bLabel}.`} />
          <Table label="Changed lines" className="border-0">
            <THead>
              <Tr>
                <Th>Line</Th>
                <Th>Field</Th>
                <Th>{aLabel}</Th>
                <Th>{bLabel}</Th>
              </Tr>
            </THead>
            <TBody>
              {comparison.changed.flatMap((line) =>
                line.changes.map((change, i) => (
                  <Tr key={`${line.key}-${change.field}`} data-testid={`changed-${line.code}-${change.field}`}>
                    <Td className="font-semibold">{i === 0 ? `${line.code} ${line.title}` : ""}</Td>
                    <Td>{FIELD_LABELS[change.field] ?? change.field}</Td>
                    <Td className="text-muted line-through decoration-1">{show(change.field, change.before, codeOfKey)}</Td>
                    <Td className="font-medium">{show(change.field, change.after, codeOfKey)}</Td>
                  </Tr>
                )),
              )}
            </TBody>
          </Table>
        </Card>
      )}
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <Card>
          <CardHeader title={`Added in ${bLabel} (${counts.added})`} />
          <CardBody>{comparison.added.length ? <LineList lines={comparison.added} /> : <p className="text-muted">None.</p>}</CardBody>
        </Card>
        <Card>
          <CardHeader title={`Removed from ${aLabel} (${counts.removed})`} />
          <CardBody>{comparison.removed.length ? <LineList lines={comparison.removed} /> : <p className="text-muted">None.</p>}</CardBody>
        </Card>
      </div>
    </div>
  );
}
