import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { z } from "zod";
import { insertMany } from "@/db/bulk-insert";
import { db, type Tx } from "@/db/client";
import {
  findImport,
  findSavedMapping,
  findStoredUpload,
  listImportHistory,
  loadRegisterForImport,
  saveMapping,
  type RegisterForImport,
} from "@/db/imports";
import { auditEntries, imports, platforms, vehicles, type VehicleState } from "@/db/schema";
import {
  DEFAULT_MAX_BYTES,
  ImportFileError,
  importFileErrorStatus,
  matchHeaders,
  parseSpreadsheet,
  planUpsert,
  validateRows,
  vehicleImportMappingSchema,
  vehicleImportTemplate,
  VEHICLE_FIELD_INFO,
  type CellValue,
  type DuplicateClaim,
  type ExistingVehicle,
  type FieldValue,
  type HeaderMapping,
  type HeaderMatch,
  type RowValidation,
  type ParsedSpreadsheet,
  type PlatformRatingField,
  type UpsertField,
  type UpsertPlan,
  type ValidRow,
  type VehicleField,
} from "@/imports";
import { AppError, notFound } from "@/lib/server/errors";
import { command, execute, query } from "@/lib/server/operation";
import type { SignedIn } from "@/lib/server/session";
import { newStorageKey, sha256OfBytes, storage } from "@/lib/server/storage";

/**
 * Vehicle register import: a CSV or XLSX upload is read and checked outside any transaction
 * (`readVehicleUpload`), its original bytes are kept in file storage, and then one command
 * (`runVehicleImport`) plans the upsert against the register as it is inside the transaction
 * and, unless it is a dry run, writes every good row in that same transaction. A refused
 * all-or-nothing import leaves the database exactly as it was, history included.
 */

export const IMPORT_MODES = ["all_or_nothing", "good_rows"] as const;
export type ImportMode = (typeof IMPORT_MODES)[number];

export const XLSX_CONTENT_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
export const contentTypeOfFormat = (format: "csv" | "xlsx") => (format === "csv" ? "text/csv; charset=utf-8" : XLSX_CONTENT_TYPE);

const PREVIEW_ROWS = 8;

// ─── Input ──────────────────────────────────────────────────────────────────────

const flag = (label: string) =>
  z
    .union([z.boolean(), z.enum(["1", "0", "true", "false", "on", ""], { error: `${label} is 1 or 0` })])
    .optional()
    .transform((v) => v === true || v === "1" || v === "true" || v === "on");

const mappingField = z.preprocess(
  (v) => (v === "" || v === null ? undefined : v),
  z
    .string()
    .max(100_000, { error: "The column mapping is too long" })
    .transform((text, ctx) => {
      try {
        return JSON.parse(text) as unknown;
      } catch {
        ctx.addIssue({ code: "custom", message: "The column mapping is not valid JSON" });
        return z.NEVER;
      }
    })
    .pipe(vehicleImportMappingSchema)
    .optional(),
);

export const importUploadInput = z.object({
  file: z.custom<Blob>((v) => typeof Blob !== "undefined" && v instanceof Blob, { error: "Choose a CSV or XLSX file to import" }),
  mapping: mappingField,
  dryRun: flag("dryRun"),
  mode: z.preprocess(
    (v) => (v === "" || v === null ? undefined : v),
    z.enum(IMPORT_MODES, { error: "Mode is all_or_nothing or good_rows" }).default("all_or_nothing"),
  ),
});

/** A file name fit to show and to offer for download: no folders, no control characters. */
export function displayFilename(name: string | undefined): string {
  const base = (name ?? "").split(/[\\/]/).pop() ?? "";
  const clean = base.replace(/[\u0000-\u001f\u007f]/g, "").trim().slice(0, 200);
  return clean === "" ? "upload" : clean;
}

export type PreparedUpload = {
  filename: string;
  bytes: Buffer;
  sizeBytes: number;
  sha256: string;
  parsed: ParsedSpreadsheet;
  mapping: Record<string, VehicleField | null> | null;
  dryRun: boolean;
  mode: ImportMode;
};

function fileRefusal(error: ImportFileError): AppError {
  const status = importFileErrorStatus(error.code);
  const code = status === 413 ? "payload_too_large" : status === 415 ? "unsupported_media_type" : "validation_failed";
  return new AppError(code, error.message, [{ field: "file", message: error.message }]);
}

/** Reads and checks the uploaded file (size, type, content) before any transaction opens. */
export const readVehicleUpload = query({
  name: "vehicle.import.read",
  input: importUploadInput,
  permission: ["manage", "Vehicle"],
  run: async ({ input }): Promise<PreparedUpload> => {
    const filename = displayFilename((input.file as Partial<File>).name);
    if (input.file.size > DEFAULT_MAX_BYTES) {
      throw fileRefusal(new ImportFileError("too_large", `${filename} is ${mebibytes(input.file.size)}; the limit is ${mebibytes(DEFAULT_MAX_BYTES)}`));
    }
    const bytes = Buffer.from(await input.file.arrayBuffer());
    let parsed: ParsedSpreadsheet;
    try {
      parsed = await parseSpreadsheet(bytes, { filename });
    } catch (error) {
      if (error instanceof ImportFileError) throw fileRefusal(error);
      throw error;
    }
    return {
      filename,
      bytes,
      sizeBytes: bytes.byteLength,
      sha256: sha256OfBytes(bytes),
      parsed,
      mapping: input.mapping ?? null,
      dryRun: input.dryRun,
      mode: input.mode,
    };
  },
});

function mebibytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toLocaleString("en-AU", { maximumFractionDigits: 1 })} MB`;
}

// ─── Analysis: mapping, row checks, depots, plan ───────────────────────────────────

export type ImportRowError = { row: number; column: string; message: string };
export type MappingSource = "chosen" | "saved" | "automatic";

export type ImportNewPlatform = {
  make: string;
  model: string;
  variant: string | null;
  rowNumbers: number[];
  ratings: Record<PlatformRatingField, number | null>;
  missingRatings: PlatformRatingField[];
  ratingsMissing: true;
};

export type ImportRowOutcome = {
  row: number;
  action: "create" | "update" | "unchanged";
  fleetNumber: string;
  vehicleId: string | null;
  changes: { field: UpsertField; label: string; before: FieldValue; after: FieldValue }[];
  warnings: string[];
};

export type ImportResult = {
  importId: string;
  dryRun: boolean;
  mode: ImportMode;
  filename: string;
  format: "csv" | "xlsx";
  sha256: string;
  totalRows: number;
  valid: number;
  created: number;
  updated: number;
  unchanged: number;
  errors: ImportRowError[];
  unknownColumns: string[];
  /** Depot names or codes in the file that match none of the organisation's depots. */
  unknownDepots: string[];
  /** The file's heading read as the depot, if any (to suggest not importing it). */
  depotColumn: string | null;
  newPlatforms: ImportNewPlatform[];
  /** Every fleet-number column is matched, so rows could be read. */
  ready: boolean;
  headerRowNumber: number;
  headers: string[];
  mapping: HeaderMapping;
  mappingSources: Record<string, MappingSource>;
  /** A mapping saved from an earlier import of the same header row was offered. */
  savedMappingUsed: boolean;
  duplicateColumns: DuplicateClaim[];
  missingRequired: VehicleField[];
  preview: { rowNumber: number; cells: Record<string, string | null> }[];
  rows: ImportRowOutcome[];
  summary: string;
};

/** The header row exactly as the file has it: the same layout next month finds its mapping. */
export function headerSignature(headers: readonly string[]): string {
  return JSON.stringify(headers);
}

const PLATFORM_KEY = (make: string | null | undefined, model: string | null | undefined, variant: string | null | undefined) =>
  [make, model, variant].map((part) => (part ?? "").replace(/\s+/g, " ").trim().toUpperCase()).join("\u0000");

function depotResolver(register: RegisterForImport) {
  const norm = (text: string) => text.replace(/\s+/g, " ").trim().toUpperCase();
  const byCode = new Map(register.depots.map((d) => [norm(d.code), d]));
  const byName = new Map<string, (typeof register.depots)[number][]>();
  for (const depot of register.depots) byName.set(norm(depot.name), [...(byName.get(norm(depot.name)) ?? []), depot]);
  return (value: string): { id: string } | { error: string; unknown?: true } => {
    const code = byCode.get(norm(value));
    if (code) return { id: code.id };
    const named = byName.get(norm(value)) ?? [];
    if (named.length === 1) return { id: named[0]!.id };
    if (named.length > 1) return { error: `Depot "${value}" names ${named.length} depots; use the depot's code` };
    return { error: `Depot "${value}" is not a depot of this organisation (by name or code); correct the cell or have the depot added under Depots`, unknown: true };
  };
}

function cellText(value: CellValue): string | null {
  if (value === null) return null;
  if (value instanceof Date) return Number.isNaN(value.getTime()) ? null : value.toISOString().slice(0, 10);
  return String(value).replace(/\r\n?/g, "\n");
}

type Analysis = {
  match: HeaderMatch;
  sources: Record<string, MappingSource>;
  savedMappingUsed: boolean;
  errors: ImportRowError[];
  /** Depot names or codes the file gives that match no depot, in file order. */
  unknownDepots: string[];
  plan: UpsertPlan | null;
  /** Rows the final plan was made from (depot already resolved to its id). */
  rows: ValidRow[];
};

/** What the file alone says: the column matching and each row's own checks (no register needed). */
export type CheckedUpload = {
  match: HeaderMatch;
  sources: Record<string, MappingSource>;
  savedMappingUsed: boolean;
  /** null when no column feeds a required field. */
  validation: RowValidation | null;
};

/** Matches the columns (the user's mapping, else the saved one, else automatic) and checks each row. */
export function checkUpload(upload: PreparedUpload, saved: Record<string, string | null> | null, now: Date): CheckedUpload {
  const requested = upload.mapping ?? saved ?? undefined;
  const match = matchHeaders(upload.parsed.headers, requested);
  const sources: Record<string, MappingSource> = {};
  for (const [heading, source] of Object.entries(match.sources)) {
    sources[heading] = source === "automatic" ? "automatic" : upload.mapping ? "chosen" : "saved";
  }
  return {
    match,
    sources,
    savedMappingUsed: upload.mapping === null && saved !== null,
    validation: match.ready ? validateRows(upload.parsed, match.mapping, { now }) : null,
  };
}

/** Plans the checked rows against the register as the transaction sees it. */
function analyse(upload: PreparedUpload, checked: CheckedUpload, register: RegisterForImport): Analysis {
  const { parsed } = upload;
  const { match, sources, savedMappingUsed, validation } = checked;
  if (!validation) {
    const missing = match.missingRequired.map((field) => VEHICLE_FIELD_INFO[field].label).join(", ");
    return {
      match,
      sources,
      savedMappingUsed,
      errors: [{ row: parsed.headerRowNumber, column: "", message: `No column is matched to ${missing}; choose the column that holds it` }],
      unknownDepots: [],
      plan: null,
      rows: [],
    };
  }

  const columnOf = new Map<VehicleField, string>();
  for (const [heading, field] of Object.entries(match.mapping)) if (field) columnOf.set(field, heading);
  const column = (field: VehicleField) => columnOf.get(field) ?? VEHICLE_FIELD_INFO[field].label;

  const errors: ImportRowError[] = validation.errors.map((e) => ({ row: e.row, column: e.column, message: e.message }));

  // Depots by code or name; the plan then compares depot ids, so "OCW" and "Ochre Well" are one depot.
  const resolveDepot = depotResolver(register);
  const unknownDepots = new Set<string>();
  let candidates: ValidRow[] = [];
  for (const row of validation.valid) {
    if (row.values.depot === null) {
      candidates.push(row);
      continue;
    }
    const found = resolveDepot(row.values.depot);
    if ("error" in found) {
      errors.push({ row: row.rowNumber, column: column("depot"), message: found.error });
      if (found.unknown) unknownDepots.add(row.values.depot);
    }
    else candidates.push({ rowNumber: row.rowNumber, values: { ...row.values, depot: found.id } });
  }

  const existing: ExistingVehicle[] = register.vehicles.map((v) => ({
    id: v.id,
    fleetNumber: v.fleetNumber,
    vin: v.vin,
    registration: v.registration,
    registrationExpiry: v.registrationExpiry,
    make: v.make,
    model: v.model,
    variant: v.variant === "" ? null : v.variant,
    buildYear: v.buildYear,
    depot: v.depotId,
    costCentre: v.costCentre,
    state: v.state,
    odometerKm: v.odometerKm,
    notes: v.notes,
  }));
  const stateOf = new Map(register.vehicles.map((v) => [v.id, v]));
  const known = register.platforms.map((p) => ({ make: p.make, model: p.model, variant: p.variant }));

  // Rules the pure plan does not know: a new vehicle needs a platform, and some state moves
  // belong to their own actions. Rows refused here are taken out and the plan made again.
  let plan = planUpsert(candidates, existing, { platforms: known });
  for (let round = 0; round < 5; round++) {
    const refused = new Map<number, ImportRowError>();
    for (const planned of plan.rows) {
      if (planned.action === "create") {
        if (planned.values.make === null || planned.values.model === null) {
          const field = planned.values.make === null ? "make" : "model";
          refused.set(planned.rowNumber, {
            row: planned.rowNumber,
            column: column(field),
            message: `Fleet number ${planned.values.fleetNumber} is new, and a new vehicle needs its make and model (they name its platform)`,
          });
        }
      } else if (planned.action === "update") {
        const stateChange = planned.changes.find((c) => c.field === "state");
        const current = stateOf.get(String(planned.vehicleId));
        if (stateChange && current?.state === "grounded") {
          refused.set(planned.rowNumber, {
            row: planned.rowNumber,
            column: column("state"),
            message: `Vehicle ${current.fleetNumber} is grounded; return it to service from its page, where the reason is recorded`,
          });
        } else if (stateChange && current?.state === "retired") {
          refused.set(planned.rowNumber, {
            row: planned.rowNumber,
            column: column("state"),
            message: `Vehicle ${current.fleetNumber} is retired and stays retired`,
          });
        }
      }
    }
    if (refused.size === 0) break;
    errors.push(...refused.values());
    candidates = candidates.filter((row) => !refused.has(row.rowNumber));
    plan = planUpsert(candidates, existing, { platforms: known });
  }
  for (const planned of plan.rows) {
    if (planned.action === "error") errors.push({ row: planned.rowNumber, column: column(planned.field), message: planned.message });
  }
  errors.sort((a, b) => a.row - b.row);
  return { match, sources, savedMappingUsed, errors, unknownDepots: [...unknownDepots], plan, rows: candidates };
}

// ─── Writing ────────────────────────────────────────────────────────────────────

const dateOf = (iso: string | null) => (iso === null ? null : new Date(`${iso}T00:00:00.000Z`));

type AuditRow = typeof auditEntries.$inferInsert;

async function writePlan(
  tx: Tx,
  user: SignedIn,
  upload: PreparedUpload,
  register: RegisterForImport,
  analysis: Analysis & { plan: UpsertPlan },
): Promise<Map<number, string>> {
  const reason = `Imported from ${upload.filename}`;
  const auditRows: AuditRow[] = [];
  const auditOf = (entry: Omit<AuditRow, "orgId" | "actorId" | "reason">) =>
    auditRows.push({ ...entry, orgId: user.orgId, actorId: user.userId, reason });

  // Platforms: known ones by make/model/variant (ignoring case), new ones created as "ratings missing".
  const platformIds = new Map(register.platforms.map((p) => [PLATFORM_KEY(p.make, p.model, p.variant), p.id]));
  const ratingsOf = new Map(analysis.plan.newPlatforms.map((p) => [PLATFORM_KEY(p.make, p.model, p.variant), p.ratings]));
  const platformFor = async (make: string, model: string, variant: string | null): Promise<string> => {
    const key = PLATFORM_KEY(make, model, variant);
    const known = platformIds.get(key);
    if (known) return known;
    const ratings = ratingsOf.get(key);
    const [created] = await tx
      .insert(platforms)
      .values({
        orgId: user.orgId,
        make,
        model,
        variant: variant ?? "",
        kerbMassKg: ratings?.kerbMassKg ?? null,
        gvmKg: ratings?.gvmKg ?? null,
        frontAxleRatingKg: ratings?.frontAxleRatingKg ?? null,
        rearAxleRatingKg: ratings?.rearAxleRatingKg ?? null,
        ratingsMissing: true,
      })
      .returning({ id: platforms.id });
    if (!created) throw new Error("platform insert returned nothing");
    platformIds.set(key, created.id);
    auditOf({ action: "platform.create", entityType: "platform", entityId: created.id, before: null, after: { make, model, variant: variant ?? "", ratingsMissing: true, ...ratings } });
    return created.id;
  };

  const vehicleIds = new Map<number, string>();
  const byRow = new Map(analysis.rows.map((row) => [row.rowNumber, row.values]));
  const current = new Map(register.vehicles.map((v) => [v.id, v]));

  const creates: (typeof vehicles.$inferInsert & { rowNumber: number })[] = [];
  for (const planned of analysis.plan.rows) {
    if (planned.action !== "create") continue;
    const v = planned.values;
    const state: VehicleState = v.state ?? "in_service";
    creates.push({
      rowNumber: planned.rowNumber,
      orgId: user.orgId,
      fleetNumber: v.fleetNumber,
      vin: v.vin,
      registration: v.registration,
      registrationExpiry: dateOf(v.registrationExpiry),
      platformId: await platformFor(v.make!, v.model!, v.variant),
      depotId: v.depot,
      costCentre: v.costCentre,
      state,
      groundedReason: state === "grounded" ? `Grounded in the imported register (${upload.filename})` : null,
      odometerKm: v.odometerKm,
      buildYear: v.buildYear,
      notes: v.notes,
    });
  }
  // Ids are made here (as the schema's default would) so the audit rows can name them without a read back.
  const createdRows = creates.map(({ rowNumber, ...values }) => {
    const row = { ...values, id: crypto.randomUUID() };
    vehicleIds.set(rowNumber, row.id);
    const { orgId: _org, ...after } = values;
    auditOf({ action: "vehicle.create", entityType: "vehicle", entityId: row.id, before: null, after });
    return row;
  });
  await insertMany(tx, vehicles, createdRows);

  for (const planned of analysis.plan.rows) {
    if (planned.action === "unchanged") vehicleIds.set(planned.rowNumber, String(planned.vehicleId));
    if (planned.action !== "update") continue;
    const id = String(planned.vehicleId);
    const stored = current.get(id)!;
    const values = byRow.get(planned.rowNumber)!;
    const set: Partial<typeof vehicles.$inferInsert> = {};
    const changed = new Set(planned.changes.map((c) => c.field));
    for (const change of planned.changes) {
      switch (change.field) {
        case "fleetNumber":
          set.fleetNumber = values.fleetNumber;
          break;
        case "vin":
          set.vin = values.vin;
          break;
        case "registration":
          set.registration = values.registration;
          break;
        case "registrationExpiry":
          set.registrationExpiry = dateOf(values.registrationExpiry);
          break;
        case "buildYear":
          set.buildYear = values.buildYear;
          break;
        case "depot":
          set.depotId = values.depot;
          break;
        case "costCentre":
          set.costCentre = values.costCentre;
          break;
        case "state":
          set.state = values.state!;
          if (values.state === "grounded") set.groundedReason = `Grounded in the imported register (${upload.filename})`;
          break;
        case "odometerKm":
          set.odometerKm = values.odometerKm;
          break;
        case "notes":
          set.notes = values.notes;
          break;
        case "make":
        case "model":
        case "variant":
          break;
      }
    }
    if (changed.has("make") || changed.has("model") || changed.has("variant")) {
      set.platformId = await platformFor(
        values.make ?? stored.make,
        values.model ?? stored.model,
        values.variant ?? (stored.variant === "" ? null : stored.variant),
      );
    }
    await tx
      .update(vehicles)
      .set({ ...set, version: sql`${vehicles.version} + 1`, updatedAt: new Date() })
      .where(and(eq(vehicles.id, id), eq(vehicles.orgId, user.orgId)));
    vehicleIds.set(planned.rowNumber, id);
    auditOf({
      action: "vehicle.update",
      entityType: "vehicle",
      entityId: id,
      before: Object.fromEntries(planned.changes.map((c) => [c.field, c.before])),
      after: Object.fromEntries(planned.changes.map((c) => [c.field, c.after])),
    });
  }

  await insertMany(tx, auditEntries, auditRows);
  return vehicleIds;
}

// ─── The command ────────────────────────────────────────────────────────────────

const checkedUpload = z.custom<CheckedUpload>((v) => typeof v === "object" && v !== null && "match" in v, { error: "The file was not checked" });

const preparedUpload = z.custom<PreparedUpload>(
  (v) => typeof v === "object" && v !== null && Buffer.isBuffer((v as PreparedUpload).bytes) && typeof (v as PreparedUpload).parsed === "object",
  { error: "No file was read" },
);

function summarise(result: Pick<ImportResult, "dryRun" | "ready" | "totalRows" | "created" | "updated" | "unchanged" | "errors">): string {
  if (!result.ready) return "Choose the column that holds the fleet number, then check again.";
  const bad = new Set(result.errors.map((e) => e.row)).size;
  const badText = bad === 0 ? "" : `; ${bad} ${bad === 1 ? "row has" : "rows have"} errors and ${result.dryRun ? "would be" : "were"} left out`;
  if (result.created === 0 && result.updated === 0) {
    if (result.unchanged > 0 && bad === 0) return `Nothing ${result.dryRun ? "would change" : "changed"}: all ${result.unchanged} rows match the register already.`;
    if (result.unchanged > 0) return `Nothing ${result.dryRun ? "would change" : "changed"}: ${result.unchanged} rows match the register already${badText}.`;
    return `Nothing ${result.dryRun ? "would change" : "changed"}${badText}.`;
  }
  const verb = result.dryRun ? "Would create" : "Created";
  return `${verb} ${result.created}, ${result.dryRun ? "update" : "updated"} ${result.updated}, ${result.unchanged} unchanged${badText}.`;
}

/** Plans (and, unless a dry run, writes) the import in one transaction, and records it. */
export const runVehicleImport = command({
  name: "vehicle.import",
  input: z.object({ upload: preparedUpload, checked: checkedUpload, storageKey: z.string().min(1) }),
  permission: ["manage", "Vehicle"],
  run: async ({ user, input, tx, audit, now }): Promise<ImportResult> => {
    const { upload, checked, storageKey } = input;
    const { parsed } = upload;
    const signature = headerSignature(parsed.headers);
    const register = await loadRegisterForImport(tx, user.orgId);
    const analysis = analyse(upload, checked, register);
    const { match, plan } = analysis;

    if (!upload.dryRun) {
      if (!plan) {
        throw new AppError("validation_failed", "Match a column to the fleet number before importing; nothing was imported", [
          { field: "mapping", message: analysis.errors[0]?.message ?? "The fleet number column is not matched" },
        ]);
      }
      if (upload.mode === "all_or_nothing" && analysis.errors.length > 0) {
        const rows = new Set(analysis.errors.map((e) => e.row)).size;
        throw new AppError(
          "validation_failed",
          `${rows} ${rows === 1 ? "row has" : "rows have"} errors, so nothing was imported (all or nothing)`,
          analysis.errors.map((e) => ({ row: e.row, column: e.column, message: e.message })),
        );
      }
    }

    const vehicleIds = !upload.dryRun && plan ? await writePlan(tx, user, upload, register, { ...analysis, plan }) : new Map<number, string>();
    const counts = plan?.counts ?? { create: 0, update: 0, unchanged: 0, error: 0 };

    const depotLabel = new Map(register.depots.map((d) => [d.id, `${d.name} (${d.code})`]));
    const showValue = (field: UpsertField, value: FieldValue) =>
      field === "depot" && typeof value === "string" ? (depotLabel.get(value) ?? value) : value;
    const valuesOf = new Map(analysis.rows.map((r) => [r.rowNumber, r.values]));
    const rows: ImportRowOutcome[] = (plan?.rows ?? []).flatMap((planned): ImportRowOutcome[] => {
      if (planned.action === "error") return [];
      const values = valuesOf.get(planned.rowNumber);
      const base = {
        row: planned.rowNumber,
        fleetNumber: values?.fleetNumber ?? "",
        vehicleId: vehicleIds.get(planned.rowNumber) ?? (planned.action === "create" ? null : String(planned.vehicleId)),
      };
      if (planned.action === "create") return [{ ...base, action: "create", changes: [], warnings: [] }];
      if (planned.action === "unchanged") return [{ ...base, action: "unchanged", changes: [], warnings: [] }];
      return [
        {
          ...base,
          action: "update",
          changes: planned.changes.map((c) => ({
            field: c.field,
            label: VEHICLE_FIELD_INFO[c.field].label,
            before: showValue(c.field, c.before),
            after: showValue(c.field, c.after),
          })),
          warnings: planned.warnings,
        },
      ];
    });

    const summaryInput = {
      dryRun: upload.dryRun,
      ready: match.ready,
      totalRows: parsed.rows.length,
      created: counts.create,
      updated: counts.update,
      unchanged: counts.unchanged,
      errors: analysis.errors,
    };

    const [record] = await tx
      .insert(imports)
      .values({
        orgId: user.orgId,
        filename: upload.filename,
        format: parsed.format,
        storageKey,
        sha256: upload.sha256,
        sizeBytes: upload.sizeBytes,
        dryRun: upload.dryRun,
        totalRows: parsed.rows.length,
        created: counts.create,
        updated: counts.update,
        unchanged: counts.unchanged,
        errorCount: analysis.errors.length,
        errors: analysis.errors,
        mapping: match.mapping,
        createdBy: user.userId,
        createdAt: now,
      })
      .returning({ id: imports.id });
    if (!record) throw new Error("import record insert returned nothing");

    // The mapping the user confirmed (a commit, or a dry run with their corrections) is offered next time.
    if (match.ready && (!upload.dryRun || upload.mapping)) await saveMapping(tx, user.orgId, signature, match.mapping);

    await audit({
      action: upload.dryRun ? "vehicle.import.dry_run" : "vehicle.import",
      entityType: "import",
      entityId: record.id,
      before: null,
      after: {
        filename: upload.filename,
        sha256: upload.sha256,
        mode: upload.mode,
        totalRows: parsed.rows.length,
        created: counts.create,
        updated: counts.update,
        unchanged: counts.unchanged,
        errors: analysis.errors.length,
      },
    });

    return {
      importId: record.id,
      dryRun: upload.dryRun,
      mode: upload.mode,
      filename: upload.filename,
      format: parsed.format,
      sha256: upload.sha256,
      totalRows: parsed.rows.length,
      valid: counts.create + counts.update + counts.unchanged,
      created: counts.create,
      updated: counts.update,
      unchanged: counts.unchanged,
      errors: analysis.errors,
      unknownColumns: match.unknown,
      unknownDepots: analysis.unknownDepots,
      depotColumn: Object.entries(match.mapping).find(([, field]) => field === "depot")?.[0] ?? null,
      newPlatforms: (plan?.newPlatforms ?? []).map((p) => ({
        make: p.make,
        model: p.model,
        variant: p.variant,
        rowNumbers: p.rowNumbers,
        ratings: p.ratings,
        missingRatings: p.missingRatings,
        ratingsMissing: true,
      })),
      ready: match.ready,
      headerRowNumber: parsed.headerRowNumber,
      headers: parsed.headers,
      mapping: match.mapping,
      mappingSources: analysis.sources,
      savedMappingUsed: analysis.savedMappingUsed,
      duplicateColumns: match.duplicates,
      missingRequired: match.missingRequired,
      preview: parsed.rows.slice(0, PREVIEW_ROWS).map((row) => ({
        rowNumber: row.rowNumber,
        cells: Object.fromEntries(parsed.headers.map((h) => [h, cellText(row.cells[h] ?? null)])),
      })),
      rows,
      summary: summarise(summaryInput),
    };
  },
});

/** Keeps the original file: the same bytes uploaded before are not stored twice. */
async function keepOriginal(orgId: string, upload: PreparedUpload): Promise<{ key: string; fresh: boolean }> {
  const earlier = await findStoredUpload(db(), orgId, upload.sha256);
  if (earlier) {
    const head = await storage().head(earlier);
    if (head && head.sizeBytes === upload.sizeBytes) return { key: earlier, fresh: false };
  }
  const key = newStorageKey(`imports/${orgId}`, upload.parsed.format);
  await storage().put(key, upload.bytes, contentTypeOfFormat(upload.parsed.format));
  return { key, fresh: true };
}

/**
 * The whole import for one request: read and check the file, keep the original, then plan and
 * write in one transaction. When that transaction fails, a file stored for it is removed again.
 */
export async function importVehicleFile(user: SignedIn | null, raw: unknown): Promise<ImportResult> {
  const upload = await execute(readVehicleUpload, user, raw);
  const orgId = user!.orgId;
  // The file's own checks run before the transaction, so it is held only for the plan and the writes.
  const saved = upload.mapping ? null : await findSavedMapping(db(), orgId, headerSignature(upload.parsed.headers));
  const checked = checkUpload(upload, saved?.mapping ?? null, new Date());
  const stored = await keepOriginal(orgId, upload);
  try {
    return await execute(runVehicleImport, user, { upload, checked, storageKey: stored.key });
  } catch (error) {
    if (stored.fresh) await storage().delete(stored.key).catch(() => undefined);
    throw error;
  }
}

// ─── History, original files, template ─────────────────────────────────────────

export const listImports = query({
  name: "vehicle.import.list",
  input: z.object({}).passthrough(),
  permission: ["manage", "Vehicle"],
  run: async ({ user }) => listImportHistory(db(), user.orgId),
});

export const getImportFile = query({
  name: "vehicle.import.file",
  input: z.object({ id: z.string().trim().min(1, { error: "id is required" }).max(64) }),
  permission: ["manage", "Vehicle"],
  run: async ({ user, input }) => {
    const record = await findImport(db(), user.orgId, input.id);
    if (!record || !record.storageKey) throw notFound("That import");
    const file = await storage().get(record.storageKey);
    if (!file) throw notFound("The original file of that import");
    return { filename: record.filename, format: record.format, bytes: file.bytes };
  },
});

export const importTemplate = query({
  name: "vehicle.import.template",
  input: z.object({}).passthrough(),
  permission: ["manage", "Vehicle"],
  run: async () => vehicleImportTemplate(),
});
