import { getEdition } from "@/lib/commands/standards";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getEdition, (_request, params) => ({ id: params.id }));
