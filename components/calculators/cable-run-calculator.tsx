"use client";

import { useState } from "react";
import { conductorSizes, MAX_DROP_PCT_BY_CIRCUIT } from "@/lib/electrical";
import { CableRunResult } from "./cable-run-result";
import { CalculatorCard } from "./calculator-card";
import { ChoiceField, NumberField } from "./fields";
import { numberOrText } from "./numbers";
import type { CableRunResponse } from "./types";
import { useCalc } from "./use-calc";

type Limit = "critical" | "other" | "own";
type Series = "metric" | "awg";

const FIELDS = new Set(["currentA", "lengthOneWayM", "systemV", "maxDropPct", "areaMm2", "temperatureC", "circuit", "sizeSeries"]);

const LIMIT_OPTIONS: { value: Limit; label: string }[] = [
  { value: "critical", label: `Critical circuit (${MAX_DROP_PCT_BY_CIRCUIT.critical} %): fridge, radio, pumps` },
  { value: "other", label: `Other circuit (${MAX_DROP_PCT_BY_CIRCUIT.other} %): lights, accessories` },
  { value: "own", label: "A limit of my own" },
];

const SIZE_OPTIONS = [
  { value: "", label: "None: size it for me" },
  ...conductorSizes("metric").map((s) => ({ value: String(s.areaMm2), label: s.label })),
  ...conductorSizes("awg").map((s) => ({ value: String(s.areaMm2), label: `${s.label} (${s.areaMm2.toFixed(2)} mm²)` })),
];

export type CableValues = {
  currentA: string;
  lengthOneWayM: string;
  systemV: string;
  limit: Limit;
  maxDropPct: string;
  areaMm2: string;
  temperatureC: string;
  sizeSeries: Series;
};

export function cableRunBody(v: CableValues) {
  return {
    currentA: numberOrText(v.currentA),
    lengthOneWayM: numberOrText(v.lengthOneWayM),
    systemV: numberOrText(v.systemV),
    circuit: v.limit === "own" ? undefined : v.limit,
    maxDropPct: v.limit === "own" ? numberOrText(v.maxDropPct) : undefined,
    areaMm2: numberOrText(v.areaMm2),
    temperatureC: numberOrText(v.temperatureC),
    sizeSeries: v.sizeSeries,
  };
}

export function CableRunCalculator() {
  const calc = useCalc<CableRunResponse>("/api/calc/cable");
  const [values, setValues] = useState<CableValues>({
    currentA: "20",
    lengthOneWayM: "5",
    systemV: "12",
    limit: "critical",
    maxDropPct: "",
    areaMm2: "6",
    temperatureC: "",
    sizeSeries: "metric",
  });
  const set =
    <K extends keyof CableValues>(k: K) =>
    (value: CableValues[K]) =>
      setValues((v) => ({ ...v, [k]: value }));

  function submit() {
    calc.run(cableRunBody(values));
  }

  return (
    <CalculatorCard
      id="cable-run"
      title="Cable run"
      description="The voltage drop of a 12 V run, the cable size that keeps it within the limit, and the fuse that protects that cable."
      calc={calc}
      shown={(f) => FIELDS.has(f) && (f !== "maxDropPct" || values.limit === "own")}
      submitLabel="Size the cable"
      onSubmit={submit}
      result={(r) => <CableRunResult result={r} />}
    >
      <div className="grid gap-4 sm:grid-cols-3">
        <NumberField
          name="currentA"
          label="Load current"
          unit="A"
          value={values.currentA}
          onChange={set("currentA")}
          error={calc.errorOf("currentA")}
          required
        />
        <NumberField
          name="lengthOneWayM"
          label="Run length, one way"
          unit="m"
          hint="Battery to load; the return path is counted for you"
          value={values.lengthOneWayM}
          onChange={set("lengthOneWayM")}
          error={calc.errorOf("lengthOneWayM")}
          required
        />
        <NumberField
          name="systemV"
          label="System voltage"
          unit="V"
          value={values.systemV}
          onChange={set("systemV")}
          error={calc.errorOf("systemV")}
          required
        />
        <ChoiceField
          name="circuit"
          label="Drop limit"
          className="sm:col-span-2"
          value={values.limit}
          onChange={set("limit")}
          options={LIMIT_OPTIONS}
          error={calc.errorOf("circuit")}
        />
        {values.limit === "own" ? (
          <NumberField
            name="maxDropPct"
            label="Largest drop"
            unit="%"
            value={values.maxDropPct}
            onChange={set("maxDropPct")}
            error={calc.errorOf("maxDropPct")}
            required
          />
        ) : (
          <div aria-hidden="true" />
        )}
        <ChoiceField
          name="areaMm2"
          label="Cable to check"
          hint="The cable fitted or planned, if any"
          value={values.areaMm2}
          onChange={set("areaMm2")}
          options={SIZE_OPTIONS}
          error={calc.errorOf("areaMm2")}
        />
        <ChoiceField
          name="sizeSeries"
          label="Recommend sizes in"
          value={values.sizeSeries}
          onChange={set("sizeSeries")}
          options={[
            { value: "metric", label: "mm² (metric)" },
            { value: "awg", label: "AWG" },
          ]}
          error={calc.errorOf("sizeSeries")}
        />
        <NumberField
          name="temperatureC"
          label="Conductor temperature"
          unit="°C"
          hint="Leave empty for 20 °C; engine bays run hotter"
          value={values.temperatureC}
          onChange={set("temperatureC")}
          error={calc.errorOf("temperatureC")}
        />
      </div>
    </CalculatorCard>
  );
}
