import { decideQuote } from "@/lib/commands/quotes";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../../jobs/body";

/** Body: `{ decision: "accept" | "decline" | "return", reason, version }`. */
export const POST = routeHandler(decideQuote, bodyWithId);
