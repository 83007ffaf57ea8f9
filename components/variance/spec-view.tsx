import { CATEGORY_LABELS, EVIDENCE_LABELS, REQUIREMENT_LABELS, dollars, requirementText } from "@/components/standards/labels";
import { Card, CardBody, CardHeader, Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { VehicleVarianceView } from "@/lib/commands/variance";
import type { Criterion, LineCategory, LineStatus } from "@/lib/variance";
import { LINE_STATUS_TONES, LINE_STATUS_WORDS, LineStatusPill } from "./line-status";
import { formatCalendarDay } from "@/lib/format/dates";

type Line = VehicleVarianceView["lines"][number];

/** What the status means for this line, in a few words. */
function detail(line: Line): string {
  switch (line.status) {
    case "short": {
      const expired = line.expiredFitmentIds.length > 0 ? " (the one on board has expired)" : "";
      const lapsed = line.concessionExpiredAt ? ` · concession ended ${formatCalendarDay(line.concessionExpiredAt)}` : "";
      return `${line.missingQuantity} of ${line.requiredQuantity || line.missingQuantity} missing${expired}${lapsed}`;
    }
    case "off_spec":
      return line.failing
        .map((f) => `${f.label} is ${String(f.actual)}${f.unit && typeof f.actual === "number" ? ` ${f.unit}` : ""}; needs ${requirementText({ op: f.op as Criterion["op"], value: f.expected as Criterion["value"], unit: f.unit ?? undefined })}`)
        .join(" · ");
    case "unproven":
      return `Waiting for accepted ${line.evidenceMissing.map((k) => EVIDENCE_LABELS[k] ?? k).join(", ").toLowerCase() || "evidence"}`;
    case "concession":
      return line.concession ? `${line.concession.reason} (until ${formatCalendarDay(line.concession.expiresAt)})` : "Covered by a concession";
    case "prohibited_fitted":
      return "Must not be fitted: remove it";
    case "optional_absent":
      return "Optional";
    case "meets":
      return line.requirement === "must_not_fit" ? "Not fitted, as required" : `${line.fittedQuantity} fitted`;
  }
}

const ORDER: LineStatus[] = ["short", "off_spec", "prohibited_fitted", "unproven", "concession", "meets", "optional_absent"];

export function VarianceSummaryCounts({ view }: { view: VehicleVarianceView }) {
  const s = view.summary;
  if (!s) return null;
  const items: [LineStatus | "extra", number][] = [
    ["meets", s.meets],
    ["short", s.short],
    ["off_spec", s.offSpec],
    ["unproven", s.unproven],
    ["concession", s.concession],
    ["prohibited_fitted", s.prohibitedFitted],
    ["extra", s.extra],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-7" data-testid="variance-summary">
      {items.map(([status, n]) => (
        <div key={status} className="flex flex-col gap-1 rounded-md border border-line bg-surface-raised px-3 py-2" data-testid={`count-${status}`}>
          <dt>{status === "extra" ? <StatusPill tone="neutral" size="sm">Extras</StatusPill> : <StatusPill tone={LINE_STATUS_TONES[status]} size="sm">{LINE_STATUS_WORDS[status]}</StatusPill>}</dt>
          <dd className="text-2xl font-bold tabular-nums">{n}</dd>
        </div>
      ))}
    </dl>
  );
}

/** Every line of the vehicle's edition with its status, gaps first within each category. */
export function VarianceLinesTable({ view }: { view: VehicleVarianceView }) {
  const categories = Object.keys(CATEGORY_LABELS).filter((c) => view.lines.some((l) => l.category === c)) as LineCategory[];
  return (
    <Table label="Lines and their status">
      <THead>
        <Tr>
          <Th>Code</Th>
          <Th>Line</Th>
          <Th>Requirement</Th>
          <Th>Status</Th>
          <Th>What it means</Th>
          <Th numeric>Fitted</Th>
          <Th numeric>Cost to close</Th>
        </Tr>
      </THead>
      {categories.map((category) => (
        <TBody key={category}>
          <Tr className="bg-surface-sunken hover:bg-surface-sunken">
            <Th scope="row" colSpan={7}>
              {CATEGORY_LABELS[category]}
            </Th>
          </Tr>
          {view.lines
            .filter((l) => l.category === category)
            .sort((a, b) => ORDER.indexOf(a.status) - ORDER.indexOf(b.status))
            .map((l) => (
              <Tr key={l.lineId} data-testid={`spec-line-${l.code}`} data-status={l.status}>
                <Td className="font-semibold whitespace-nowrap">{l.code}</Td>
                <Td>{l.title}</Td>
                <Td className="whitespace-nowrap">{REQUIREMENT_LABELS[l.requirement]}</Td>
                <Td>
                  <LineStatusPill status={l.status} />
                </Td>
                <Td className="text-sm">{detail(l)}</Td>
                <Td numeric>{l.requirement === "must_fit" ? `${l.fittedQuantity} / ${l.requiredQuantity}` : l.fittedQuantity}</Td>
                <Td numeric>{l.status === "short" || l.status === "off_spec" ? dollars(l.standardCostCents) : <span className="text-muted">—</span>}</Td>
              </Tr>
            ))}
        </TBody>
      ))}
    </Table>
  );
}

/** The same lines for a phone in the field: gaps first in large type, the lines that meet folded away. */
export function VarianceLinesList({ view }: { view: VehicleVarianceView }) {
  const open = view.lines.filter((l) => !["meets", "optional_absent", "concession"].includes(l.status));
  const rest = view.lines.filter((l) => !open.includes(l));
  const item = (l: Line) => (
    <li key={l.lineId} className="flex flex-col gap-1 py-3" data-testid={`spec-line-${l.code}`} data-status={l.status}>
      <LineStatusPill status={l.status} size="lg" />
      <span className="text-base font-semibold">
        {l.code} {l.title}
      </span>
      <span className="text-base text-muted">{detail(l)}</span>
    </li>
  );
  return (
    <Card>
      <CardHeader title={open.length === 0 ? "Nothing missing" : `${open.length} ${open.length === 1 ? "line needs" : "lines need"} work`} description="Tell the fleet manager about anything that looks wrong." />
      <CardBody>
        {open.length > 0 && <ul className="divide-y divide-line">{open.map(item)}</ul>}
        {rest.length > 0 && (
          <details className="mt-2">
            <summary className="min-h-12 cursor-pointer py-3 text-base font-semibold text-accent">Show the {rest.length} other lines</summary>
            <ul className="divide-y divide-line">{rest.map(item)}</ul>
          </details>
        )}
      </CardBody>
    </Card>
  );
}

/** The order the remaining work can be done in; blocked lines say what they wait for. */
export function BuildOrderCard({ view }: { view: VehicleVarianceView }) {
  return (
    <Card>
      <CardHeader title="Build order of the remaining work" description="From the edition's dependencies: each step can start once the steps before it are done. Engineering sign-off comes before the work it covers." />
      <CardBody>
        {view.buildOrder.length === 0 ? (
          <p className="text-muted">Nothing left to do.</p>
        ) : (
          <ol className="flex flex-col gap-4" data-testid="build-order">
            {view.buildOrder.map((stage) => (
              <li key={stage.stage}>
                <h3 className="text-sm font-semibold uppercase tracking-wide text-muted">
                  Step {stage.stage}
                  {stage.stage === 1 ? " · can start now" : ""}
                </h3>
                <ul className="mt-1 grid grid-cols-1 gap-1 md:grid-cols-2">
                  {stage.lines.map((l) => (
                    <li key={l.lineId} className="flex flex-wrap items-baseline gap-x-2 text-sm">
                      {l.blocked ? <StatusPill tone="warn" size="sm">Blocked</StatusPill> : <StatusPill tone="info" size="sm">Ready</StatusPill>}
                      <span className="font-medium">{l.label}</span>
                      {l.blocked && <span className="text-muted">waits for {l.blockedBy.map((b) => b.label.split(" ")[0]).join(", ")}</span>}
                    </li>
                  ))}
                </ul>
              </li>
            ))}
          </ol>
        )}
      </CardBody>
    </Card>
  );
}

export function CloseFigures({ view }: { view: VehicleVarianceView }) {
  return (
    <p className="text-sm text-muted" data-testid="close-figures">
      To close every gap: about <strong className="text-ink">{dollars(view.costToCloseCents)}</strong> at standard cost, adding about{" "}
      <strong className="text-ink">
        <Quantity value={view.massToCloseKg} unit="kg" digits={1} />
      </strong>{" "}
      of fitted mass.
    </p>
  );
}
