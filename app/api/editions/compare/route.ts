import { compareEditionsQuery } from "@/lib/commands/standards";
import { queryParams, routeHandler } from "@/lib/server/route";

/** `?a=<editionId>&b=<editionId>`: added, removed and changed lines (before → after). */
export const GET = routeHandler(compareEditionsQuery, (request) => queryParams(request));
