import { NextResponse, type NextRequest } from "next/server";

import { isSameOrigin } from "@/lib/server/auth/origin";
import { DomainError } from "@/lib/server/errors";
import { badOriginProblem, toProblem } from "@/lib/server/http/problem";

/** Forms and actions carry a few kilobytes; Next's own limit would answer 500, this answers 413. */
const MAX_FORM_BODY_BYTES = 1_000_000;

// Cookie-authenticated writes from a foreign, "null" or missing Origin, or with an oversized
// body, are refused here with a clear problem, before Next's own server-action checks (which
// would answer 500). Every action and route still checks for itself: this is not the only layer.
// API-key routes carry no cookies and apply their own limits.
export function proxy(request: NextRequest) {
  // A malformed percent-escape would make Next fail decoding route parameters with a 500.
  if (!isDecodablePath(request.nextUrl.pathname)) {
    return toProblem(new DomainError("bad_request", "The address contains a malformed percent-escape."));
  }
  const safe = ["GET", "HEAD", "OPTIONS"].includes(request.method);
  // API-key routes carry no cookies: the origin rule is not theirs (they reach here only without a body).
  if (safe || request.nextUrl.pathname.startsWith("/api/v1/")) return NextResponse.next();
  const instance = request.nextUrl.pathname;
  if (!isSameOrigin(request.headers)) return badOriginProblem(instance);
  if (Number(request.headers.get("content-length") ?? "0") > MAX_FORM_BODY_BYTES) {
    return toProblem(new DomainError("too_large", `Forms accept at most ${MAX_FORM_BODY_BYTES} bytes.`), instance);
  }
  return NextResponse.next();
}

function isDecodablePath(pathname: string): boolean {
  try {
    decodeURIComponent(pathname);
    return true;
  } catch {
    return false;
  }
}

// API-key routes stay out of the proxy entirely: it would also cap their bodies at 10 MB. So does
// the dashboard's CSV upload (up to 64 MB): Next would cut its body at the proxy's 10 MB copy. Its
// handler refuses foreign origins itself (withSessionRoute) and reads at most 64 MB (readBodyBytes).
// Body-less API requests (no Content-Length, no Transfer-Encoding) still pass through, so that a
// malformed escape in their address is a 400 too.
export const config = {
  matcher: [
    "/((?!_next/static|_next/image|favicon.ico|api/v1/|api/schedules/upload).*)",
    // An API address with a percent-escape, body or not: ids never hold one, so the 10 MB copy
    // cannot cut a real upload, and a malformed escape answers 400 instead of Next's 500.
    "/api/v1/:rest(.*%.*)",
    {
      source: "/api/:rest(v1/.*|schedules/upload)",
      missing: [
        { type: "header", key: "content-length" },
        { type: "header", key: "transfer-encoding" },
      ],
    },
  ],
};
