import { withdrawQuote } from "@/lib/commands/quotes";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../../jobs/body";

/** Body: `{ reason? }`. */
export const POST = routeHandler(withdrawQuote, bodyWithId);
