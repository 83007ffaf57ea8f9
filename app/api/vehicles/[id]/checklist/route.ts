import { getChecklist } from "@/lib/commands/checks";
import { routeHandler } from "@/lib/server/route";

/** The pre-trip checklist of one vehicle: general items, then its standard's checkable lines. */
export const GET = routeHandler(getChecklist, (_request, params) => ({ vehicleId: params.id }));
