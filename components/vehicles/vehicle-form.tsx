"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Checkbox, Field, Input, Select, Textarea } from "@/components/ui";
import type { VehicleState } from "@/db/schema";
import { createVehicleAction, updateVehicleAction } from "./actions";
import { VEHICLE_STATE_LABELS } from "./vehicle-state";
import { VinCheckDigitNote } from "./vin-note";

export type VehicleFormOptions = {
  platforms: { id: string; name: string; ratingsMissing: boolean }[];
  depots: { id: string; name: string; code: string }[];
  drivers: { id: string; name: string; email: string }[];
};

export type VehicleFormValues = {
  id: string;
  version: number;
  fleetNumber: string;
  vin: string | null;
  registration: string | null;
  /** yyyy-mm-dd */
  registrationExpiry: string | null;
  platformId: string;
  depotId: string | null;
  costCentre: string | null;
  state: VehicleState;
  odometerKm: number | null;
  buildYear: number | null;
  notes: string | null;
  driverIds: string[];
};

const FORM_STATES = ["in_service", "in_fitout", "retired"] as const;

/** Add a vehicle to the register or edit one; errors appear beside their fields. */
export function VehicleForm({ vehicle, options }: { vehicle?: VehicleFormValues; options: VehicleFormOptions }) {
  const router = useRouter();
  const { state, formAction, errorOf, valueOf } = useFormAction<{ id: string }>(vehicle ? updateVehicleAction : createVehicleAction);
  const [vin, setVin] = useState(valueOf("vin", vehicle?.vin) ?? "");
  useEffect(() => {
    if (state.status === "ok" && state.data?.id) router.push(`/vehicles/${state.data.id}`);
  }, [state, router]);
  // Controlled, so a failed submit keeps the ticks the user made.
  const [drivers, setDrivers] = useState<Set<string>>(() => new Set(vehicle?.driverIds ?? []));
  const toggleDriver = (id: string, on: boolean) =>
    setDrivers((prev) => {
      const next = new Set(prev);
      if (on) next.add(id);
      else next.delete(id);
      return next;
    });
  const stateLocked = vehicle && (vehicle.state === "grounded" || vehicle.state === "retired");
  const stale = state.status === "error" && /changed by someone else/.test(state.message ?? "");

  return (
    <form action={formAction} noValidate className="flex flex-col gap-6" data-testid="vehicle-form">
      {vehicle && (
        <>
          <input type="hidden" name="id" value={vehicle.id} />
          <input type="hidden" name="version" value={vehicle.version} />
        </>
      )}
      <FormStatus state={state} testId="vehicle-status" />
      {stale && (
        <p>
          <Button type="button" variant="secondary" onClick={() => window.location.reload()}>
            Reload the latest version
          </Button>
        </p>
      )}
      <fieldset className="grid grid-cols-1 items-start gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-semibold">Identity</legend>
        <Field label="Fleet number" hint="Unique in the organisation." error={errorOf("fleetNumber")} required>
          <Input name="fleetNumber" defaultValue={valueOf("fleetNumber", vehicle?.fleetNumber)} autoComplete="off" />
        </Field>
        <Field label="VIN" hint="17 characters; never I, O or Q." error={errorOf("vin")}>
          {(control) => (
            <div className="grid gap-1.5">
              <Input
                {...control}
                name="vin"
                value={vin}
                onChange={(e) => setVin(e.target.value)}
                autoComplete="off"
                spellCheck={false}
                className="font-mono uppercase"
                aria-describedby={[control["aria-describedby"], "vin-check-digit"].filter(Boolean).join(" ")}
              />
              <VinCheckDigitNote vin={vin} id="vin-check-digit" />
            </div>
          )}
        </Field>
        <Field label="Registration" error={errorOf("registration")}>
          <Input name="registration" defaultValue={valueOf("registration", vehicle?.registration)} autoComplete="off" className="uppercase" />
        </Field>
        <Field label="Registration expiry" error={errorOf("registrationExpiry")}>
          <Input type="date" name="registrationExpiry" defaultValue={valueOf("registrationExpiry", vehicle?.registrationExpiry)} />
        </Field>
        <Field label="Build year" error={errorOf("buildYear")}>
          <Input name="buildYear" inputMode="numeric" defaultValue={valueOf("buildYear", vehicle?.buildYear?.toString())} />
        </Field>
        <Field label="Odometer (km)" error={errorOf("odometerKm")}>
          <Input name="odometerKm" inputMode="numeric" defaultValue={valueOf("odometerKm", vehicle?.odometerKm?.toString())} />
        </Field>
      </fieldset>

      <fieldset className="grid grid-cols-1 items-start gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-semibold">Where it belongs</legend>
        <Field label="Platform" hint={<Link href="/platforms/new" className="text-accent underline">Add a platform</Link>} error={errorOf("platformId")} required>
          <Select name="platformId" defaultValue={valueOf("platformId", vehicle?.platformId) ?? ""}>
            <option value="">Choose…</option>
            {options.platforms.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
                {p.ratingsMissing ? " (ratings missing)" : ""}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Depot" error={errorOf("depotId")}>
          <Select name="depotId" defaultValue={valueOf("depotId", vehicle?.depotId) ?? ""}>
            <option value="">No depot</option>
            {options.depots.map((d) => (
              <option key={d.id} value={d.id}>
                {d.name} ({d.code})
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Cost centre" error={errorOf("costCentre")}>
          <Input name="costCentre" defaultValue={valueOf("costCentre", vehicle?.costCentre)} autoComplete="off" />
        </Field>
        {stateLocked ? (
          <div className="grid gap-1.5">
            <span className="text-sm font-semibold">State</span>
            <p className="text-sm">
              {VEHICLE_STATE_LABELS[vehicle.state]}
              <span className="block text-muted">
                {vehicle.state === "grounded"
                  ? "A grounded vehicle goes back into service with “Return to service” on its page; it needs a reason."
                  : "A retired vehicle stays retired."}
              </span>
            </p>
          </div>
        ) : (
          <Field label="State" hint="Grounding is its own action on the vehicle's page." error={errorOf("state")}>
            <Select name="state" defaultValue={valueOf("state", vehicle?.state ?? "in_service")}>
              {FORM_STATES.map((s) => (
                <option key={s} value={s}>
                  {VEHICLE_STATE_LABELS[s]}
                </option>
              ))}
            </Select>
          </Field>
        )}
      </fieldset>

      <fieldset className="flex flex-col gap-1" aria-describedby={errorOf("driverIds") ? "driver-error" : undefined}>
        <legend className="mb-1 text-lg font-semibold">Assigned drivers</legend>
        <p className="text-sm text-muted">Drivers see only the vehicles assigned to them.</p>
        {/* An empty entry so unticking every box clears the list. */}
        <input type="hidden" name="driverIds[]" value="" />
        {options.drivers.length === 0 ? (
          <p className="text-sm text-muted">No active drivers in the organisation yet.</p>
        ) : (
          <div className="grid grid-cols-1 gap-x-6 sm:grid-cols-2 md:grid-cols-3">
            {options.drivers.map((d) => (
              <Checkbox
                key={d.id}
                name="driverIds[]"
                value={d.id}
                label={d.name}
                hint={d.email}
                checked={drivers.has(d.id)}
                onChange={(e) => toggleDriver(d.id, e.target.checked)}
              />
            ))}
          </div>
        )}
        {errorOf("driverIds") && (
          <p id="driver-error" className="text-sm font-semibold text-danger">
            {errorOf("driverIds")}
          </p>
        )}
      </fieldset>

      <Field label="Notes" error={errorOf("notes")}>
        <Textarea name="notes" rows={3} defaultValue={valueOf("notes", vehicle?.notes)} />
      </Field>

      <div className="flex flex-wrap gap-3">
        <SubmitButton>{vehicle ? "Save vehicle" : "Add vehicle"}</SubmitButton>
        <Button asChild variant="ghost">
          <Link href={vehicle ? `/vehicles/${vehicle.id}` : "/vehicles"}>Cancel</Link>
        </Button>
      </div>
    </form>
  );
}
