import { lookup } from "node:dns/promises";
import { BlockList, isIP } from "node:net";

/**
 * Server-side request forgery guard for webhook URLs. A URL is vetted at registration and again
 * just before every attempt; the attempt then connects to the very address vetted here (see
 * http-post.ts), so a DNS answer that changes in between (rebinding) cannot redirect it.
 */

export type Resolver = (hostname: string) => Promise<string[]>;

export interface GuardOptions {
  /** Hosts (`127.0.0.1`, `localhost`) or host:port pairs let through without address checks. */
  allowlist: readonly string[];
  /** Injected in tests; defaults to the system resolver. */
  resolve?: Resolver;
  /** A name that does not resolve in this time is refused (default DNS_TIMEOUT_MS). */
  dnsTimeoutMs?: number;
}

/** How long a webhook host's DNS lookup may take before the URL is refused. */
export const DNS_TIMEOUT_MS = 3_000;

/** Ports a webhook may use unless the allowlist names `host:port`. */
const WEB_PORTS = new Set(["80", "443"]);

export interface VettedTarget {
  url: URL;
  /** The address the request must connect to. */
  address: string;
  family: 4 | 6;
  allowlisted: boolean;
}

export class UnsafeUrlError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "UnsafeUrlError";
  }
}

// Separate lists: an IPv6 rule such as ::ffff:0:0/96 would otherwise match every IPv4 address.
const blockedV4 = new BlockList();
const blockedV6 = new BlockList();
// IPv4: this-network, private, CGNAT, loopback, link-local (metadata 169.254.169.254 included),
// IETF protocol assignments, documentation, benchmarking, multicast, reserved and broadcast.
for (const [net, prefix] of [
  ["0.0.0.0", 8],
  ["10.0.0.0", 8],
  ["100.64.0.0", 10],
  ["127.0.0.0", 8],
  ["169.254.0.0", 16],
  ["172.16.0.0", 12],
  ["192.0.0.0", 24],
  ["192.0.2.0", 24],
  ["192.168.0.0", 16],
  ["198.18.0.0", 15],
  ["198.51.100.0", 24],
  ["203.0.113.0", 24],
  ["224.0.0.0", 4],
  ["240.0.0.0", 4],
] as const) {
  blockedV4.addSubnet(net, prefix, "ipv4");
}
// IPv6: unspecified, loopback, IPv4-mapped and -compatible, NAT64 (well-known and local-use),
// Teredo and 6to4 (they embed IPv4 addresses that could be private), discard-only, unique local
// (fd00:ec2::254 included), link-local, site-local, documentation and multicast.
for (const [net, prefix] of [
  ["::", 128],
  ["::1", 128],
  ["::", 96],
  ["::ffff:0:0", 96],
  ["64:ff9b::", 96],
  ["64:ff9b:1::", 48],
  ["100::", 64],
  ["2001::", 32],
  ["2002::", 16],
  ["fc00::", 7],
  ["fe80::", 10],
  ["fec0::", 10],
  ["2001:db8::", 32],
  ["ff00::", 8],
] as const) {
  blockedV6.addSubnet(net, prefix, "ipv6");
}

// Names that reach the machine itself or a cloud metadata service whatever DNS says.
const blockedNames = [/^localhost$/, /\.localhost$/, /^metadata$/, /^metadata\.google\.internal$/, /^metadata\.goog$/, /^instance-data(\.ec2\.internal)?$/];

/** Why an IP address may not be contacted, or null when it may. */
export function getBlockedAddressReason(address: string): string | null {
  const family = isIP(address);
  if (family === 0) return "is not an IP address";
  const hit = family === 4 ? blockedV4.check(address, "ipv4") : blockedV6.check(address, "ipv6");
  if (hit) return `${address} is a loopback, private, link-local, metadata, multicast or reserved address`;
  return null;
}

function stripBrackets(hostname: string): string {
  return hostname.startsWith("[") && hostname.endsWith("]") ? hostname.slice(1, -1) : hostname;
}

function defaultPort(url: URL): string {
  return url.port || (url.protocol === "https:" ? "443" : "80");
}

export function isAllowlisted(url: URL, allowlist: readonly string[]): boolean {
  const host = stripBrackets(url.hostname).replace(/\.$/, "").toLowerCase();
  const hostPort = `${host}:${defaultPort(url)}`;
  return allowlist.some((entry) => entry === host || entry === hostPort);
}

/** Ports 80 and 443 only, unless the allowlist names this host with this very port. */
function assertPortAllowed(url: URL, allowlist: readonly string[]): void {
  const port = defaultPort(url);
  if (WEB_PORTS.has(port)) return;
  const host = stripBrackets(url.hostname).replace(/\.$/, "").toLowerCase();
  if (allowlist.includes(`${host}:${port}`)) return;
  throw new UnsafeUrlError(`uses port ${port}; webhooks use ports 80 and 443 unless WEBHOOK_ALLOWLIST names ${host}:${port}`);
}

function withTimeout<T>(work: Promise<T>, ms: number, message: string): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new UnsafeUrlError(message)), ms);
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}

/**
 * Parses a webhook URL and refuses what can never be safe: other schemes, credentials in the URL,
 * a blocked literal address (the WHATWG parser has already turned decimal, octal, hex and short
 * forms such as `http://2130706433/` or `http://127.1/` into dotted quads) and blocked names.
 */
export function parseWebhookUrl(raw: string, allowlist: readonly string[]): URL {
  let url: URL;
  try {
    url = new URL(raw.trim());
  } catch {
    throw new UnsafeUrlError("is not a valid URL");
  }
  if (url.protocol !== "https:" && url.protocol !== "http:") throw new UnsafeUrlError("must start with https:// or http://");
  if (url.username || url.password) throw new UnsafeUrlError("must not contain a user name or password");
  if (!url.hostname) throw new UnsafeUrlError("has no host");
  if (isAllowlisted(url, allowlist)) {
    assertPortAllowed(url, allowlist);
    return url;
  }
  const host = stripBrackets(url.hostname).replace(/\.$/, "").toLowerCase();
  if (isIP(host)) {
    const reason = getBlockedAddressReason(host);
    if (reason) throw new UnsafeUrlError(`points at a non-public address: ${reason}`);
    assertPortAllowed(url, allowlist);
    return url;
  }
  if (blockedNames.some((pattern) => pattern.test(host))) throw new UnsafeUrlError(`points at a non-public host (${host})`);
  // A bare number that the parser did not take as an address (e.g. out of range) is no host name.
  if (/^[0-9.]+$/.test(host) || /^0x[0-9a-f.]+$/i.test(host)) throw new UnsafeUrlError("has a malformed numeric host");
  assertPortAllowed(url, allowlist);
  return url;
}

async function resolveWithSystem(hostname: string): Promise<string[]> {
  const answers = await lookup(hostname, { all: true, verbatim: true });
  return answers.map((a) => a.address);
}

/**
 * Parses, resolves once and checks every address the name resolves to; returns the address to
 * pin the connection to. Throws UnsafeUrlError naming the reason.
 */
export async function vetWebhookUrl(raw: string, options: GuardOptions): Promise<VettedTarget> {
  const url = parseWebhookUrl(raw, options.allowlist);
  const allowlisted = isAllowlisted(url, options.allowlist);
  const host = stripBrackets(url.hostname).replace(/\.$/, "");
  let addresses: string[];
  if (isIP(host)) {
    addresses = [host];
  } else {
    const timeoutMs = options.dnsTimeoutMs ?? DNS_TIMEOUT_MS;
    try {
      addresses = await withTimeout((options.resolve ?? resolveWithSystem)(host), timeoutMs, `host ${host} did not resolve within ${timeoutMs} ms`);
    } catch (error) {
      if (error instanceof UnsafeUrlError) throw error;
      throw new UnsafeUrlError(`host ${host} could not be resolved`);
    }
  }
  if (addresses.length === 0) throw new UnsafeUrlError(`host ${host} has no address`);
  if (!allowlisted) {
    for (const address of addresses) {
      const reason = getBlockedAddressReason(address);
      if (reason) throw new UnsafeUrlError(`host ${host} resolves to a non-public address: ${reason}`);
    }
  }
  const address = addresses[0]!;
  return { url, address, family: isIP(address) === 6 ? 6 : 4, allowlisted };
}
