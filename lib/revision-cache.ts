import { LRUCache } from "lru-cache";

/**
 * Answers kept while the data they were computed from is unchanged: each entry records the
 * data's revision when it was computed and the span of time it holds for (from the instant it
 * was computed for, until the first instant time alone could change it). A lookup names the
 * revision it reads now and its own instant; anything else is a miss. Least recently used
 * entries go first once the total size passes `maxSize`.
 */
export type RevisionCacheOptions<V> = {
  maxEntries: number;
  maxSize: number;
  /** Size of one value, in the units of maxSize (at least 1). */
  sizeOf: (value: V) => number;
};

type Entry<V> = { revision: number; fromMs: number; untilMs: number | null; value: V };

export class RevisionCache<V extends object> {
  private readonly entries: LRUCache<string, Entry<V>>;

  constructor(options: RevisionCacheOptions<V>) {
    this.entries = new LRUCache<string, Entry<V>>({
      max: options.maxEntries,
      maxSize: options.maxSize,
      sizeCalculation: (entry) => Math.max(1, options.sizeOf(entry.value)),
    });
  }

  /** The value kept for `key` if it was computed at `revision` and still holds at `nowMs`. */
  get(key: string, revision: number, nowMs: number): V | undefined {
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    // Revisions only rise: an entry of an older one can never be served again, so it goes now.
    if (entry.revision < revision) {
      this.entries.delete(key);
      return undefined;
    }
    if (entry.revision !== revision || nowMs < entry.fromMs || (entry.untilMs !== null && nowMs >= entry.untilMs)) return undefined;
    return entry.value;
  }

  /**
   * Keeps `value`, computed from data at `revision` for the instant `fromMs`, until `untilMs`
   * (null: until the data changes). An entry computed at a later revision is not replaced by
   * one from an earlier revision (a slow computation finishing last).
   */
  set(key: string, revision: number, fromMs: number, untilMs: number | null, value: V): void {
    if (untilMs !== null && untilMs <= fromMs) return;
    const kept = this.entries.peek(key);
    if (kept && kept.revision > revision) return;
    this.entries.set(key, { revision, fromMs, untilMs, value });
  }

  clear(): void {
    this.entries.clear();
  }

  get size(): number {
    return this.entries.size;
  }
}
