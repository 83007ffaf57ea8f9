import { closeJob } from "@/lib/commands/jobs";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../body";

/** Body: `{}`. */
export const POST = routeHandler(closeJob, bodyWithId);
