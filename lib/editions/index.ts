export { compareEditions, COMPARED_FIELDS } from "./compare";
export type { ChangedLine, ComparedField, EditionComparison, FieldChange } from "./compare";
export { copyEditionLines } from "./copy";
export { rolloutPreview } from "./rollout";
export type { RolloutGap, RolloutInput, RolloutPreview, RolloutTotals, RolloutVehicle, RolloutVehicleInput } from "./rollout";
export { validateDependencies, EditionCycleError } from "./dependencies";
export type { CycleLine, DependencyCheck, ValidateDependenciesOptions } from "./dependencies";
export { criterionInputSchema, editionLineInputSchema, editionLinesInputSchema } from "./schema";
export type { EditionLineInput } from "./schema";
