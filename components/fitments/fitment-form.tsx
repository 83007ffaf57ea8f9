"use client";

import { useState } from "react";
import { recordFitmentAction } from "@/app/(app)/vehicles/[id]/spec/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { CATEGORY_LABELS, REQUIREMENT_LABELS, ZONE_LABELS, criterionText } from "@/components/standards/labels";
import { Field, Input, Select } from "@/components/ui";
import type { Criterion, LineCategory, Requirement } from "@/lib/variance";

export type FitmentLineOption = {
  key: string;
  code: string;
  title: string;
  category: LineCategory;
  requirement: Requirement;
  quantity: number;
  criteria: Criterion[];
  expiryMonths: number | null;
  /** The line's status on this vehicle, to put the gaps first. */
  statusWord: string;
};

const EXTRA = "__extra__";

type Props = { vehicleId: string; lines: FitmentLineOption[]; today: string; preselect?: string };

/** Record what was fitted: a line of the vehicle's edition (its criteria offered as fields) or an extra. */
export function FitmentForm(props: Props) {
  const { state, formAction, errorOf, valueOf } = useFormAction(recordFitmentAction);
  // A new form after every answer: its fields start from what was sent (after a refusal) or afresh.
  const version = state.status === "error" ? JSON.stringify(state.values ?? {}) : state.status === "ok" ? JSON.stringify(state.data ?? {}) : "new";
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4" aria-label="Record a fitment" key={version}>
      <input type="hidden" name="vehicleId" value={props.vehicleId} />
      <FormStatus state={state} testId="fitment-status" />
      <FitmentFields {...props} errorOf={errorOf} valueOf={valueOf} />
    </form>
  );
}

function FitmentFields({ lines, today, preselect, errorOf, valueOf }: Props & { errorOf: (f: string) => string | undefined; valueOf: (f: string, fallback?: string | null) => string | undefined }) {
  const [choice, setChoice] = useState(() => valueOf("lineKey", preselect ?? lines.find((l) => l.statusWord === "Short")?.key ?? lines[0]?.key ?? EXTRA)!);
  const line = lines.find((l) => l.key === choice);
  const categories = Object.keys(CATEGORY_LABELS).filter((c) => lines.some((l) => l.category === c)) as LineCategory[];
  return (
    <>
      <Field label="What was fitted" error={errorOf("lineKey")} required id="fitment-line">
        <Select name="lineKey" value={choice} onChange={(e) => setChoice(e.target.value)}>
          {categories.map((c) => (
            <optgroup key={c} label={CATEGORY_LABELS[c]}>
              {lines
                .filter((l) => l.category === c)
                .map((l) => (
                  <option key={l.key} value={l.key}>
                    {l.code} {l.title} — {l.statusWord}
                  </option>
                ))}
            </optgroup>
          ))}
          <option value={EXTRA}>Extra: something not in the standard</option>
        </Select>
      </Field>
      {line?.requirement === "must_not_fit" && (
        <p className="text-sm font-medium text-danger-ink">{REQUIREMENT_LABELS.must_not_fit}: recording it marks the vehicle as carrying a prohibited item.</p>
      )}
      {!line && (
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
          <Field label="Item" error={errorOf("label")} required id="fitment-label">
            <Input name="label" defaultValue={valueOf("label")} placeholder="Rooftop awning" />
          </Field>
          <Field label="Mass each (kg)" error={errorOf("massKg")} id="fitment-mass">
            <Input name="massKg" inputMode="decimal" defaultValue={valueOf("massKg")} />
          </Field>
          <Field label="Behind the front axle (mm)" error={errorOf("xMm")} id="fitment-x" hint="Negative is ahead of it">
            <Input name="xMm" inputMode="decimal" defaultValue={valueOf("xMm")} />
          </Field>
          <Field label="Or zone" error={errorOf("zone")} id="fitment-zone">
            <Select name="zone" defaultValue={valueOf("zone", "")}>
              <option value="">No zone</option>
              {Object.entries(ZONE_LABELS).map(([v, l]) => (
                <option key={v} value={v}>
                  {l}
                </option>
              ))}
            </Select>
          </Field>
          <Field label="Mass kind" error={errorOf("massKind")} id="fitment-mass-kind">
            <Select name="massKind" defaultValue={valueOf("massKind", "constant")}>
              <option value="constant">Constant (accessory)</option>
              <option value="variable">Variable (water, load)</option>
            </Select>
          </Field>
        </div>
      )}
      {line && line.criteria.length > 0 && (
        <fieldset className="grid grid-cols-1 gap-3 rounded-md border border-line p-3 sm:grid-cols-2">
          <legend className="px-1 text-sm font-semibold">Measured values</legend>
          {line.criteria.map((c) => (
            <Field key={`${line.key}-${c.attribute}`} label={`${c.label ?? c.attribute}${c.unit ? ` (${c.unit})` : ""}`} hint={`Needs ${criterionText({ ...c, label: c.label ?? c.attribute })}`} error={errorOf(`attributes.${c.attribute}`)} id={`fitment-attr-${c.attribute}`}>
              <Input name={`attributes.${c.attribute}`} defaultValue={valueOf(`attributes.${c.attribute}`)} />
            </Field>
          ))}
        </fieldset>
      )}
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <Field label="Quantity" error={errorOf("quantity")} id="fitment-quantity">
          <Input name="quantity" inputMode="numeric" key={choice} defaultValue={valueOf("quantity", String(line?.quantity ?? 1))} />
        </Field>
        <Field label="Fitted on" error={errorOf("fittedAt")} id="fitment-fitted">
          <Input name="fittedAt" type="date" defaultValue={valueOf("fittedAt", today)} />
        </Field>
        <Field label="Expires on" error={errorOf("expiresAt")} id="fitment-expires" hint={line?.expiryMonths ? `Blank: ${line.expiryMonths} months after fitting` : "Blank if it does not expire"}>
          <Input name="expiresAt" type="date" defaultValue={valueOf("expiresAt")} />
        </Field>
      </div>
      <div>
        <SubmitButton>Record fitment</SubmitButton>
      </div>
    </>
  );
}
