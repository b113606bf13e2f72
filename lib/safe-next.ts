/**
 * Where the browser may go after signing in or creating an account: only a
 * path on our own origin. Used by the server pages (their redirect) and by the
 * client forms (router.replace), so both sides apply the same rule.
 */

/** A base that no real request uses; a value that keeps this origin is a path of ours. */
const BASE = "http://x.invalid";
/** Longer `next` values are not links anyone made by hand. */
const MAX_LENGTH = 2048;

/**
 * The path, query and fragment of `value` when it resolves, with the URL
 * parser browsers use, to our own origin; `fallback` otherwise. A backslash
 * (`/\evil.example`), a second slash, a scheme (`https:`, `javascript:`), or
 * tabs and newlines that the parser removes cannot lead off-site. The answer
 * never starts with `//` or `/\`.
 *
 * @example
 * ```ts
 * safeNextPath("/formulations?sort=name"); // "/formulations?sort=name"
 * safeNextPath("/\\evil.example"); // "/home"
 * ```
 */
export function safeNextPath(value: unknown, fallback = "/home"): string {
  const raw = Array.isArray(value) ? (value as unknown[])[0] : value;
  if (typeof raw !== "string" || raw.length === 0 || raw.length > MAX_LENGTH || raw[0] !== "/") return fallback;
  let url: URL;
  try {
    url = new URL(raw, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // A pathname such as "//evil.example" (from "/a/..//evil.example") would leave the site when used as a link.
  if (!path.startsWith("/") || path.startsWith("//") || path.startsWith("/\\")) return fallback;
  return path;
}
