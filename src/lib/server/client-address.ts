/**
 * Who is asking, by network address, for the per-address sign-in limits (better-auth's rate
 * limit) and the session record. The address is the TCP peer of the connection, as
 * scripts/serve.mjs sees it and hands to the app in `locals.peerAddress`; a client cannot write
 * it. Only when that peer is a proxy the operator lists in TRUSTED_PROXIES (addresses or CIDR
 * ranges) is `X-Forwarded-For` read, from the right: the right-most hop that is not a trusted
 * proxy is the client (everything left of it was written by the client and is ignored).
 *
 * The address reaches better-auth in CLIENT_ADDRESS_HEADER, which the auth route always deletes
 * and rewrites, so a value sent by the client never counts.
 */
import { BlockList, isIP } from "node:net";

export const CLIENT_ADDRESS_HEADER = "x-gavelwright-client-address";

export interface TrustedProxies {
  list: BlockList;
  empty: boolean;
}

/** Strip an IPv4-mapped IPv6 prefix ("::ffff:203.0.113.5" → "203.0.113.5") and brackets. */
function normalise(address: string): string | null {
  let a = address.trim();
  if (a.startsWith("[") && a.endsWith("]")) a = a.slice(1, -1);
  if (/^::ffff:\d+\.\d+\.\d+\.\d+$/i.test(a)) a = a.slice(7);
  return isIP(a) ? a.toLowerCase() : null;
}

/** Parse TRUSTED_PROXIES: addresses or CIDR ranges separated by commas or spaces. Throws on a bad entry. */
export function parseTrustedProxies(value: string | undefined): TrustedProxies {
  const list = new BlockList();
  const entries = (value ?? "").split(/[\s,]+/).filter(Boolean);
  for (const entry of entries) {
    const [addr, prefixText, ...rest] = entry.split("/");
    const a = normalise(addr ?? "");
    const family = a ? (isIP(a) === 4 ? "ipv4" : "ipv6") : null;
    const max = family === "ipv4" ? 32 : 128;
    const prefix = prefixText === undefined ? max : /^\d{1,3}$/.test(prefixText) ? Number(prefixText) : NaN;
    if (!a || !family || rest.length > 0 || !(prefix >= 0 && prefix <= max))
      throw new Error(`TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR range (e.g. 10.0.0.0/8, 192.0.2.7, fd00::/8)`);
    list.addSubnet(a, prefix, family);
  }
  return { list, empty: entries.length === 0 };
}

function isTrusted(address: string, trusted: TrustedProxies): boolean {
  if (trusted.empty) return false;
  return trusted.list.check(address, isIP(address) === 4 ? "ipv4" : "ipv6");
}

/**
 * The client's address: `peer` itself unless `peer` is a trusted proxy; then the right-most hop
 * of `forwardedFor` that is not a trusted proxy (or the left-most hop when every hop is trusted).
 * A malformed hop stops the walk at the last address known good. Null when there is no peer.
 */
export function resolveClientAddress(peer: string | null | undefined, forwardedFor: string | null | undefined, trusted: TrustedProxies): string | null {
  const p = peer ? normalise(peer) : null;
  if (!p) return null;
  if (!isTrusted(p, trusted) || !forwardedFor) return p;
  const hops = forwardedFor.split(",").map((h) => h.trim()).filter(Boolean);
  let last = p;
  for (let i = hops.length - 1; i >= 0; i--) {
    const hop = normalise(hops[i]!);
    if (!hop) return last;
    if (!isTrusted(hop, trusted)) return hop;
    last = hop;
  }
  return last;
}

let configured: TrustedProxies | null = null;
/** TRUSTED_PROXIES of this process (read once). */
export function trustedProxies(): TrustedProxies {
  configured ??= parseTrustedProxies(process.env.TRUSTED_PROXIES);
  return configured;
}

/**
 * `request` with CLIENT_ADDRESS_HEADER set to the resolved client address (or removed when
 * there is none), whatever the client sent in it.
 */
export function withClientAddress(request: Request, peer: string | null | undefined): Request {
  const address = resolveClientAddress(peer, request.headers.get("x-forwarded-for"), trustedProxies());
  const headers = new Headers(request.headers);
  headers.delete(CLIENT_ADDRESS_HEADER);
  if (address) headers.set(CLIENT_ADDRESS_HEADER, address);
  const hasBody = request.method !== "GET" && request.method !== "HEAD" && request.body !== null;
  return new Request(request.url, {
    method: request.method,
    headers,
    body: hasBody ? request.body : undefined,
    signal: request.signal,
    // A streamed body (as the Node adapter gives) must be sent half-duplex.
    ...(hasBody ? { duplex: "half" } : {}),
  } as RequestInit);
}
