"use client";

import { useEffect, useState } from "react";
import { addLineAction, updateLineAction } from "@/app/(app)/standards/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Checkbox, Field, Input, Select } from "@/components/ui";
import type { EditionLine } from "@/lib/variance";
import { CATEGORY_LABELS, COMMON_ATTRIBUTES, EVIDENCE_LABELS, OP_LABELS, REQUIREMENT_LABELS, ZONE_LABELS } from "./labels";

type CriterionRow = { attribute: string; op: string; value: string; high: string; unit: string; label: string };

const blankRow = (): CriterionRow => ({ attribute: "", op: "gte", value: "", high: "", unit: "", label: "" });

function rowsOf(line?: EditionLine): CriterionRow[] {
  return (line?.criteria ?? []).map((c) => {
    const list = Array.isArray(c.value) ? c.value : [c.value];
    return {
      attribute: c.attribute,
      op: c.op,
      value: c.op === "one_of" ? list.join(", ") : String(list[0] ?? ""),
      high: c.op === "between" ? String(list[1] ?? "") : "",
      unit: c.unit ?? "",
      label: c.label ?? "",
    };
  });
}

/** Rows as submitted, after a failed save (so nothing typed is lost). */
function rowsFromValues(values: Record<string, string>): CriterionRow[] | null {
  const rows = new Map<number, CriterionRow>();
  for (const [name, value] of Object.entries(values)) {
    const m = /^criteria\.(\d+)\.(attribute|op|value|high|unit|label)$/.exec(name);
    if (!m) continue;
    const row = rows.get(Number(m[1])) ?? blankRow();
    row[m[2] as keyof CriterionRow] = value;
    rows.set(Number(m[1]), row);
  }
  return rows.size ? [...rows.entries()].sort(([a], [b]) => a - b).map(([, r]) => r) : null;
}

export type LineFormProps = {
  standardId: string;
  editionId: string;
  /** The line being edited; absent for a new line. */
  line?: EditionLine;
  /** Other lines of the edition, for the dependencies. */
  others: Pick<EditionLine, "id" | "code" | "title">[];
  onDone?: () => void;
};

/** Every field of an edition line, for adding a line to a draft or changing one. */
export function LineForm({ standardId, editionId, line, others, onDone }: LineFormProps) {
  const { state, formAction, errorOf, valueOf } = useFormAction(line ? updateLineAction : addLineAction);
  const [rows, setRows] = useState<CriterionRow[]>(() => rowsOf(line));
  const [evidence, setEvidence] = useState<string[]>(line?.evidenceNeeded ?? []);
  const [dependsOn, setDependsOn] = useState<string[]>(line?.dependsOn ?? []);
  const [checkable, setCheckable] = useState(line?.checkable ?? false);
  const prefix = line ? `line-${line.id}` : "line-new";

  useEffect(() => {
    if (state.status === "error" && state.values) {
      const submitted = rowsFromValues(state.values);
      // eslint-disable-next-line react-hooks/set-state-in-effect -- restore what was typed after a refused save
      if (submitted) setRows(submitted);
    }
    if (state.status === "ok") {
      if (line) onDone?.();
      else {
        setRows([]);
        setEvidence([]);
        setDependsOn([]);
        setCheckable(false);
      }
    }
  }, [state, line, onDone]);

  const setRow = (i: number, patch: Partial<CriterionRow>) => setRows((rs) => rs.map((r, k) => (k === i ? { ...r, ...patch } : r)));
  const cost = line ? (line.standardCostCents / 100).toFixed(2) : "";

  return (
    <form action={formAction} noValidate className="flex flex-col gap-4" aria-label={line ? `Edit ${line.code}` : "Add a line"} key={line?.id ?? "new"}>
      <input type="hidden" name="standardId" value={standardId} />
      <input type="hidden" name="editionId" value={editionId} />
      {line && <input type="hidden" name="lineId" value={line.id} />}
      <FormStatus state={state} testId={`${prefix}-status`} />

      <div className="grid grid-cols-1 gap-3 sm:grid-cols-[8rem_1fr]">
        <Field label="Code" error={errorOf("code")} required id={`${prefix}-code`}>
          <Input name="code" defaultValue={valueOf("code", line?.code)} placeholder="RC-04" />
        </Field>
        <Field label="What the line asks for" error={errorOf("title")} required id={`${prefix}-title`}>
          <Input name="title" defaultValue={valueOf("title", line?.title)} />
        </Field>
      </div>

      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <Field label="Category" error={errorOf("category")} required id={`${prefix}-category`}>
          <Select name="category" defaultValue={valueOf("category", line?.category ?? "recovery")}>
            {Object.entries(CATEGORY_LABELS).map(([v, l]) => (
              <option key={v} value={v}>
                {l}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Requirement" error={errorOf("requirement")} required id={`${prefix}-requirement`}>
          <Select name="requirement" defaultValue={valueOf("requirement", line?.requirement ?? "must_fit")}>
            {Object.entries(REQUIREMENT_LABELS).map(([v, l]) => (
              <option key={v} value={v}>
                {l}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Quantity" error={errorOf("quantity")} required id={`${prefix}-quantity`}>
          <Input name="quantity" inputMode="numeric" defaultValue={valueOf("quantity", String(line?.quantity ?? 1))} />
        </Field>
      </div>

      <fieldset className="grid grid-cols-1 gap-3 rounded-md border border-line p-3 sm:grid-cols-4">
        <legend className="px-1 text-sm font-semibold">Mass and where it sits</legend>
        <Field label="Mass (kg, each)" error={errorOf("massKg")} id={`${prefix}-mass`}>
          <Input name="massKg" inputMode="decimal" defaultValue={valueOf("massKg", String(line?.massKg ?? 0))} />
        </Field>
        <Field label="Behind the front axle (mm)" error={errorOf("xMm")} id={`${prefix}-x`}>
          <Input name="xMm" inputMode="decimal" defaultValue={valueOf("xMm", line?.xMm == null ? "" : String(line.xMm))} placeholder="negative: ahead of it" />
        </Field>
        <Field label="Or zone" error={errorOf("zone")} id={`${prefix}-zone`}>
          <Select name="zone" defaultValue={valueOf("zone", line?.zone ?? "")}>
            <option value="">No zone</option>
            {Object.entries(ZONE_LABELS).map(([v, l]) => (
              <option key={v} value={v}>
                {l}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Mass kind" error={errorOf("massKind")} id={`${prefix}-mass-kind`}>
          <Select name="massKind" defaultValue={valueOf("massKind", line?.massKind ?? "constant")}>
            <option value="constant">Constant (accessory)</option>
            <option value="variable">Variable (water, load)</option>
          </Select>
        </Field>
        <p className="text-sm text-muted sm:col-span-4">A line with mass says where it sits: a distance behind the front axle, a zone, or both. Springs are rated for the constant mass; the variable mass is for airbags.</p>
      </fieldset>

      <fieldset className="flex flex-col gap-2 rounded-md border border-line p-3">
        <legend className="px-1 text-sm font-semibold">Measurable criteria</legend>
        {rows.length === 0 && <p className="text-sm text-muted">No criteria: the line is met by fitting it (and any evidence it needs).</p>}
        <datalist id={`${prefix}-attributes`}>
          {COMMON_ATTRIBUTES.map((a) => (
            <option key={a.attribute} value={a.attribute}>
              {a.label}
            </option>
          ))}
        </datalist>
        {rows.map((row, i) => (
          <div key={i} className="grid grid-cols-2 items-end gap-2 sm:grid-cols-[1.4fr_1.2fr_1fr_1fr_0.8fr_auto]" data-testid={`${prefix}-criterion-${i}`}>
            <Field label="Attribute" error={errorOf(`criteria.${i}.attribute`)} id={`${prefix}-c${i}-attribute`}>
              <Input name={`criteria.${i}.attribute`} list={`${prefix}-attributes`} value={row.attribute} onChange={(e) => setRow(i, { attribute: e.target.value })} placeholder="loadIndex" />
            </Field>
            <Field label="Test" error={errorOf(`criteria.${i}.op`)} id={`${prefix}-c${i}-op`}>
              <Select name={`criteria.${i}.op`} value={row.op} onChange={(e) => setRow(i, { op: e.target.value })}>
                {Object.entries(OP_LABELS).map(([v, l]) => (
                  <option key={v} value={v}>
                    {l}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label={row.op === "between" ? "From" : row.op === "one_of" ? "Values (commas)" : "Value"} error={errorOf(`criteria.${i}.value`)} id={`${prefix}-c${i}-value`}>
              <Input name={`criteria.${i}.value`} value={row.value} onChange={(e) => setRow(i, { value: e.target.value })} />
            </Field>
            {row.op === "between" ? (
              <Field label="To" id={`${prefix}-c${i}-high`}>
                <Input name={`criteria.${i}.high`} value={row.high} onChange={(e) => setRow(i, { high: e.target.value })} />
              </Field>
            ) : (
              <span aria-hidden="true" />
            )}
            <Field label="Unit" error={errorOf(`criteria.${i}.unit`)} id={`${prefix}-c${i}-unit`}>
              <Input name={`criteria.${i}.unit`} value={row.unit} onChange={(e) => setRow(i, { unit: e.target.value })} />
            </Field>
            <input type="hidden" name={`criteria.${i}.label`} value={row.label} />
            <Button type="button" variant="ghost" onClick={() => setRows((rs) => rs.filter((_, k) => k !== i))} aria-label={`Remove criterion ${i + 1}`}>
              Remove
            </Button>
          </div>
        ))}
        {errorOf("criteria") && <p className="text-sm font-semibold text-danger">{errorOf("criteria")}</p>}
        <div>
          <Button type="button" variant="secondary" size="sm" onClick={() => setRows((rs) => [...rs, blankRow()])}>
            Add a criterion
          </Button>
        </div>
      </fieldset>

      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <fieldset className="rounded-md border border-line p-3">
          <legend className="px-1 text-sm font-semibold">Evidence needed</legend>
          {Object.entries(EVIDENCE_LABELS).map(([kind, l]) => (
            <Checkbox
              key={kind}
              id={`${prefix}-evidence-${kind}`}
              name="evidenceNeeded[]"
              value={kind}
              label={l}
              checked={evidence.includes(kind)}
              onChange={(e) => setEvidence((ks) => (e.target.checked ? [...ks, kind] : ks.filter((k) => k !== kind)))}
            />
          ))}
          {errorOf("evidenceNeeded") && <p className="text-sm font-semibold text-danger">{errorOf("evidenceNeeded")}</p>}
        </fieldset>
        <div className="flex flex-col gap-3">
          <Field label="Standard cost (AUD, whole line)" error={errorOf("standardCost") ?? errorOf("standardCostCents")} id={`${prefix}-cost`} hint="Fitted, for its whole quantity">
            <Input name="standardCost" inputMode="decimal" defaultValue={valueOf("standardCost", cost)} placeholder="0.00" />
          </Field>
          <Field label="Expires after (months)" error={errorOf("expiryMonths")} id={`${prefix}-expiry`} hint="For kits and extinguishers; blank if it never expires">
            <Input name="expiryMonths" inputMode="numeric" defaultValue={valueOf("expiryMonths", line?.expiryMonths == null ? "" : String(line.expiryMonths))} />
          </Field>
          <Checkbox id={`${prefix}-checkable`} name="checkable" value="true" label="Checked by the driver before each trip" checked={checkable} onChange={(e) => setCheckable(e.target.checked)} />
        </div>
      </div>

      <Field label="Depends on" error={errorOf("dependsOn")} id={`${prefix}-depends`} hint="Lines that must be decided or fitted first. Hold Ctrl (or ⌘) to choose several.">
        <select
          name="dependsOn[]"
          multiple
          size={Math.min(8, Math.max(3, others.length))}
          value={dependsOn}
          onChange={(e) => setDependsOn([...e.target.selectedOptions].map((o) => o.value))}
          className="block w-full rounded-md border border-line-strong bg-surface-raised px-2 py-1 text-sm text-ink aria-invalid:border-2 aria-invalid:border-danger"
        >
          {others.map((o) => (
            <option key={o.id} value={o.id}>
              {o.code} {o.title}
            </option>
          ))}
        </select>
      </Field>

      <div className="flex flex-wrap gap-2">
        <SubmitButton>{line ? "Save line" : "Add line"}</SubmitButton>
        {line && onDone && (
          <Button type="button" variant="ghost" onClick={onDone}>
            Cancel
          </Button>
        )}
      </div>
    </form>
  );
}
