/**
 * The kinds of value an environment setting can hold, as zod schemas from the
 * raw text (or undefined) to a typed value. Each refuses a bad value with a
 * message saying what is expected; lib/settings.ts puts the variable's name
 * and value in front of it. A blank value counts as unset.
 */
import { isIP } from "node:net";
import { z } from "zod";

/** The raw text of one variable: undefined when unset or blank. */
const raw = z.string().optional().transform((v) => (v === undefined || v.trim() === "" ? undefined : v.trim()));

/** A whole number from `min` to `max`; `fallback` when unset. */
export function wholeNumber(min: number, max: number, fallback: number) {
  return raw.transform((v, ctx): number => {
    if (v === undefined) return fallback;
    const n = /^[+-]?\d+$/.test(v) ? Number(v) : NaN;
    if (Number.isSafeInteger(n) && n >= min && n <= max) return n;
    ctx.addIssue({ code: "custom", message: `a whole number from ${min.toLocaleString("en")} to ${max.toLocaleString("en")}` });
    return z.NEVER;
  });
}

/** One of `choices`; `fallback` when unset. */
export function oneOf<const T extends string>(choices: readonly T[], fallback: T) {
  return raw.transform((v, ctx): T => {
    if (v === undefined) return fallback;
    if ((choices as readonly string[]).includes(v)) return v as T;
    ctx.addIssue({ code: "custom", message: `one of ${choices.join(", ")}` });
    return z.NEVER;
  });
}

/** Any text (kept as written, without surrounding blanks); `fallback` when unset. */
export function text(fallback: string) {
  return raw.transform((v): string => v ?? fallback);
}

/** Optional text: undefined when unset. */
export const optionalText = raw;

/**
 * A URL whose protocol is one of `protocols` (e.g. ["http:", "https:"]);
 * undefined when unset. The URL is kept as written.
 */
export function url(protocols: readonly string[], example: string) {
  return raw.transform((v, ctx): string | undefined => {
    if (v === undefined) return undefined;
    let parsed: URL | undefined;
    try {
      parsed = new URL(v);
    } catch {
      parsed = undefined;
    }
    if (parsed && protocols.includes(parsed.protocol)) return v;
    const schemes = protocols.map((p) => `${p}//`).join(" or ");
    ctx.addIssue({ code: "custom", message: `a URL starting with ${schemes} (example: ${example})` });
    return z.NEVER;
  });
}

/** A comma-separated list, blanks dropped. */
function list(value: string | undefined): string[] {
  return (value ?? "")
    .split(",")
    .map((v) => v.trim())
    .filter(Boolean);
}

/** proxy-addr's named ranges, accepted as they are. */
const PROXY_NAMES = new Set(["loopback", "linklocal", "uniquelocal"]);

/** True for an IPv4 or IPv6 address, a CIDR range, or one of proxy-addr's named ranges. */
export function isProxyEntry(entry: string): boolean {
  if (PROXY_NAMES.has(entry)) return true;
  const [address, bits, extra] = entry.split("/");
  const family = isIP(address ?? "");
  const maxBits = family === 6 ? 128 : 32;
  const bitsOk = bits === undefined || (/^\d{1,3}$/.test(bits) && Number(bits) <= maxBits);
  return family !== 0 && bitsOk && extra === undefined;
}

/**
 * Addresses or CIDR ranges of trusted reverse proxies, comma-separated.
 *
 * @example proxyList.parse("10.0.0.5, 10.1.0.0/16") // ["10.0.0.5", "10.1.0.0/16"]
 */
export const proxyList = raw.transform((v, ctx): string[] => {
  const entries = list(v);
  const bad = entries.filter((e) => !isProxyEntry(e));
  if (bad.length === 0) return entries;
  ctx.addIssue({
    code: "custom",
    message: `IP addresses or CIDR ranges, comma-separated (examples: 10.0.0.5, 10.0.0.0/8, ::1, loopback); not ${bad.map((b) => `“${b}”`).join(", ")}`,
  });
  return z.NEVER;
});

/**
 * Web origins, comma-separated; each entry is reduced to its origin.
 *
 * @example originList.parse("https://lab.example/path") // ["https://lab.example"]
 */
export const originList = raw.transform((v, ctx): string[] => {
  const origins: string[] = [];
  const bad: string[] = [];
  for (const entry of list(v)) {
    try {
      const parsed = new URL(entry);
      if (parsed.protocol === "http:" || parsed.protocol === "https:") origins.push(parsed.origin);
      else bad.push(entry);
    } catch {
      bad.push(entry);
    }
  }
  if (bad.length === 0) return origins;
  ctx.addIssue({
    code: "custom",
    message: `URLs starting with http:// or https://, comma-separated (example: https://gelwright.example.org); not ${bad.map((b) => `“${b}”`).join(", ")}`,
  });
  return z.NEVER;
});

/** A database or user name of letters, digits, `_` and `$`; `fallback` when unset. */
export function identifier(fallback: string) {
  return raw.transform((v, ctx): string => {
    if (v === undefined) return fallback;
    if (/^[A-Za-z0-9_$]{1,64}$/.test(v)) return v;
    ctx.addIssue({ code: "custom", message: "a name of 1 to 64 letters, digits, _ or $" });
    return z.NEVER;
  });
}

/** A secret of at least `min` characters; `fallback` when unset. */
export function secret(min: number, fallback: string) {
  return raw.transform((v, ctx): string => {
    if (v === undefined) return fallback;
    if (v.length >= min) return v;
    ctx.addIssue({ code: "custom", message: `a random string of at least ${min} characters (e.g. openssl rand -base64 32)` });
    return z.NEVER;
  });
}
