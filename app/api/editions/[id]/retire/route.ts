import { retireEdition } from "@/lib/commands/standards";
import { routeHandler } from "@/lib/server/route";

export const POST = routeHandler(retireEdition, (_request, params) => ({ id: params.id }));
