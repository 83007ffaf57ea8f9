"use client";

import { useMemo, useState } from "react";
import { confirmRolloutAction, previewRolloutAction } from "@/app/(app)/standards/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Caution, Checkbox, Field, Input, Quantity, Table, TBody, Td, TFoot, Th, THead, Tr } from "@/components/ui";
import { dollars } from "./labels";

export type RolloutVehicleOption = {
  id: string;
  fleetNumber: string;
  depotName: string | null;
  platform: string;
  editionId: string | null;
  editionLabel: string | null;
};

/** Choose vehicles, preview what the edition adds to each (work, cost, mass), then confirm. */
export function RolloutPanel({ standardId, editionId, editionNumber, vehicles }: { standardId: string; editionId: string; editionNumber: number; vehicles: RolloutVehicleOption[] }) {
  const [chosen, setChosen] = useState<string[]>([]);
  const [filter, setFilter] = useState("");
  const preview = useFormAction(previewRolloutAction, { toastOnSuccess: false });
  const confirm = useFormAction(confirmRolloutAction);
  const shown = useMemo(() => {
    const q = filter.trim().toLowerCase();
    return q ? vehicles.filter((v) => `${v.fleetNumber} ${v.depotName ?? ""} ${v.platform} ${v.editionLabel ?? ""}`.toLowerCase().includes(q)) : vehicles;
  }, [filter, vehicles]);
  const plan = preview.state.status === "ok" ? preview.state.data : undefined;
  const confirmed = confirm.state.status === "ok";
  const planIds = plan?.vehicles.map((v) => v.vehicleId) ?? [];
  const stale = plan !== undefined && (planIds.length !== chosen.length || planIds.some((id) => !chosen.includes(id)));

  return (
    <div className="flex flex-col gap-4">
      <form action={preview.formAction} className="flex flex-col gap-3" aria-label="Choose vehicles for the roll-out">
        <input type="hidden" name="standardId" value={standardId} />
        <input type="hidden" name="editionId" value={editionId} />
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Find vehicles" id="rollout-filter" className="min-w-64 flex-1">
            <Input value={filter} onChange={(e) => setFilter(e.target.value)} placeholder="Fleet number, depot, platform or edition" />
          </Field>
          <Button type="button" variant="secondary" onClick={() => setChosen((c) => [...new Set([...c, ...shown.map((v) => v.id)])])}>
            Choose all {shown.length} shown
          </Button>
          <Button type="button" variant="ghost" onClick={() => setChosen([])} disabled={chosen.length === 0}>
            Clear
          </Button>
        </div>
        <div className="max-h-72 overflow-y-auto rounded-md border border-line px-3" role="group" aria-label="Vehicles">
          {shown.map((v) => (
            <Checkbox
              key={v.id}
              id={`rollout-${v.id}`}
              name="vehicleIds[]"
              value={v.id}
              checked={chosen.includes(v.id)}
              onChange={(e) => setChosen((c) => (e.target.checked ? [...c, v.id] : c.filter((x) => x !== v.id)))}
              label={
                <span>
                  <span className="font-semibold">{v.fleetNumber}</span> <span className="text-muted">· {v.platform} · {v.depotName ?? "no depot"} · {v.editionLabel ?? "no standard"}</span>
                </span>
              }
            />
          ))}
          {/* Chosen vehicles hidden by the filter are still sent. */}
          {chosen
            .filter((id) => !shown.some((v) => v.id === id))
            .map((id) => (
              <input key={id} type="hidden" name="vehicleIds[]" value={id} />
            ))}
        </div>
        <FormStatus state={preview.state} testId="rollout-preview-status" />
        <div>
          <SubmitButton variant="secondary" disabled={chosen.length === 0}>
            Preview roll-out to {chosen.length} {chosen.length === 1 ? "vehicle" : "vehicles"}
          </SubmitButton>
        </div>
      </form>

      {plan && !confirmed && (
        <div className="flex flex-col gap-3" data-testid="rollout-preview">
          <Caution text="Estimates from the standard costs and line masses. Added mass changes axle loads and payload: check the mass plan, and weigh the vehicle on a certified weighbridge after fitting." />
          <Table label="Roll-out preview">
            <THead>
              <Tr>
                <Th>Vehicle</Th>
                <Th>Now on</Th>
                <Th>New short lines</Th>
                <Th>Off-spec under edition {editionNumber}</Th>
                <Th numeric>Estimated cost</Th>
                <Th numeric>Added mass</Th>
              </Tr>
            </THead>
            <TBody>
              {plan.vehicles.map((v) => (
                <Tr key={v.vehicleId}>
                  <Td className="font-semibold">{v.fleetNumber}</Td>
                  <Td>{v.currentEdition ?? "No standard"}</Td>
                  <Td>
                    {v.shortLines.length === 0 ? (
                      <span className="text-muted">None</span>
                    ) : v.shortLines.length <= 6 ? (
                      <ShortLines lines={v.shortLines} />
                    ) : (
                      <details>
                        <summary className="cursor-pointer font-medium">
                          {v.shortLines.length} lines{v.shortLines.every((l) => l.already) ? ", all short already" : ""}
                        </summary>
                        <ShortLines lines={v.shortLines} />
                      </details>
                    )}
                  </Td>
                  <Td>{v.offSpecLines.length === 0 ? <span className="text-muted">None</span> : v.offSpecLines.map((l) => `${l.code} ${l.title}`).join("; ")}</Td>
                  <Td numeric>{dollars(v.costCents)}</Td>
                  <Td numeric>
                    <Quantity value={v.addedMassKg} unit="kg" digits={1} />
                  </Td>
                </Tr>
              ))}
            </TBody>
            <TFoot>
              <Tr>
                <Td colSpan={2}>Total for {plan.totals.vehicles} {plan.totals.vehicles === 1 ? "vehicle" : "vehicles"}</Td>
                <Td>{plan.totals.shortLines} short lines</Td>
                <Td>
                  {plan.totals.offSpecLines} off-spec{plan.totals.offSpecCostCents > 0 ? ` (${dollars(plan.totals.offSpecCostCents)} rework)` : ""}
                </Td>
                <Td numeric>{dollars(plan.totals.costCents)}</Td>
                <Td numeric>
                  <Quantity value={plan.totals.addedMassKg} unit="kg" digits={1} />
                </Td>
              </Tr>
            </TFoot>
          </Table>
          <form action={confirm.formAction} className="flex flex-col items-start gap-2">
            <input type="hidden" name="standardId" value={standardId} />
            <input type="hidden" name="editionId" value={editionId} />
            {planIds.map((id) => (
              <input key={id} type="hidden" name="vehicleIds[]" value={id} />
            ))}
            {stale && <p className="text-sm font-medium text-warn-ink">You changed the choice since this preview; preview again to confirm the new choice.</p>}
            <FormStatus state={confirm.state} testId="rollout-confirm-status" />
            <SubmitButton disabled={stale}>
              Confirm: assign edition {editionNumber} to {planIds.length} {planIds.length === 1 ? "vehicle" : "vehicles"}
            </SubmitButton>
          </form>
        </div>
      )}
      {confirmed && <FormStatus state={confirm.state} testId="rollout-confirm-status" />}
    </div>
  );
}

function ShortLines({ lines }: { lines: { key: string; code: string; title: string; missingQuantity: number; already: boolean }[] }) {
  return (
    <ul className="list-none">
      {lines.map((l) => (
        <li key={l.key}>
          {l.code} {l.title}
          {l.missingQuantity > 1 ? ` × ${l.missingQuantity}` : ""}
          {l.already && <span className="text-muted"> (short already)</span>}
        </li>
      ))}
    </ul>
  );
}
