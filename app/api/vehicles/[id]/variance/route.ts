import { getVehicleVariance } from "@/lib/commands/variance";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getVehicleVariance, (_request, params) => ({ vehicleId: params.id }));
