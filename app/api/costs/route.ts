import { createManualCost, listLedger } from "@/lib/commands/costs";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listLedger, (request) => queryParams(request));

export const POST = routeHandler(createManualCost, (request) => readJson(request), { status: 201 });
