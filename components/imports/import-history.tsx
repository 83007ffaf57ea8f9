import { EmptyState, StatusPill, Table, TBody, Td, Th, THead, Tr } from "@/components/ui";
import { Instant } from "@/components/providers/time-zone";

export type ImportHistoryItem = {
  id: string;
  createdAt: Date;
  filename: string;
  format: "csv" | "xlsx";
  sizeBytes: number;
  dryRun: boolean;
  totalRows: number;
  created: number;
  updated: number;
  unchanged: number;
  errorCount: number;
  hasFile: boolean;
  createdByName: string | null;
};

const n = (value: number) => value.toLocaleString("en-AU");
const size = (bytes: number) => (bytes < 1024 ? `${n(bytes)} B` : bytes < 1024 * 1024 ? `${n(Math.round(bytes / 1024))} KB` : `${(bytes / (1024 * 1024)).toFixed(1)} MB`);

/** Every import and check, newest first: when, who, which file (downloadable as sent), and the counts. */
export function ImportHistory({ items }: { items: ImportHistoryItem[] }) {
  if (items.length === 0) {
    return <EmptyState title="No imports yet">Checks and imports you run appear here, with the original file.</EmptyState>;
  }
  return (
    <Table label="Import history" data-testid="import-history">
      <THead>
        <Tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>File</Th>
          <Th>Kind</Th>
          <Th numeric>Rows</Th>
          <Th numeric>Created</Th>
          <Th numeric>Updated</Th>
          <Th numeric>Unchanged</Th>
          <Th numeric>Errors</Th>
        </Tr>
      </THead>
      <TBody>
        {items.map((item) => (
          <Tr key={item.id}>
            <Td className="whitespace-nowrap"><Instant at={item.createdAt} /></Td>
            <Td>{item.createdByName ?? "—"}</Td>
            <Td>
              {item.hasFile ? (
                <a href={`/api/imports/${item.id}/file`} download className="font-semibold text-accent underline-offset-4 hover:underline">
                  {item.filename}
                </a>
              ) : (
                item.filename
              )}
              <span className="block text-xs text-muted">
                {item.format.toUpperCase()}, {size(item.sizeBytes)}
              </span>
            </Td>
            <Td>
              {item.dryRun ? (
                <StatusPill tone="neutral" size="sm">
                  Check only
                </StatusPill>
              ) : (
                <StatusPill tone="ok" size="sm">
                  Imported
                </StatusPill>
              )}
            </Td>
            <Td numeric>{n(item.totalRows)}</Td>
            <Td numeric>{n(item.created)}</Td>
            <Td numeric>{n(item.updated)}</Td>
            <Td numeric>{n(item.unchanged)}</Td>
            <Td numeric className={item.errorCount > 0 ? "font-semibold text-danger" : undefined}>
              {n(item.errorCount)}
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}
