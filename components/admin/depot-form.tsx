"use client";

import { saveDepotAction } from "@/app/(app)/admin/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input } from "@/components/ui";

type Depot = { id: string; name: string; code: string; region: string | null };

export function DepotForm({ depot }: { depot?: Depot }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(saveDepotAction);
  const prefix = depot ? `depot-${depot.code}` : "depot-new";
  return (
    <form action={formAction} className="grid grid-cols-1 items-end gap-3 md:grid-cols-[2fr_1fr_2fr_auto]" noValidate key={depot ? depot.id : (state.data?.id ?? "new")}>
      {depot && <input type="hidden" name="id" value={depot.id} />}
      <Field label="Name" error={errorOf("name")} required id={`${prefix}-name`}>
        <Input name="name" defaultValue={valueOf("name", depot?.name)} />
      </Field>
      <Field label="Code" error={errorOf("code")} required id={`${prefix}-code`}>
        <Input name="code" defaultValue={valueOf("code", depot?.code)} />
      </Field>
      <Field label="Region" error={errorOf("region")} id={`${prefix}-region`}>
        <Input name="region" defaultValue={valueOf("region", depot?.region)} />
      </Field>
      <SubmitButton variant={depot ? "secondary" : "primary"}>{depot ? "Save" : "Add depot"}</SubmitButton>
      {state.status === "error" && (
        <div className="md:col-span-4">
          <FormStatus state={state} testId={`${prefix}-status`} />
        </div>
      )}
    </form>
  );
}
