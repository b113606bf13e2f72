/**
 * Who is at the other end of a request. X-Forwarded-For is believed only when
 * it was added by a proxy listed in GELWRIGHT_TRUSTED_PROXIES; otherwise the
 * socket's own address is the client's. proxy-addr (the package Express uses)
 * walks the chain from the socket outwards and stops at the first address
 * that is not a trusted proxy.
 */
import type { IncomingMessage } from "node:http";
import proxyaddr from "proxy-addr";

/** The header the front sets, overwriting whatever the client sent; the app reads only this one. */
export const CLIENT_ADDRESS_HEADER = "x-gelwright-client-address";

export type TrustFn = (address: string, index: number) => boolean;

/** Compiles the trusted-proxy list once; an empty list trusts nobody. */
export function compileTrust(trustedProxies: readonly string[]): TrustFn {
  if (trustedProxies.length === 0) return () => false;
  return proxyaddr.compile([...trustedProxies]);
}

/**
 * The client's address for `req`, normalised (IPv4-mapped IPv6 becomes IPv4).
 *
 * @example clientAddress(req, compileTrust([])) // "127.0.0.1", whatever X-Forwarded-For says
 */
export function clientAddress(req: IncomingMessage, trust: TrustFn): string {
  const address = proxyaddr(req, trust);
  return address.startsWith("::ffff:") && address.includes(".") ? address.slice(7) : address;
}

/**
 * Replaces the forwarding headers by what the front itself established, so
 * that nothing downstream (better-auth's rate limit, the audit trail) can read
 * an address the client made up.
 */
export function setClientAddress(req: IncomingMessage, trust: TrustFn): string {
  const address = clientAddress(req, trust);
  req.headers[CLIENT_ADDRESS_HEADER] = address;
  req.headers["x-forwarded-for"] = address;
  delete req.headers["x-real-ip"];
  return address;
}
