import { submitQuote } from "@/lib/commands/quotes";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../../jobs/body";

/** Body: `{ version? }`. */
export const POST = routeHandler(submitQuote, bodyWithId);
