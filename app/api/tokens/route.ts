import { createApiToken, listApiTokens } from "@/lib/commands/tokens";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listApiTokens, () => ({}));

export const POST = routeHandler(createApiToken, (request) => readJson(request), { status: 201 });
