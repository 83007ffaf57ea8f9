import { readJson, routeHandler } from "@/lib/server/route";
import { batteryCalcOp } from "../operations";

export const POST = routeHandler(batteryCalcOp, (request) => readJson(request));
