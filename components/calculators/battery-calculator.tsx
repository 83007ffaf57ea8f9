"use client";

import { useState } from "react";
import { Button, Checkbox } from "@/components/ui";
import { BatteryResult } from "./battery-result";
import { CalculatorCard } from "./calculator-card";
import { ChoiceField, NumberField, TextField } from "./fields";
import { numberOrText } from "./numbers";
import { RemoveRowButton } from "./parts";
import type { BatteryResponse } from "./types";
import { useCalc } from "./use-calc";
import { useRows } from "./use-rows";

type Chemistry = "lead-acid" | "agm" | "lithium-iron-phosphate";
type SourceKind = "dc-dc" | "solar" | "mains";

export type ConsumerRow = { key: number; label: string; amount: string; unit: "W" | "A"; hoursPerDay: string; dutyPct: string; ac: boolean };
export type SourceRow = { key: number; kind: SourceKind; amount: string; unit: "A" | "W"; hoursPerDay: string };
export type BatteryValues = { systemV: string; daysAutonomy: string; chemistry: Chemistry; inverterEfficiency: string };

// Example loads of an invented touring set-up, to be replaced with the real ones.
const START_CONSUMERS: Omit<ConsumerRow, "key">[] = [
  { label: "Fridge", amount: "45", unit: "W", hoursPerDay: "24", dutyPct: "50", ac: false },
  { label: "Cabin lights", amount: "20", unit: "W", hoursPerDay: "5", dutyPct: "", ac: false },
  { label: "Laptop on the inverter", amount: "90", unit: "W", hoursPerDay: "4", dutyPct: "", ac: true },
  { label: "Radio on listen", amount: "1", unit: "A", hoursPerDay: "10", dutyPct: "", ac: false },
];
const START_SOURCES: Omit<SourceRow, "key">[] = [
  { kind: "dc-dc", amount: "25", unit: "A", hoursPerDay: "3" },
  { kind: "solar", amount: "200", unit: "W", hoursPerDay: "5" },
];

const CHEMISTRY_OPTIONS: { value: Chemistry; label: string }[] = [
  { value: "lithium-iron-phosphate", label: "Lithium iron phosphate" },
  { value: "agm", label: "AGM" },
  { value: "lead-acid", label: "Flooded lead-acid" },
];
const KIND_OPTIONS: { value: SourceKind; label: string }[] = [
  { value: "dc-dc", label: "DC-DC charger (while driving)" },
  { value: "solar", label: "Solar panels" },
  { value: "mains", label: "Mains charger" },
];

const TOP_FIELDS = new Set(["systemV", "daysAutonomy", "chemistry", "inverterEfficiency"]);
const ROW_FIELD = /^(consumers\.\d+\.(label|powerW|currentA|hoursPerDay|dutyPct)|(charging\.)?sources\.\d+\.(kind|currentA|watts|hoursPerDay))$/;

export function batteryBody(values: BatteryValues, consumers: ReadonlyArray<Omit<ConsumerRow, "key">>, sources: ReadonlyArray<Omit<SourceRow, "key">> | null) {
  return {
    systemV: numberOrText(values.systemV),
    daysAutonomy: numberOrText(values.daysAutonomy),
    chemistry: values.chemistry,
    inverterEfficiency: values.inverterEfficiency.trim() === "" ? undefined : percentAsFraction(values.inverterEfficiency),
    consumers: consumers.map((c) => ({
      label: c.label,
      [c.unit === "W" ? "powerW" : "currentA"]: numberOrText(c.amount),
      hoursPerDay: numberOrText(c.hoursPerDay),
      dutyPct: numberOrText(c.dutyPct),
      ac: c.ac || undefined,
    })),
    charging: sources
      ? {
          sources: sources.map((s) => ({
            kind: s.kind,
            [s.unit === "A" ? "currentA" : "watts"]: numberOrText(s.amount),
            hoursPerDay: numberOrText(s.hoursPerDay),
          })),
        }
      : undefined,
  };
}

/** The form asks for the inverter efficiency in %, the API takes a fraction. */
function percentAsFraction(raw: string): number | string | undefined {
  const value = numberOrText(raw);
  return typeof value === "number" ? value / 100 : value;
}

export function BatteryCalculator() {
  const calc = useCalc<BatteryResponse>("/api/calc/battery");
  const [values, setValues] = useState<BatteryValues>({ systemV: "12", daysAutonomy: "2", chemistry: "lithium-iron-phosphate", inverterEfficiency: "" });
  const consumers = useRows<ConsumerRow>(START_CONSUMERS, { label: "", amount: "", unit: "W", hoursPerDay: "", dutyPct: "", ac: false });
  const [charging, setCharging] = useState(true);
  const sources = useRows<SourceRow>(START_SOURCES, { kind: "dc-dc", amount: "", unit: "A", hoursPerDay: "" });

  const set =
    <K extends keyof BatteryValues>(k: K) =>
    (value: BatteryValues[K]) =>
      setValues((v) => ({ ...v, [k]: value }));
  const sourceError = (i: number, part: string) => calc.errorOf(`charging.sources.${i}.${part}`) ?? calc.errorOf(`sources.${i}.${part}`);
  const shown = (field: string) => TOP_FIELDS.has(field) || ROW_FIELD.test(field);

  function submit() {
    calc.run(batteryBody(values, consumers.rows, charging ? sources.rows : null));
  }

  return (
    <CalculatorCard
      id="battery"
      title="12 V battery"
      description="The daily energy budget, the battery it needs for the days without charging, and whether the charging keeps up."
      calc={calc}
      shown={shown}
      submitLabel="Plan the battery"
      onSubmit={submit}
      result={(r) => <BatteryResult result={r} />}
    >
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <NumberField name="systemV" label="System voltage" unit="V" value={values.systemV} onChange={set("systemV")} error={calc.errorOf("systemV")} required />
        <NumberField
          name="daysAutonomy"
          label="Days without charging"
          value={values.daysAutonomy}
          onChange={set("daysAutonomy")}
          error={calc.errorOf("daysAutonomy")}
          required
        />
        <ChoiceField
          name="chemistry"
          label="Battery type"
          hint="Usable: about 80 % lithium, 50 % AGM and lead-acid"
          value={values.chemistry}
          onChange={set("chemistry")}
          options={CHEMISTRY_OPTIONS}
          error={calc.errorOf("chemistry")}
        />
        <NumberField
          name="inverterEfficiency"
          label="Inverter efficiency"
          unit="%"
          hint="Leave empty for about 90 %"
          value={values.inverterEfficiency}
          onChange={set("inverterEfficiency")}
          error={calc.errorOf("inverterEfficiency")}
        />
      </div>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Consumers</legend>
        {consumers.rows.map((c, i) => (
          <div key={c.key} className="grid grid-cols-2 items-start gap-3 rounded-md border border-line p-3 sm:grid-cols-[1fr_6rem_5.5rem_6rem_6rem_auto]">
            <TextField
              name={`consumers.${i}.label`}
              label={`Consumer ${i + 1}`}
              className="col-span-2 sm:col-span-1"
              value={c.label}
              onChange={consumers.update(c.key, "label")}
              error={calc.errorOf(`consumers.${i}.label`)}
              required
            />
            <NumberField
              name={`consumers.${i}.${c.unit === "W" ? "powerW" : "currentA"}`}
              label="Draw"
              unit={c.unit}
              value={c.amount}
              onChange={consumers.update(c.key, "amount")}
              error={calc.errorOf(`consumers.${i}.powerW`) ?? calc.errorOf(`consumers.${i}.currentA`)}
              required
            />
            <ChoiceField
              name={`consumers.${i}.unit`}
              label="Given in"
              value={c.unit}
              onChange={consumers.update(c.key, "unit")}
              options={[
                { value: "W", label: "W" },
                { value: "A", label: "A" },
              ]}
            />
            <NumberField
              name={`consumers.${i}.hoursPerDay`}
              label="Hours a day"
              value={c.hoursPerDay}
              onChange={consumers.update(c.key, "hoursPerDay")}
              error={calc.errorOf(`consumers.${i}.hoursPerDay`)}
              required
            />
            <NumberField
              name={`consumers.${i}.dutyPct`}
              label="Running"
              unit="%"
              value={c.dutyPct}
              onChange={consumers.update(c.key, "dutyPct")}
              error={calc.errorOf(`consumers.${i}.dutyPct`)}
            />
            <div className="col-span-2 flex flex-wrap items-center justify-between gap-1 sm:col-span-1 sm:mt-5 sm:flex-col sm:items-start">
              <Checkbox label="AC (inverter)" checked={c.ac} onChange={(e) => consumers.update(c.key, "ac")(e.target.checked)} />
              <RemoveRowButton size="sm" onRemove={() => consumers.remove(c.key)} label={`Remove consumer ${i + 1}${c.label ? ` (${c.label})` : ""}`} />
            </div>
          </div>
        ))}
        <p className="text-sm text-muted">Running: the share of those hours it actually draws, e.g. 50 for a fridge compressor. Leave empty for all of them.</p>
        <div>
          <Button type="button" variant="secondary" onClick={consumers.add}>
            Add a consumer
          </Button>
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-semibold text-ink">Charging</legend>
        <Checkbox label="Check the charging too" checked={charging} onChange={(e) => setCharging(e.target.checked)} />
        {charging && (
          <>
            {sources.rows.map((s, i) => (
              <div key={s.key} className="grid grid-cols-2 items-start gap-3 rounded-md border border-line p-3 sm:grid-cols-[1fr_7rem_5.5rem_7rem_auto]">
                <ChoiceField
                  name={`charging.sources.${i}.kind`}
                  label={`Source ${i + 1}`}
                  className="col-span-2 sm:col-span-1"
                  value={s.kind}
                  onChange={sources.update(s.key, "kind")}
                  options={KIND_OPTIONS}
                  error={sourceError(i, "kind")}
                />
                <NumberField
                  name={`charging.sources.${i}.${s.unit === "A" ? "currentA" : "watts"}`}
                  label="Output"
                  unit={s.unit}
                  value={s.amount}
                  onChange={sources.update(s.key, "amount")}
                  error={sourceError(i, "currentA") ?? sourceError(i, "watts")}
                  required
                />
                <ChoiceField
                  name={`charging.sources.${i}.unit`}
                  label="Given in"
                  value={s.unit}
                  onChange={sources.update(s.key, "unit")}
                  options={[
                    { value: "A", label: "A" },
                    { value: "W", label: "W" },
                  ]}
                />
                <NumberField
                  name={`charging.sources.${i}.hoursPerDay`}
                  label={s.kind === "solar" ? "Peak sun hours" : "Hours a day"}
                  value={s.hoursPerDay}
                  onChange={sources.update(s.key, "hoursPerDay")}
                  error={sourceError(i, "hoursPerDay")}
                  required={s.kind === "solar"}
                />
                <RemoveRowButton className="col-span-2 sm:col-span-1 sm:mt-7" onRemove={() => sources.remove(s.key)} label={`Remove source ${i + 1}`} />
              </div>
            ))}
            <div>
              <Button type="button" variant="secondary" onClick={sources.add}>
                Add a source
              </Button>
            </div>
          </>
        )}
      </fieldset>

    </CalculatorCard>
  );
}
