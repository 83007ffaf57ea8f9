import { afterEach, describe, expect, it } from "vitest";
import { GET } from "@/app/api/bench/static/route";

const request = (query: string) => new Request(`http://localhost/api/bench/static${query}`);

describe("GET /api/bench/static (benchmark only)", () => {
  afterEach(() => {
    delete process.env.RIGLINE_BENCH_ROUTES;
  });

  it("is not found unless the server was started for the benchmark", async () => {
    const response = GET(request("?bytes=1000"));
    expect(response.status).toBe(404);
    expect(((await response.json()) as { error: { code: string } }).error.code).toBe("not_found");
  });

  it("answers JSON of exactly the bytes asked for", async () => {
    process.env.RIGLINE_BENCH_ROUTES = "1";
    for (const bytes of [16, 37_132, 100_001]) {
      const response = GET(request(`?bytes=${bytes}`));
      expect(response.status).toBe(200);
      expect(response.headers.get("content-type")).toBe("application/json");
      const body = new Uint8Array(await response.arrayBuffer());
      expect(body.byteLength).toBe(bytes);
      expect(JSON.parse(new TextDecoder().decode(body))).toHaveProperty("padding");
    }
  });

  it("refuses a size that is missing, not a whole number or out of range, naming the field", async () => {
    process.env.RIGLINE_BENCH_ROUTES = "1";
    for (const query of ["", "?bytes=abc", "?bytes=1.5", "?bytes=2", "?bytes=2000000"]) {
      const response = GET(request(query));
      expect(response.status, query).toBe(422);
      const body = (await response.json()) as { error: { details: { field: string }[] } };
      expect(body.error.details[0]?.field).toBe("bytes");
    }
  });
});
