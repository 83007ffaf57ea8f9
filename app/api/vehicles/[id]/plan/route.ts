import { addPlannedItem, listPlanQuery, planEdition } from "@/lib/commands/mass";
import { jsonError, readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listPlanQuery, (_request, params) => ({ id: String(params.id ?? "") }));

const addItem = routeHandler(addPlannedItem, async (request, params) => ({ ...(await bodyOf(request)), id: String(params.id ?? "") }), { status: 201 });
const addEdition = routeHandler(planEdition, async (request, params) => ({ ...(await bodyOf(request)), id: String(params.id ?? "") }), { status: 201 });

async function bodyOf(request: Request): Promise<Record<string, unknown>> {
  const body = await readJson(request);
  return body && typeof body === "object" && !Array.isArray(body) ? (body as Record<string, unknown>) : {};
}

/** One planned item, or `{ "editionId": … }` to plan an edition's short lines at once. */
export async function POST(request: Request, context: { params: Promise<Record<string, string | string[]>> }) {
  try {
    const peek = await request.clone().text();
    let parsed: unknown = null;
    try {
      parsed = peek ? JSON.parse(peek) : null;
    } catch {
      parsed = null;
    }
    const wantsEdition = parsed !== null && typeof parsed === "object" && "editionId" in parsed;
    return await (wantsEdition ? addEdition : addItem)(request, context);
  } catch (error) {
    return jsonError(error);
  }
}
