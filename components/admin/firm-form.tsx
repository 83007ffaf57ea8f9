"use client";

import { saveFirmAction } from "@/app/(app)/admin/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input, Select } from "@/components/ui";

type Firm = { id: string; name: string; email: string; phone: string | null; abn: string | null; active: boolean };

export function FirmForm({ firm }: { firm?: Firm }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(saveFirmAction);
  const prefix = firm ? `firm-${firm.id}` : "firm-new";
  return (
    <form action={formAction} className="grid grid-cols-1 items-end gap-3 md:grid-cols-3" noValidate key={firm ? firm.id : (state.data?.id ?? "new")}>
      {firm && <input type="hidden" name="id" value={firm.id} />}
      <Field label="Name" error={errorOf("name")} required id={`${prefix}-name`}>
        <Input name="name" defaultValue={valueOf("name", firm?.name)} />
      </Field>
      <Field label="E-mail for job offers" error={errorOf("email")} required id={`${prefix}-email`}>
        <Input name="email" type="email" defaultValue={valueOf("email", firm?.email)} />
      </Field>
      <Field label="Phone" error={errorOf("phone")} id={`${prefix}-phone`}>
        <Input name="phone" defaultValue={valueOf("phone", firm?.phone)} />
      </Field>
      <Field label="ABN" hint="11 digits" error={errorOf("abn")} id={`${prefix}-abn`}>
        <Input name="abn" inputMode="numeric" defaultValue={valueOf("abn", firm?.abn)} />
      </Field>
      <Field label="Status" error={errorOf("active")} id={`${prefix}-active`}>
        <Select name="active" defaultValue={valueOf("active", firm ? String(firm.active) : "true")}>
          <option value="true">Taking work</option>
          <option value="false">Not taking work</option>
        </Select>
      </Field>
      <SubmitButton variant={firm ? "secondary" : "primary"}>{firm ? "Save" : "Add workshop"}</SubmitButton>
      {state.status === "error" && (
        <div className="md:col-span-3">
          <FormStatus state={state} testId={`${prefix}-status`} />
        </div>
      )}
    </form>
  );
}
