import { readJson, routeHandler } from "@/lib/server/route";
import { cableRunCalc } from "../operations";

export const POST = routeHandler(cableRunCalc, (request) => readJson(request));
