"use client";

import { Field, Input } from "@/components/ui";
import type { Loading } from "./model";

export type LoadingText = Record<keyof Loading, string>;

export const loadingToText = (l: Loading): LoadingText => ({
  occupants: String(l.occupants),
  fuelL: String(l.fuelL),
  waterL: String(l.waterL),
  cargoKg: String(l.cargoKg),
  trailerAtmKg: String(l.trailerAtmKg),
  towballKg: String(l.towballKg),
});

const LIMITS: Record<keyof Loading, { max: number; whole?: boolean; unit: string }> = {
  occupants: { max: 20, whole: true, unit: "people" },
  fuelL: { max: 1000, unit: "L" },
  waterL: { max: 1000, unit: "L" },
  cargoKg: { max: 5000, unit: "kg" },
  trailerAtmKg: { max: 10_000, unit: "kg" },
  towballKg: { max: 1000, unit: "kg" },
};

/** Reads the typed loading; a field that is not a sensible number gets a message and keeps its last good value. */
export function parseLoading(text: LoadingText, last: Loading): { loading: Loading; errors: Partial<Record<keyof Loading, string>> } {
  const loading = { ...last };
  const errors: Partial<Record<keyof Loading, string>> = {};
  for (const key of Object.keys(LIMITS) as (keyof Loading)[]) {
    const raw = text[key].trim();
    const n = raw === "" ? 0 : Number(raw);
    const limit = LIMITS[key];
    if (!Number.isFinite(n) || n < 0) errors[key] = "Enter zero or more";
    else if (n > limit.max) errors[key] = `At most ${limit.max.toLocaleString("en-AU")} ${limit.unit}`;
    else if (limit.whole && !Number.isInteger(n)) errors[key] = "Enter a whole number";
    else loading[key] = n;
  }
  if (!errors.towballKg && !errors.trailerAtmKg && loading.towballKg > loading.trailerAtmKg) {
    errors.towballKg = loading.trailerAtmKg === 0 ? "Give the trailer's ATM first" : "Cannot exceed the trailer's ATM";
    loading.towballKg = Math.min(last.towballKg, loading.trailerAtmKg);
  }
  return { loading, errors };
}

type Props = {
  text: LoadingText;
  errors: Partial<Record<keyof Loading, string>>;
  personMassKg: number;
  onChange: (text: LoadingText) => void;
};

/** The loading of the what-if: changes apply to every figure at once. */
export function LoadingForm({ text, errors, personMassKg, onChange }: Props) {
  const field = (key: keyof Loading) => ({
    name: key,
    value: text[key],
    inputMode: "decimal" as const,
    onChange: (e: React.ChangeEvent<HTMLInputElement>) => onChange({ ...text, [key]: e.target.value }),
  });
  return (
    <form className="grid grid-cols-2 gap-3" onSubmit={(e) => e.preventDefault()} aria-label="Loading">
      <Field label="Occupants" hint={`${personMassKg} kg each (organisation setting)`} error={errors.occupants} className="col-span-2">
        <Input {...field("occupants")} inputMode="numeric" />
      </Field>
      <Field label="Extra fuel (L)" hint="Beyond the full main tank" error={errors.fuelL}>
        <Input {...field("fuelL")} />
      </Field>
      <Field label="Water (L)" error={errors.waterL}>
        <Input {...field("waterL")} />
      </Field>
      <Field label="Cargo allowance (kg)" hint="Touring gear and load, in the tub" error={errors.cargoKg} className="col-span-2">
        <Input {...field("cargoKg")} />
      </Field>
      <Field label="Trailer ATM (kg)" error={errors.trailerAtmKg}>
        <Input {...field("trailerAtmKg")} />
      </Field>
      <Field label="Towball download (kg)" error={errors.towballKg}>
        <Input {...field("towballKg")} />
      </Field>
    </form>
  );
}
