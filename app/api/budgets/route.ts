import { createBudget, listBudgets } from "@/lib/commands/costs";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

export const GET = routeHandler(listBudgets, (request) => queryParams(request));

export const POST = routeHandler(createBudget, (request) => readJson(request), { status: 201 });
