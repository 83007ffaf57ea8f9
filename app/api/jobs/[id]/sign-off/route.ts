import { signOffJob } from "@/lib/commands/jobs";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../body";

/** Body: `{ version? } — books the cost`. */
export const POST = routeHandler(signOffJob, bodyWithId);
