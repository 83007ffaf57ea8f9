import { cancelJob } from "@/lib/commands/jobs";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../body";

/** Body: `{ reason }`. */
export const POST = routeHandler(cancelJob, bodyWithId);
