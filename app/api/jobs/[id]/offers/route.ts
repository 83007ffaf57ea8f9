import { offerJob } from "@/lib/commands/jobs";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../body";

/** Body: `{ firmIds: [...], dueAt }`. */
export const POST = routeHandler(offerJob, bodyWithId);
