import { createVehicle, listVehicles } from "@/lib/commands/vehicles";
import { queryParams, readJson, routeHandler, sharedJson } from "@/lib/server/route";

/** The register: ?page&pageSize&sort&dir&depotId&platformId&state&editionId&standardId&variance&q */
/** Pages are kept per process while the register is unchanged (db/register-cache.ts), so their JSON is too. */
export const GET = routeHandler(listVehicles, (request) => queryParams(request), { respond: sharedJson });

export const POST = routeHandler(createVehicle, (request) => readJson(request), { status: 201 });
