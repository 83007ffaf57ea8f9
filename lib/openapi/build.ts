import { z } from "zod";
import type { ZodOpenApiOperationObject, ZodOpenApiPathsObject, ZodOpenApiResponsesObject } from "zod-openapi";
import type { Action, Subject } from "@/lib/permissions";

/**
 * How one route is documented. Every field comes from the route itself: the operation it runs
 * (whose zod input schema is the one that validates the request), where the request carries
 * that input, and what it answers.
 */
export type HttpMethod = "get" | "post" | "put" | "patch" | "delete";

/** Where the operation's input comes from in the request. */
export type InputPlace = "query" | "json" | "multipart" | "none";

export type ResponseKind = "json" | "csv-or-xlsx" | "xlsx" | "pdf" | "file";

export type ApiRoute = {
  method: HttpMethod;
  /** OpenAPI path, e.g. /api/vehicles/{id}. */
  path: string;
  summary: string;
  tag: string;
  /** The operation's input schema and permission (lib/server/operation), or an explicit schema. */
  op?: { name?: string; input: z.ZodType; permission: readonly [Action, Subject] };
  input?: z.ZodType;
  /** Path parameter → the input field it fills (default: the same name). */
  params?: Record<string, string>;
  in: InputPlace;
  success?: { status?: number; description: string; kind?: ResponseKind };
  /** No sign-in needed (health, this document). */
  public?: boolean;
  /** Answers 409 on an illegal state change or a stale version. */
  conflicts?: boolean;
  description?: string;
};

/** The one API error shape. */
export const errorBodySchema = z
  .object({
    error: z.object({
      code: z.enum(["bad_request", "unauthenticated", "forbidden", "not_found", "conflict", "payload_too_large", "unsupported_media_type", "validation_failed", "rate_limited", "internal"]),
      message: z.string(),
      details: z.array(z.object({ field: z.string().optional(), row: z.number().optional(), column: z.string().optional(), message: z.string() })),
    }),
  })
  .meta({ id: "Error", description: 'The one error shape: {"error":{"code","message","details"}}' });

type Def = { type: string; in?: z.ZodType; out?: z.ZodType; left?: z.ZodType; right?: z.ZodType; options?: z.ZodType[]; innerType?: z.ZodType };

function defOf(schema: z.ZodType): Def {
  return (schema as unknown as { _zod: { def: Def } })._zod.def;
}

function isOptional(schema: z.ZodType): boolean {
  const type = defOf(schema).type;
  return type === "optional" || type === "default" || type === "prefault";
}

/**
 * The form a client sends a field in: through z.preprocess (whose input is "anything", which
 * JSON Schema cannot say) to the schema it feeds, and through transforms to what they read.
 */
function clientSide(field: z.ZodType): z.ZodType {
  const def = defOf(field);
  if (def.type !== "pipe") return field;
  const side = defOf(def.in!).type === "transform" ? clientSide(def.out!) : clientSide(def.in!);
  // The field's own description and examples stay with it.
  const { id: _id, ...meta } = (field.meta() ?? {}) as Record<string, unknown>;
  return Object.keys(meta).length > 0 ? side.meta({ ...((side.meta() ?? {}) as Record<string, unknown>), ...meta }) : side;
}

const shown = new WeakMap<z.ZodObject, z.ZodType>();
const named = new WeakMap<z.ZodType, z.ZodType>();

/**
 * An object whose fields are shown as the validation reads them: each field in the form the
 * client sends it, optional exactly when the validation accepts it missing. A whole object keeps
 * its metadata and component id (and is built once, so the id stays unique).
 */
function asValidated(object: z.ZodObject, fields: readonly string[] = []): z.ZodType {
  if (fields.length === 0 && shown.has(object)) return shown.get(object)!;
  const shape = { ...object.shape } as Record<string, z.ZodType>;
  let changed = fields.length > 0;
  for (const f of fields) delete shape[f];
  for (const [key, field] of Object.entries(shape)) {
    if (isOptional(field)) continue;
    const side = clientSide(field);
    const next = field.safeParse(undefined).success ? side.optional() : side;
    if (next !== field) {
      shape[key] = next;
      changed = true;
    }
  }
  let result: z.ZodType = object;
  if (changed) {
    const meta = (object.meta() ?? {}) as Record<string, unknown>;
    // A part of a schema is not the schema: it loses the component id, keeps the rest.
    const { id: _id, ...rest } = meta;
    const keep = fields.length === 0 ? meta : rest;
    result = Object.keys(keep).length > 0 ? z.object(shape).meta(keep) : z.object(shape);
  }
  if (fields.length === 0) shown.set(object, result);
  return result;
}

/**
 * The part of an input schema the request body or query string carries: the same field schemas
 * without the fields the path fills. Looks through transforms (to the side the client sends),
 * intersections and unions; a schema of another shape is used as it is. An object left whole
 * keeps its component id.
 */
export function withoutFields(schema: z.ZodType, fields: readonly string[]): z.ZodType {
  const def = defOf(schema);
  switch (def.type) {
    case "object":
      return asValidated(schema as z.ZodObject, fields);
    case "pipe": {
      // z.preprocess(fn, schema) is a pipe from a transform: the client sends what `out` reads.
      const side = defOf(def.in!).type === "transform" ? def.out! : def.in!;
      const inner = withoutFields(side, fields);
      if (fields.length > 0) return inner;
      const meta = schema.meta() as Record<string, unknown> | undefined;
      if (!meta?.id) return inner;
      // The whole schema's name (say ManualCostInput) goes with what the client sends.
      if (!named.has(schema)) named.set(schema, inner.meta(meta));
      return named.get(schema)!;
    }
    case "intersection":
      if (fields.length === 0) return schema;
      return z.intersection(withoutFields(def.left!, fields), withoutFields(def.right!, fields));
    case "union":
      if (fields.length === 0) return schema;
      return z.union(def.options!.map((o) => withoutFields(o, fields)) as [z.ZodType, z.ZodType, ...z.ZodType[]]);
    default:
      return schema;
  }
}

/** Marks optional the fields of object nodes (through intersections) that the validation fills in. */
function relax(schema: z.ZodType, filled: ReadonlySet<string>): z.ZodType {
  const def = defOf(schema);
  if (def.type === "intersection") return z.intersection(relax(def.left!, filled), relax(def.right!, filled));
  if (def.type !== "object") return schema;
  const shape = { ...(schema as z.ZodObject).shape } as Record<string, z.ZodType>;
  let changed = false;
  for (const [key, field] of Object.entries(shape)) {
    if (filled.has(key) && !isOptional(field)) {
      shape[key] = field.optional();
      changed = true;
    }
  }
  return changed ? z.object(shape) : schema;
}

function topLevelFields(schema: z.ZodType): string[] {
  const def = defOf(schema);
  if (def.type === "object") return Object.keys((schema as z.ZodObject).shape);
  if (def.type === "intersection") return [...topLevelFields(def.left!), ...topLevelFields(def.right!)];
  return [];
}

/**
 * What the client sends for an input schema: the fields without those the path fills, and a
 * field that the validation fills in when it is missing (a preprocess that makes up a key, a
 * default) shown as optional. Found by asking the schema itself what it refuses when only the
 * path is given.
 */
export function requestShape(schema: z.ZodType, pathFields: readonly string[]): z.ZodType {
  const carried = withoutFields(schema, pathFields);
  const fields = topLevelFields(carried);
  if (fields.length === 0) return carried;
  const probe = schema.safeParse(Object.fromEntries(pathFields.map((f) => [f, "x"])));
  const issues = probe.success ? [] : probe.error.issues;
  // A refusal of the whole input (a union, a wrong type) says nothing about single fields.
  if (issues.some((i) => i.path.length === 0)) return carried;
  const refused = new Set(issues.map((i) => String(i.path[0])));
  const filled = new Set(fields.filter((f) => !refused.has(f)));
  return filled.size === 0 ? carried : relax(carried, filled);
}

const JSON_TYPE = "application/json";

function successContent(kind: ResponseKind | undefined) {
  switch (kind ?? "json") {
    case "json":
      return { [JSON_TYPE]: { schema: z.unknown() } };
    case "csv-or-xlsx":
      return {
        "text/csv": { schema: z.string().meta({ description: "UTF-8 CSV with a byte order mark, header row and totals row" }) },
        "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet": { schema: z.string().meta({ format: "binary" }) },
      };
    case "xlsx":
      return { "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet": { schema: z.string().meta({ format: "binary" }) } };
    case "pdf":
      return { "application/pdf": { schema: z.string().meta({ format: "binary" }) } };
    case "file":
      return { "application/octet-stream": { schema: z.string().meta({ format: "binary", description: "The stored file, with its own content type" }) } };
  }
}

const errorResponse = (description: string) => ({ description, content: { [JSON_TYPE]: { schema: errorBodySchema } } });

function operationOf(route: ApiRoute): ZodOpenApiOperationObject {
  const input = route.op?.input ?? route.input;
  const pathNames = [...route.path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1]!);
  const fromPath = pathNames.map((name) => route.params?.[name] ?? name);
  const operation: ZodOpenApiOperationObject = {
    operationId: `${route.method}${route.path.replace(/^\/api/, "").replace(/\{([^}]+)\}/g, "By-$1").replace(/[^A-Za-z0-9]+(.)?/g, (_m, c: string | undefined) => (c ? c.toUpperCase() : ""))}`,
    summary: route.summary,
    tags: [route.tag],
    ...(route.description ? { description: route.description } : {}),
    responses: {},
  };
  if (route.op) (operation as unknown as Record<string, unknown>)["x-permission"] = `${route.op.permission[0]} ${route.op.permission[1]}`;
  if (pathNames.length > 0) {
    operation.requestParams = { path: z.object(Object.fromEntries(pathNames.map((name) => [name, z.string().meta({ description: `${name} of the record` })]))) };
  }
  if (input && route.in !== "none") {
    const carried = requestShape(input, fromPath);
    if (route.in === "query") {
      const query = defOf(carried).type === "object" ? (carried as z.ZodObject) : null;
      if (query && Object.keys(query.shape).length > 0) operation.requestParams = { ...operation.requestParams, query };
    } else {
      operation.requestBody = {
        required: true,
        content: { [route.in === "json" ? JSON_TYPE : "multipart/form-data"]: { schema: carried } },
      };
    }
  }
  const responses: ZodOpenApiResponsesObject = {
    [String(route.success?.status ?? 200)]: { description: route.success?.description ?? "Done", content: successContent(route.success?.kind) },
  };
  if (input && route.in !== "none") {
    responses["400"] = errorResponse("The body is not valid JSON or form data");
    responses["422"] = errorResponse("Some fields need attention; each detail names its field");
  }
  if (!route.public) {
    responses["401"] = errorResponse("Not signed in, or the API token is unknown, revoked or its user deactivated");
    responses["403"] = errorResponse("The user's role may not do this");
    operation.security = [{ bearerToken: [] }, { session: [] }];
  } else {
    operation.security = [];
  }
  if (pathNames.length > 0) responses["404"] = errorResponse("Not found, or not visible to this user (another organisation's ids are never revealed)");
  if (route.conflicts) responses["409"] = errorResponse("Not allowed in the record's current state, or someone changed it since");
  operation.responses = responses;
  return operation;
}

/** The paths object of the document, one operation per route and method. */
export function pathsOf(routes: readonly ApiRoute[]): ZodOpenApiPathsObject {
  const paths: ZodOpenApiPathsObject = {};
  for (const route of routes) {
    const item = (paths[route.path] ??= {});
    if (item[route.method]) throw new Error(`${route.method.toUpperCase()} ${route.path} is documented twice`);
    item[route.method] = operationOf(route);
  }
  return paths;
}
