"use client";

import { Caution, Field, Input, Quantity, StatusPill, type StatusTone } from "@/components/ui";
import { InputError } from "@/lib/errors";
import { liftCheck, type LiftCheckResult, type RuleSet } from "@/lib/rules";
import { springAdvice, type SpringAdvice, type SpringVerdict } from "@/lib/suspension";
import { parseTyreSize } from "@/lib/tyres";
import { SPRING_CAUTION, tyreCaution } from "./cautions";
import { FindingList } from "./findings";
import type { AxleSplit, MassSettings } from "./model";

const VERDICT: Record<SpringVerdict, { tone: StatusTone; word: string }> = {
  "too soft": { tone: "danger", word: "Too soft" },
  suits: { tone: "ok", word: "Suits" },
  "too stiff": { tone: "warn", word: "Too stiff" },
};

export type SpringText = { frontRatedKg: string; rearRatedKg: string; frontAirbagKg: string; rearAirbagKg: string; liftMm: string };

function numberOrNull(text: string): number | null {
  if (text.trim() === "") return null;
  const n = Number(text);
  return Number.isFinite(n) && n >= 0 ? n : Number.NaN;
}

function diameterOf(size: string | null): number | null {
  if (!size) return null;
  try {
    return parseTyreSize(size, "size").overallDiameterMm;
  } catch {
    return null;
  }
}

type Props = {
  constant: AxleSplit | null;
  variable: AxleSplit | null;
  settings: MassSettings;
  rules: RuleSet;
  text: SpringText;
  onText: (t: SpringText) => void;
  /** The tyre size the lift is counted with (typed in the tyre check, else the one in use). */
  tyreSize: string | null;
  standardSize: string | null;
};

function AxleAdvice({
  axle,
  advice,
  suggested,
  error,
}: {
  axle: "Front" | "Rear";
  advice: SpringAdvice | null;
  suggested: { minKg: number; maxKg: number } | null;
  error: string | null;
}) {
  return (
    <div className="flex flex-col gap-2 rounded-md border border-line p-3" data-testid={`spring-${axle.toLowerCase()}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-semibold">{axle} axle</h3>
        {advice && (
          <StatusPill tone={VERDICT[advice.verdict].tone} size="sm">
            {VERDICT[advice.verdict].word}
          </StatusPill>
        )}
      </div>
      {error && <p className="text-sm font-semibold text-danger">{error}</p>}
      {suggested && (
        <p className="text-sm">
          Springs that suit: <Quantity value={suggested.minKg} unit="kg" /> up to <Quantity value={suggested.maxKg} unit="kg" /> over standard.
        </p>
      )}
      {advice ? (
        <FindingList findings={advice.findings} label={`${axle} spring findings`} />
      ) : (
        !error && <p className="text-sm text-muted">Enter the rating of the spring you are considering to check it.</p>
      )}
    </div>
  );
}

/** Spring advice per axle from the constant accessory load, airbags only for the variable load, and the combined lift. */
export function SpringAdviceCard({ constant, variable, settings, rules, text, onText, tyreSize, standardSize }: Props) {
  if (!constant || !variable) {
    return <p className="text-muted">Spring advice needs the platform&apos;s wheelbase.</p>;
  }
  const axles = (["front", "rear"] as const).map((axle) => {
    const rated = numberOrNull(axle === "front" ? text.frontRatedKg : text.rearRatedKg);
    const airbag = numberOrNull(axle === "front" ? text.frontAirbagKg : text.rearAirbagKg);
    const constantKg = axle === "front" ? constant.frontKg : constant.rearKg;
    const variableKg = Math.max(0, axle === "front" ? variable.frontKg : variable.rearKg);
    const margins = { softKg: settings.springSoftMarginKg, stiffKg: settings.springStiffMarginKg };
    if (rated === null) {
      // No spring chosen yet: the range that would suit, without a verdict.
      const suggested = springAdvice({ axle, constantLoadKg: constantKg, variableLoadKg: variableKg, springRatedKg: Math.max(0, constantKg), margins }).suggestedRatingKg;
      return { axle, advice: null, suggested, error: null, constantKg, variableKg };
    }
    if (Number.isNaN(rated) || (airbag !== null && Number.isNaN(airbag))) return { axle, advice: null, suggested: null, error: "Enter ratings as kilograms, zero or more.", constantKg, variableKg };
    try {
      const advice = springAdvice({
        axle,
        constantLoadKg: constantKg,
        variableLoadKg: variableKg,
        springRatedKg: rated,
        ...(airbag !== null && airbag > 0 ? { airbagAssistKg: airbag } : {}),
        margins,
      });
      return { axle, advice, suggested: advice.suggestedRatingKg, error: null, constantKg, variableKg };
    } catch (e) {
      if (e instanceof InputError) return { axle, advice: null, suggested: null, error: e.message, constantKg, variableKg };
      throw e;
    }
  });

  const liftNumber = numberOrNull(text.liftMm) ?? 0;
  const newD = diameterOf(tyreSize);
  const baseD = diameterOf(standardSize);
  let lift: LiftCheckResult | null = null;
  let liftError: string | null = null;
  if (Number.isNaN(liftNumber)) liftError = "Enter the lift in mm, zero or more.";
  else {
    try {
      lift = liftCheck(
        {
          suspensionLiftMm: liftNumber,
          tyreDiameterIncreaseMm: newD !== null && baseD !== null ? newD - baseD : 0,
          ...(baseD !== null ? { baseTyreDiameterMm: baseD } : {}),
        },
        rules,
      );
    } catch (e) {
      if (e instanceof InputError) liftError = e.message;
      else throw e;
    }
  }

  const set = (key: keyof SpringText) => (e: React.ChangeEvent<HTMLInputElement>) => onText({ ...text, [key]: e.target.value });
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid grid-cols-2 gap-3 text-sm">
        {axles.map((a) => (
          <div key={a.axle} className="flex flex-col">
            <dt className="text-muted">{a.axle === "front" ? "Front" : "Rear"}: constant / variable load over standard</dt>
            <dd className="font-semibold" data-testid={`constant-${a.axle}`}>
              <Quantity value={a.constantKg} unit="kg" /> / <Quantity value={a.variableKg} unit="kg" />
            </dd>
          </div>
        ))}
      </dl>
      <div className="grid grid-cols-2 gap-3">
        <Field label="Front spring rating (kg over standard)">
          <Input name="frontRatedKg" inputMode="decimal" value={text.frontRatedKg} onChange={set("frontRatedKg")} />
        </Field>
        <Field label="Rear spring rating (kg over standard)">
          <Input name="rearRatedKg" inputMode="decimal" value={text.rearRatedKg} onChange={set("rearRatedKg")} />
        </Field>
        <Field label="Front airbag assist (kg)" hint="Only for the variable load">
          <Input name="frontAirbagKg" inputMode="decimal" value={text.frontAirbagKg} onChange={set("frontAirbagKg")} />
        </Field>
        <Field label="Rear airbag assist (kg)" hint="Only for the variable load">
          <Input name="rearAirbagKg" inputMode="decimal" value={text.rearAirbagKg} onChange={set("rearAirbagKg")} />
        </Field>
      </div>
      <div className="grid grid-cols-1 gap-3 md:grid-cols-2">
        {axles.map((a) => (
          <AxleAdvice key={a.axle} axle={a.axle === "front" ? "Front" : "Rear"} advice={a.advice} suggested={a.suggested} error={a.error} />
        ))}
      </div>
      <div className="flex flex-col gap-3 rounded-md border border-line p-3">
        <h3 className="font-semibold">Lift from springs and tyres</h3>
        <Field label="Suspension lift (mm)" error={liftError ?? undefined} className="max-w-xs">
          <Input name="liftMm" inputMode="decimal" value={text.liftMm} onChange={set("liftMm")} />
        </Field>
        {lift && (
          <div data-testid="lift-result" className="flex flex-col gap-2">
            <p className="text-sm">
              Springs <Quantity value={lift.suspensionLiftMm} unit="mm" /> + tyres <Quantity value={lift.tyreLiftMm} unit="mm" digits={1} /> ={" "}
              <span className="font-semibold">
                <Quantity value={lift.combinedLiftMm} unit="mm" digits={1} />
              </span>{" "}
              against the {rules.combinedLiftMaxMm} mm combined-lift limit of “{rules.name}”
              {tyreSize && standardSize ? ` (tyres ${tyreSize} against the standard ${standardSize})` : ""}.
            </p>
            <FindingList findings={lift.findings} label="Lift findings" />
          </div>
        )}
        <Caution text={tyreCaution(rules.name)} />
      </div>
      <Caution text={SPRING_CAUTION} />
    </div>
  );
}
