import { readJson, routeHandler } from "@/lib/server/route";
import { axleLoadsCalc } from "../operations";

export const POST = routeHandler(axleLoadsCalc, (request) => readJson(request));
