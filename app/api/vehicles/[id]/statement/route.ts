import { statementQuery } from "@/lib/commands/mass";
import { fileResponse } from "@/lib/server/files";
import { executeForRequest } from "@/lib/server/operation";
import { jsonError, queryParams } from "@/lib/server/route";
import { renderStatementPdf } from "@/lib/statement";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The printable mass statement of a vehicle as a PDF, for the loading in the query string. */
export async function GET(request: Request, context: { params: Promise<Record<string, string | string[]>> }) {
  try {
    const params = await context.params;
    const { data, filename } = await executeForRequest(statementQuery, { ...queryParams(request), id: String(params.id ?? "") });
    const pdf = await renderStatementPdf(data);
    return fileResponse({ body: pdf, contentType: "application/pdf", filename });
  } catch (error) {
    return jsonError(error);
  }
}
