import { Table, TBody, Td, Th, THead, Tr } from "@/components/ui";

export type RowErrorItem = { row?: number; column?: string; message: string };

/** Every bad row: its number, the file's column and the reason, in plain words. */
export function RowErrors({ errors, testId = "row-errors" }: { errors: RowErrorItem[]; testId?: string }) {
  return (
    <div className="max-h-[28rem] overflow-y-auto rounded-lg">
      <Table label="Rows with errors" data-testid={testId}>
        <THead className="sticky top-0">
          <Tr>
            <Th numeric>Row</Th>
            <Th>Column</Th>
            <Th>Reason</Th>
          </Tr>
        </THead>
        <TBody>
          {errors.map((e, at) => (
            <Tr key={`${e.row}-${e.column}-${at}`}>
              <Td numeric>{e.row ?? "—"}</Td>
              <Td className="whitespace-nowrap">{e.column || "—"}</Td>
              <Td>{e.message}</Td>
            </Tr>
          ))}
        </TBody>
      </Table>
    </div>
  );
}
