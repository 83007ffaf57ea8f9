import { triageDefect } from "@/lib/commands/defects";
import { AppError } from "@/lib/server/errors";
import { readJson, routeHandler } from "@/lib/server/route";

/**
 * A manager's move on a defect: {"move":"triage"} · {"move":"start_repair","jobId"} ·
 * {"move":"resolve"} · {"move":"close","reason"} · {"move":"merge","intoId"}, with the
 * `version` last seen (409 when someone moved it since, or when the move is not allowed).
 */
export const POST = routeHandler(triageDefect, async (request, params) => {
  const body = await readJson(request);
  if (typeof body !== "object" || body === null || Array.isArray(body)) throw new AppError("bad_request", "The request body must be a JSON object");
  return { ...body, id: params.id };
});
