import { DEFAULT_CAUTION } from "@/components/ui/caution";

/**
 * The cautions that travel with every mass, tyre, spring, brake and 12 V result of a vehicle:
 * the API returns them with the result, the tab shows them beside it, the statement prints them.
 */

export const MASS_CAUTION = DEFAULT_CAUTION;

export const RULE_SET_LABEL = "Example values — check your local rules";

export function tyreCaution(ruleSetName: string): string {
  return (
    `Checked against "${ruleSetName}": ${RULE_SET_LABEL.toLowerCase()}. ` +
    "Planning aid only: whether a tyre size or lift may be fitted is decided under local rules by an authorised vehicle engineer."
  );
}

export const SPRING_CAUTION =
  "Planning aid only. Springs are chosen for the constant load; airbags help only with the variable load. Weigh the vehicle on a certified weighbridge and have suspension changes checked by an authorised vehicle engineer.";

export const BRAKE_CAUTION =
  "Heavier vehicles need better brakes. Have brake capacity for the loaded mass checked by an authorised vehicle engineer.";

export const ELECTRICAL_CAUTION =
  "Planning aid only. Wiring follows the equipment makers' instructions and local wiring rules.";

export const WEIGHBRIDGE_CAUTION =
  "Only a certified weighbridge gives the vehicle's true masses. Computed figures are a plan to check against the ticket.";
