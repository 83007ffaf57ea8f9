"use client";

import { useState } from "react";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
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
  Textarea,
} from "@/components/ui";
import type { VehicleState } from "@/db/schema";
import { groundVehicleAction, returnToServiceAction } from "./actions";

/** Ground a vehicle, or return a grounded one to service; both need a reason and are audited. */
export function GroundingActions({ vehicleId, fleetNumber, state }: { vehicleId: string; fleetNumber: string; state: VehicleState }) {
  if (state === "retired") return null;
  return state === "grounded" ? (
    <ReasonDialog
      key="return"
      vehicleId={vehicleId}
      action={returnToServiceAction}
      trigger="Return to service"
      title={`Return ${fleetNumber} to service`}
      description="Say what was done to make it safe. The reason is kept in the vehicle's history."
      label="Why it is safe to drive again"
      submit="Return to service"
      variant="primary"
    />
  ) : (
    <ReasonDialog
      key="ground"
      vehicleId={vehicleId}
      action={groundVehicleAction}
      trigger="Ground vehicle"
      title={`Ground ${fleetNumber}`}
      description="A grounded vehicle must not be driven until a manager returns it to service with a reason."
      label="Why it is grounded"
      submit="Ground vehicle"
      variant="danger"
    />
  );
}

function ReasonDialog({
  vehicleId,
  action,
  trigger,
  title,
  description,
  label,
  submit,
  variant,
}: {
  vehicleId: string;
  action: typeof groundVehicleAction | typeof returnToServiceAction;
  trigger: string;
  title: string;
  description: string;
  label: string;
  submit: string;
  variant: "primary" | "danger";
}) {
  const [open, setOpen] = useState(false);
  const { state, formAction, errorOf, valueOf } = useFormAction(action);
  // The result the dialog opened with: a newer "ok" means the change is saved, so it closes.
  const [openedWith, setOpenedWith] = useState<unknown>(state);
  const shown = open && !(state.status === "ok" && state !== openedWith);
  return (
    <Dialog
      open={shown}
      onOpenChange={(next) => {
        setOpen(next);
        if (next) setOpenedWith(state);
      }}
    >
      <DialogTrigger asChild>
        <Button variant={variant === "danger" ? "danger" : "primary"}>{trigger}</Button>
      </DialogTrigger>
      <DialogContent>
        <DialogHeader>
          <DialogTitle>{title}</DialogTitle>
          <DialogDescription>{description}</DialogDescription>
        </DialogHeader>
        <form action={formAction} noValidate className="flex flex-col gap-4">
          <input type="hidden" name="id" value={vehicleId} />
          {state.status === "error" && <FormStatus state={state} testId="grounding-status" />}
          <Field label={label} error={errorOf("reason")} required>
            <Textarea name="reason" rows={3} defaultValue={valueOf("reason")} />
          </Field>
          <DialogFooter>
            <DialogClose asChild>
              <Button type="button" variant="ghost">
                Cancel
              </Button>
            </DialogClose>
            <SubmitButton variant={variant}>{submit}</SubmitButton>
          </DialogFooter>
        </form>
      </DialogContent>
    </Dialog>
  );
}
