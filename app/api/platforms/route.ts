import { createPlatform, listPlatforms } from "@/lib/commands/platforms";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listPlatforms, () => ({}), {
  respond: (items) => Response.json({ items }),
});

export const POST = routeHandler(createPlatform, (request) => readJson(request), { status: 201 });
