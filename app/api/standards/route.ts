import { createStandard, listStandardsQuery } from "@/lib/commands/standards";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listStandardsQuery, () => ({}));

export const POST = routeHandler(createStandard, (request) => readJson(request), { status: 201 });
