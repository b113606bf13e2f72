/**
 * A memo keyed by a short list of plain numbers (the material constants a
 * folded factor is made of), never by object identity: two materials with
 * the same numbers share one entry, and a material edited between calls gets
 * a new one. The numbers are hashed in float arithmetic to find a bucket and
 * then compared one by one, so a hash collision can never return another
 * list's value.
 */
export class ValueKeyedCache<T> {
  private readonly buckets = new Map<number, { key: number[]; value: T }[]>();
  private size = 0;

  /** @param limit - entries kept before the cache is emptied */
  constructor(private readonly limit = 1000) {}

  /**
   * The value for `key`, built by `build` on the first call with these numbers.
   * An absent constant is best passed as a number no valid material carries (−1).
   *
   * @param key - the defining numbers (finite; the list is copied when stored)
   * @param build - makes the value from the numbers
   * @example
   * ```ts
   * const cache = new ValueKeyedCache<number>();
   * cache.get([2, 3], () => 2 * 3); // 6, built
   * cache.get([2, 3], () => 0);     // 6, from the cache
   * ```
   */
  get(key: readonly number[], build: () => T): T {
    let hash = 0;
    for (let i = 0; i < key.length; i += 1) hash = hash * 31.000001 + (key[i] as number);
    let bucket = this.buckets.get(hash);
    if (bucket !== undefined) {
      for (const entry of bucket) {
        if (sameNumbers(entry.key, key)) return entry.value;
      }
    }
    if (this.size >= this.limit) {
      this.buckets.clear();
      this.size = 0;
      bucket = undefined;
    }
    const value = build();
    if (bucket === undefined) {
      bucket = [];
      this.buckets.set(hash, bucket);
    }
    bucket.push({ key: key.slice(), value });
    this.size += 1;
    return value;
  }
}

function sameNumbers(a: readonly number[], b: readonly number[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i += 1) if (!Object.is(a[i], b[i])) return false;
  return true;
}
