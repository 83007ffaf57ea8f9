import { getJob } from "@/lib/commands/jobs";
import { routeHandler } from "@/lib/server/route";

export const GET = routeHandler(getJob, (_request, params) => ({ id: params.id }));
