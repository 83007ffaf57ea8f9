import { listFitments, recordFitment } from "@/lib/commands/fitments";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listFitments, (request, params) => ({ ...queryParams(request), vehicleId: params.id }));

export const POST = routeHandler(
  recordFitment,
  async (request, params) => ({ ...((await readJson(request)) as object), vehicleId: params.id }),
  { status: 201 },
);
