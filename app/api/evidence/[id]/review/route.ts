import { reviewEvidence } from "@/lib/commands/evidence";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../../jobs/body";

/** Body: `{ decision: "accept" | "reject", reason }` (a reason is needed to reject). */
export const POST = routeHandler(reviewEvidence, bodyWithId);
