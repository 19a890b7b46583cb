let addressCounter = 0;

/**
 * A distinct documentation address (RFC 3849, 2001:db8::/32) per call, sent as X-Forwarded-For
 * (the test server trusts no proxy, so the header is the client address). Tests that sign in
 * then never share the per-address throttle with each other.
 */
export function nextTestAddress(): string {
  addressCounter += 1;
  const n = addressCounter + Math.floor(Math.random() * 1_000_000);
  return `2001:db8:${(n >> 16) & 0xffff}:${n & 0xffff}::1`;
}
