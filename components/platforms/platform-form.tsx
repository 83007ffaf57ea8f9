"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect } from "react";
import { createPlatformAction, updatePlatformAction } from "@/app/(app)/platforms/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Caution, Field, Input } from "@/components/ui";
import { PLATFORM_FIGURE_GROUPS, PLATFORM_FIGURES, type PlatformFigureKey } from "./figures";

export type PlatformFormValues = {
  id: string;
  make: string;
  model: string;
  variant: string;
  standardTyreSize: string | null;
  ratingsMissing: boolean;
} & Record<PlatformFigureKey, number | null>;

/** Create or edit a platform: the maker's figures, grouped the way a spec sheet groups them. */
export function PlatformForm({ platform }: { platform?: PlatformFormValues }) {
  const router = useRouter();
  const { state, formAction, errorOf, valueOf } = useFormAction<{ id: string }>(platform ? updatePlatformAction : createPlatformAction);
  useEffect(() => {
    if (state.status === "ok" && state.data?.id) router.push(`/platforms/${state.data.id}`);
  }, [state, router]);
  const figure = (key: PlatformFigureKey) => {
    const v = platform?.[key];
    return valueOf(key, v === null || v === undefined ? "" : String(v));
  };
  return (
    <form action={formAction} noValidate className="flex flex-col gap-6">
      {platform && <input type="hidden" name="id" value={platform.id} />}
      <FormStatus state={state} testId="platform-status" />
      <fieldset className="grid grid-cols-1 items-start gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-semibold">Make and model</legend>
        <Field label="Make" error={errorOf("make")} required>
          <Input name="make" defaultValue={valueOf("make", platform?.make)} autoComplete="off" />
        </Field>
        <Field label="Model" error={errorOf("model")} required>
          <Input name="model" defaultValue={valueOf("model", platform?.model)} autoComplete="off" />
        </Field>
        <Field label="Variant" hint="Body, cab or trim, as the maker names it." error={errorOf("variant")}>
          <Input name="variant" defaultValue={valueOf("variant", platform?.variant)} autoComplete="off" />
        </Field>
      </fieldset>
      {PLATFORM_FIGURE_GROUPS.map((group) => (
        <fieldset key={group.group} className="grid grid-cols-1 items-start gap-4 md:grid-cols-3">
          <legend className="mb-2 text-lg font-semibold">{group.title}</legend>
          {PLATFORM_FIGURES.filter((f) => f.group === group.group).map((f) => (
            <Field
              key={f.key}
              label={`${f.label} (${f.unit})`}
              hint={f.hint}
              error={errorOf(f.key)}
              required={f.rating}
            >
              <Input name={f.key} inputMode="decimal" defaultValue={figure(f.key)} autoComplete="off" />
            </Field>
          ))}
          {group.group === "other" && (
            <Field label="Standard tyre size" hint="As on the placard, e.g. 265/70R17 or LT265/75R16 123/120Q." error={errorOf("standardTyreSize")}>
              <Input name="standardTyreSize" defaultValue={valueOf("standardTyreSize", platform?.standardTyreSize)} autoComplete="off" />
            </Field>
          )}
        </fieldset>
      ))}
      <Caution text="Enter the maker's published figures from the placard or the owner's handbook. Rigline checks them against each other, not against the vehicle; the placard and a certified weighbridge decide." />
      <div className="flex flex-wrap gap-3">
        <SubmitButton>{platform ? "Save platform" : "Add platform"}</SubmitButton>
        <Button asChild variant="ghost">
          <Link href={platform ? `/platforms/${platform.id}` : "/platforms"}>Cancel</Link>
        </Button>
      </div>
    </form>
  );
}
