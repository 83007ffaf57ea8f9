import { copyRuleSet, listRuleSetsQuery } from "@/lib/commands/rules";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listRuleSetsQuery, () => ({}));

/** Copies a rule set into one the organisation owns and may edit: `{ "copyFromId": …, "name"?: … }`. */
export const POST = routeHandler(copyRuleSet, (request) => readJson(request), { status: 201 });
