import { getVehicle } from "@/lib/commands/vehicles";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getVehicle, (_request, params) => ({ id: params.id }));
