import { Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import type { ImportResult } from "@/lib/commands/imports";

/** The first rows as the file has them, with the row numbers a spreadsheet program shows. */
export function PreviewTable({ check }: { check: ImportResult }) {
  if (check.preview.length === 0) return <p className="text-sm text-muted">The file has a header row but no data rows.</p>;
  return (
    <Table label="First rows of the file" data-testid="preview-table">
      <THead>
        <Tr>
          <Th numeric>Row</Th>
          {check.headers.map((h) => (
            <Th key={h}>{h}</Th>
          ))}
        </Tr>
      </THead>
      <TBody>
        {check.preview.map((row) => (
          <Tr key={row.rowNumber}>
            <Td numeric>{row.rowNumber}</Td>
            {check.headers.map((h) => (
              <Td key={h} className="max-w-48 truncate whitespace-nowrap" title={row.cells[h] ?? ""}>
                {row.cells[h] ?? <span className="text-muted">—</span>}
              </Td>
            ))}
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
