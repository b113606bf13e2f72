/**
 * A count with its noun, in the singular for one and the plural otherwise.
 *
 * @example
 * ```ts
 * plural(1, "error"); // "1 error"
 * plural(3, "error"); // "3 errors"
 * plural(2, "batch", "batches"); // "2 batches"
 * ```
 */
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}

/**
 * The word alone, chosen by the count ("it is" / "they are", say).
 *
 * @example
 * ```ts
 * pluralWord(1, "it is", "they are"); // "it is"
 * ```
 */
export function pluralWord(count: number, one: string, many = `${one}s`): string {
  return count === 1 ? one : many;
}
