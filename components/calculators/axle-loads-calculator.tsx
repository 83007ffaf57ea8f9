"use client";

import { useState } from "react";
import { Button, Checkbox } from "@/components/ui";
import { AxleLoadsResult } from "./axle-loads-result";
import { CalculatorCard } from "./calculator-card";
import { NumberField, TextField } from "./fields";
import { numberOrText } from "./numbers";
import { RemoveRowButton } from "./parts";
import type { AxleLoadsResponse } from "./types";
import { useCalc } from "./use-calc";
import { useRows } from "./use-rows";

type ItemRow = { key: number; label: string; massKg: string; xMm: string };

// Example figures of an invented dual-cab work vehicle, to be replaced with the real ones.
const START_ITEMS: Omit<ItemRow, "key">[] = [
  { label: "Front bar and winch", massKg: "85", xMm: "-600" },
  { label: "Occupants", massKg: "160", xMm: "1100" },
  { label: "Drawers and fridge in the tub", massKg: "120", xMm: "2600" },
  { label: "Second spare on the rear carrier", massKg: "45", xMm: "3900" },
];

const START = {
  wheelbaseMm: "3000",
  "base.frontKg": "1200",
  "base.rearKg": "950",
  "ratings.frontKg": "1450",
  "ratings.rearKg": "1880",
  "ratings.gvmKg": "3100",
  "ratings.gcmKg": "5900",
  "trailer.atmKg": "2500",
  "trailer.towballKg": "250",
};
type Key = keyof typeof START;

const STATIC_FIELDS = new Set<string>(["wheelbaseMm", "base.frontKg", "base.rearKg", "ratings.frontKg", "ratings.rearKg", "ratings.gvmKg", "ratings.gcmKg"]);

/** The request body from what was typed (numbers as numbers; anything else as typed, for the API to name). */
export function axleLoadsBody(values: Record<Key, string>, items: ReadonlyArray<Omit<ItemRow, "key">>, towing: boolean) {
  const n = (k: Key) => numberOrText(values[k]);
  return {
    wheelbaseMm: n("wheelbaseMm"),
    base: { frontKg: n("base.frontKg"), rearKg: n("base.rearKg") },
    ratings: { frontKg: n("ratings.frontKg"), rearKg: n("ratings.rearKg"), gvmKg: n("ratings.gvmKg"), gcmKg: n("ratings.gcmKg") },
    items: items.map((i) => ({ label: i.label.trim() || undefined, massKg: numberOrText(i.massKg), xMm: numberOrText(i.xMm) })),
    trailer: towing ? { atmKg: n("trailer.atmKg"), towballKg: n("trailer.towballKg") } : undefined,
  };
}

export function AxleLoadsCalculator() {
  const calc = useCalc<AxleLoadsResponse>("/api/calc/axle-loads");
  const [values, setValues] = useState<Record<Key, string>>(START);
  const items = useRows<ItemRow>(START_ITEMS, { label: "", massKg: "", xMm: "" });
  const [towing, setTowing] = useState(false);
  const [submittedGcm, setSubmittedGcm] = useState<number | undefined>(undefined);

  const set = (k: Key) => (value: string) => setValues((v) => ({ ...v, [k]: value }));
  const shown = (field: string) =>
    STATIC_FIELDS.has(field) ||
    (towing && (field === "trailer.atmKg" || field === "trailer.towballKg")) ||
    /^items\.\d+\.(label|massKg|xMm)$/.test(field);

  function submit() {
    const body = axleLoadsBody(values, items.rows, towing);
    setSubmittedGcm(typeof body.ratings.gcmKg === "number" ? body.ratings.gcmKg : undefined);
    calc.run(body);
  }

  const num = (k: Key, label: string, unit: string, extra: { hint?: string; required?: boolean } = {}) => (
    <NumberField name={k} label={label} unit={unit} value={values[k]} onChange={set(k)} error={calc.errorOf(k)} {...extra} />
  );

  return (
    <CalculatorCard
      id="axle-loads"
      title="Axle loads"
      description="What the fitted items and a trailer's towball put on each axle, against the maker's ratings. Example figures are filled in: replace them with your vehicle's."
      calc={calc}
      shown={shown}
      submitLabel="Work out axle loads"
      onSubmit={submit}
      result={(r) => <AxleLoadsResult result={r} gcmRatingKg={submittedGcm} />}
    >
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Vehicle before the items</legend>
        {num("wheelbaseMm", "Wheelbase", "mm", { required: true })}
        {num("base.frontKg", "Front axle load", "kg", { required: true, hint: "Kerb, weighed, or as it stands" })}
        {num("base.rearKg", "Rear axle load", "kg", { required: true })}
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-4">
        <legend className="mb-2 text-sm font-semibold text-ink">Maker&apos;s ratings</legend>
        {num("ratings.frontKg", "Front axle", "kg", { required: true })}
        {num("ratings.rearKg", "Rear axle", "kg", { required: true })}
        {num("ratings.gvmKg", "GVM", "kg", { required: true })}
        {num("ratings.gcmKg", "GCM", "kg", { hint: "Leave empty if not rated" })}
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Items added</legend>
        <p className="-mt-1 text-sm text-muted">
          Position is the distance behind the front axle centre line; negative is ahead of it. Past the rear axle an item takes load off the
          front.
        </p>
        {items.rows.map((item, i) => (
          <div key={item.key} className="grid grid-cols-2 items-start gap-3 rounded-md border border-line p-3 sm:grid-cols-[1fr_8rem_9rem_auto]">
            <TextField
              name={`items.${i}.label`}
              label={`Item ${i + 1}`}
              className="col-span-2 sm:col-span-1"
              value={item.label}
              onChange={items.update(item.key, "label")}
              error={calc.errorOf(`items.${i}.label`)}
            />
            <NumberField
              name={`items.${i}.massKg`}
              label="Mass"
              unit="kg"
              value={item.massKg}
              onChange={items.update(item.key, "massKg")}
              error={calc.errorOf(`items.${i}.massKg`)}
              required
            />
            <NumberField
              name={`items.${i}.xMm`}
              label="Position"
              unit="mm"
              value={item.xMm}
              onChange={items.update(item.key, "xMm")}
              error={calc.errorOf(`items.${i}.xMm`)}
              required
            />
            <RemoveRowButton
              className="col-span-2 sm:col-span-1 sm:mt-7"
              onRemove={() => items.remove(item.key)}
              label={`Remove item ${i + 1}${item.label ? ` (${item.label})` : ""}`}
            />
          </div>
        ))}
        <div>
          <Button type="button" variant="secondary" onClick={items.add}>
            Add an item
          </Button>
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Trailer</legend>
        <Checkbox
          label="Towing a trailer"
          hint="The towball download counts within GVM; the combination is the vehicle plus what the trailer's axles carry."
          checked={towing}
          onChange={(e) => setTowing(e.target.checked)}
        />
        {towing && (
          <div className="grid gap-4 sm:grid-cols-2">
            {num("trailer.atmKg", "Trailer ATM", "kg", { required: true, hint: "Laden trailer, including the towball download" })}
            {num("trailer.towballKg", "Towball download", "kg", { required: true, hint: "Weigh it where you can: 10 % of the ATM is only a rule of thumb" })}
          </div>
        )}
      </fieldset>

    </CalculatorCard>
  );
}
