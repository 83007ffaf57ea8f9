import { createVehicle, listVehicles } from "@/lib/commands/vehicles";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

/** The register: ?page&pageSize&sort&dir&depotId&platformId&state&editionId&standardId&variance&q */
export const GET = routeHandler(listVehicles, (request) => queryParams(request));

export const POST = routeHandler(createVehicle, (request) => readJson(request), { status: 201 });
