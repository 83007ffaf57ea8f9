"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import {
  Button,
  Dialog,
  DialogClose,
  DialogContent,
  DialogDescription,
  DialogFooter,
  DialogHeader,
  DialogTitle,
  DialogTrigger,
  Field,
  FormMessage,
  Select,
  toast,
} from "@/components/ui";

export type BulkOptions = {
  editions: { id: string; label: string }[];
  depots: { id: string; name: string; code: string }[];
};

type BulkResult = { action: string; target: string; requested: number; updated: number; unchanged: number };
type ApiError = { error?: { message?: string; details?: { field?: string; message: string }[] } };

async function postBulk(body: unknown): Promise<BulkResult> {
  const response = await fetch("/api/vehicles/bulk", {
    method: "POST",
    headers: { "content-type": "application/json", accept: "application/json" },
    body: JSON.stringify(body),
  });
  const json = (await response.json().catch(() => null)) as (BulkResult & ApiError) | null;
  if (!response.ok) throw new Error(json?.error?.message ?? "The change could not be made. Nothing was changed.");
  return json as BulkResult;
}

const vehiclesWord = (n: number) => `${n} vehicle${n === 1 ? "" : "s"}`;

/** The bar above the register when rows are chosen: assign an edition, or move to a depot. */
export function BulkActions({ selectedIds, options, onDone }: { selectedIds: string[]; options: BulkOptions; onDone: () => void }) {
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-md border border-accent/40 bg-accent-soft px-3 py-2" role="region" aria-label="Bulk actions">
      <p className="font-semibold" data-testid="selected-count">
        {vehiclesWord(selectedIds.length)} chosen
      </p>
      <BulkDialog
        action="assign_edition"
        selectedIds={selectedIds}
        onDone={onDone}
        trigger="Assign standard edition"
        title="Assign a standard edition"
        description={`The chosen ${vehiclesWord(selectedIds.length)} will be held to this edition. Their variance is recomputed at once.`}
        label="Published edition"
        choices={options.editions.map((e) => ({ value: e.id, label: e.label }))}
        empty="No edition is published yet. Publish one on the Standards page first."
        done={(r) => `Assigned ${r.target} to ${vehiclesWord(r.updated)}${r.unchanged ? `; ${r.unchanged} already had it` : ""}`}
      />
      <BulkDialog
        action="move_depot"
        selectedIds={selectedIds}
        onDone={onDone}
        trigger="Move to depot"
        title="Move to another depot"
        description={`The chosen ${vehiclesWord(selectedIds.length)} will belong to this depot.`}
        label="Depot"
        choices={options.depots.map((d) => ({ value: d.id, label: `${d.name} (${d.code})` }))}
        empty="There are no depots yet."
        done={(r) => `Moved ${vehiclesWord(r.updated)} to ${r.target}${r.unchanged ? `; ${r.unchanged} were already there` : ""}`}
      />
      <Button variant="ghost" size="sm" onClick={onDone}>
        Clear choice
      </Button>
    </div>
  );
}

function BulkDialog({
  action,
  selectedIds,
  onDone,
  trigger,
  title,
  description,
  label,
  choices,
  empty,
  done,
}: {
  action: "assign_edition" | "move_depot";
  selectedIds: string[];
  onDone: () => void;
  trigger: string;
  title: string;
  description: string;
  label: string;
  choices: { value: string; label: string }[];
  empty: string;
  done: (r: BulkResult) => string;
}) {
  const [open, setOpen] = useState(false);
  const [choice, setChoice] = useState("");
  const [missing, setMissing] = useState(false);
  const queryClient = useQueryClient();
  const mutation = useMutation({
    mutationFn: (target: string) =>
      postBulk({ action, vehicleIds: selectedIds, ...(action === "assign_edition" ? { editionId: target } : { depotId: target }) }),
    onSuccess: async (result) => {
      toast.success(done(result));
      setOpen(false);
      setChoice("");
      onDone();
      await queryClient.invalidateQueries({ queryKey: ["vehicles"] });
    },
  });
  return (
    <Dialog
      open={open}
      onOpenChange={(next) => {
        setOpen(next);
        if (!next) mutation.reset();
      }}
    >
      <DialogTrigger asChild>
        <Button variant="secondary" size="sm">
          {trigger}
        </Button>
      </DialogTrigger>
      <DialogContent>
        <DialogHeader>
          <DialogTitle>{title}</DialogTitle>
          <DialogDescription>{description}</DialogDescription>
        </DialogHeader>
        <form
          noValidate
          className="flex flex-col gap-4"
          onSubmit={(e) => {
            e.preventDefault();
            if (!choice) {
              setMissing(true);
              return;
            }
            mutation.mutate(choice);
          }}
        >
          {mutation.isError && <FormMessage tone="error">{mutation.error.message}</FormMessage>}
          {choices.length === 0 ? (
            <p className="text-muted">{empty}</p>
          ) : (
            <Field label={label} error={missing && !choice ? `Choose the ${label.toLowerCase()}` : undefined} required>
              <Select value={choice} onChange={(e) => setChoice(e.target.value)}>
                <option value="">Choose…</option>
                {choices.map((c) => (
                  <option key={c.value} value={c.value}>
                    {c.label}
                  </option>
                ))}
              </Select>
            </Field>
          )}
          <DialogFooter>
            <DialogClose asChild>
              <Button type="button" variant="ghost">
                Cancel
              </Button>
            </DialogClose>
            <Button type="submit" loading={mutation.isPending} disabled={choices.length === 0}>
              {trigger}
            </Button>
          </DialogFooter>
        </form>
      </DialogContent>
    </Dialog>
  );
}
