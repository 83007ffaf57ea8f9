import { Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { FindingsList, ResultPanel, SeverityPill, Verdict } from "./parts";
import { SpeedometerTable } from "./speedometer-table";
import type { TyreChangeResponse } from "./types";

/** Short names of the checks, for the one-line answer. */
const CHECK_NAMES: Record<string, string> = {
  speedometer: "speedometer accuracy",
  "load-front": "front tyre load",
  "load-rear": "rear tyre load",
  "speed-symbol": "speed symbol",
  "suspension-lift": "suspension lift",
  "suspension-travel": "share of suspension travel",
  "tyre-diameter-mm": "tyre diameter increase",
  "tyre-diameter-pct": "tyre diameter increase",
  "tyre-lift": "lift from tyres",
  "combined-lift": "combined lift",
  "certified-lift": "most that can be certified",
  "wheel-track": "wheel track",
  "wheel-spacers": "wheel spacers",
};

const VERDICT = {
  ok: { tone: "ok", word: "Within", text: "Every check passes for this rule set." },
  check: { tone: "warn", word: "Check", text: "Nothing exceeds a limit, but some points need a person to check them." },
  exceeds: { tone: "danger", word: "Exceeds", text: "A limit is exceeded: see the findings below." },
} as const;

export function TyreChangeResult({ result }: { result: TyreChangeResponse }) {
  const v = VERDICT[result.worst];
  const exceeded = result.findings.filter((f) => f.severity === "exceeds");
  return (
    <ResultPanel title="Tyre change result" caution={result.caution}>
      <Verdict tone={v.tone} word={v.word}>
        {exceeded.length > 0 ? `Exceeded: ${[...new Set(exceeded.map((f) => CHECK_NAMES[f.code] ?? f.code))].join(", ")}. See the findings below.` : v.text}
      </Verdict>

      <Table label="Tyre sizes">
        <THead>
          <Tr>
            <Th>Size</Th>
            <Th numeric>Overall diameter</Th>
            <Th numeric>In inches</Th>
          </Tr>
        </THead>
        <TBody>
          <Tr>
            <Th scope="row">Now: {result.from.designation}</Th>
            <Td numeric>
              <Quantity value={result.oldDiameterMm} unit="mm" digits={1} />
            </Td>
            <Td numeric>
              <Quantity value={result.from.overallDiameterIn} unit="in" digits={2} />
            </Td>
          </Tr>
          <Tr>
            <Th scope="row">Proposed: {result.to.designation}</Th>
            <Td numeric>
              <Quantity value={result.newDiameterMm} unit="mm" digits={1} />
            </Td>
            <Td numeric>
              <Quantity value={result.to.overallDiameterIn} unit="in" digits={2} />
            </Td>
          </Tr>
        </TBody>
      </Table>
      <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-muted">Diameter change</dt>
        <dd>
          <Quantity value={result.diameterChangeMm} unit="mm" digits={1} signed /> (
          <Quantity value={result.diameterChangePct} unit="%" digits={2} signed />)
        </dd>
        <dt className="text-muted">Ground clearance under the axles</dt>
        <dd>
          <Quantity value={result.clearanceGainedMm} unit="mm" digits={1} signed /> (half the diameter change)
        </dd>
        <dt className="text-muted">True speed at the same reading</dt>
        <dd>
          × <Quantity value={result.diameterRatio} digits={4} /> (new diameter ÷ old)
        </dd>
      </dl>

      <SpeedometerTable rows={result.speedometer} />
      <p className="-mt-2 text-sm text-muted">
        Accuracy rule: a speedometer may read high by up to a tenth of the true speed plus 4 km/h, and never low.
      </p>

      {result.lift && (
        <p className="flex flex-wrap items-center gap-2 text-sm">
          <SeverityPill severity={result.lift.needsCertification ? "exceeds" : "ok"} />
          <span>
            Combined lift <Quantity value={result.lift.combinedLiftMm} unit="mm" digits={1} /> (suspension{" "}
            <Quantity value={result.lift.suspensionLiftMm} unit="mm" /> + tyres <Quantity value={result.lift.tyreLiftMm} unit="mm" digits={1} />)
            {result.lift.needsCertification ? ": needs certification." : ": within the limits without certification."}
          </span>
        </p>
      )}

      <div className="flex flex-col gap-2">
        <h4 className="text-sm font-semibold text-ink">Findings</h4>
        <FindingsList findings={result.findings} />
      </div>
      <p className="text-sm text-muted">
        <span className="font-semibold text-ink">{result.ruleSet.name}.</span> {result.ruleSet.note}
      </p>
    </ResultPanel>
  );
}
