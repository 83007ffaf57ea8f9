import "server-only";
import { createDocument, type ZodOpenApiObject } from "zod-openapi";
import { pathsOf, type ApiRoute } from "./build";
import { API_ROUTES } from "./routes";

export const API_VERSION = "1.0.0";

/** The OpenAPI 3.1 document of Rigline's API, built from the routes' own zod schemas. */
export function openApiDocument(routes: readonly ApiRoute[] = API_ROUTES, serverUrl?: string): ReturnType<typeof createDocument> {
  const spec: ZodOpenApiObject = {
    openapi: "3.1.0",
    info: {
      title: "Rigline API",
      version: API_VERSION,
      description:
        "Fit-out control for remote-area fleets. Every request acts as one user inside one organisation: a signed-in session, or a personal API token sent as `Authorization: Bearer <token>` (created under Profile → API tokens; a token carries its user's role and never more). Errors always have the shape {\"error\":{\"code\",\"message\",\"details\"}}. Money is in integer cents unless a field says dollars; masses in kg, lengths in mm.",
    },
    ...(serverUrl ? { servers: [{ url: serverUrl }] } : {}),
    components: {
      securitySchemes: {
        bearerToken: { type: "http", scheme: "bearer", description: "A personal API token (rgl_…)" },
        session: { type: "apiKey", in: "cookie", name: "authjs.session-token", description: "The browser session of a signed-in user" },
      },
    },
    paths: pathsOf(routes),
  };
  return createDocument(spec, {
    // Files in multipart uploads are unrepresentable as JSON Schema; they show as empty schemas.
    allowEmptySchema: { custom: true, file: true },
    override: ({ jsonSchema, zodSchema, io }) => {
      const type = (zodSchema as unknown as { _zod: { def: { type: string } } })._zod.def.type;
      if (type === "date" && io === "output") {
        jsonSchema.type = "string";
        jsonSchema.format = "date-time";
      }
    },
  });
}
