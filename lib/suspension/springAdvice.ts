import { InputError, requireFinite, requireNonNegative } from "../errors";
import { worstSeverity, type Finding, type Severity } from "../rules";

/**
 * Common practice: a spring rated about 500 kg above the constant load it carries rides harshly
 * when the vehicle is unladen.
 */
export const DEFAULT_STIFF_MARGIN_KG = 500;
/** Common practice: a spring rated below the constant load is overloaded (no allowance by default). */
export const DEFAULT_SOFT_MARGIN_KG = 0;

export type SpringVerdict = "too soft" | "suits" | "too stiff";

export interface SpringAdviceInput {
  axle: "front" | "rear";
  /**
   * Constant load over standard on this axle (fitted accessories), in the terms springs are sold
   * in: the extra load the spring is made to carry.
   */
  constantLoadKg: number;
  /** Variable load over standard on this axle (touring gear, water, contents). */
  variableLoadKg: number;
  /** The load over standard the chosen spring is rated for. */
  springRatedKg: number;
  /** What airbags (helper bags) can carry on this axle, if fitted. */
  airbagAssistKg?: number;
  margins?: { softKg?: number; stiffKg?: number };
}

export interface SpringAdvice {
  axle: "front" | "rear";
  verdict: SpringVerdict;
  constantLoadKg: number;
  variableLoadKg: number;
  springRatedKg: number;
  /** Spring rating minus constant load: negative = overloaded, large = stiff. */
  spareKg: number;
  /** The spring ratings that suit this constant load: from minKg up to (not including) maxKg. */
  suggestedRatingKg: { minKg: number; maxKg: number };
  /** The laden case: constant + variable against spring + airbag assist. */
  laden: { loadKg: number; supportKg: number; overKg: number };
  airbag?: { assistKg: number; usedForVariableKg: number; wouldCarryConstantKg: number };
  findings: Finding[];
  worst: Severity;
}

const k = (x: number) => (Math.round(x) === 0 ? 0 : Math.round(x)).toString();
const EPS = 1e-9;

/**
 * Spring advice for one axle: the spring is rated for the constant load (accessories); airbags
 * only help with the variable load and must never carry the constant load.
 */
export function springAdvice(input: SpringAdviceInput): SpringAdvice {
  if (input.axle !== "front" && input.axle !== "rear") throw new InputError("axle", 'axle must be "front" or "rear"');
  const constant = requireFinite("constantLoadKg", input.constantLoadKg);
  const variable = requireNonNegative("variableLoadKg", input.variableLoadKg);
  const rating = requireNonNegative("springRatedKg", input.springRatedKg);
  const airbag = input.airbagAssistKg === undefined ? undefined : requireNonNegative("airbagAssistKg", input.airbagAssistKg);
  const soft = input.margins?.softKg === undefined ? DEFAULT_SOFT_MARGIN_KG : requireNonNegative("margins.softKg", input.margins.softKg);
  const stiff = input.margins?.stiffKg === undefined ? DEFAULT_STIFF_MARGIN_KG : requireNonNegative("margins.stiffKg", input.margins.stiffKg);
  if (stiff <= soft) throw new InputError("margins.stiffKg", "the stiff margin must be larger than the soft margin");

  const Axle = input.axle === "front" ? "Front" : "Rear";
  const spare = rating - constant;
  const findings: Finding[] = [];
  let verdict: SpringVerdict;

  if (-spare > soft + EPS) {
    verdict = "too soft";
    findings.push({
      code: "spring-soft",
      severity: "exceeds",
      message: `${Axle} spring rated for ${k(rating)} kg carries ${k(constant)} kg of constant load: overloaded by ${k(-spare)} kg, it will sag and lose clearance.`,
    });
    if (airbag !== undefined && airbag > 0 && constant <= rating + airbag + soft + EPS) {
      findings.push({
        code: "airbag-constant",
        severity: "exceeds",
        message: `The ${Axle.toLowerCase()} airbags could make up the ${k(-spare)} kg, but airbags must not carry the constant load: fit a spring rated for it.`,
      });
    }
  } else if (spare >= stiff - EPS) {
    verdict = "too stiff";
    findings.push({
      code: "spring-stiff",
      severity: "check",
      message: `${Axle} spring rated for ${k(rating)} kg is ${k(spare)} kg above the ${k(constant)} kg constant load: it will ride harshly when unladen.`,
    });
  } else {
    verdict = "suits";
    findings.push({
      code: "spring-suits",
      severity: "ok",
      message: `${Axle} spring rated for ${k(rating)} kg suits the ${k(constant)} kg constant load.`,
    });
  }

  // Laden: springs carry the constant load; airbags help with (at most) the variable load.
  const usedForVariable = airbag === undefined ? 0 : Math.min(airbag, variable);
  const ladenLoad = constant + variable;
  const support = rating + usedForVariable;
  const ladenOver = ladenLoad - support;
  if (variable > 0 && ladenOver > soft + EPS) {
    findings.push({
      code: "laden",
      severity: "check",
      message:
        airbag === undefined
          ? `Fully loaded, the ${Axle.toLowerCase()} axle carries ${k(ladenLoad)} kg over standard, ${k(ladenOver)} kg more than the spring is rated for: airbags can help with the variable load.`
          : `Fully loaded, the ${Axle.toLowerCase()} axle carries ${k(ladenLoad)} kg over standard, ${k(ladenOver)} kg more than the spring and airbags together.`,
    });
  }

  return {
    axle: input.axle,
    verdict,
    constantLoadKg: constant,
    variableLoadKg: variable,
    springRatedKg: rating,
    spareKg: spare,
    suggestedRatingKg: { minKg: Math.max(0, constant - soft), maxKg: Math.max(0, constant + stiff) },
    laden: { loadKg: ladenLoad, supportKg: support, overKg: Math.max(0, ladenOver) },
    ...(airbag === undefined
      ? {}
      : { airbag: { assistKg: airbag, usedForVariableKg: usedForVariable, wouldCarryConstantKg: Math.max(0, Math.min(airbag, -spare)) } }),
    findings,
    worst: worstSeverity(findings),
  };
}
