import { ledgerSummary } from "@/lib/commands/costs";
import { queryParams, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(ledgerSummary, (request) => queryParams(request));
