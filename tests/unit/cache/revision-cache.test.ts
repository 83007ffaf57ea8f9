import { describe, expect, it } from "vitest";
import { RevisionCache } from "@/lib/revision-cache";

const make = (maxSize = 100, maxEntries = 10) => new RevisionCache<{ rows: number[] }>({ maxEntries, maxSize, sizeOf: (v) => v.rows.length });
const T = 1_000_000;

describe("RevisionCache", () => {
  it("serves a value only for the revision it was computed at", () => {
    const cache = make();
    const value = { rows: [1, 2] };
    cache.set("page-1", 7, T, null, value);
    expect(cache.get("page-1", 7, T)).toBe(value);
    expect(cache.get("page-1", 6, T)).toBeUndefined();
    expect(cache.get("page-2", 7, T)).toBeUndefined();
    expect(cache.size).toBe(1);
    // Asked for at a later revision, the older entry is let go; it could never be served again.
    expect(cache.get("page-1", 8, T)).toBeUndefined();
    expect(cache.size).toBe(0);
    expect(cache.get("page-1", 7, T)).toBeUndefined();
  });

  it("serves a value from the instant it was computed for until (not at) its valid-until instant", () => {
    const cache = make();
    cache.set("page-1", 1, T, T + 500, { rows: [1] });
    expect(cache.get("page-1", 1, T - 1)).toBeUndefined();
    expect(cache.get("page-1", 1, T)).toBeDefined();
    expect(cache.get("page-1", 1, T + 499)).toBeDefined();
    expect(cache.get("page-1", 1, T + 500)).toBeUndefined();
  });

  it("keeps nothing that is already out of date, and no older revision over a newer one", () => {
    const cache = make();
    cache.set("stale", 1, T, T, { rows: [1] });
    expect(cache.get("stale", 1, T)).toBeUndefined();
    const newer = { rows: [2] };
    cache.set("page-1", 5, T, null, newer);
    cache.set("page-1", 4, T, null, { rows: [1] });
    expect(cache.get("page-1", 5, T)).toBe(newer);
    const newest = { rows: [3] };
    cache.set("page-1", 6, T, null, newest);
    expect(cache.get("page-1", 6, T)).toBe(newest);
  });

  it("lets the least recently used values go once their total size passes the limit", () => {
    const cache = make(10);
    cache.set("a", 1, T, null, { rows: [1, 2, 3, 4] });
    cache.set("b", 1, T, null, { rows: [1, 2, 3, 4] });
    expect(cache.get("a", 1, T)).toBeDefined(); // a is now the more recently used
    cache.set("c", 1, T, null, { rows: [1, 2, 3, 4] });
    expect(cache.get("b", 1, T)).toBeUndefined();
    expect(cache.get("a", 1, T)).toBeDefined();
    expect(cache.get("c", 1, T)).toBeDefined();
    cache.clear();
    expect(cache.size).toBe(0);
  });

  it("bounds the number of entries, and counts an empty value as size 1", () => {
    const cache = make(1_000, 3);
    for (const key of ["a", "b", "c", "d"]) cache.set(key, 1, T, null, { rows: [] });
    expect(cache.size).toBe(3);
    expect(cache.get("a", 1, T)).toBeUndefined();
  });
});
