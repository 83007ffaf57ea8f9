"use client";

import { changeRoleAction, setActiveAction } from "@/app/(app)/admin/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Select } from "@/components/ui";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/permissions/roles";

type Option = { id: string; name: string };

export function MemberRoleForm({
  membershipId,
  role,
  firmId,
  depotId,
  firms,
  depots,
  label,
}: {
  membershipId: string;
  role: Role;
  firmId: string | null;
  depotId: string | null;
  firms: Option[];
  depots: Option[];
  label: string;
}) {
  const { state, formAction } = useFormAction(changeRoleAction);
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-2">
      <input type="hidden" name="membershipId" value={membershipId} />
      <Select name="role" defaultValue={role} size="sm" aria-label={`Role of ${label}`}>
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </Select>
      <Select name="firmId" defaultValue={firmId ?? ""} size="sm" aria-label={`Workshop of ${label}`}>
        <option value="">No workshop</option>
        {firms.map((f) => (
          <option key={f.id} value={f.id}>
            {f.name}
          </option>
        ))}
      </Select>
      <Select name="depotId" defaultValue={depotId ?? ""} size="sm" aria-label={`Depot of ${label}`}>
        <option value="">No depot</option>
        {depots.map((d) => (
          <option key={d.id} value={d.id}>
            {d.name}
          </option>
        ))}
      </Select>
      <SubmitButton size="sm" variant="secondary">
        Save
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId={`role-status-${membershipId}`} />}
    </form>
  );
}

export function MemberActiveForm({ membershipId, active, label }: { membershipId: string; active: boolean; label: string }) {
  const { state, formAction } = useFormAction(setActiveAction);
  return (
    <form action={formAction} className="flex items-center gap-2">
      <input type="hidden" name="membershipId" value={membershipId} />
      <input type="hidden" name="active" value={active ? "false" : "true"} />
      <SubmitButton size="sm" variant="secondary" aria-label={`${active ? "Deactivate" : "Reactivate"} ${label}`}>
        {active ? "Deactivate" : "Reactivate"}
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} testId={`active-status-${membershipId}`} />}
    </form>
  );
}
