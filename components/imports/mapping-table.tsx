"use client";

import { VEHICLE_FIELDS, VEHICLE_FIELD_INFO, type VehicleField } from "@/imports/fields";
import { Select, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { ImportResult, MappingSource } from "@/lib/commands/imports";

export type EditableMapping = Record<string, VehicleField | null>;

const SOURCE_WORD: Record<MappingSource, string> = { automatic: "Automatic", saved: "Saved", chosen: "Your choice" };

/** Each column of the file, what it is imported as (the user may correct it), and why. */
export function MappingTable({
  check,
  mapping,
  edited,
  onChange,
  disabled,
}: {
  check: ImportResult;
  mapping: EditableMapping;
  /** Headings the user changed since the last check. */
  edited: ReadonlySet<string>;
  onChange: (heading: string, field: VehicleField | null) => void;
  disabled?: boolean;
}) {
  const example = (heading: string) =>
    check.preview
      .map((row) => row.cells[heading])
      .filter((v): v is string => v !== null && v !== undefined && v !== "")
      .slice(0, 2)
      .join(" · ");
  const usedBy = new Map<VehicleField, string[]>();
  for (const [heading, field] of Object.entries(mapping)) if (field) usedBy.set(field, [...(usedBy.get(field) ?? []), heading]);

  return (
    <Table label="Column matching" data-testid="mapping-table">
      <THead>
        <Tr>
          <Th>Column in your file</Th>
          <Th>Example values</Th>
          <Th>Imported as</Th>
          <Th>Matched</Th>
        </Tr>
      </THead>
      <TBody>
        {check.headers.map((heading) => {
          const field = mapping[heading] ?? null;
          const clash = field !== null && (usedBy.get(field)?.length ?? 0) > 1;
          const source = check.mappingSources[heading];
          return (
            <Tr key={heading}>
              <Th scope="row">{heading}</Th>
              <Td className="max-w-64 truncate text-muted" title={example(heading)}>
                {example(heading) || "—"}
              </Td>
              <Td className="min-w-56">
                <Select
                  size="sm"
                  aria-label={`Field for column "${heading}"`}
                  value={field ?? ""}
                  disabled={disabled}
                  aria-invalid={clash || undefined}
                  onChange={(event) => onChange(heading, event.target.value === "" ? null : (event.target.value as VehicleField))}
                >
                  <option value="">Not imported</option>
                  {VEHICLE_FIELDS.map((f) => (
                    <option key={f} value={f}>
                      {VEHICLE_FIELD_INFO[f].label}
                      {VEHICLE_FIELD_INFO[f].required ? " (required)" : ""}
                    </option>
                  ))}
                </Select>
                {clash && <p className="mt-1 text-xs font-medium text-danger">Also chosen for {usedBy.get(field!)!.filter((h) => h !== heading).join(", ")}; only one column is read</p>}
              </Td>
              <Td>
                {edited.has(heading) ? (
                  <StatusPill tone="info" size="sm">Changed</StatusPill>
                ) : field === null ? (
                  check.unknownColumns.includes(heading) ? (
                    <StatusPill tone="warn" size="sm">Not matched</StatusPill>
                  ) : (
                    <StatusPill tone="neutral" size="sm">Ignored</StatusPill>
                  )
                ) : source ? (
                  <StatusPill tone={source === "automatic" ? "ok" : "info"} size="sm">{SOURCE_WORD[source]}</StatusPill>
                ) : null}
              </Td>
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}
