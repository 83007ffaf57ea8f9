import { readJson, routeHandler } from "@/lib/server/route";
import { tyreChangeCalc } from "../operations";

export const POST = routeHandler(tyreChangeCalc, (request) => readJson(request));
