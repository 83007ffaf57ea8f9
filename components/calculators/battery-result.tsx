import { Quantity, StatusPill, Table, TBody, Td, TFoot, Th, THead, Tr } from "@/components/ui";
import { ResultPanel, Verdict } from "./parts";
import type { BatteryResponse } from "./types";

const CHEMISTRY = {
  "lead-acid": "flooded lead-acid",
  agm: "AGM",
  "lithium-iron-phosphate": "lithium iron phosphate",
} as const;

const SOURCE = { "dc-dc": "DC-DC charger (driving)", solar: "Solar", mains: "Mains charger" } as const;

export function BatteryResult({ result }: { result: BatteryResponse }) {
  const { plan, recharge, chargingKeepsUp } = result;
  const b = plan.suggestedBattery;
  return (
    <ResultPanel title="12 V battery result" caution={result.caution}>
      <Verdict tone="info" word="Size">
        Needs <Quantity value={plan.requiredCapacityAh} unit="Ah" /> of {CHEMISTRY[plan.chemistry]} battery for {plan.daysAutonomy}{" "}
        {plan.daysAutonomy === 1 ? "day" : "days"} without charging:{" "}
        {b.count === 1 ? (
          <>
            one <Quantity value={b.capacityAhEach} unit="Ah" /> battery
          </>
        ) : (
          <>
            {b.count} × <Quantity value={b.capacityAhEach} unit="Ah" /> in parallel (<Quantity value={b.totalAh} unit="Ah" />)
          </>
        )}
        .
      </Verdict>

      <Table label="Daily energy budget">
        <THead>
          <Tr>
            <Th>Consumer</Th>
            <Th numeric>Draw from battery</Th>
            <Th numeric>Energy a day</Th>
            <Th numeric>Charge a day</Th>
          </Tr>
        </THead>
        <TBody>
          {plan.consumers.map((c, i) => (
            <Tr key={`${c.label}-${i}`}>
              <Th scope="row">{c.label}</Th>
              <Td numeric>
                <Quantity value={c.batteryDrawW} unit="W" digits={1} />
              </Td>
              <Td numeric>
                <Quantity value={c.whPerDay} unit="Wh" />
              </Td>
              <Td numeric>
                <Quantity value={c.ahPerDay} unit="Ah" digits={1} />
              </Td>
            </Tr>
          ))}
        </TBody>
        <TFoot>
          <Tr>
            <Th scope="row">Each day</Th>
            <Td />
            <Td numeric>
              <Quantity value={plan.dailyWh} unit="Wh" />
            </Td>
            <Td numeric>
              <Quantity value={plan.dailyAh} unit="Ah" digits={1} />
            </Td>
          </Tr>
        </TFoot>
      </Table>

      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-muted">Capacity needed</dt>
        <dd>
          <Quantity value={plan.dailyAh} unit="Ah" digits={1} /> × {plan.daysAutonomy} ÷ <Quantity value={plan.usableDepthOfDischargePct} unit="%" /> usable
          = <Quantity value={plan.requiredCapacityAh} unit="Ah" digits={1} />
        </dd>
        <dt className="text-muted">Inverter efficiency for AC loads</dt>
        <dd>
          <Quantity value={plan.inverterEfficiency * 100} unit="%" />
        </dd>
      </dl>

      {recharge && (
        <>
          <Table label="Charging">
            <THead>
              <Tr>
                <Th>Source</Th>
                <Th numeric>Into the battery</Th>
                <Th numeric>Charge a day</Th>
              </Tr>
            </THead>
            <TBody>
              {recharge.sources.map((s, i) => (
                <Tr key={`${s.kind}-${i}`}>
                  <Th scope="row">{SOURCE[s.kind]}</Th>
                  <Td numeric>
                    <Quantity value={s.chargeA} unit="A" digits={1} />
                  </Td>
                  <Td numeric>
                    <Quantity value={s.dailyAh} unit="Ah" digits={1} />
                  </Td>
                </Tr>
              ))}
            </TBody>
            <TFoot>
              <Tr>
                <Th scope="row">All together</Th>
                <Td numeric>
                  <Quantity value={recharge.chargeA} unit="A" digits={1} />
                </Td>
                <Td numeric>
                  <Quantity value={recharge.dailyAhIn} unit="Ah" digits={1} />
                </Td>
              </Tr>
            </TFoot>
          </Table>
          <p className="flex flex-wrap items-center gap-2 text-sm">
            {chargingKeepsUp === null ? (
              <StatusPill tone="neutral" size="sm">
                Unknown
              </StatusPill>
            ) : chargingKeepsUp ? (
              <StatusPill tone="ok" size="sm">
                Keeps up
              </StatusPill>
            ) : (
              <StatusPill tone="danger" size="sm">
                Falls behind
              </StatusPill>
            )}
            <span>
              {chargingKeepsUp === null
                ? "Give hours per day for a source to see whether charging keeps up with the daily use."
                : chargingKeepsUp
                  ? "The daily charge covers the daily use."
                  : "The daily charge is less than the daily use: the battery runs down day by day."}{" "}
              Putting back <Quantity value={plan.dailyAh * plan.daysAutonomy} unit="Ah" /> takes{" "}
              <Quantity value={recharge.hoursToRecover} unit="h" digits={1} /> with every source delivering
              {recharge.daysToRecover !== null && (
                <>
                  , or <Quantity value={recharge.daysToRecover} unit="days" digits={1} /> at the daily charge
                </>
              )}
              .
            </span>
          </p>
          {recharge.sources.some((s) => s.kind === "solar") && (
            <p className="text-sm text-muted">
              Solar is counted at <Quantity value={recharge.solarDerating * 100} unit="%" /> of the panels&apos; rating for heat, dust and wiring losses.
            </p>
          )}
        </>
      )}
    </ResultPanel>
  );
}
