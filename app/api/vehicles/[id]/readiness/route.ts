import { getVehicleReadiness } from "@/lib/commands/readiness";
import { routeHandler } from "@/lib/server/route";

/** Trip readiness of one vehicle: state, headline and reasons (404 for a vehicle not yours). */
export const GET = routeHandler(getVehicleReadiness, (_request, params) => ({ id: params.id }));
