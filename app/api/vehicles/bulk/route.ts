import { bulkUpdateVehicles } from "@/lib/commands/vehicles";
import { readJson, routeHandler } from "@/lib/server/route";

/** { action: "assign_edition" | "move_depot", vehicleIds, editionId? | depotId? } → counts. */
export const POST = routeHandler(bulkUpdateVehicles, (request) => readJson(request));
