import { Badge, Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { AxleLimit } from "@/lib/mass";
import { LimitPill, ResultPanel, Verdict } from "./parts";
import type { AxleLoadsResponse } from "./types";

export const LIMIT_NAMES: Record<AxleLimit, string> = {
  front: "front axle rating",
  rear: "rear axle rating",
  gvm: "GVM",
  gcm: "GCM",
};

type Row = { limit: AxleLimit; name: string; loadKg: number; ratingKg: number; headroomKg: number };

/** The rows of the result table: each limit with its load, rating and headroom. */
export function axleRows(result: AxleLoadsResponse, gcmRatingKg?: number): Row[] {
  const h = result.headroom;
  const rows: Row[] = [
    { limit: "front", name: "Front axle", loadKg: result.frontKg, ratingKg: result.frontKg + h.frontKg, headroomKg: h.frontKg },
    { limit: "rear", name: "Rear axle", loadKg: result.rearKg, ratingKg: result.rearKg + h.rearKg, headroomKg: h.rearKg },
    { limit: "gvm", name: "Vehicle (GVM)", loadKg: result.grossKg, ratingKg: result.grossKg + h.gvmKg, headroomKg: h.gvmKg },
  ];
  if (h.gcmKg !== undefined && gcmRatingKg !== undefined) {
    rows.push({ limit: "gcm", name: "Combination (GCM)", loadKg: gcmRatingKg - h.gcmKg, ratingKg: gcmRatingKg, headroomKg: h.gcmKg });
  }
  return rows;
}

const kg = (value: number) => <Quantity value={Math.abs(value)} unit="kg" />;

/** The plain answer: which limit binds and by how much. */
export function axleVerdict(result: AxleLoadsResponse, rows: Row[]) {
  const { limit, marginKg } = result.binding;
  const name = LIMIT_NAMES[limit];
  const alsoOver = rows.filter((r) => r.headroomKg < 0 && r.limit !== limit);
  if (marginKg < 0) {
    return (
      <Verdict tone="danger" word="Over">
        Over the {name} by {kg(marginKg)}
        {alsoOver.length > 0 && (
          <>
            ; also over the{" "}
            {alsoOver.map((r, i) => (
              <span key={r.limit}>
                {i > 0 && ", "}
                {LIMIT_NAMES[r.limit]} by {kg(r.headroomKg)}
              </span>
            ))}
          </>
        )}
        .
      </Verdict>
    );
  }
  return (
    <Verdict tone="ok" word="Within">
      No limit exceeded. The {name} binds first, with {kg(marginKg)} to spare.
    </Verdict>
  );
}

export function AxleLoadsResult({ result, gcmRatingKg }: { result: AxleLoadsResponse; gcmRatingKg?: number }) {
  const rows = axleRows(result, gcmRatingKg);
  return (
    <ResultPanel title="Axle loads result" caution={result.caution}>
      {axleVerdict(result, rows)}
      <Table label="Loads against ratings">
        <THead>
          <Tr>
            <Th>Limit</Th>
            <Th numeric>Load</Th>
            <Th numeric>Rating</Th>
            <Th numeric>Headroom</Th>
            <Th>Status</Th>
          </Tr>
        </THead>
        <TBody>
          {rows.map((r) => (
            <Tr key={r.limit} data-limit={r.limit}>
              <Th scope="row">
                {r.name}
                {r.limit === result.binding.limit && " "}
                {r.limit === result.binding.limit && (
                  <Badge tone="accent" className="ml-2">
                    binds
                  </Badge>
                )}
              </Th>
              <Td numeric>
                <Quantity value={r.loadKg} unit="kg" />
              </Td>
              <Td numeric>
                <Quantity value={r.ratingKg} unit="kg" />
              </Td>
              <Td numeric>
                <Quantity value={r.headroomKg} unit="kg" signed />
              </Td>
              <Td>
                <LimitPill headroom={r.headroomKg} />
              </Td>
            </Tr>
          ))}
        </TBody>
      </Table>
    </ResultPanel>
  );
}
