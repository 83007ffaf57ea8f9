import { revokeApiToken } from "@/lib/commands/tokens";
import { routeHandler } from "@/lib/server/route";

export const DELETE = routeHandler(revokeApiToken, (_request, params) => ({ id: params.id }));
