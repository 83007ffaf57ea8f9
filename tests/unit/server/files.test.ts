import { describe, expect, it } from "vitest";
import { contentDisposition, fileResponse } from "@/lib/server/files";

describe("contentDisposition", () => {
  it("gives a plain ASCII name as is", () => {
    expect(contentDisposition("attachment", "rigline-costs-2026-06-30.csv")).toBe('attachment; filename="rigline-costs-2026-06-30.csv"');
  });

  it("adds the exact UTF-8 name beside an ASCII fallback", () => {
    // RFC 6266 §5 example: attachment; filename="EURO rates"; filename*=utf-8''%e2%82%ac%20rates
    // (charset and percent-encoding are case-insensitive, RFC 5987 §3.2.1).
    const header = contentDisposition("attachment", "€ rates");
    expect(header.toLowerCase()).toBe(`attachment; filename="_ rates"; filename*=utf-8''%e2%82%ac%20rates`);
  });

  it("never lets a quote or backslash end the quoted name early", () => {
    expect(contentDisposition("inline", 'a"b\\c.jpg')).toMatch(/^inline; filename="a_b_c\.jpg"; filename\*=UTF-8''/);
  });
});

describe("fileResponse", () => {
  it("answers an upload inline, sandboxed, unsniffed, with its length and entity tag", async () => {
    const response = fileResponse({ body: Buffer.from("hello"), contentType: "image/png", filename: "p.png", disposition: "inline", sha256: "abc" });
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("image/png");
    expect(response.headers.get("content-length")).toBe("5");
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("content-security-policy")).toContain("sandbox");
    expect(response.headers.get("etag")).toBe('"abc"');
    expect(response.headers.get("cache-control")).toBe("private, no-store");
    expect(await response.text()).toBe("hello");
  });

  it("saves a download as an attachment and caches privately only when asked", () => {
    const response = fileResponse({ body: "a,b\n", contentType: "text/csv", filename: "x.csv", maxAgeSeconds: 60, headers: { "x-rigline-rows": "1" } });
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="x.csv"');
    expect(response.headers.get("content-security-policy")).toBeNull();
    expect(response.headers.get("cache-control")).toBe("private, max-age=60");
    expect(response.headers.get("x-rigline-rows")).toBe("1");
  });
});
