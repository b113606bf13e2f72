/**
 * The type a value has after a trip through JSON: what `Response.json(x)` on
 * the server becomes in `await res.json()` in the browser. Dates become ISO
 * strings, undefined properties drop out, functions vanish. Client types are
 * written as `Jsonified<ReturnType of the query>`, never restated by hand.
 *
 * @example
 * ```ts
 * type Batch = Jsonified<NonNullable<Awaited<ReturnType<typeof getBatch>>>>;
 * ```
 */
export type Jsonified<T> = T extends Date
  ? string
  : T extends string | number | boolean | null
    ? T
    : T extends undefined | ((...args: never[]) => unknown)
      ? never
      : T extends readonly (infer U)[]
        ? Jsonified<U>[]
        : T extends object
          ? { [K in keyof T as T[K] extends (...args: never[]) => unknown ? never : K]: Jsonified<T[K]> }
          : T;

/** The JSON a query function's promise resolves to, as the client receives it (null removed). */
export type ApiData<F extends (...args: never[]) => Promise<unknown>> = Jsonified<NonNullable<Awaited<ReturnType<F>>>>;

/**
 * A server value as the browser will see it, for a server page handing a
 * query's result to a client component (dates become ISO strings).
 *
 * @example
 * ```tsx
 * <RevisionView initial={asJson(rev)} />
 * ```
 */
export function asJson<T>(value: T): Jsonified<T> {
  return JSON.parse(JSON.stringify(value)) as Jsonified<T>;
}
