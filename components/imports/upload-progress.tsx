import { cn } from "@/components/ui";

/** Upload progress as a bar with its percentage; after the last byte, the server is still reading. */
export function UploadProgress({ fraction, label }: { fraction: number; label: string }) {
  const percent = Math.round(fraction * 100);
  const sent = percent >= 100;
  return (
    <div className="flex flex-col gap-1.5" data-testid="upload-progress">
      <div className="flex items-baseline justify-between gap-3 text-sm">
        <span className="font-medium text-ink">{sent ? `${label}: reading the rows…` : `${label}: uploading…`}</span>
        <span className="tabular-nums text-muted" aria-hidden="true">
          {percent}%
        </span>
      </div>
      <div
        role="progressbar"
        aria-label={`${label}: upload`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={`${percent}% uploaded`}
        className="h-2.5 w-full overflow-hidden rounded-full bg-surface-sunken ring-1 ring-line"
      >
        <div className={cn("h-full rounded-full bg-accent transition-[width] duration-150", sent && "animate-pulse")} style={{ width: `${percent}%` }} />
      </div>
    </div>
  );
}
