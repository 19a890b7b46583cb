import { isIP } from "node:net";

/**
 * The address a request came from, for per-address throttles. Next records the peer in
 * X-Forwarded-For only when the request carries none, so with no proxy in front the header can be
 * chosen by the client: TRUSTED_PROXY_COUNT names the proxies that append to it, and the client is
 * that many entries from the right (the nearest proxy's record). IPv6 is keyed by its /64, the
 * block one host usually holds.
 */
export function readClientAddress(headers: Headers, trustedProxyCount: number): string {
  const entries = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((e) => e.trim())
    .filter(Boolean);
  const picked = entries[entries.length - Math.max(1, trustedProxyCount)] ?? "";
  return normaliseAddress(picked);
}

export function normaliseAddress(raw: string): string {
  const address = raw.replace(/^\[|\]$/g, "").replace(/%.*$/, "").toLowerCase();
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/.exec(address);
  if (mapped) return mapped[1]!;
  const kind = isIP(address);
  if (kind === 4) return address;
  if (kind === 6) return `${expandIpv6(address).slice(0, 4).join(":")}::/64`;
  return "unknown";
}

function expandIpv6(address: string): string[] {
  const [head = "", tail] = address.split("::");
  const left = head ? head.split(":") : [];
  const right = tail ? tail.split(":") : [];
  // An embedded IPv4 tail counts as two groups; its digits do not matter for the /64.
  const rightGroups = right.flatMap((g) => (g.includes(".") ? ["0", "0"] : [g]));
  const fill = tail === undefined ? [] : Array.from({ length: 8 - left.length - rightGroups.length }, () => "0");
  return [...left, ...fill, ...rightGroups].map((g) => g.replace(/^0+(?=.)/, ""));
}
