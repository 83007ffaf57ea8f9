import { financeApproval } from "@/lib/commands/quotes";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../../jobs/body";

/** Body: `{ approve: true | false, reason, version }`. */
export const POST = routeHandler(financeApproval, bodyWithId);
