"use client";

import { useState } from "react";
import { CalculatorCard } from "./calculator-card";
import { ChoiceField, NumberField, TextField } from "./fields";
import { numberOrText } from "./numbers";
import type { RuleSetOption, TyreChangeResponse } from "./types";
import { TyreChangeResult } from "./tyre-change-result";
import { useCalc } from "./use-calc";

const FIELDS = new Set(["from", "to", "speedoReadsHighPct", "ruleSetId", "suspensionLiftMm"]);

export function tyreChangeBody(values: { from: string; to: string; speedoReadsHighPct: string; ruleSetId: string; suspensionLiftMm: string }) {
  return {
    from: values.from,
    to: values.to,
    speedoReadsHighPct: numberOrText(values.speedoReadsHighPct),
    ruleSetId: values.ruleSetId || undefined,
    suspensionLiftMm: numberOrText(values.suspensionLiftMm),
  };
}

export function TyreChangeCalculator({ ruleSets }: { ruleSets: readonly RuleSetOption[] }) {
  const calc = useCalc<TyreChangeResponse>("/api/calc/tyre-change");
  const [values, setValues] = useState({
    from: "265/70R17",
    to: "285/70R17",
    speedoReadsHighPct: "",
    ruleSetId: ruleSets[0]?.id ?? "",
    suspensionLiftMm: "",
  });
  const set = (k: keyof typeof values) => (value: string) => setValues((v) => ({ ...v, [k]: value }));

  function submit() {
    calc.run(tyreChangeBody(values));
  }

  return (
    <CalculatorCard
      id="tyre-change"
      title="Tyre change"
      description="What a new tyre size does to the diameter, ground clearance and speedometer, and how the lift compares with a rule set."
      calc={calc}
      shown={(f) => FIELDS.has(f)}
      submitLabel="Check the tyre change"
      onSubmit={submit}
      result={(r) => <TyreChangeResult result={r} />}
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          name="from"
          label="Size fitted now"
          placeholder="265/70R17"
          hint="As on the sidewall, e.g. 265/70R17 112T or 35x12.50R17LT"
          value={values.from}
          onChange={set("from")}
          error={calc.errorOf("from")}
          required
        />
        <TextField
          name="to"
          label="Size proposed"
          placeholder="285/70R17"
          value={values.to}
          onChange={set("to")}
          error={calc.errorOf("to")}
          required
        />
        <NumberField
          name="speedoReadsHighPct"
          label="Speedometer read high on the old tyres by"
          unit="%"
          hint="E.g. 5 if it showed 100 at a true 95 km/h. Leave empty if not known: it is then taken as exact."
          value={values.speedoReadsHighPct}
          onChange={set("speedoReadsHighPct")}
          error={calc.errorOf("speedoReadsHighPct")}
        />
        <NumberField
          name="suspensionLiftMm"
          label="Suspension lift fitted with the tyres"
          unit="mm"
          hint="Leave empty for none"
          value={values.suspensionLiftMm}
          onChange={set("suspensionLiftMm")}
          error={calc.errorOf("suspensionLiftMm")}
        />
        <ChoiceField
          name="ruleSetId"
          label="Rule set"
          hint="Example values only — check your local rules."
          className="sm:col-span-2"
          value={values.ruleSetId}
          onChange={set("ruleSetId")}
          options={ruleSets.map((r) => ({ value: r.id, label: r.name }))}
          error={calc.errorOf("ruleSetId")}
        />
      </div>
    </CalculatorCard>
  );
}
