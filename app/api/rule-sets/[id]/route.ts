import { updateRuleSet } from "@/lib/commands/rules";
import { readJson, routeHandler } from "@/lib/server/route";

/** Edits one of the organisation's own rule sets (the shipped examples answer 409). */
export const PATCH = routeHandler(updateRuleSet, async (request, params) => {
  const body = await readJson(request);
  return { ...(body && typeof body === "object" ? body : {}), id: String(params.id ?? "") };
});
