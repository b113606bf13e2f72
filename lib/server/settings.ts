/**
 * The settings of the HTTP front (scripts/server.ts), read and checked once at
 * start. A bad value stops the start with a message naming the setting; it is
 * never silently ignored. No "server-only" here: the front loads this before Next.
 */
import { isIP } from "node:net";

export class SettingError extends Error {
  constructor(setting: string, problem: string) {
    super(`${setting}: ${problem}`);
    this.name = "SettingError";
  }
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

/**
 * GELWRIGHT_TRUSTED_PROXIES: addresses or CIDR ranges of the reverse proxies
 * whose X-Forwarded-For is believed. Default: none (the socket's address is the
 * client's).
 *
 * @example parseTrustedProxies("10.0.0.5, 10.1.0.0/16") // ["10.0.0.5", "10.1.0.0/16"]
 */
export function parseTrustedProxies(value: string | undefined): string[] {
  const entries = list(value);
  for (const entry of entries) {
    if (PROXY_NAMES.has(entry)) continue;
    const [address, bits, extra] = entry.split("/");
    const family = isIP(address ?? "");
    const maxBits = family === 6 ? 128 : 32;
    const bitsOk = bits === undefined || (/^\d{1,3}$/.test(bits) && Number(bits) <= maxBits);
    if (!family || !bitsOk || extra !== undefined) {
      throw new SettingError(
        "GELWRIGHT_TRUSTED_PROXIES",
        `“${entry}” is not an IP address or CIDR range (examples: 10.0.0.5, 10.0.0.0/8, ::1, loopback).`,
      );
    }
  }
  return entries;
}

/**
 * The origins allowed to send changes: the app's own URL and
 * GELWRIGHT_TRUSTED_ORIGINS (comma-separated).
 *
 * @example parseTrustedOrigins("http://localhost:3000", "https://lab.example") // Set { "http://localhost:3000", "https://lab.example" }
 */
export function parseTrustedOrigins(baseUrl: string, extra: string | undefined): Set<string> {
  const origins = new Set<string>();
  for (const [setting, value] of [["BETTER_AUTH_URL", baseUrl], ...list(extra).map((v) => ["GELWRIGHT_TRUSTED_ORIGINS", v])] as const) {
    let url: URL;
    try {
      url = new URL(value);
    } catch {
      throw new SettingError(setting, `“${value}” is not a URL (example: https://gelwright.example.org).`);
    }
    if (url.protocol !== "http:" && url.protocol !== "https:") throw new SettingError(setting, `“${value}” must start with http:// or https://.`);
    origins.add(url.origin);
  }
  return origins;
}

export interface FrontSettings {
  baseUrl: string;
  trustedProxies: string[];
  trustedOrigins: Set<string>;
}

/** Reads the front's settings from the environment; throws SettingError on a bad one. */
export function readFrontSettings(env: Record<string, string | undefined> = process.env): FrontSettings {
  const baseUrl = env.BETTER_AUTH_URL ?? env.GELWRIGHT_BASE_URL ?? `http://localhost:${env.PORT ?? 3000}`;
  return {
    baseUrl,
    trustedProxies: parseTrustedProxies(env.GELWRIGHT_TRUSTED_PROXIES),
    trustedOrigins: parseTrustedOrigins(baseUrl, env.GELWRIGHT_TRUSTED_ORIGINS),
  };
}
