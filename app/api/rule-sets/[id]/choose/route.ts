import { chooseRuleSet } from "@/lib/commands/rules";
import { routeHandler } from "@/lib/server/route";

/** Makes this rule set the one the organisation's tyre and lift checks use. */
export const POST = routeHandler(chooseRuleSet, (_request, params) => ({ ruleSetId: String(params.id ?? "") }));
