"use client";

import { raiseJobAction } from "@/app/(app)/jobs/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Checkbox, Field, Input, Select, Table, TBody, Td, Th, THead, Tr, Textarea } from "@/components/ui";
import { formatCents } from "@/lib/money";
import { LineStatusPill } from "./status";

type PlanLine = {
  key: string;
  code: string;
  title: string;
  category: string;
  status: string;
  standardCostCents: number;
  isGap: boolean;
  stage: number | null;
  blockedBy: string[];
};

/** A triaged defect the job is raised for: its words start the job, and it is linked on raising. */
export type RepairFor = { id: string; title: string; description: string };

/** Raise a job from a vehicle's gaps: pick short / off-spec / unproven lines, add free-text work. */
export function RaiseJobForm({ vehicleId, fleetNumber, lines, repairFor }: { vehicleId: string; fleetNumber: string; lines: PlanLine[]; repairFor?: RepairFor | null }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(raiseJobAction);
  const gaps = lines.filter((l) => l.isGap);
  return (
    <form action={formAction} aria-label="Raise a job" className="flex flex-col gap-5" noValidate>
      <input type="hidden" name="vehicleId" value={vehicleId} />
      {repairFor && <input type="hidden" name="defectId" value={repairFor.id} />}
      {repairFor && (
        <p className="rounded-md border border-line bg-surface-sunken p-3 text-sm" data-testid="repair-for">
          This job repairs the reported defect “<span className="font-semibold">{repairFor.title}</span>”; raising it links the defect and marks it in repair.
        </p>
      )}
      {errorOf("defectId") && <p className="text-sm font-semibold text-danger">{errorOf("defectId")}</p>}
      <Field label="Title" error={errorOf("title")} required id="job-title">
        <Input name="title" defaultValue={valueOf("title", repairFor ? `Repair: ${repairFor.title}` : `Close the gaps on ${fleetNumber}`)} />
      </Field>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Lines to close</legend>
        {gaps.length === 0 ? (
          <p className="text-muted">This vehicle has no gaps against its standard{lines.length === 0 ? " (no edition is assigned)" : ""}. Describe free-text work below.</p>
        ) : (
          <Table label="Gaps of this vehicle, in build order" density="compact">
            <THead>
              <Tr>
                <Th>Pick</Th>
                <Th>Line</Th>
                <Th>Status</Th>
                <Th numeric>Stage</Th>
                <Th>Waits for</Th>
                <Th numeric>Standard cost</Th>
              </Tr>
            </THead>
            <TBody>
              {gaps
                .slice()
                .sort((a, b) => (a.stage ?? 99) - (b.stage ?? 99))
                .map((l) => (
                  <Tr key={l.key} data-testid="gap-line">
                    <Td>
                      <Checkbox name="lineKeys[]" value={l.key} label={<span className="sr-only">{`${l.code} ${l.title}`}</span>} aria-label={`${l.code} ${l.title}`} />
                    </Td>
                    <Td>
                      <span className="font-semibold">{l.code}</span> {l.title}
                    </Td>
                    <Td>
                      <LineStatusPill status={l.status} />
                    </Td>
                    <Td numeric>{l.stage === null ? "—" : l.stage + 1}</Td>
                    <Td>{l.blockedBy.length ? <span className="text-warn-ink">Blocked by {l.blockedBy.join(", ")}</span> : <span className="text-muted">Can start now</span>}</Td>
                    <Td numeric>{formatCents(l.standardCostCents)}</Td>
                  </Tr>
                ))}
            </TBody>
          </Table>
        )}
        {errorOf("lineKeys") && <p className="text-sm font-semibold text-danger">{errorOf("lineKeys")}</p>}
        <p className="text-sm text-muted">A blocked line can be raised, but it is awarded only with its prerequisites in the same job or once they are met.</p>
      </fieldset>
      <Field label="Other work" hint="One item per line, in plain words" error={errorOf("freeText")} id="job-free-text">
        <Textarea name="freeTextBlock" rows={3} defaultValue={valueOf("freeTextBlock", repairFor ? repairFor.description : undefined)} />
      </Field>
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        <Field label="Wanted by" error={errorOf("dueAt")} id="job-due">
          <Input name="dueAt" type="date" defaultValue={valueOf("dueAt")} />
        </Field>
        <Field label="Booked as" error={errorOf("costKind")} id="job-cost-kind">
          <Select name="costKind" defaultValue={valueOf("costKind", repairFor ? "operating" : "capital")}>
            <option value="capital">Capital (fit-out)</option>
            <option value="operating">Operating (repair, upkeep)</option>
          </Select>
        </Field>
      </div>
      <div>
        <SubmitButton>Raise the job</SubmitButton>
      </div>
      <FormStatus state={state} testId="raise-job-status" />
    </form>
  );
}
