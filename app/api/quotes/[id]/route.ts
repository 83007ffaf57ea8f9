import { getQuote, updateQuote } from "@/lib/commands/quotes";
import { routeHandler } from "@/lib/server/route";
import { bodyWithId } from "../../jobs/body";

export const GET = routeHandler(getQuote, (_request, params) => ({ id: params.id }));

/** Replace the lines, validity and notes of a draft or returned quote: `{ lines, validUntil, notes, version? }`. */
export const PATCH = routeHandler(updateQuote, bodyWithId);
