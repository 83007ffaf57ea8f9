import { listWeighbridgeQuery, recordWeighbridgeTicket } from "@/lib/commands/mass";
import { readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listWeighbridgeQuery, (_request, params) => ({ id: String(params.id ?? "") }));

export const POST = routeHandler(
  recordWeighbridgeTicket,
  async (request, params) => {
    const body = await readJson(request);
    return { ...(body && typeof body === "object" ? body : {}), id: String(params.id ?? "") };
  },
  { status: 201 },
);
