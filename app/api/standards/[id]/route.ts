import { getStandard } from "@/lib/commands/standards";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getStandard, (_request, params) => ({ id: params.id }));
