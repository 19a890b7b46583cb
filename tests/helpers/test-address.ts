// A random start per test process, then consecutive: distinct within a file, and files practically never meet.
let addressCounter = Math.floor(Math.random() * 2 ** 31);

/**
 * A distinct documentation address (RFC 3849, 2001:db8::/32) per call, sent as X-Forwarded-For
 * (the test server trusts no proxy, so the header is the client address). Tests that sign in
 * then never share the per-address throttle with each other.
 */
export function nextTestAddress(): string {
  addressCounter += 1;
  const n = addressCounter;
  return `2001:db8:${((n >>> 16) & 0xffff).toString(16)}:${(n & 0xffff).toString(16)}::1`;
}
