"use client";

import { createBudgetAction, deleteBudgetAction, updateBudgetAction } from "@/app/(app)/budgets/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input } from "@/components/ui";

/** A new budget for one cost centre and period (finance). */
export function BudgetForm({ costCentres, periodStart, periodEnd }: { costCentres: string[]; periodStart: string; periodEnd: string }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(createBudgetAction);
  const key = state.status === "ok" ? ((state.data as { id: string } | undefined)?.id ?? "ok") : "new";
  return (
    <form action={formAction} noValidate className="flex flex-col gap-3" key={key}>
      <div className="grid grid-cols-1 items-start gap-3 md:grid-cols-[2fr_1fr_1fr_1.5fr_auto]">
        <Field label="Cost centre" required error={errorOf("costCentre")} id="budget-centre">
          <Input name="costCentre" list="budget-centre-list" autoComplete="off" defaultValue={valueOf("costCentre")} />
        </Field>
        <datalist id="budget-centre-list">
          {costCentres.map((c) => (
            <option key={c} value={c} />
          ))}
        </datalist>
        <Field label="First day" required error={errorOf("periodStart")} id="budget-start">
          <Input type="date" name="periodStart" defaultValue={valueOf("periodStart", periodStart)} />
        </Field>
        <Field label="Last day" required error={errorOf("periodEnd")} id="budget-end">
          <Input type="date" name="periodEnd" defaultValue={valueOf("periodEnd", periodEnd)} />
        </Field>
        <Field label="Budget ex GST ($)" required error={errorOf("amount")} id="budget-amount">
          <Input name="amount" inputMode="decimal" defaultValue={valueOf("amount")} />
        </Field>
        <div className="md:pt-7">
          <SubmitButton>Add budget</SubmitButton>
        </div>
      </div>
      <FormStatus state={state} testId="budget-status" />
    </form>
  );
}

type Budget = { id: string; costCentre: string; periodStart: string; periodEnd: string; amount: string };

/** Change a budget's amount in place, or remove it (finance). */
export function BudgetRowActions({ budget }: { budget: Budget }) {
  const update = useFormAction(updateBudgetAction);
  const remove = useFormAction(deleteBudgetAction);
  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex flex-wrap items-center justify-end gap-2">
        <form action={update.formAction} noValidate className="flex items-center gap-2">
          <input type="hidden" name="id" value={budget.id} />
          <input type="hidden" name="costCentre" value={budget.costCentre} />
          <input type="hidden" name="periodStart" value={budget.periodStart} />
          <input type="hidden" name="periodEnd" value={budget.periodEnd} />
          <Input
            name="amount"
            size="sm"
            inputMode="decimal"
            className="w-32 text-right"
            defaultValue={update.valueOf("amount", budget.amount)}
            aria-label={`Budget of ${budget.costCentre} in dollars`}
            aria-invalid={update.errorOf("amount") ? true : undefined}
          />
          <SubmitButton size="sm" variant="secondary" aria-label={`Save the budget of ${budget.costCentre}`}>
            Save
          </SubmitButton>
        </form>
        <form action={remove.formAction}>
          <input type="hidden" name="id" value={budget.id} />
          <SubmitButton size="sm" variant="ghost" aria-label={`Remove the budget of ${budget.costCentre}`}>
            Remove
          </SubmitButton>
        </form>
      </div>
      {update.state.status === "error" && <FormStatus state={update.state} testId={`budget-update-${budget.id}`} />}
      {remove.state.status === "error" && <FormStatus state={remove.state} testId={`budget-remove-${budget.id}`} />}
    </div>
  );
}
