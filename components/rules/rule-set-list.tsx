"use client";

import { useState } from "react";
import { chooseRuleSetAction, copyRuleSetAction, updateRuleSetAction } from "@/app/(app)/admin/rules/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Badge, Button, Card, CardBody, CardHeader, Field, Input, StatusPill, Textarea } from "@/components/ui";
import type { RuleSet } from "@/lib/rules";

export type RuleSetItem = { id: string; name: string; shipped: boolean; orgId: string | null; rules: RuleSet };

type LimitKey = Exclude<keyof RuleSet, "id" | "name" | "exampleOnly" | "note">;

const LIMITS: { key: LimitKey; label: string; unit: string; hint?: string }[] = [
  { key: "suspensionLiftMaxMm", label: "Suspension lift", unit: "mm" },
  { key: "suspensionLiftMaxTravelFraction", label: "Suspension lift, share of original travel", unit: "", hint: "A fraction: 0.333 or 1/3" },
  { key: "tyreDiameterIncreaseMaxMm", label: "Tyre diameter increase", unit: "mm", hint: "Over the largest tyre the maker specifies; leave empty for none" },
  { key: "tyreDiameterIncreaseMaxPct", label: "Tyre diameter increase", unit: "%", hint: "Leave empty for none" },
  { key: "combinedLiftMaxMm", label: "Combined lift (suspension + tyres)", unit: "mm" },
  { key: "tyreLiftShareMaxMm", label: "Lift from tyres (half the diameter increase)", unit: "mm" },
  { key: "maxCertifiedLiftMm", label: "Most lift that can be certified", unit: "mm", hint: "Leave empty where no ceiling is set" },
  { key: "wheelTrackIncreaseMaxMm", label: "Wheel track wider than the maker's maximum", unit: "mm" },
];

function limitText(rules: RuleSet, key: LimitKey, unit: string): string {
  const v = rules[key];
  if (v === undefined) return "—";
  if (key === "suspensionLiftMaxTravelFraction") return Math.abs(v - 1 / 3) < 1e-6 ? "a third" : `${Math.round(v * 1000) / 10} %`;
  return `${v.toLocaleString("en-AU")}${unit === "%" ? " %" : ` ${unit}`}`;
}

function ChooseForm({ id, name }: { id: string; name: string }) {
  const { state, formAction } = useFormAction(chooseRuleSetAction);
  return (
    <form action={formAction} className="flex flex-col gap-1">
      <input type="hidden" name="ruleSetId" value={id} />
      <SubmitButton size="sm" aria-label={`Use ${name} for the organisation`}>
        Use this set
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} />}
    </form>
  );
}

function CopyForm({ id, name }: { id: string; name: string }) {
  const { state, formAction } = useFormAction(copyRuleSetAction);
  return (
    <form action={formAction} className="flex flex-col gap-1">
      <input type="hidden" name="copyFromId" value={id} />
      <SubmitButton size="sm" variant="secondary" aria-label={`Copy ${name} to edit`}>
        Copy to edit
      </SubmitButton>
      {state.status === "error" && <FormStatus state={state} />}
    </form>
  );
}

function EditForm({ set, onDone }: { set: RuleSetItem; onDone: () => void }) {
  const { state, formAction, errorOf, valueOf } = useFormAction(updateRuleSetAction);
  const value = (key: LimitKey) => {
    const v = set.rules[key];
    return valueOf(key, v === undefined ? "" : String(key === "suspensionLiftMaxTravelFraction" && Math.abs(v - 1 / 3) < 1e-6 ? "1/3" : v));
  };
  return (
    <form action={formAction} className="grid grid-cols-1 gap-3 md:grid-cols-2" noValidate aria-label={`Edit ${set.name}`}>
      <input type="hidden" name="id" value={set.id} />
      <div className="md:col-span-2">
        <FormStatus state={state} testId="rule-set-status" />
      </div>
      <Field label="Name" error={errorOf("name")} required className="md:col-span-2">
        <Input name="name" defaultValue={valueOf("name", set.name)} maxLength={120} />
      </Field>
      <Field label="Note shown beside every result" error={errorOf("note")} required className="md:col-span-2">
        <Textarea name="note" defaultValue={valueOf("note", set.rules.note)} rows={3} />
      </Field>
      {LIMITS.map((l) => (
        <Field key={l.key} label={`${l.label}${l.unit ? ` (${l.unit})` : ""}`} hint={l.hint} error={errorOf(l.key)}>
          <Input name={l.key} inputMode="decimal" defaultValue={value(l.key)} />
        </Field>
      ))}
      <div className="flex gap-2 md:col-span-2">
        <SubmitButton>Save limits</SubmitButton>
        <Button type="button" variant="ghost" onClick={onDone}>
          Close
        </Button>
      </div>
    </form>
  );
}

function RuleSetCard({ set, inUse, chosen, canManage }: { set: RuleSetItem; inUse: boolean; chosen: boolean; canManage: boolean }) {
  const [editing, setEditing] = useState(false);
  return (
    <Card data-testid="rule-set" data-id={set.id}>
      <CardHeader
        title={
          <span className="flex flex-wrap items-center gap-2">
            {set.name}
            {set.shipped ? <Badge tone="neutral">Shipped example</Badge> : <Badge tone="accent">Our copy</Badge>}
            {inUse && (
              <StatusPill tone={chosen ? "ok" : "neutral"} size="sm">
                {chosen ? "In use" : "In use until one is chosen"}
              </StatusPill>
            )}
          </span>
        }
        description="Example values — check your local rules."
        actions={
          canManage ? (
            <div className="flex flex-wrap items-start gap-2">
              {!(inUse && chosen) && <ChooseForm id={set.id} name={set.name} />}
              <CopyForm id={set.id} name={set.name} />
              {!set.shipped && (
                <Button type="button" size="sm" variant="secondary" onClick={() => setEditing((e) => !e)} aria-expanded={editing}>
                  {editing ? "Close" : "Edit limits"}
                </Button>
              )}
            </div>
          ) : undefined
        }
      />
      <CardBody className="flex flex-col gap-3">
        <p className="text-sm text-muted">{set.rules.note}</p>
        {editing && !set.shipped ? (
          <EditForm set={set} onDone={() => setEditing(false)} />
        ) : (
          <dl className="grid grid-cols-1 gap-x-8 gap-y-1 text-sm sm:grid-cols-2">
            {LIMITS.map((l) => (
              <div key={l.key} className="flex justify-between gap-4 border-b border-line py-1">
                <dt>
                  {l.label}
                  {l.unit === "%" ? " (%)" : ""}
                </dt>
                <dd className="font-semibold tabular-nums">{limitText(set.rules, l.key, l.unit)}</dd>
              </div>
            ))}
          </dl>
        )}
      </CardBody>
    </Card>
  );
}

/** The rule sets the organisation can use: shipped examples and its own edited copies. */
export function RuleSetList({ sets, inUseId, chosen, canManage }: { sets: RuleSetItem[]; inUseId: string; chosen: boolean; canManage: boolean }) {
  return (
    <div className="flex flex-col gap-4">
      {sets.map((set) => (
        <RuleSetCard key={set.id} set={set} inUse={set.id === inUseId} chosen={chosen} canManage={canManage} />
      ))}
    </div>
  );
}
