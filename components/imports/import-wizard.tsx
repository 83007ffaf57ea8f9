"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useRef, useState, type ChangeEvent } from "react";
import { Button, Card, CardBody, CardFooter, CardHeader, FormMessage, StatusPill, cn } from "@/components/ui";
import { VEHICLE_FIELD_INFO, type VehicleField } from "@/imports/fields";
import type { ImportResult } from "@/lib/commands/imports";
import { MappingTable, type EditableMapping } from "./mapping-table";
import { PlanTable } from "./plan-table";
import { PreviewTable } from "./preview-table";
import { RowErrors } from "./row-errors";
import { UploadProgress } from "./upload-progress";
import { ImportRequestError, sendImport, type UploadHandle } from "./upload";

type Mode = "good_rows" | "all_or_nothing";
type Busy = { label: string; fraction: number } | null;

function Count({ label, value, tone, testId }: { label: string; value: number; tone?: "danger"; testId: string }) {
  return (
    <div className="flex min-w-28 flex-col rounded-md border border-line bg-surface px-3 py-2" data-testid={testId}>
      <span className={cn("text-2xl font-bold tabular-nums", tone === "danger" && value > 0 ? "text-danger" : "text-ink")}>{value.toLocaleString("en-AU")}</span>
      <span className="text-sm text-muted">{label}</span>
    </div>
  );
}

const rowsWord = (n: number) => `${n.toLocaleString("en-AU")} ${n === 1 ? "row" : "rows"}`;
const badRows = (result: ImportResult) => new Set(result.errors.map((e) => e.row)).size;

/**
 * The import, step by step: choose a file (uploaded with visible progress and checked as a dry
 * run), correct the column matching, read the preview and every bad row, choose how to treat
 * bad rows, import, and see what happened with links to the vehicles.
 */
export function ImportWizard() {
  const router = useRouter();
  const fileInput = useRef<HTMLInputElement>(null);
  const upload = useRef<UploadHandle | null>(null);
  const [file, setFile] = useState<File | null>(null);
  const [check, setCheck] = useState<ImportResult | null>(null);
  const [mapping, setMapping] = useState<EditableMapping>({});
  const [edited, setEdited] = useState<Set<string>>(new Set());
  const [mode, setMode] = useState<Mode>("good_rows");
  const [busy, setBusy] = useState<Busy>(null);
  const [error, setError] = useState<{ at: "check" | "commit"; error: ImportRequestError } | null>(null);
  const [outcome, setOutcome] = useState<ImportResult | null>(null);

  async function run(chosen: File, dryRun: boolean, withMapping: EditableMapping | undefined) {
    setError(null);
    setBusy({ label: dryRun ? "Checking" : "Importing", fraction: 0 });
    const handle = sendImport({ file: chosen, dryRun, mapping: withMapping, mode: dryRun ? undefined : mode }, (fraction) =>
      setBusy((b) => (b ? { ...b, fraction } : b)),
    );
    upload.current = handle;
    try {
      const result = await handle.promise;
      if (dryRun) {
        setCheck(result);
        setMapping(result.mapping);
        setEdited(new Set());
      } else {
        setOutcome(result);
      }
      // Every check and import is in the history below.
      router.refresh();
    } catch (caught) {
      setError({
        at: dryRun ? "check" : "commit",
        error: caught instanceof ImportRequestError ? caught : new ImportRequestError(0, "internal", "The import could not be done. Nothing was changed."),
      });
    } finally {
      upload.current = null;
      setBusy(null);
    }
  }

  function choose(event: ChangeEvent<HTMLInputElement>) {
    const chosen = event.target.files?.[0] ?? null;
    setFile(chosen);
    setCheck(null);
    setOutcome(null);
    setEdited(new Set());
    if (chosen) void run(chosen, true, undefined);
  }

  function changeField(heading: string, field: VehicleField | null) {
    setMapping((m) => ({ ...m, [heading]: field }));
    setEdited((e) => new Set(e).add(heading));
  }

  function startOver() {
    setFile(null);
    setCheck(null);
    setOutcome(null);
    setError(null);
    setEdited(new Set());
    if (fileInput.current) fileInput.current.value = "";
  }

  const dirty = edited.size > 0;
  const bad = check ? badRows(check) : 0;
  const canCommit = check !== null && check.ready && !dirty && busy === null && (mode === "good_rows" ? check.valid > 0 : bad === 0 && check.valid > 0);

  if (outcome) return <ImportOutcome outcome={outcome} onAgain={startOver} />;

  return (
    <div className="flex flex-col gap-6">
      <Card>
        <CardHeader
          title="1. Choose the file"
          description="A CSV or XLSX vehicle register, up to 10 MB and 20,000 rows. Nothing is written until you press Import."
        />
        <CardBody className="flex flex-col gap-4">
          <div className="flex flex-wrap items-center gap-3">
            <label htmlFor="import-file" className="text-sm font-semibold text-ink">
              Register file
            </label>
            <input
              ref={fileInput}
              id="import-file"
              name="file"
              type="file"
              accept=".csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
              onChange={choose}
              disabled={busy !== null}
              className="block text-sm text-ink file:mr-3 file:h-10 file:cursor-pointer file:rounded-md file:border file:border-line-strong file:bg-surface-raised file:px-4 file:font-semibold file:text-ink hover:file:bg-surface-sunken"
            />
            {busy && (
              <Button variant="ghost" size="sm" onClick={() => upload.current?.abort()}>
                Stop
              </Button>
            )}
          </div>
          {busy && <UploadProgress fraction={busy.fraction} label={busy.label} />}
          {error?.at === "check" && <RequestError error={error.error} />}
        </CardBody>
      </Card>

      {check && file && (
        <>
          <Card>
            <CardHeader
              title="2. Match the columns"
              description="Each column of your file and the vehicle field it fills. Correct any that are wrong, or choose Not imported."
              actions={
                <Button variant={dirty ? "primary" : "secondary"} onClick={() => void run(file, true, mapping)} disabled={busy !== null}>
                  Check again
                </Button>
              }
            />
            <CardBody className="flex flex-col gap-3">
              {check.savedMappingUsed && !dirty && (
                <FormMessage tone="info" label="Saved matching">
                  The matching saved from your last import of this column layout is used.
                </FormMessage>
              )}
              {dirty && (
                <FormMessage tone="info" label="Matching changed" data-testid="mapping-dirty">
                  You changed the matching of {edited.size === 1 ? "a column" : `${edited.size} columns`}. Check again to see the rows read this way.
                </FormMessage>
              )}
              {!check.ready && !dirty && (
                <FormMessage tone="error" label="Required column">
                  Choose the column that holds the {check.missingRequired.map((f) => VEHICLE_FIELD_INFO[f].label.toLowerCase()).join(", ")}, then check again.
                </FormMessage>
              )}
              <MappingTable check={check} mapping={mapping} edited={edited} onChange={changeField} disabled={busy !== null} />
              {check.unknownColumns.length > 0 && (
                <p className="text-sm text-muted" data-testid="unknown-columns">
                  Not matched to any field, so not imported: {check.unknownColumns.join(", ")}.
                </p>
              )}
            </CardBody>
          </Card>

          <Card>
            <CardHeader
              title="3. Preview"
              description={`The first rows of ${check.filename}. Row numbers are the ones your spreadsheet shows; the header is row ${check.headerRowNumber}.`}
            />
            <CardBody>
              <PreviewTable check={check} />
            </CardBody>
          </Card>

          <Card>
            <CardHeader title="4. Check" description={check.summary} />
            <CardBody className="flex flex-col gap-5">
              <div className="flex flex-wrap gap-3" data-testid="check-counts">
                <Count label="rows in the file" value={check.totalRows} testId="count-total" />
                <Count label="new vehicles" value={check.created} testId="count-create" />
                <Count label="vehicles to update" value={check.updated} testId="count-update" />
                <Count label="unchanged" value={check.unchanged} testId="count-unchanged" />
                <Count label="rows with errors" value={bad} tone="danger" testId="count-errors" />
              </div>

              {check.newPlatforms.length > 0 && (
                <div className="flex flex-col gap-2" data-testid="new-platforms">
                  <h3 className="text-sm font-semibold text-ink">New platforms</h3>
                  <p className="text-sm text-muted">
                    These makes and models are not in Rigline yet. They are created with the figures the file gives; enter the maker&apos;s
                    other figures on the platform before relying on mass checks.
                  </p>
                  <ul className="flex flex-col gap-1 text-sm">
                    {check.newPlatforms.map((p) => (
                      <li key={`${p.make}|${p.model}|${p.variant}`} className="flex flex-wrap items-center gap-2">
                        <span className="font-semibold">
                          {p.make} {p.model}
                        </span>
                        {p.variant && <span className="text-muted">{p.variant}</span>}
                        <StatusPill tone="warn" size="sm">
                          Ratings missing
                        </StatusPill>
                        <span className="text-muted">rows {p.rowNumbers.join(", ")}</span>
                      </li>
                    ))}
                  </ul>
                </div>
              )}

              {check.unknownDepots.length > 0 && (
                <FormMessage tone="info" label="Unknown depots" data-testid="unknown-depots">
                  The file names {check.unknownDepots.length === 1 ? "a depot" : "depots"} this organisation does not have:{" "}
                  {check.unknownDepots.join("; ")}. Correct those cells, have the depots added under{" "}
                  <Link href="/admin/depots" className="underline underline-offset-4">
                    Depots
                  </Link>
                  {check.depotColumn ? `, or choose Not imported for the column "${check.depotColumn}" to import the vehicles without a depot` : ""}.
                </FormMessage>
              )}

              {check.errors.length > 0 && (
                <div className="flex flex-col gap-2">
                  <h3 className="text-sm font-semibold text-ink">Rows with errors ({rowsWord(bad)})</h3>
                  <RowErrors errors={check.errors} />
                </div>
              )}

              {check.rows.length > 0 && (
                <details className="group">
                  <summary className="cursor-pointer text-sm font-semibold text-accent">What each good row would do ({rowsWord(check.rows.length)})</summary>
                  <div className="mt-3">
                    <PlanTable rows={check.rows} done={false} />
                  </div>
                </details>
              )}
            </CardBody>
          </Card>

          <Card>
            <CardHeader title="5. Import" description="All good rows are written together, in one step: either all of them or none." />
            <CardBody className="flex flex-col gap-3">
              <fieldset className="flex flex-col gap-2" disabled={busy !== null}>
                <legend className="mb-1 text-sm font-semibold text-ink">Rows with errors</legend>
                <label className="flex min-h-11 cursor-pointer items-start gap-3 text-sm">
                  <input type="radio" name="mode" value="good_rows" checked={mode === "good_rows"} onChange={() => setMode("good_rows")} className="mt-0.5 size-5 accent-accent" />
                  <span>
                    <span className="font-semibold">Import the good rows</span>
                    <span className="block text-muted">
                      {bad > 0 ? `${rowsWord(check.valid)} are imported; the ${rowsWord(bad)} with errors are left out.` : "Every row is good."}
                    </span>
                  </span>
                </label>
                <label className="flex min-h-11 cursor-pointer items-start gap-3 text-sm">
                  <input type="radio" name="mode" value="all_or_nothing" checked={mode === "all_or_nothing"} onChange={() => setMode("all_or_nothing")} className="mt-0.5 size-5 accent-accent" />
                  <span>
                    <span className="font-semibold">All or nothing</span>
                    <span className="block text-muted">Import only when every row is good; otherwise nothing is written.</span>
                  </span>
                </label>
              </fieldset>
              {error?.at === "commit" && <RequestError error={error.error} />}
              {mode === "all_or_nothing" && bad > 0 && (
                <FormMessage tone="info" label="All or nothing">
                  {rowsWord(bad)} {bad === 1 ? "has" : "have"} errors. Correct the file or the matching and check again, or import the good rows.
                </FormMessage>
              )}
            </CardBody>
            <CardFooter>
              <Button variant="ghost" onClick={startOver} disabled={busy !== null}>
                Choose another file
              </Button>
              <Button onClick={() => void run(file, false, mapping)} disabled={!canCommit} loading={busy?.label === "Importing"}>
                {dirty ? "Check again first" : `Import ${rowsWord(check.valid)}`}
              </Button>
            </CardFooter>
          </Card>
        </>
      )}
    </div>
  );
}

function RequestError({ error }: { error: ImportRequestError }) {
  return (
    <div className="flex flex-col gap-3">
      <FormMessage tone="error" label="Import error" data-testid="import-error">
        {error.message}
      </FormMessage>
      {error.details.some((d) => d.row !== undefined) && <RowErrors errors={error.details} testId="refused-rows" />}
    </div>
  );
}

function ImportOutcome({ outcome, onAgain }: { outcome: ImportResult; onAgain: () => void }) {
  const bad = badRows(outcome);
  const written = outcome.rows.filter((r) => r.action !== "unchanged");
  return (
    <Card data-testid="import-outcome">
      <CardHeader
        title="Import finished"
        description={outcome.summary}
        actions={
          <>
            <Button asChild variant="secondary">
              <Link href="/vehicles">Open the register</Link>
            </Button>
            <Button onClick={onAgain}>Import another file</Button>
          </>
        }
      />
      <CardBody className="flex flex-col gap-5">
        <FormMessage tone="success" label="Import result">
          {outcome.created + outcome.updated === 0 ? "Nothing needed changing: the register already matches the file." : `${outcome.filename} is imported.`}
        </FormMessage>
        <div className="flex flex-wrap gap-3">
          <Count label="created" value={outcome.created} testId="result-created" />
          <Count label="updated" value={outcome.updated} testId="result-updated" />
          <Count label="unchanged" value={outcome.unchanged} testId="result-unchanged" />
          <Count label="rows left out" value={bad} tone="danger" testId="result-errors" />
        </div>
        {written.length > 0 && (
          <div className="flex flex-col gap-2">
            <h3 className="text-sm font-semibold text-ink">Vehicles created or updated</h3>
            <p className="text-sm text-muted">
              Open one, or{" "}
              <Link className="font-semibold text-accent underline underline-offset-4" href={`/vehicles?q=${encodeURIComponent(written[0]!.fleetNumber)}`}>
                find {written[0]!.fleetNumber} in the register
              </Link>
              .
            </p>
            <PlanTable rows={written} done />
          </div>
        )}
        {outcome.newPlatforms.length > 0 && (
          <p className="text-sm text-muted">
            {outcome.newPlatforms.length} new {outcome.newPlatforms.length === 1 ? "platform was" : "platforms were"} created and marked ratings missing:{" "}
            {outcome.newPlatforms.map((p) => `${p.make} ${p.model}`).join(", ")}.{" "}
            <Link className="font-semibold text-accent underline underline-offset-4" href="/platforms">
              Enter their figures
            </Link>
            .
          </p>
        )}
        {outcome.errors.length > 0 && (
          <div className="flex flex-col gap-2">
            <h3 className="text-sm font-semibold text-ink">Rows left out</h3>
            <RowErrors errors={outcome.errors} testId="result-row-errors" />
          </div>
        )}
      </CardBody>
    </Card>
  );
}
