import { Quantity, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { TyreChangeResult } from "@/lib/tyres";

/**
 * The speedometer on the new tyres, one row per indicated speed: the true speeds before and
 * after, how far it reads high, the most it may, and whether it meets the accuracy rule. Shown by
 * the tyre change calculator and by a vehicle's tyre check.
 */
export function SpeedometerTable({ rows }: { rows: TyreChangeResult["speedometer"] }) {
  return (
    <Table label="Speedometer on the new tyres">
      <THead>
        <Tr>
          <Th numeric>Indicated</Th>
          <Th numeric>True, old tyres</Th>
          <Th numeric>True, new tyres</Th>
          <Th numeric>Reads high by</Th>
          <Th numeric>Allowed high</Th>
          <Th>Accuracy rule</Th>
        </Tr>
      </THead>
      <TBody>
        {rows.map((row) => (
          <Tr key={row.indicatedKmh} data-indicated={row.indicatedKmh}>
            <Td numeric>
              <Quantity value={row.indicatedKmh} unit="km/h" />
            </Td>
            <Td numeric>
              <Quantity value={row.trueOldKmh} unit="km/h" digits={1} />
            </Td>
            <Td numeric>
              <Quantity value={row.trueNewKmh} unit="km/h" digits={1} />
            </Td>
            <Td numeric>
              <Quantity value={row.readsHighKmh} unit="km/h" digits={1} signed />
            </Td>
            <Td numeric>
              <Quantity value={row.allowedHighKmh} unit="km/h" digits={1} />
            </Td>
            <Td>
              {row.compliant ? (
                <StatusPill tone="ok" size="sm">
                  Meets
                </StatusPill>
              ) : (
                <StatusPill tone="danger" size="sm">
                  {row.readsHighKmh < 0 ? "Reads low" : "Reads too high"}
                </StatusPill>
              )}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
