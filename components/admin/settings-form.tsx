"use client";

import { updateSettingsAction } from "@/app/(app)/admin/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Field, Input, Select } from "@/components/ui";

export type SettingsValues = {
  name: string;
  approvalThresholdCents: number;
  personMassKg: number;
  brakeWarningMarginKg: number;
  springSoftMarginKg: number;
  springStiffMarginKg: number;
  weighbridgeToleranceKg: number;
  gstMethod: "per-line" | "invoice-total";
  timeZone: string;
};

export function SettingsForm({ settings, readOnly, timeZones }: { settings: SettingsValues; readOnly: boolean; timeZones: readonly string[] }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(updateSettingsAction);
  const num = (field: keyof SettingsValues) => valueOf(field, String(settings[field]));
  return (
    <form action={formAction} className="grid grid-cols-1 gap-4 md:grid-cols-2" noValidate>
      <div className="md:col-span-2">
        <FormStatus state={state} testId="settings-status" />
      </div>
      <fieldset disabled={readOnly} className="contents">
        <Field label="Organisation name" error={errorOf("name")} required>
          <Input name="name" defaultValue={valueOf("name", settings.name)} />
        </Field>
        <Field label="Finance approval above (AUD incl. GST)" hint="Quotes above this also need a finance approval." error={errorOf("approvalThreshold")} required>
          <Input name="approvalThreshold" inputMode="decimal" defaultValue={valueOf("approvalThreshold", (settings.approvalThresholdCents / 100).toFixed(2))} />
        </Field>
        <Field label="Mass per occupant (kg)" hint="Used for axle loads. 80 kg is common practice." error={errorOf("personMassKg")} required>
          <Input name="personMassKg" inputMode="decimal" defaultValue={num("personMassKg")} />
        </Field>
        <Field label="Brake warning above standard (kg)" hint="Warn when loaded mass exceeds kerb mass by more than this without a brake upgrade. Common practice: 500 kg." error={errorOf("brakeWarningMarginKg")} required>
          <Input name="brakeWarningMarginKg" inputMode="decimal" defaultValue={num("brakeWarningMarginKg")} />
        </Field>
        <Field label="Spring too soft beyond (kg)" hint="Constant load above the spring rating by more than this." error={errorOf("springSoftMarginKg")} required>
          <Input name="springSoftMarginKg" inputMode="decimal" defaultValue={num("springSoftMarginKg")} />
        </Field>
        <Field label="Spring too stiff beyond (kg)" hint="Spring rating above the constant load by more than this. Common practice: about 500 kg." error={errorOf("springStiffMarginKg")} required>
          <Input name="springStiffMarginKg" inputMode="decimal" defaultValue={num("springStiffMarginKg")} />
        </Field>
        <Field label="Weighbridge tolerance (kg)" hint="Differences larger than this between weighed and computed masses are flagged." error={errorOf("weighbridgeToleranceKg")} required>
          <Input name="weighbridgeToleranceKg" inputMode="decimal" defaultValue={num("weighbridgeToleranceKg")} />
        </Field>
        <Field label="GST rounding on quotes" hint="Both are allowed by the GST Act s 9-90; quotes state which one they use." error={errorOf("gstMethod")} required>
          <Select name="gstMethod" defaultValue={valueOf("gstMethod", settings.gstMethod)}>
            <option value="per-line">Round each line, then add up</option>
            <option value="invoice-total">Add up unrounded, round the total</option>
          </Select>
        </Field>
        <Field label="Time zone" hint="Dates and times of reports, decisions and saves read in this zone; due dates and expiry dates are calendar days." error={errorOf("timeZone")} required>
          <Select name="timeZone" defaultValue={valueOf("timeZone", settings.timeZone)}>
            {timeZones.map((zone) => (
              <option key={zone} value={zone}>
                {zone.replace(/_/g, " ")}
              </option>
            ))}
          </Select>
        </Field>
      </fieldset>
      {!readOnly && (
        <div>
          <SubmitButton>Save settings</SubmitButton>
        </div>
      )}
    </form>
  );
}
