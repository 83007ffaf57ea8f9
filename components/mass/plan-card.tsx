"use client";

import { useCallback, useState } from "react";
import { addPlannedItemAction, planEditionAction, removePlannedItemAction, updatePlannedItemAction } from "@/app/(app)/vehicles/[id]/mass/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import type { FormState } from "@/lib/server/form-state";
import { Button, EmptyState, Field, Input, Quantity, Select, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { PLAN_ZONES, ZONE_LABELS, type MassKind, type PlannedItem, type PlanZone } from "./model";

/** What the user is typing for an item, as text. */
type ItemText = { label: string; massKg: string; where: PlanZone | "mm"; xMm: string; massKind: MassKind };

const EMPTY_ITEM: ItemText = { label: "", massKg: "", where: "rear_overhang", xMm: "", massKind: "constant" };

/** The typed item as a planned item, or null while it is not yet a usable one. */
export function itemFromText(id: string, t: ItemText): PlannedItem | null {
  const mass = Number(t.massKg);
  if (t.label.trim() === "" || t.massKg.trim() === "" || !Number.isFinite(mass) || mass <= 0 || mass > 3000) return null;
  if (t.where === "mm") {
    const x = Number(t.xMm);
    if (t.xMm.trim() === "" || !Number.isFinite(x) || x < -3000 || x > 12_000) return null;
    return { id, label: t.label.trim(), massKg: mass, xMm: x, zone: null, massKind: t.massKind };
  }
  return { id, label: t.label.trim(), massKg: mass, xMm: null, zone: t.where, massKind: t.massKind };
}

function textFromItem(item: PlannedItem): ItemText {
  return {
    label: item.label,
    massKg: String(item.massKg),
    where: item.xMm !== null ? "mm" : (item.zone ?? "cab"),
    xMm: item.xMm !== null ? String(item.xMm) : "",
    massKind: item.massKind,
  };
}

export function positionWords(item: Pick<PlannedItem, "xMm" | "zone">): string {
  if (item.xMm !== null) return `${Math.round(item.xMm).toLocaleString("en-AU")} mm behind the front axle`;
  if (item.zone) return ZONE_LABELS[item.zone];
  return "Not recorded";
}

function ItemFields({
  text,
  onChange,
  errorOf,
  idPrefix,
}: {
  text: ItemText;
  onChange: (t: ItemText) => void;
  errorOf: (field: string) => string | undefined;
  idPrefix: string;
}) {
  return (
    <>
      <Field label="Item" error={errorOf("label")} required id={`${idPrefix}-label`}>
        <Input name="label" value={text.label} maxLength={120} onChange={(e) => onChange({ ...text, label: e.target.value })} placeholder="e.g. Rear bar with wheel carrier" />
      </Field>
      <Field label="Mass (kg)" error={errorOf("massKg")} required id={`${idPrefix}-mass`}>
        <Input name="massKg" inputMode="decimal" value={text.massKg} onChange={(e) => onChange({ ...text, massKg: e.target.value })} />
      </Field>
      <Field label="Where it sits" error={errorOf("zone")} id={`${idPrefix}-where`}>
        <Select value={text.where} onChange={(e) => onChange({ ...text, where: e.target.value as ItemText["where"] })}>
          {PLAN_ZONES.map((z) => (
            <option key={z} value={z}>
              {ZONE_LABELS[z]}
            </option>
          ))}
          <option value="mm">Measured distance (mm)</option>
        </Select>
      </Field>
      {/* The zone sent: none when a measured distance is given. */}
      <input type="hidden" name="zone" value={text.where === "mm" ? "" : text.where} />
      {text.where === "mm" && (
        <Field label="Distance behind the front axle (mm)" hint="Negative is ahead of the front axle" error={errorOf("xMm")} required id={`${idPrefix}-x`}>
          <Input name="xMm" inputMode="decimal" value={text.xMm} onChange={(e) => onChange({ ...text, xMm: e.target.value })} />
        </Field>
      )}
      {text.where !== "mm" && errorOf("xMm") && <p className="text-sm font-semibold text-danger">{errorOf("xMm")}</p>}
      <Field label="Mass kind" hint="Constant: fitted accessories. Variable: gear and contents." error={errorOf("massKind")} id={`${idPrefix}-kind`}>
        <Select name="massKind" value={text.massKind} onChange={(e) => onChange({ ...text, massKind: e.target.value as MassKind })}>
          <option value="constant">Constant</option>
          <option value="variable">Variable</option>
        </Select>
      </Field>
    </>
  );
}

export type DraftEffect = { frontKg: number; rearKg: number; grossKg: number } | null;

function AddItemForm({ vehicleId, onDraft, effect }: { vehicleId: string; onDraft: (item: PlannedItem | null) => void; effect: DraftEffect }) {
  const [text, setText] = useState<ItemText>(EMPTY_ITEM);
  // Once saved, the item is part of the plan: the form starts afresh and the preview ends.
  const action = useCallback(
    async (prev: FormState<PlannedItem>, formData: FormData) => {
      const next = (await addPlannedItemAction(prev, formData)) as FormState<PlannedItem>;
      if (next.status === "ok") {
        setText(EMPTY_ITEM);
        onDraft(null);
      }
      return next;
    },
    [onDraft],
  );
  const { state, formAction, errorOf } = useFormAction(action);
  const change = (t: ItemText) => {
    setText(t);
    onDraft(itemFromText("draft", t));
  };
  return (
    <form action={formAction} className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-3" noValidate aria-label="Add a planned item">
      <input type="hidden" name="id" value={vehicleId} />
      <div className="sm:col-span-2 lg:col-span-3">
        <FormStatus state={state} testId="plan-add-status" />
      </div>
      <ItemFields text={text} onChange={change} errorOf={errorOf} idPrefix="add" />
      <div className="flex items-end">
        <SubmitButton>Add to plan</SubmitButton>
      </div>
      <p className="text-sm sm:col-span-2 lg:col-span-3" aria-live="polite" data-testid="draft-effect">
        {effect && (
          <>
            Shown in the figures now, before saving: front <Quantity value={effect.frontKg} unit="kg" signed />, rear <Quantity value={effect.rearKg} unit="kg" signed />, gross{" "}
            <Quantity value={effect.grossKg} unit="kg" signed />.
          </>
        )}
      </p>
    </form>
  );
}

function PlannedRow({
  vehicleId,
  item,
  canPlan,
  onPreview,
}: {
  vehicleId: string;
  item: PlannedItem;
  canPlan: boolean;
  onPreview: (id: string, item: PlannedItem | null) => void;
}) {
  const [editing, setEditing] = useState(false);
  const [text, setText] = useState<ItemText>(() => textFromItem(item));
  const save = useCallback(
    async (prev: FormState<PlannedItem>, formData: FormData) => {
      const next = (await updatePlannedItemAction(prev, formData)) as FormState<PlannedItem>;
      if (next.status === "ok") {
        setEditing(false);
        onPreview(item.id, null);
      }
      return next;
    },
    [item.id, onPreview],
  );
  const update = useFormAction(save);
  const remove = useFormAction(removePlannedItemAction);
  const change = (t: ItemText) => {
    setText(t);
    onPreview(item.id, itemFromText(item.id, t));
  };
  const stopEditing = () => {
    setEditing(false);
    setText(textFromItem(item));
    onPreview(item.id, null);
  };
  return (
    <>
      <Tr data-testid="planned-item">
        <Th scope="row">{item.label}</Th>
        <Td numeric>
          <Quantity value={item.massKg} unit="kg" digits={item.massKg % 1 === 0 ? 0 : 1} />
        </Td>
        <Td>{positionWords(item)}</Td>
        <Td>{item.massKind === "variable" ? "Variable" : "Constant"}</Td>
        {canPlan && (
          <Td className="whitespace-nowrap text-right">
            <div className="flex justify-end gap-2">
              <Button type="button" variant="secondary" size="sm" onClick={() => (editing ? stopEditing() : setEditing(true))} aria-expanded={editing}>
                {editing ? "Cancel" : "Move or edit"}
              </Button>
              <form action={remove.formAction}>
                <input type="hidden" name="id" value={vehicleId} />
                <input type="hidden" name="itemId" value={item.id} />
                <SubmitButton variant="ghost" size="sm" aria-label={`Remove ${item.label} from the plan`}>
                  Remove
                </SubmitButton>
              </form>
            </div>
            {remove.state.status === "error" && <p className="text-sm text-danger">{remove.state.message}</p>}
          </Td>
        )}
      </Tr>
      {editing && (
        <Tr>
          <Td colSpan={5}>
            <form action={update.formAction} className="grid grid-cols-1 gap-3 py-2 sm:grid-cols-2 lg:grid-cols-3" noValidate aria-label={`Edit ${item.label}`}>
              <input type="hidden" name="id" value={vehicleId} />
              <input type="hidden" name="itemId" value={item.id} />
              {text.where !== "mm" && <input type="hidden" name="xMm" value="" />}
              <div className="sm:col-span-2 lg:col-span-3">
                <FormStatus state={update.state} testId="plan-edit-status" />
                <p className="text-sm text-muted">The figures above already show the change; save to keep it.</p>
              </div>
              <ItemFields text={text} onChange={change} errorOf={update.errorOf} idPrefix={`edit-${item.id}`} />
              <div className="flex items-end">
                <SubmitButton>Save</SubmitButton>
              </div>
            </form>
          </Td>
        </Tr>
      )}
    </>
  );
}

function EditionPlanForm({ vehicleId, editions }: { vehicleId: string; editions: { id: string; label: string }[] }) {
  const { state, formAction, errorOf } = useFormAction(planEditionAction);
  return (
    <form action={formAction} className="flex flex-wrap items-end gap-3" noValidate aria-label="Plan a draft edition">
      <input type="hidden" name="id" value={vehicleId} />
      <Field label="Plan an edition's short lines" hint="Adds every must-fit line this vehicle is short of, with its mass and place." error={errorOf("editionId")} className="min-w-64 flex-1">
        <Select name="editionId" defaultValue={editions[0]?.id}>
          {editions.map((e) => (
            <option key={e.id} value={e.id}>
              {e.label}
            </option>
          ))}
        </Select>
      </Field>
      <SubmitButton variant="secondary">Plan these lines</SubmitButton>
      <div className="basis-full">
        <FormStatus state={state} testId="plan-edition-status" />
      </div>
    </form>
  );
}

type Props = {
  vehicleId: string;
  planned: PlannedItem[];
  /** What the item being typed does to the axles, while it is typed. */
  draftEffect: DraftEffect;
  canPlan: boolean;
  editions: { id: string; label: string }[];
  onDraft: (item: PlannedItem | null) => void;
  onPreview: (id: string, item: PlannedItem | null) => void;
};

/** The what-if plan: items to add before anything is bought, each one moved or removed at will. */
export function PlanCard({ vehicleId, planned, draftEffect, canPlan, editions, onDraft, onPreview }: Props) {
  return (
    <div className="flex flex-col gap-4">
      {planned.length === 0 ? (
        <EmptyState title="Nothing planned yet">
          {canPlan ? "Add an item below to see what it does to the axles before anyone buys it." : "A manager can plan items here."}
        </EmptyState>
      ) : (
        <Table label="Planned items">
          <THead>
            <Tr>
              <Th>Item</Th>
              <Th numeric>Mass</Th>
              <Th>Where</Th>
              <Th>Kind</Th>
              {canPlan && <Th className="text-right">Change</Th>}
            </Tr>
          </THead>
          <TBody>
            {planned.map((item) => (
              <PlannedRow key={`${item.id}:${item.massKg}:${item.xMm}:${item.zone}:${item.label}:${item.massKind}`} vehicleId={vehicleId} item={item} canPlan={canPlan} onPreview={onPreview} />
            ))}
          </TBody>
        </Table>
      )}
      {canPlan && (
        <>
          <AddItemForm vehicleId={vehicleId} onDraft={onDraft} effect={draftEffect} />
          {editions.length > 0 && <EditionPlanForm vehicleId={vehicleId} editions={editions} />}
        </>
      )}
    </div>
  );
}
