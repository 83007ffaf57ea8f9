import { publishEdition } from "@/lib/commands/standards";
import { routeHandler } from "@/lib/server/route";

export const POST = routeHandler(publishEdition, (_request, params) => ({ id: params.id }));
