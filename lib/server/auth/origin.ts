/**
 * A cookie-authenticated write must come from our own pages: the Origin header has to be present
 * and name the host the request was sent to. Foreign, "null" and missing origins are refused,
 * which closes cross-site request forgery for every browser that sends Origin on POST.
 */
export function isSameOrigin(headers: Headers): boolean {
  const origin = headers.get("origin");
  if (!origin || origin === "null") return false;
  const host = headers.get("x-forwarded-host") ?? headers.get("host");
  if (!host) return false;
  try {
    return new URL(origin).host === host;
  } catch {
    return false;
  }
}
