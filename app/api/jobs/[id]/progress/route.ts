import { progressJob } from "@/lib/commands/jobs";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../body";

/** Body: `{ to: "in_workshop" | "evidence_lodged" }`. */
export const POST = routeHandler(progressJob, bodyWithId);
