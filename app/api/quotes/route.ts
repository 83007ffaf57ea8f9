import { createQuote, listQuotes } from "@/lib/commands/quotes";
import { queryParams, readJson, routeHandler } from "@/lib/server/route";

/** Quotes the caller may see (a contractor: their own firm's only); filters `jobId`, `status`. */
export const GET = routeHandler(listQuotes, (request) => queryParams(request), {
  respond: (items) => Response.json({ items }),
});

/** A contractor starts a quote: `{ jobId, lines?, validUntil?, notes? }`. */
export const POST = routeHandler(createQuote, (request) => readJson(request), { status: 201 });
