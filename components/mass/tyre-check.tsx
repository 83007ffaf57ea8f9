"use client";

import { SpeedometerTable } from "@/components/calculators/speedometer-table";
import { Caution, Field, Input, Quantity, StatusPill } from "@/components/ui";
import { InputError } from "@/lib/errors";
import type { RuleSet } from "@/lib/rules";
import { tyreChange, type TyreChangeResult } from "@/lib/tyres";
import { tyreCaution } from "./cautions";
import { FindingList, SEVERITY } from "./findings";

type Props = {
  fromSize: string | null;
  fromSource: "fitted" | "platform" | null;
  standardSize: string | null;
  topSpeedKmh: number | null;
  axleRatings: { frontKg: number; rearKg: number } | null;
  rules: RuleSet;
  newSize: string;
  onNewSize: (size: string) => void;
  suspensionLiftMm: number;
  speedoText: string;
  onSpeedoText: (text: string) => void;
};

export function runTyreCheck(p: Omit<Props, "onNewSize" | "onSpeedoText" | "fromSource">): { result: TyreChangeResult | null; error: { field: string; message: string } | null } {
  if (!p.fromSize || p.newSize.trim() === "") return { result: null, error: null };
  const speedo = p.speedoText.trim() === "" ? undefined : Number(p.speedoText);
  if (speedo !== undefined && (!Number.isFinite(speedo) || speedo < -20 || speedo > 50)) {
    return { result: null, error: { field: "speedoReadsHighPct", message: "Enter how far it read high, from -20 to 50 %" } };
  }
  try {
    const result = tyreChange({
      from: p.fromSize,
      to: p.newSize.trim(),
      rules: p.rules,
      suspensionLiftMm: p.suspensionLiftMm,
      ...(speedo !== undefined ? { speedoReadsHighPct: speedo } : {}),
      ...(p.topSpeedKmh ? { topSpeedKmh: p.topSpeedKmh } : {}),
      ...(p.axleRatings ? { axleRatings: p.axleRatings } : {}),
      ...(p.standardSize ? { makerLargestSize: p.standardSize } : {}),
    });
    return { result, error: null };
  } catch (error) {
    if (error instanceof InputError) return { result: null, error: { field: error.field, message: error.message } };
    throw error;
  }
}

/** Tyre change check for this vehicle: from the tyres in use to a size the user types. */
export function TyreCheck(props: Props) {
  const { result, error } = runTyreCheck(props);
  const fieldError = (f: string) => (error && (error.field === f || error.field.startsWith(`${f}.`)) ? error.message : undefined);
  return (
    <div className="flex flex-col gap-4">
      <p className="text-sm">
        In use:{" "}
        <span className="font-semibold">{props.fromSize ?? "not recorded"}</span>
        {props.fromSource && <span className="text-muted"> ({props.fromSource === "fitted" ? "as fitted" : "the maker's standard size"})</span>}
        {props.topSpeedKmh ? <span className="text-muted">; top speed {props.topSpeedKmh} km/h</span> : null}
      </p>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <Field label="New tyre size" hint="e.g. LT285/75R16 126/123Q or 285/70R17" error={fieldError("to") ?? (error && error.field === "from" ? error.message : undefined)}>
          <Input name="newTyreSize" value={props.newSize} onChange={(e) => props.onNewSize(e.target.value)} autoComplete="off" disabled={!props.fromSize} />
        </Field>
        <Field label="Speedometer read high on the old tyres (%)" hint="Leave empty if you do not know" error={fieldError("speedoReadsHighPct")}>
          <Input name="speedoReadsHighPct" inputMode="decimal" value={props.speedoText} onChange={(e) => props.onSpeedoText(e.target.value)} />
        </Field>
      </div>
      {!props.fromSize && <p className="text-sm text-muted">Record the tyre size fitted (or the platform&apos;s standard size) to check a change.</p>}
      {result && (
        <div className="flex flex-col gap-4" data-testid="tyre-result">
          <div className="flex flex-wrap items-center gap-3">
            <StatusPill tone={SEVERITY[result.worst].tone}>{result.worst === "ok" ? "Within the rules checked" : result.worst === "check" ? "Needs checking" : "Exceeds a limit"}</StatusPill>
            <span className="text-sm">
              Diameter <Quantity value={result.oldDiameterMm} unit="mm" digits={1} /> → <Quantity value={result.newDiameterMm} unit="mm" digits={1} /> (
              <Quantity value={result.diameterChangePct} unit="%" digits={2} signed />
              ), clearance <Quantity value={result.clearanceGainedMm} unit="mm" digits={1} signed />
            </span>
          </div>
          <FindingList findings={result.findings} label="Tyre change findings" />
          <SpeedometerTable rows={result.speedometer} />
        </div>
      )}
      <Caution text={tyreCaution(props.rules.name)} />
    </div>
  );
}
