import { Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { CABLE_RATING_SOURCE } from "@/lib/electrical";
import { LimitPill, ResultPanel, Verdict } from "./parts";
import type { CableRunResponse } from "./types";

const LIMIT_FROM = {
  input: "the limit you set",
  critical: "critical circuit: fridge, radio, pumps",
  other: "other circuits",
} as const;

const pct = (value: number) => <Quantity value={value} unit="%" digits={2} />;

export function cableVerdict(r: CableRunResponse) {
  const marginPct = r.maxDropPct - r.dropPct;
  if (r.checked) {
    const name = `${r.checked.areaMm2} mm²`;
    if (!r.checked.withinLimit) {
      return (
        <Verdict tone="danger" word="Over">
          {name} drops {pct(r.checked.dropPct)} against the {pct(r.maxDropPct)} limit, {pct(-marginPct)} over. Use {r.recommendedSizeLabel} with a{" "}
          <Quantity value={r.fuseA} unit="A" digits={r.fuseA % 1 === 0 ? 0 : 1} /> fuse.
        </Verdict>
      );
    }
    if (r.checked.ratingA < r.fuseA) {
      return (
        <Verdict tone="danger" word="Too thin">
          {name} keeps the drop within the limit ({pct(r.checked.dropPct)}) but is rated below the <Quantity value={r.fuseA} unit="A" /> fuse
          this load needs. Use {r.recommendedSizeLabel}.
        </Verdict>
      );
    }
    return (
      <Verdict tone="ok" word="Within">
        {name} drops {pct(r.checked.dropPct)} against the {pct(r.maxDropPct)} limit, {pct(marginPct)} to spare. Fuse it at{" "}
        <Quantity value={r.fuseA} unit="A" />.
      </Verdict>
    );
  }
  return (
    <Verdict tone="ok" word="Size">
      Use {r.recommendedSizeLabel} with a <Quantity value={r.fuseA} unit="A" /> fuse: it drops {pct(r.dropPct)} against the {pct(r.maxDropPct)} limit,{" "}
      {pct(marginPct)} to spare.
    </Verdict>
  );
}

export function CableRunResult({ result: r }: { result: CableRunResponse }) {
  return (
    <ResultPanel title="Cable run result" caution={r.caution}>
      {cableVerdict(r)}
      <Table label="Cable run figures">
        <THead>
          <Tr>
            <Th>Figure</Th>
            <Th numeric>Value</Th>
            <Th>Note</Th>
          </Tr>
        </THead>
        <TBody>
          <Tr>
            <Th scope="row">Voltage drop{r.checked ? ` on ${r.checked.areaMm2} mm²` : ` on ${r.recommendedSizeLabel}`}</Th>
            <Td numeric>
              <Quantity value={r.dropV} unit="V" digits={3} />
            </Td>
            <Td>
              <span className="inline-flex items-center gap-2">
                {pct(r.dropPct)} of the system voltage <LimitPill headroom={r.maxDropPct - r.dropPct} />
              </span>
            </Td>
          </Tr>
          <Tr>
            <Th scope="row">Drop limit</Th>
            <Td numeric>{pct(r.maxDropPct)}</Td>
            <Td className="text-muted">{LIMIT_FROM[r.maxDropFrom]}</Td>
          </Tr>
          <Tr>
            <Th scope="row">Smallest cross-section for the limit</Th>
            <Td numeric>
              <Quantity value={r.minAreaMm2} unit="mm²" digits={2} />
            </Td>
            <Td className="text-muted">not a standard size</Td>
          </Tr>
          <Tr>
            <Th scope="row">Recommended cable</Th>
            <Td numeric>
              <Quantity value={r.recommendedAreaMm2} unit="mm²" digits={r.recommendedAreaMm2 % 1 === 0 ? 0 : 2} />
            </Td>
            <Td>
              {r.recommendedSizeLabel !== `${r.recommendedAreaMm2} mm²` && r.recommendedSizeLabel}
              {r.steppedUpForFuse && <span className="text-muted"> stepped up so a standard fuse fits</span>}
            </Td>
          </Tr>
          <Tr>
            <Th scope="row">Its current rating</Th>
            <Td numeric>
              <Quantity value={r.recommendedRatingA} unit="A" />
            </Td>
            <Td className="text-muted">Approximate: {CABLE_RATING_SOURCE.replace(/^from memory: approximate ratings /, "")}</Td>
          </Tr>
          <Tr>
            <Th scope="row">Fuse</Th>
            <Td numeric>
              <Quantity value={r.fuseA} unit="A" digits={r.fuseA % 1 === 0 ? 0 : 1} />
            </Td>
            <Td>{r.fuseLocation}</Td>
          </Tr>
        </TBody>
      </Table>
      {r.notes.length > 0 && (
        <ul className="list-disc pl-5 text-sm">
          {r.notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      )}
    </ResultPanel>
  );
}
