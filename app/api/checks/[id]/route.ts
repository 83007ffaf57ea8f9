import { getCheck } from "@/lib/commands/checks";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getCheck, (_request, params) => ({ id: params.id }));
