import { importTemplate, XLSX_CONTENT_TYPE } from "@/lib/commands/imports";
import { fileResponse } from "@/lib/server/files";
import { routeHandler } from "@/lib/server/route";

/** GET /api/imports/template — the XLSX template with our headings and a notes sheet. */
export const GET = routeHandler(importTemplate, () => ({}), {
  respond: (bytes) => fileResponse({ body: bytes, contentType: XLSX_CONTENT_TYPE, filename: "rigline-vehicle-import-template.xlsx" }),
});
