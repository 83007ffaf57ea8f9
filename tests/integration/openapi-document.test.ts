import { readdirSync, readFileSync } from "node:fs";
import { join, relative, sep } from "node:path";
import { describe, expect, it } from "vitest";
import { GET as openApiRoute } from "@/app/api/openapi.json/route";
import { API_ROUTES, openApiDocument, UNDOCUMENTED_ROUTES } from "@/lib/openapi";

type Doc = ReturnType<typeof openApiDocument>;
type Operation = {
  operationId: string;
  parameters?: { in: string; name: string; required?: boolean }[];
  requestBody?: { content: Record<string, { schema: SchemaObject }> };
  responses: Record<string, unknown>;
  security: unknown[];
};
type SchemaObject = { $ref?: string; type?: string; required?: string[]; properties?: Record<string, unknown> };

const API_DIR = join(process.cwd(), "app", "api");
/**
 * Route files that are not part of the API and so are left out of the document on purpose, each
 * with the reason. The benchmark's bare route answers 404 unless the server was started with
 * RIGLINE_BENCH_ROUTES=1, which only `npm run bench` does.
 */
const BENCHMARK_ONLY_ROUTES: Record<string, string> = {
  "/api/bench/static": "static JSON of a given size, the baseline of the register API benchmark (bench/vehicles-api.ts)",
};
const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

/** Every route file under app/api with the HTTP methods it exports, as OpenAPI paths. */
function routeFiles(): { path: string; methods: string[]; file: string }[] {
  const out: { path: string; methods: string[]; file: string }[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") {
        const folder = relative(API_DIR, dir).split(sep).filter(Boolean);
        const path = `/api/${folder.map((s) => s.replace(/^\[(?:\.\.\.)?(.+)\]$/, "{$1}")).join("/")}`.replace(/\/$/, "");
        const source = readFileSync(full, "utf8");
        const methods = METHODS.filter((m) => new RegExp(`export\\s+(?:const|(?:async\\s+)?function)\\s+${m}\\b`).test(source)).map((m) => m.toLowerCase());
        out.push({ path, methods, file: relative(process.cwd(), full) });
      }
    }
  };
  walk(API_DIR);
  return out;
}

const doc: Doc = openApiDocument();
const paths = doc.paths as Record<string, Record<string, Operation>>;

function resolve(schema: SchemaObject): SchemaObject {
  if (!schema.$ref) return schema;
  const name = schema.$ref.replace("#/components/schemas/", "");
  return (doc.components?.schemas as Record<string, SchemaObject>)[name]!;
}

describe("the OpenAPI document covers the API", () => {
  const files = routeFiles();

  it("finds the route files", () => {
    expect(files.length).toBeGreaterThan(20);
    expect(files.find((f) => f.path === "/api/costs/export")?.methods).toEqual(["get"]);
    expect(files.find((f) => f.path === "/api/budgets/{id}")?.methods).toEqual(["patch", "delete"]);
  });

  it("documents every method of every route file under app/api", () => {
    const missing: string[] = [];
    for (const file of files) {
      if (UNDOCUMENTED_ROUTES[file.path] || BENCHMARK_ONLY_ROUTES[file.path]) continue;
      expect(file.methods.length, `${file.file} exports no HTTP method`).toBeGreaterThan(0);
      for (const method of file.methods) if (!paths[file.path]?.[method]) missing.push(`${method.toUpperCase()} ${file.path} (${file.file})`);
    }
    // Add the route to lib/openapi/routes.ts with the operation it runs.
    expect(missing).toEqual([]);
  });

  it("leaves the benchmark-only routes out of the document, and they exist", () => {
    for (const path of Object.keys(BENCHMARK_ONLY_ROUTES)) {
      expect(files.some((f) => f.path === path), path).toBe(true);
      expect(paths[path], path).toBeUndefined();
    }
  });

  it("documents nothing that has no route file behind it", () => {
    const exported = new Set(files.flatMap((f) => f.methods.map((m) => `${m} ${f.path}`)));
    const stale = API_ROUTES.map((r) => `${r.method} ${r.path}`).filter((key) => !exported.has(key));
    expect(stale).toEqual([]);
  });

  it("is OpenAPI 3.1 with a unique operation id, responses and security on each operation", () => {
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.info.title).toBe("Rigline API");
    const ids = new Set<string>();
    for (const [path, item] of Object.entries(paths)) {
      for (const [method, op] of Object.entries(item)) {
        expect(ids.has(op.operationId), `${method} ${path}`).toBe(false);
        ids.add(op.operationId);
        expect(Object.keys(op.responses).length, `${method} ${path}`).toBeGreaterThan(0);
        expect(Array.isArray(op.security)).toBe(true);
        for (const name of [...path.matchAll(/\{([^}]+)\}/g)].map((m) => m[1])) {
          expect(op.parameters?.some((p) => p.in === "path" && p.name === name && p.required === true), `${method} ${path} path parameter ${name}`).toBe(true);
        }
      }
    }
  });

  it("describes the error shape once and refers to it", () => {
    const error = resolve({ $ref: "#/components/schemas/Error" });
    expect(error.required).toEqual(["error"]);
    expect(JSON.stringify(paths["/api/costs"]!.post!.responses["422"])).toContain("#/components/schemas/Error");
  });
});

describe("the document is generated from the schemas that validate the routes", () => {
  it("documents as required only what the validation refuses when missing, and every field it needs", () => {
    let compared = 0;
    for (const route of API_ROUTES) {
      if (route.in !== "json" || !route.op) continue;
      const body = paths[route.path]![route.method]!.requestBody?.content["application/json"]?.schema;
      if (!body) continue;
      const schema = resolve(body);
      if (schema.type !== "object" || !schema.properties) continue;
      const pathFields = [...route.path.matchAll(/\{([^}]+)\}/g)].map((m) => route.params?.[m[1]!] ?? m[1]!);
      const parsed = route.op.input.safeParse(Object.fromEntries(pathFields.map((f) => [f, "x"])));
      const issues = parsed.success ? [] : parsed.error.issues.filter((i) => i.path.length === 1);
      const refused = new Set(issues.map((i) => String(i.path[0])));
      // A missing value of the wrong type (not a rule across fields) is refused by the field itself.
      const missing = new Set(issues.filter((i) => i.code === "invalid_type").map((i) => String(i.path[0])));
      const required = new Set((schema.required ?? []).filter((f) => !pathFields.includes(f)));
      const where = `${route.method} ${route.path}`;
      // Nothing documented as required is accepted when missing...
      expect([...required].filter((f) => !refused.has(f)), where).toEqual([]);
      // ...and every field that must be sent is documented as required.
      expect([...missing].filter((f) => f in schema.properties! && !required.has(f)), where).toEqual([]);
      compared++;
    }
    expect(compared).toBeGreaterThan(5);
  });

  it("shows the ledger filters and the export format as query parameters of the export", () => {
    const names = paths["/api/costs/export"]!.get!.parameters!.filter((p) => p.in === "query").map((p) => p.name);
    expect(names.sort()).toEqual(["category", "costCentre", "depotId", "format", "from", "kind", "source", "to", "vehicleId"]);
    expect(paths["/api/costs/export"]!.get!.parameters!.find((p) => p.name === "format")?.required).toBe(true);
    expect(Object.keys((paths["/api/costs/export"]!.get!.responses["200"] as { content: object }).content)).toEqual([
      "text/csv",
      "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
    ]);
  });

  it("keeps the path id out of the body of PATCH /api/budgets/{id}", () => {
    const body = resolve(paths["/api/budgets/{id}"]!.patch!.requestBody!.content["application/json"]!.schema);
    expect(Object.keys(body.properties ?? {}).sort()).toEqual(["amount", "costCentre", "periodEnd", "periodStart"]);
  });
});

describe("GET /api/openapi.json", () => {
  it("answers the document without a sign-in", async () => {
    const response = await openApiRoute();
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toContain("application/json");
    const body = (await response.json()) as { openapi: string; paths: Record<string, unknown> };
    expect(body.openapi).toBe("3.1.0");
    expect(body.paths["/api/tokens/{id}"]).toHaveProperty("delete");
  });
});
