import { rolloutOperation } from "@/lib/commands/standards";
import { jsonError, readJson, routeHandler } from "@/lib/server/route";

type Context = { params: Promise<Record<string, string | string[]>> };

/**
 * `{ vehicleIds, dryRun }`: a dry run (the default) answers the preview and writes nothing;
 * `dryRun: false` assigns the edition to the vehicles in one transaction.
 */
export async function POST(request: Request, context: Context): Promise<Response> {
  let body: Record<string, unknown>;
  try {
    const raw = await readJson(request);
    body = raw !== null && typeof raw === "object" && !Array.isArray(raw) ? (raw as Record<string, unknown>) : {};
  } catch (error) {
    return jsonError(error);
  }
  const dryRun = !(body.dryRun === false || body.dryRun === "false");
  return routeHandler(rolloutOperation(dryRun), (_r, params) => ({ ...body, editionId: params.id }))(request, context);
}
