import { removeFitment } from "@/lib/commands/fitments";
import { routeHandler } from "@/lib/server/route";

/** Removes a fitment: the record stays, with its removal date. */
export const DELETE = routeHandler(removeFitment, (request, params) => ({
  id: params.id,
  reason: new URL(request.url).searchParams.get("reason") ?? undefined,
}));
