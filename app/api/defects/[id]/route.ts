import { getDefect } from "@/lib/commands/defects";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getDefect, (_request, params) => ({ id: params.id }));
