import { vehicleMassQuery } from "@/lib/commands/mass";
import { queryParams, routeHandler } from "@/lib/server/route";

/** The vehicle's mass figures for a loading given as query parameters. */
export const GET = routeHandler(vehicleMassQuery, (request, params) => ({ ...queryParams(request), id: String(params.id ?? "") }));
