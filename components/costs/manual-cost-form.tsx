"use client";

import Link from "next/link";
import { useState } from "react";
import { createManualCostAction } from "@/app/(app)/costs/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input, Select, Textarea } from "@/components/ui";
import { CATEGORY_LABELS, COST_CATEGORIES, KIND_LABELS, COST_KINDS } from "@/lib/exports";
import { gstInInclusive, gstOnExclusive, parseMoneyToCents } from "@/lib/money";

type Options = { costCentres: string[]; depots: { id: string; name: string }[]; vehicles: { id: string; fleetNumber: string }[] };

const GST_CHOICES = [
  ["add", "Add 10 % GST to the amount"],
  ["included", "The amount includes GST"],
  ["entered", "Enter the GST shown on the invoice"],
  ["none", "No GST (GST-free)"],
] as const;

const money = (cents: number) => (cents / 100).toLocaleString("en-AU", { style: "currency", currency: "AUD" });

/** What will be booked, worked out as the user types (the server works it out again). */
function preview(amount: string, gstMode: string, gst: string): string | null {
  try {
    const cents = parseMoneyToCents(amount);
    let ex = cents;
    let tax = 0;
    if (gstMode === "add") tax = gstOnExclusive(cents);
    else if (gstMode === "included") {
      tax = gstInInclusive(cents);
      ex = cents - tax;
    } else if (gstMode === "entered") tax = parseMoneyToCents(gst);
    return `${money(ex)} ex GST + ${money(tax)} GST = ${money(ex + tax)}`;
  } catch {
    return null;
  }
}

/** Books an invoice from outside Rigline (or an adjustment) into the ledger. */
export function ManualCostForm({ options, today, vehicleId }: { options: Options; today: string; vehicleId?: string }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(createManualCostAction);
  // A new key after each booking clears the form for the next invoice.
  const key = state.status === "ok" ? (state.data as { id: string } | undefined)?.id ?? "ok" : "entry";
  return (
    <form action={formAction} noValidate className="flex flex-col gap-4" key={key}>
      <CostFields options={options} today={today} vehicleId={vehicleId} errorOf={errorOf} valueOf={valueOf} />
      <FormStatus state={state} testId="cost-status" />
    </form>
  );
}

type FieldHelpers = { errorOf: (field: string) => string | undefined; valueOf: (field: string, fallback?: string | null) => string | undefined };

function CostFields({ options, today, vehicleId, errorOf, valueOf }: { options: Options; today: string; vehicleId?: string } & FieldHelpers) {
  const [amount, setAmount] = useState(valueOf("amount") ?? "");
  const [gstMode, setGstMode] = useState(valueOf("gstMode") ?? "add");
  const [gst, setGst] = useState(valueOf("gst") ?? "");
  const shown = preview(amount, gstMode, gst);
  return (
    <>
      <div className="grid grid-cols-1 items-end gap-4 md:grid-cols-3">
        <Field label="Invoice date" required error={errorOf("incurredOn")} id="cost-date">
          <Input type="date" name="incurredOn" max={today} defaultValue={valueOf("incurredOn", today)} />
        </Field>
        <Field label="Vehicle" hint="Its cost centre and depot are used unless you give others." error={errorOf("vehicleId")} id="cost-vehicle">
          <Select name="vehicleId" defaultValue={valueOf("vehicleId", vehicleId ?? "")}>
            <option value="">No vehicle (fleet-wide)</option>
            {options.vehicles.map((v) => (
              <option key={v.id} value={v.id}>
                {v.fleetNumber}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Cost centre" hint="Needed when there is no vehicle." error={errorOf("costCentre")} id="cost-centre">
          <Input name="costCentre" list="cost-centre-list" autoComplete="off" defaultValue={valueOf("costCentre")} />
        </Field>
        <datalist id="cost-centre-list">
          {options.costCentres.map((c) => (
            <option key={c} value={c} />
          ))}
        </datalist>
        <Field label="Depot" error={errorOf("depotId")} id="cost-depot">
          <Select name="depotId" defaultValue={valueOf("depotId", "")}>
            <option value="">The vehicle&apos;s depot, or none</option>
            {options.depots.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Category" required error={errorOf("category")} id="cost-category">
          <Select name="category" defaultValue={valueOf("category", "")}>
            <option value="">Choose…</option>
            {COST_CATEGORIES.map((c) => (
              <option key={c} value={c}>
                {CATEGORY_LABELS[c]}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Capital or operating" required error={errorOf("kind")} id="cost-kind">
          <Select name="kind" defaultValue={valueOf("kind", "")}>
            <option value="">Choose…</option>
            {COST_KINDS.map((k) => (
              <option key={k} value={k}>
                {KIND_LABELS[k]}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      <Field label="What the invoice is for" required error={errorOf("description")} id="cost-description">
        <Textarea name="description" rows={2} defaultValue={valueOf("description")} />
      </Field>
      <div className="grid grid-cols-1 items-end gap-4 md:grid-cols-4">
        <Field label="Invoice number" error={errorOf("reference")} id="cost-reference">
          <Input name="reference" defaultValue={valueOf("reference")} />
        </Field>
        <Field label="Entry type" error={errorOf("source")} id="cost-source">
          <Select name="source" defaultValue={valueOf("source", "manual")}>
            <option value="manual">Invoice</option>
            <option value="adjustment">Adjustment or credit (may be negative)</option>
          </Select>
        </Field>
        <Field label="Amount ($)" required hint="Dollars and cents, e.g. 1,234.50" error={errorOf("amount")} id="cost-amount">
          <Input name="amount" inputMode="decimal" value={amount} onChange={(e) => setAmount(e.target.value)} />
        </Field>
        <Field label="GST" error={errorOf("gstMode")} id="cost-gst-mode">
          <Select name="gstMode" value={gstMode} onChange={(e) => setGstMode(e.target.value)}>
            {GST_CHOICES.map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </Select>
        </Field>
        {gstMode === "entered" && (
          <Field label="GST on the invoice ($)" required error={errorOf("gst")} id="cost-gst">
            <Input name="gst" inputMode="decimal" value={gst} onChange={(e) => setGst(e.target.value)} />
          </Field>
        )}
      </div>
      <p className="text-sm text-muted" aria-live="polite" data-testid="cost-preview">
        {shown ? `Will book ${shown}.` : "GST is 10 %, to the nearest cent, half a cent up."}
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <SubmitButton>Book the cost</SubmitButton>
        <Link href="/costs" className="text-sm font-semibold text-accent underline-offset-4 hover:underline">
          Back to the ledger
        </Link>
      </div>
    </>
  );
}
