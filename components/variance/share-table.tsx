import Link from "next/link";
import { dollars } from "@/components/standards/labels";
import { Quantity, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";

type Row = {
  id: string | null;
  name: string;
  vehicles: number;
  withEdition: number;
  fullyMeeting: number;
  shareFullyMeeting: number | null;
  costToCloseCents: number;
  massToCloseKg: number;
};

const percent = (share: number | null) => (share === null ? "—" : `${Math.round(share * 100)}%`);

/** Share of vehicles fully meeting their standard per group, with links into the register. */
export function ShareTable({ label, groupLabel, rows, registerParam }: { label: string; groupLabel: string; rows: Row[]; registerParam: "depotId" | "platformId" }) {
  return (
    <Table label={label}>
      <THead>
        <Tr>
          <Th>{groupLabel}</Th>
          <Th numeric>Vehicles</Th>
          <Th numeric>With a standard</Th>
          <Th numeric>Fully meeting</Th>
          <Th numeric>Share</Th>
          <Th numeric>Cost to close</Th>
          <Th numeric>Mass to close</Th>
          <Th>In the register</Th>
        </Tr>
      </THead>
      <TBody>
        {rows.map((r) => (
          <Tr key={r.id ?? "none"}>
            <Td className="font-medium">{r.name}</Td>
            <Td numeric>{r.vehicles}</Td>
            <Td numeric>{r.withEdition}</Td>
            <Td numeric>{r.fullyMeeting}</Td>
            <Td numeric className="font-semibold">
              {percent(r.shareFullyMeeting)}
            </Td>
            <Td numeric>{dollars(r.costToCloseCents)}</Td>
            <Td numeric>
              <Quantity value={r.massToCloseKg} unit="kg" digits={1} />
            </Td>
            <Td className="whitespace-nowrap">
              {r.id ? (
                <Link className="text-accent underline-offset-4 hover:underline" href={`/vehicles?${registerParam}=${r.id}&variance=gaps`}>
                  Vehicles with gaps
                </Link>
              ) : (
                <span className="text-muted">—</span>
              )}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}

export { percent };
