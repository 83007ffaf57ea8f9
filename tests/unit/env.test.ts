import { describe, expect, it } from "vitest";
import { readEnv } from "@/lib/env";

describe("environment", () => {
  it("names a missing or bad variable", () => {
    expect(() => readEnv({})).toThrow(/AUTH_SECRET/);
    expect(() => readEnv({ AUTH_SECRET: "x".repeat(40), DATABASE_URL: "postgres://nope" })).toThrow(/DATABASE_URL/);
    expect(() => readEnv({ AUTH_SECRET: "x".repeat(40), SMTP_PORT: "99999" })).toThrow(/SMTP_PORT/);
    expect(() => readEnv({ AUTH_SECRET: "x".repeat(40), STORAGE_DRIVER: "s3" })).toThrow(/S3_ENDPOINT/);
  });

  it("defaults to a local SQLite file and accepts a remote libSQL URL unchanged", () => {
    expect(readEnv({ AUTH_SECRET: "x".repeat(40) }).DATABASE_URL).toBe("file:./data/rigline.db");
    expect(readEnv({ AUTH_SECRET: "x".repeat(40), DATABASE_URL: "libsql://fleet-db.example.io" }).DATABASE_URL).toBe(
      "libsql://fleet-db.example.io",
    );
  });
});
