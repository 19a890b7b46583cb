/** Where people land after sign-in when no usable callbackUrl came with them. */
export const DEFAULT_AFTER_SIGN_IN = "/schedules";

const MAX_CALLBACK_LENGTH = 2_000;

// Backslashes and control characters: browsers read "\" as "/" and drop tabs and newlines, which
// turns "/\evil.example" and "/<tab>/evil.example" into the protocol-relative "//evil.example".
const UNSAFE_CHARACTERS = /[\\\u0000-\u001f\u007f]/;

/**
 * A callbackUrl reduced to a path on this app, or the fallback. Only a path is accepted (one
 * leading "/", nothing a browser could read as another host, also once percent-decoded), and it
 * must resolve, parsed with URL against the app's origin, to that same origin.
 */
export function toSameOriginPath(raw: unknown, appOrigin: string, fallback: string = DEFAULT_AFTER_SIGN_IN): string {
  if (typeof raw !== "string" || raw.length === 0 || raw.length > MAX_CALLBACK_LENGTH) return fallback;
  const origin = new URL(appOrigin).origin;
  // next-auth hands absolute URLs to the redirect callback: ours are reduced to their path first.
  const candidate = raw.startsWith(`${origin}/`) ? raw.slice(origin.length) : raw;
  if (!isPlainPath(candidate)) return fallback;
  let decoded: string;
  try {
    decoded = decodeURIComponent(candidate);
  } catch {
    return fallback;
  }
  if (!isPlainPath(decoded)) return fallback;
  let url: URL;
  try {
    url = new URL(candidate, origin);
  } catch {
    return fallback;
  }
  if (url.origin !== origin) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  return isPlainPath(path) ? path : fallback;
}

function isPlainPath(value: string): boolean {
  return value.startsWith("/") && !value.startsWith("//") && !UNSAFE_CHARACTERS.test(value);
}
