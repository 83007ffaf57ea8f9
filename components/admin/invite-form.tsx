"use client";

import { inviteUserAction } from "@/app/(app)/admin/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input, Select } from "@/components/ui";
import { ROLES, ROLE_LABELS } from "@/lib/permissions/roles";

type Option = { id: string; name: string };

export function InviteForm({ firms, depots }: { firms: Option[]; depots: Option[] }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(inviteUserAction);
  return (
    <form aria-label="Invite someone" action={formAction} className="grid grid-cols-1 gap-4 md:grid-cols-2" noValidate key={state.data?.membershipId ?? "invite"}>
      <div className="md:col-span-2">
        <FormStatus state={state} testId="invite-status" />
      </div>
      <Field label="Name" error={errorOf("name")} required>
        <Input name="name" defaultValue={valueOf("name")} autoComplete="off" />
      </Field>
      <Field label="E-mail" error={errorOf("email")} required>
        <Input name="email" type="email" defaultValue={valueOf("email")} autoComplete="off" />
      </Field>
      <Field label="Role" error={errorOf("role")} required>
        <Select name="role" defaultValue={valueOf("role", "driver")}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Workshop" hint="Needed for contractors." error={errorOf("firmId")}>
        <Select name="firmId" defaultValue={valueOf("firmId", "")}>
          <option value="">—</option>
          {firms.map((f) => (
            <option key={f.id} value={f.id}>
              {f.name}
            </option>
          ))}
        </Select>
      </Field>
      <Field label="Home depot" hint="For drivers." error={errorOf("depotId")}>
        <Select name="depotId" defaultValue={valueOf("depotId", "")}>
          <option value="">—</option>
          {depots.map((d) => (
            <option key={d.id} value={d.id}>
              {d.name}
            </option>
          ))}
        </Select>
      </Field>
      <div className="flex items-end">
        <SubmitButton>Send invitation</SubmitButton>
      </div>
    </form>
  );
}
