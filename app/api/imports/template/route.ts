import { attachment, importTemplate, XLSX_CONTENT_TYPE } from "@/lib/commands/imports";
import { routeHandler } from "@/lib/server/route";

/** GET /api/imports/template — the XLSX template with our headings and a notes sheet. */
export const GET = routeHandler(importTemplate, () => ({}), {
  respond: (bytes) =>
    new Response(new Uint8Array(bytes), {
      headers: {
        "content-type": XLSX_CONTENT_TYPE,
        "content-disposition": attachment("rigline-vehicle-import-template.xlsx"),
        "cache-control": "private, no-store",
      },
    }),
});
