import { exportLedger, exportResponse } from "@/lib/commands/costs";
import { queryParams, routeHandler } from "@/lib/server/route";

export const dynamic = "force-dynamic";

export const GET = routeHandler(exportLedger, (request) => queryParams(request), { respond: exportResponse });
