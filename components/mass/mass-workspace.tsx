"use client";

import Link from "next/link";
import { useCallback, useMemo, useState } from "react";
import { Caution, Card, CardBody, CardHeader, Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr, buttonClasses } from "@/components/ui";
import type { MassTabData } from "@/lib/commands/mass";
import { BRAKE_CAUTION, MASS_CAUTION, RULE_SET_LABEL } from "./cautions";
import { ElectricalPlan } from "./electrical-plan";
import { FiguresTable } from "./figures-table";
import { LoadingForm, loadingToText, parseLoading, type LoadingText } from "./loading-form";
import { tryComputeMass, type Loading, type MassFigures, type PlannedItem } from "./model";
import { PlanCard, positionWords } from "./plan-card";
import { loadingQuery, useServerFigures, useSettled } from "./server-figures";
import { SideView } from "./side-view";
import { SpringAdviceCard, type SpringText } from "./spring-advice";
import { TyreCheck } from "./tyre-check";
import { WeighbridgeCard } from "./weighbridge-card";
import { formatCalendarDay } from "@/lib/format/dates";

/** The tab opens with a driver and a passenger aboard; everything else is added by the user. */
const START_LOADING: Loading = { occupants: 2, fuelL: 0, waterL: 0, cargoKg: 0, trailerAtmKg: 0, towballKg: 0 };

const EVIDENCE_WORDS = { accepted: "Accepted", lodged: "Awaiting review", rejected: "Rejected", none: "None yet" } as const;

function BindingSummary({ figures }: { figures: MassFigures }) {
  if (!figures.binding || !figures.bindingLabel) {
    return <p className="text-lg font-semibold">No limit can be checked yet: the platform&apos;s figures are missing.</p>;
  }
  const over = figures.binding.marginKg < 0;
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
      <StatusPill tone={over ? "danger" : figures.binding.marginKg < 50 ? "warn" : "ok"} size="lg">
        {over ? "Over a limit" : "Within limits"}
      </StatusPill>
      <p className="text-lg" data-testid="binding-limit" data-limit={figures.binding.limit} data-margin={figures.binding.marginKg}>
        Binding limit: <span className="font-bold">{figures.bindingLabel}</span>,{" "}
        <span className={over ? "font-bold text-danger" : "font-bold"}>
          <Quantity value={Math.abs(figures.binding.marginKg)} unit="kg" /> {over ? "over" : "to spare"}
        </span>
      </p>
      {figures.payload && (
        <p className="text-sm text-muted">
          Payload left <Quantity value={figures.payload.leftKg} unit="kg" /> of <Quantity value={figures.payload.capacityKg} unit="kg" />
        </p>
      )}
    </div>
  );
}

/** The Mass & fit-out tab: figures, what-if plan, side view, tyres, springs, 12 V and weighbridge. */
export function MassWorkspace({ data }: { data: MassTabData }) {
  const { context, ruleSet, can } = data;
  const vehicleId = context.vehicle.id;
  const p = context.platform;

  const [loadingText, setLoadingText] = useState<LoadingText>(() => loadingToText(START_LOADING));
  const [loading, setLoading] = useState<Loading>(START_LOADING);
  const [loadingErrors, setLoadingErrors] = useState<Partial<Record<keyof Loading, string>>>({});
  const [draft, setDraft] = useState<PlannedItem | null>(null);
  const [previews, setPreviews] = useState<Record<string, PlannedItem | null>>({});
  const [newTyreSize, setNewTyreSize] = useState("");
  const [speedoText, setSpeedoText] = useState("");

  const onLoadingText = (text: LoadingText) => {
    const parsed = parseLoading(text, loading);
    setLoadingText(text);
    setLoading(parsed.loading);
    setLoadingErrors(parsed.errors);
  };
  const onPreview = useCallback((id: string, item: PlannedItem | null) => setPreviews((prev) => ({ ...prev, [id]: item })), []);

  const previewing = draft !== null || Object.values(previews).some((v) => v !== null);
  const plannedNow = useMemo(
    () => [...context.planned.map((item) => previews[item.id] ?? item), ...(draft ? [draft] : [])],
    [context.planned, previews, draft],
  );
  const client = tryComputeMass({ ...context, planned: plannedNow }, loading, { includePlanned: true });
  const withoutDraft = draft ? tryComputeMass({ ...context, planned: plannedNow.filter((i) => i !== draft) }, loading, { includePlanned: true }) : null;
  const draftEffect =
    draft && client.figures && withoutDraft?.figures && client.figures.frontKg !== undefined && withoutDraft.figures.frontKg !== undefined
      ? {
          frontKg: client.figures.frontKg - withoutDraft.figures.frontKg,
          rearKg: (client.figures.rearKg ?? 0) - (withoutDraft.figures.rearKg ?? 0),
          grossKg: (client.figures.grossKg ?? 0) - (withoutDraft.figures.grossKg ?? 0),
        }
      : null;
  const fittedOnly = tryComputeMass(context, loading, { includePlanned: false });

  // The server is asked once typing pauses; the browser's figures show meanwhile.
  const settled = useSettled(loading, 300);
  const server = useServerFigures(vehicleId, settled, context.planned, !previewing);
  const serverKey = `${loadingQuery(loading, true)}#${context.planned.map((i) => `${i.id}:${i.massKg}:${i.xMm}:${i.zone}:${i.massKind}`).join("|")}`;
  const fromServer = !previewing && settled === loading && server.data?.key === serverKey && !server.isFetching ? server.data.figures : null;
  const figures: MassFigures | null = fromServer ?? client.figures;

  const [springText, setSpringText] = useState<SpringText>({ frontRatedKg: "", rearRatedKg: "", frontAirbagKg: "", rearAirbagKg: "", liftMm: "0" });

  const statementHref = `/api/vehicles/${vehicleId}/statement?${loadingQuery(loading, true)}`;
  const brake = figures?.warnings.find((w) => w.code === "brakes");
  const otherWarnings = figures?.warnings.filter((w) => w.code !== "brakes") ?? [];
  const axleRatings = p.frontAxleRatingKg && p.rearAxleRatingKg ? { frontKg: p.frontAxleRatingKg, rearKg: p.rearAxleRatingKg } : null;

  return (
    <div className="flex flex-col gap-6">
      <Card>
        <CardHeader
          title="How much can it still carry?"
          description={
            previewing
              ? "Includes changes you have not saved yet."
              : fromServer
                ? "Figures of record, checked by the server."
                : "Instant figures from your browser; checking with the server…"
          }
          actions={
            <a href={statementHref} className={buttonClasses({ variant: "secondary" })} download>
              Download statement (PDF)
            </a>
          }
        />
        <CardBody className="flex flex-col gap-4">
          <div aria-live="polite">{figures ? <BindingSummary figures={figures} /> : <p className="font-semibold text-danger">{client.error?.message}</p>}</div>
          {brake && (
            <div className="flex flex-col gap-2 rounded-md border-l-4 border-danger bg-danger-soft px-3 py-2 text-danger-ink" data-testid="brake-warning" role="alert">
              <p className="font-semibold">{brake.message}</p>
              <p className="text-sm">{BRAKE_CAUTION}</p>
            </div>
          )}
          <Caution text={MASS_CAUTION} />
        </CardBody>
      </Card>

      <div className="grid grid-cols-1 gap-6 lg:grid-cols-3 [&>*]:min-w-0">
        <Card className="min-w-0 lg:col-span-2">
          <CardHeader
            title="Loads, limits and headroom"
            description={
              figures?.base?.source === "measured"
                ? `Starting from the last weighbridge ticket${context.measured?.measuredAt ? ` (${formatCalendarDay(context.measured.measuredAt)})` : ""}, with the plan and the loading.`
                : "Starting from the maker's kerb masses (full main tank), with fitted and planned items and the loading."
            }
          />
          <CardBody className="flex flex-col gap-4">
            {figures && (
              <>
                <dl className="grid grid-cols-3 gap-3" aria-label="Axle loads">
                  {(
                    [
                      ["Front axle", figures.frontKg, fittedOnly.figures?.frontKg, "front"],
                      ["Rear axle", figures.rearKg, fittedOnly.figures?.rearKg, "rear"],
                      ["Gross", figures.grossKg, fittedOnly.figures?.grossKg, "gross"],
                    ] as const
                  ).map(([label, value, was, key]) => (
                    <div key={key} className="flex flex-col rounded-md bg-surface-sunken px-3 py-2">
                      <dt className="text-sm text-muted">{label}</dt>
                      <dd className="text-xl font-bold">
                        <Quantity value={value} unit="kg" data-testid={`axle-${key}`} />
                      </dd>
                      {value !== undefined && was !== undefined && Math.abs(value - was) >= 0.5 && (
                        <dd className="text-sm text-muted">
                          <Quantity value={value - was} unit="kg" signed /> from the plan
                        </dd>
                      )}
                    </div>
                  ))}
                </dl>
                <FiguresTable figures={figures} fittedOnly={fittedOnly.figures} />
                {otherWarnings.length > 0 && (
                  <ul className="flex flex-col gap-1 text-sm" aria-label="Warnings">
                    {otherWarnings.map((w) => (
                      <li key={w.code} className="flex gap-2">
                        <StatusPill tone="warn" size="sm">
                          Note
                        </StatusPill>
                        <span>{w.message}</span>
                      </li>
                    ))}
                  </ul>
                )}
                {figures.missing.length > 0 && (
                  <div className="text-sm">
                    <p className="font-semibold">Not checked, figures missing:</p>
                    <ul className="list-disc pl-5 text-muted">
                      {figures.missing.map((m) => (
                        <li key={m.field}>{m.message}</li>
                      ))}
                    </ul>
                  </div>
                )}
              </>
            )}
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Loading" description="Change any figure: every result updates at once." />
          <CardBody>
            <LoadingForm text={loadingText} errors={loadingErrors} personMassKg={context.settings.personMassKg} onChange={onLoadingText} />
          </CardBody>
        </Card>
      </div>

      <Card>
        <CardHeader title="Side view" description="Where the mass sits, and what each axle carries against its rating." />
        <CardBody>{figures && <SideView fleetNumber={context.vehicle.fleetNumber} platform={p} figures={figures} tyreSize={context.tyres.size} />}</CardBody>
      </Card>

      <Card>
        <CardHeader
          title="What-if plan"
          description={can.plan ? "Add, move or remove items before anyone buys them. Typing an item shows its effect at once." : "Planned items (read only)."}
        />
        <CardBody>
          <PlanCard vehicleId={vehicleId} planned={context.planned} draftEffect={draftEffect} canPlan={can.plan} editions={data.editions} onDraft={setDraft} onPreview={onPreview} />
        </CardBody>
      </Card>

      <Card>
        <CardHeader title="Fitted now" description={`${context.fitted.length} item${context.fitted.length === 1 ? "" : "s"} on the vehicle, with the evidence for each.`} />
        <CardBody>
          {context.fitted.length === 0 ? (
            <p className="text-muted">Nothing is recorded as fitted.</p>
          ) : (
            <details>
              <summary className="cursor-pointer font-semibold">Show the fitted items</summary>
              <Table label="Fitted items" className="mt-3">
                <THead>
                  <Tr>
                    <Th>Item</Th>
                    <Th numeric>Qty</Th>
                    <Th numeric>Mass</Th>
                    <Th>Where</Th>
                    <Th>Evidence</Th>
                  </Tr>
                </THead>
                <TBody>
                  {context.fitted.map((f) => (
                    <Tr key={f.id}>
                      <Th scope="row">{f.label}</Th>
                      <Td numeric>{f.quantity}</Td>
                      <Td numeric>
                        <Quantity value={f.massKg} unit="kg" digits={f.massKg !== null && f.massKg % 1 !== 0 ? 1 : 0} />
                      </Td>
                      <Td>{positionWords(f)}</Td>
                      <Td>
                        {f.evidenceStatus === "none" && f.evidenceNeeded.length === 0 ? (
                          <span className="text-sm text-muted">Not needed</span>
                        ) : (
                          <StatusPill tone={f.evidenceStatus === "accepted" ? "ok" : f.evidenceStatus === "rejected" ? "danger" : f.evidenceStatus === "lodged" ? "info" : "warn"} size="sm">
                            {EVIDENCE_WORDS[f.evidenceStatus]}
                          </StatusPill>
                        )}
                      </Td>
                    </Tr>
                  ))}
                </TBody>
              </Table>
            </details>
          )}
        </CardBody>
      </Card>

      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2 [&>*]:min-w-0">
        <Card>
          <CardHeader
            title="Tyre change check"
            description={
              <>
                Rule set: {ruleSet.name} — {RULE_SET_LABEL.toLowerCase()}.{" "}
                {can.readRuleSets && (
                  <Link href="/admin/rules" className="underline">
                    Rule sets
                  </Link>
                )}
              </>
            }
          />
          <CardBody>
            <TyreCheck
              fromSize={context.tyres.size}
              fromSource={context.tyres.source}
              standardSize={p.standardTyreSize}
              topSpeedKmh={p.topSpeedKmh}
              axleRatings={axleRatings}
              rules={ruleSet.rules}
              newSize={newTyreSize}
              onNewSize={setNewTyreSize}
              suspensionLiftMm={Number(springText.liftMm) >= 0 ? Number(springText.liftMm) || 0 : 0}
              speedoText={speedoText}
              onSpeedoText={setSpeedoText}
            />
          </CardBody>
        </Card>
        <Card>
          <CardHeader title="Spring advice" description="Springs for the constant accessory load; airbags only for the variable load." />
          <CardBody>
            <SpringAdviceCard
              constant={figures?.constantByAxle ?? null}
              variable={figures?.variableByAxle ?? null}
              settings={context.settings}
              rules={ruleSet.rules}
              text={springText}
              onText={setSpringText}
              tyreSize={newTyreSize.trim() !== "" ? newTyreSize.trim() : context.tyres.size}
              standardSize={p.standardTyreSize}
            />
          </CardBody>
        </Card>
      </div>

      <Card>
        <CardHeader title="12 V plan" description="Daily energy, battery for the days away, recharge time and the cable for each run." />
        <CardBody>
          <ElectricalPlan vehicleId={vehicleId} saved={data.electricalPlan} canSave={can.plan} />
        </CardBody>
      </Card>

      {can.readTickets && (
        <Card>
          <CardHeader title="Weighbridge" description="Tickets update the vehicle's measured masses; the newest is compared with the plan." />
          <CardBody>
            <WeighbridgeCard vehicleId={vehicleId} tickets={data.tickets} reconciliation={data.reconciliation} canRecord={can.recordTicket} />
          </CardBody>
        </Card>
      )}
    </div>
  );
}
