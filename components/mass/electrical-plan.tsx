"use client";

import { useCallback, useState } from "react";
import { saveElectricalPlanAction } from "@/app/(app)/vehicles/[id]/mass/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import { Button, Caution, Field, Input, Quantity, Select, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { SavedElectricalPlan } from "@/lib/commands/mass";
import {
  batteryPlan,
  cableRun,
  rechargeTime,
  USABLE_DEPTH_OF_DISCHARGE,
  type BatteryChemistry,
  type BatteryPlanResult,
  type CableRunResult,
  type ChargeSourceKind,
  type RechargeResult,
} from "@/lib/electrical";
import { InputError } from "@/lib/errors";
import type { FormState } from "@/lib/server/form-state";
import { ELECTRICAL_CAUTION } from "./cautions";
import { useTimeZone } from "@/components/providers/time-zone";
import { formatDayTime } from "@/lib/format/dates";

type ConsumerRow = { label: string; currentA: string; hoursPerDay: string };
type SourceRow = { kind: ChargeSourceKind; amount: string; unit: "A" | "W"; hoursPerDay: string };
type RunRow = { label: string; currentA: string; lengthM: string; circuit: "critical" | "other" };

// Starting rows: invented example consumers a user overwrites with their own.
const START_CONSUMERS: ConsumerRow[] = [
  { label: "Fridge", currentA: "4", hoursPerDay: "10" },
  { label: "UHF radio (listening)", currentA: "0.5", hoursPerDay: "12" },
  { label: "Camp lights", currentA: "2", hoursPerDay: "3" },
];
const START_SOURCES: SourceRow[] = [
  { kind: "dc-dc", amount: "25", unit: "A", hoursPerDay: "2" },
  { kind: "solar", amount: "200", unit: "W", hoursPerDay: "5" },
];
const START_RUNS: RunRow[] = [
  { label: "Battery to fridge outlet", currentA: "5", lengthM: "4", circuit: "critical" },
  { label: "Start battery to DC-DC charger", currentA: "30", lengthM: "5", circuit: "critical" },
];

const CHEMISTRY_LABEL: Record<BatteryChemistry, string> = {
  "lead-acid": "Lead-acid (flooded)",
  agm: "AGM",
  "lithium-iron-phosphate": "Lithium iron phosphate",
};
const SOURCE_LABEL: Record<ChargeSourceKind, string> = { "dc-dc": "DC-DC from the alternator", solar: "Solar panel", mains: "Mains charger" };

const num = (text: string) => (text.trim() === "" ? Number.NaN : Number(text));

type Outcome<T> = { value: T; error: null } | { value: null; error: { field: string; message: string } };
function attempt<T>(fn: () => T): Outcome<T> {
  try {
    return { value: fn(), error: null };
  } catch (e) {
    if (e instanceof InputError) return { value: null, error: { field: e.field, message: e.message } };
    throw e;
  }
}

type PlanText = { systemV: string; days: string; chemistry: BatteryChemistry; consumers: ConsumerRow[]; sources: SourceRow[]; runs: RunRow[] };

const text = (n: number | undefined) => (n === undefined ? "" : String(n));

/** The saved plan as the text the fields hold; the invented starting rows when none is saved. */
function planText(saved: SavedElectricalPlan | null): PlanText {
  if (!saved) return { systemV: "12", days: "2", chemistry: "lithium-iron-phosphate", consumers: START_CONSUMERS, sources: START_SOURCES, runs: START_RUNS };
  const p = saved.plan;
  return {
    systemV: String(p.systemV),
    days: text(p.daysAutonomy),
    chemistry: p.chemistry,
    consumers: p.consumers.map((c) => ({ label: c.label, currentA: text(c.currentA), hoursPerDay: text(c.hoursPerDay) })),
    sources: p.sources.map((x) => ({ kind: x.kind, amount: text(x.amount), unit: x.unit, hoursPerDay: text(x.hoursPerDay) })),
    runs: p.runs.map((r) => ({ label: r.label, currentA: text(r.currentA), lengthM: text(r.lengthOneWayM), circuit: r.circuit })),
  };
}

/** What the Save button sends: the fields as typed (the server validates and names any field at fault). */
function planJson(t: PlanText): string {
  return JSON.stringify({
    systemV: t.systemV,
    daysAutonomy: t.days,
    chemistry: t.chemistry,
    consumers: t.consumers.map((c) => ({ label: c.label, currentA: c.currentA, hoursPerDay: c.hoursPerDay })),
    sources: t.sources.map((x) => ({ kind: x.kind, amount: x.amount, unit: x.unit, hoursPerDay: x.hoursPerDay })),
    runs: t.runs.map((r) => ({ label: r.label, currentA: r.currentA, lengthOneWayM: r.lengthM, circuit: r.circuit })),
  });
}

function savedWords(version: number, updatedAt: string, by: string | null, timeZone: string): string {
  return `Saved ${formatDayTime(updatedAt, timeZone)}${by ? ` by ${by}` : ""} (version ${version}).`;
}

/** 12 V plan: daily budget, battery for the days of autonomy, recharge time and the cable of each run. */
export function ElectricalPlan({ vehicleId, saved, canSave }: { vehicleId: string; saved: SavedElectricalPlan | null; canSave: boolean }) {
  const timeZone = useTimeZone();
  const [initial] = useState(() => planText(saved));
  const [consumers, setConsumers] = useState(initial.consumers);
  const [sources, setSources] = useState(initial.sources);
  const [runs, setRuns] = useState(initial.runs);
  const [days, setDays] = useState(initial.days);
  const [chemistry, setChemistry] = useState<BatteryChemistry>(initial.chemistry);
  const [systemV, setSystemV] = useState(initial.systemV);
  const current = planJson({ systemV, days, chemistry, consumers, sources, runs });
  const [savedJson, setSavedJson] = useState<string | null>(() => (saved ? planJson(initial) : null));
  const [savedNote, setSavedNote] = useState<string | null>(() => (saved ? savedWords(saved.version, saved.updatedAt, saved.updatedBy, timeZone) : null));

  const action = useCallback(
    async (prev: FormState, formData: FormData) => {
      const sent = String(formData.get("plan") ?? "");
      const next = (await saveElectricalPlanAction(prev, formData)) as FormState<{ version: number; updatedAt: string; updatedBy: string | null }>;
      if (next.status === "ok" && next.data) {
        setSavedJson(sent);
        setSavedNote(savedWords(next.data.version, next.data.updatedAt, next.data.updatedBy, timeZone));
      }
      return next as FormState;
    },
    [timeZone],
  );
  const { state, formAction, errorOf } = useFormAction(action);
  const serverError = (field: string) => (state.status === "error" ? errorOf(field) : undefined);
  const dirty = current !== savedJson;

  const v = num(systemV);
  const battery: Outcome<BatteryPlanResult> = attempt(() =>
    batteryPlan({
      consumers: consumers.map((c) => ({ label: c.label || "Consumer", currentA: num(c.currentA), hoursPerDay: num(c.hoursPerDay) })),
      systemV: v,
      daysAutonomy: num(days),
      chemistry,
    }),
  );
  const recharge: Outcome<RechargeResult> | null =
    battery.value && sources.length > 0
      ? attempt(() =>
          rechargeTime({
            deficitAh: battery.value!.dailyAh * battery.value!.daysAutonomy,
            systemV: v,
            sources: sources.map((s) => ({
              kind: s.kind,
              ...(s.unit === "A" ? { currentA: num(s.amount) } : { watts: num(s.amount) }),
              ...(s.hoursPerDay.trim() === "" ? {} : { hoursPerDay: num(s.hoursPerDay) }),
            })),
          }),
        )
      : null;
  const cable = runs.map((r) => attempt<CableRunResult>(() => cableRun({ currentA: num(r.currentA), lengthOneWayM: num(r.lengthM), systemV: v, circuit: r.circuit })));

  const errorFor = (outcome: Outcome<unknown> | null, prefix: string, index: number, key: string) =>
    (outcome?.error && outcome.error.field === `${prefix}.${index}.${key}` ? outcome.error.message : undefined) ?? serverError(`${prefix}.${index}.${key === "watts" || key === "currentA" ? (prefix === "sources" ? "amount" : key) : key}`);
  const generalError = (outcome: Outcome<unknown> | null, prefixes: string[]) =>
    outcome?.error && !prefixes.some((p) => outcome.error!.field.startsWith(`${p}.`)) ? outcome.error.message : null;

  return (
    <div className="flex flex-col gap-5">
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
        <Field label="System voltage (V)">
          <Select name="systemV" value={systemV} onChange={(e) => setSystemV(e.target.value)}>
            <option value="12">12 V</option>
            <option value="24">24 V</option>
          </Select>
        </Field>
        <Field label="Days of autonomy" error={battery.error?.field === "daysAutonomy" ? battery.error.message : serverError("daysAutonomy")}>
          <Input name="daysAutonomy" inputMode="decimal" value={days} onChange={(e) => setDays(e.target.value)} />
        </Field>
        <Field label="Battery chemistry" hint={`Usable depth of discharge about ${Math.round(USABLE_DEPTH_OF_DISCHARGE[chemistry] * 100)} % (common practice)`}>
          <Select name="chemistry" value={chemistry} onChange={(e) => setChemistry(e.target.value as BatteryChemistry)}>
            {(Object.keys(CHEMISTRY_LABEL) as BatteryChemistry[]).map((c) => (
              <option key={c} value={c}>
                {CHEMISTRY_LABEL[c]}
              </option>
            ))}
          </Select>
        </Field>
      </div>

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Consumers</legend>
        {consumers.map((c, i) => (
          <div key={i} className="grid grid-cols-2 items-end gap-2 border-b border-line pb-3 sm:grid-cols-[1fr_7rem_7rem_auto] sm:border-0 sm:pb-0 [&>*:first-child]:col-span-2 sm:[&>*:first-child]:col-span-1">
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Consumer</span>} error={serverError(`consumers.${i}.label`)} id={`consumer-${i}-label`}>
              <Input value={c.label} onChange={(e) => setConsumers(consumers.map((x, j) => (j === i ? { ...x, label: e.target.value } : x)))} />
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Current (A)</span>} error={errorFor(battery, "consumers", i, "currentA")} id={`consumer-${i}-a`}>
              <Input inputMode="decimal" value={c.currentA} onChange={(e) => setConsumers(consumers.map((x, j) => (j === i ? { ...x, currentA: e.target.value } : x)))} />
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Hours a day</span>} error={errorFor(battery, "consumers", i, "hoursPerDay")} id={`consumer-${i}-h`}>
              <Input inputMode="decimal" value={c.hoursPerDay} onChange={(e) => setConsumers(consumers.map((x, j) => (j === i ? { ...x, hoursPerDay: e.target.value } : x)))} />
            </Field>
            <Button type="button" variant="ghost" size="md" onClick={() => setConsumers(consumers.filter((_, j) => j !== i))} aria-label={`Remove ${c.label || "consumer"}`} disabled={consumers.length === 1}>
              Remove
            </Button>
          </div>
        ))}
        <div>
          <Button type="button" variant="secondary" size="sm" onClick={() => setConsumers([...consumers, { label: "", currentA: "", hoursPerDay: "" }])}>
            Add a consumer
          </Button>
        </div>
      </fieldset>

      {generalError(battery, ["consumers"]) && battery.error?.field !== "daysAutonomy" && <p className="text-sm font-semibold text-danger">{generalError(battery, ["consumers"])}</p>}
      {battery.value && (
        <p className="text-sm" data-testid="battery-result">
          Daily use <Quantity value={battery.value.dailyWh} unit="Wh" /> = <Quantity value={battery.value.dailyAh} unit="Ah" digits={1} />; for {battery.value.daysAutonomy} day
          {battery.value.daysAutonomy === 1 ? "" : "s"} at {battery.value.usableDepthOfDischargePct} % usable:{" "}
          <span className="font-semibold">
            <Quantity value={battery.value.requiredCapacityAh} unit="Ah" digits={0} /> needed
          </span>
          , for example {battery.value.suggestedBattery.count > 1 ? `${battery.value.suggestedBattery.count} × ` : ""}
          {battery.value.suggestedBattery.capacityAhEach} Ah.
        </p>
      )}

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Charging sources</legend>
        {sources.map((s, i) => (
          <div key={i} className="grid grid-cols-2 items-end gap-2 border-b border-line pb-3 sm:grid-cols-[1fr_6rem_5rem_7rem_auto] sm:border-0 sm:pb-0 [&>*:first-child]:col-span-2 sm:[&>*:first-child]:col-span-1">
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Source</span>} id={`source-${i}-kind`}>
              <Select value={s.kind} onChange={(e) => setSources(sources.map((x, j) => (j === i ? { ...x, kind: e.target.value as ChargeSourceKind } : x)))}>
                {(Object.keys(SOURCE_LABEL) as ChargeSourceKind[]).map((k) => (
                  <option key={k} value={k}>
                    {SOURCE_LABEL[k]}
                  </option>
                ))}
              </Select>
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Output</span>} error={errorFor(recharge, "sources", i, s.unit === "A" ? "currentA" : "watts")} id={`source-${i}-amount`}>
              <Input inputMode="decimal" value={s.amount} onChange={(e) => setSources(sources.map((x, j) => (j === i ? { ...x, amount: e.target.value } : x)))} />
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Unit</span>} id={`source-${i}-unit`}>
              <Select value={s.unit} onChange={(e) => setSources(sources.map((x, j) => (j === i ? { ...x, unit: e.target.value as "A" | "W" } : x)))}>
                <option value="A">A</option>
                <option value="W">W</option>
              </Select>
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Hours a day</span>} error={errorFor(recharge, "sources", i, "hoursPerDay")} id={`source-${i}-h`}>
              <Input inputMode="decimal" value={s.hoursPerDay} onChange={(e) => setSources(sources.map((x, j) => (j === i ? { ...x, hoursPerDay: e.target.value } : x)))} />
            </Field>
            <Button type="button" variant="ghost" size="md" onClick={() => setSources(sources.filter((_, j) => j !== i))} aria-label={`Remove ${SOURCE_LABEL[s.kind]}`}>
              Remove
            </Button>
          </div>
        ))}
        <div>
          <Button type="button" variant="secondary" size="sm" onClick={() => setSources([...sources, { kind: "dc-dc", amount: "", unit: "A", hoursPerDay: "" }])}>
            Add a source
          </Button>
        </div>
      </fieldset>
      {recharge?.value && battery.value && (
        <p className="text-sm" data-testid="recharge-result">
          All sources together put in <Quantity value={recharge.value.chargeA} unit="A" digits={1} />: the {battery.value.daysAutonomy}-day use comes back in{" "}
          <Quantity value={recharge.value.hoursToRecover} unit="h" digits={1} /> of charging
          {recharge.value.daysToRecover !== null && (
            <>
              , about <Quantity value={recharge.value.daysToRecover} unit="days" digits={1} /> at the hours given ({" "}
              <Quantity value={recharge.value.dailyAhIn} unit="Ah" digits={0} /> a day in against <Quantity value={battery.value.dailyAh} unit="Ah" digits={0} /> used).{" "}
              <StatusPill tone={recharge.value.dailyAhIn >= battery.value.dailyAh ? "ok" : "warn"} size="sm">
                {recharge.value.dailyAhIn >= battery.value.dailyAh ? "Keeps up" : "Falls behind"}
              </StatusPill>
            </>
          )}
        </p>
      )}
      {recharge?.error && !recharge.error.field.startsWith("sources.") && <p className="text-sm font-semibold text-danger">{recharge.error.message}</p>}

      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Cable runs</legend>
        {runs.map((r, i) => (
          <div key={i} className="grid grid-cols-2 items-end gap-2 border-b border-line pb-3 sm:grid-cols-[1fr_6rem_7rem_8rem_auto] sm:border-0 sm:pb-0 [&>*:first-child]:col-span-2 sm:[&>*:first-child]:col-span-1">
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Run</span>} error={serverError(`runs.${i}.label`)} id={`run-${i}-label`}>
              <Input value={r.label} onChange={(e) => setRuns(runs.map((x, j) => (j === i ? { ...x, label: e.target.value } : x)))} />
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Current (A)</span>} error={cable[i]?.error?.field === "currentA" ? cable[i]?.error?.message : serverError(`runs.${i}.currentA`)} id={`run-${i}-a`}>
              <Input inputMode="decimal" value={r.currentA} onChange={(e) => setRuns(runs.map((x, j) => (j === i ? { ...x, currentA: e.target.value } : x)))} />
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>One way (m)</span>} error={cable[i]?.error?.field === "lengthOneWayM" ? cable[i]?.error?.message : serverError(`runs.${i}.lengthOneWayM`)} id={`run-${i}-m`}>
              <Input inputMode="decimal" value={r.lengthM} onChange={(e) => setRuns(runs.map((x, j) => (j === i ? { ...x, lengthM: e.target.value } : x)))} />
            </Field>
            <Field label={<span className={i === 0 ? undefined : "sm:sr-only"}>Circuit</span>} id={`run-${i}-circuit`}>
              <Select value={r.circuit} onChange={(e) => setRuns(runs.map((x, j) => (j === i ? { ...x, circuit: e.target.value as RunRow["circuit"] } : x)))}>
                <option value="critical">Critical (3 %)</option>
                <option value="other">Other (10 %)</option>
              </Select>
            </Field>
            <Button type="button" variant="ghost" size="md" onClick={() => setRuns(runs.filter((_, j) => j !== i))} aria-label={`Remove ${r.label || "cable run"}`}>
              Remove
            </Button>
          </div>
        ))}
        <div>
          <Button type="button" variant="secondary" size="sm" onClick={() => setRuns([...runs, { label: "", currentA: "", lengthM: "", circuit: "critical" }])}>
            Add a cable run
          </Button>
        </div>
      </fieldset>
      {runs.length > 0 && (
        <Table label="Cable sizes">
          <THead>
            <Tr>
              <Th>Run</Th>
              <Th numeric>Cable</Th>
              <Th numeric>Drop</Th>
              <Th numeric>Fuse</Th>
              <Th>Fuse goes</Th>
            </Tr>
          </THead>
          <TBody>
            {runs.map((r, i) => {
              const c = cable[i];
              return (
                <Tr key={i} data-testid="cable-result">
                  <Th scope="row">{r.label || `Run ${i + 1}`}</Th>
                  {c?.value ? (
                    <>
                      <Td numeric>{c.value.recommendedSizeLabel}</Td>
                      <Td numeric>
                        <Quantity value={c.value.dropV} unit="V" digits={2} /> (<Quantity value={c.value.dropPct} unit="%" digits={1} />)
                      </Td>
                      <Td numeric>
                        <Quantity value={c.value.fuseA} unit="A" />
                      </Td>
                      <Td className="text-sm">{c.value.fuseLocation}</Td>
                    </>
                  ) : (
                    <Td colSpan={4} className="text-sm font-semibold text-danger">
                      {c?.error?.message ?? "Enter the current and length."}
                    </Td>
                  )}
                </Tr>
              );
            })}
          </TBody>
        </Table>
      )}
      <Caution text={ELECTRICAL_CAUTION} />
      {canSave ? (
        <form action={formAction} className="flex flex-col gap-3 border-t border-line pt-4" aria-label="Save the 12 V plan" noValidate>
          <input type="hidden" name="id" value={vehicleId} />
          <input type="hidden" name="plan" value={current} />
          <FormStatus state={state} testId="electrical-plan-status" />
          <div className="flex flex-wrap items-center gap-3">
            <SubmitButton>Save 12 V plan</SubmitButton>
            <StatusPill tone={dirty ? "warn" : "ok"} size="sm" data-testid="electrical-plan-saved">
              {savedJson === null ? "Not saved yet" : dirty ? "Changes not saved" : "Saved"}
            </StatusPill>
            {savedNote && <span className="text-sm text-muted">{savedNote}</span>}
          </div>
        </form>
      ) : (
        <p className="text-sm text-muted" data-testid="electrical-plan-saved">
          {savedNote ?? "No 12 V plan is saved for this vehicle; the figures above are an example."}
        </p>
      )}
    </div>
  );
}
