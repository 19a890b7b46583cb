import NextAuth from "next-auth";
import { NextRequest } from "next/server";

import { withSessionRoute } from "@/lib/server/auth/guards";
import { getAuthOptions } from "@/lib/server/auth/auth-options";
import { DomainError } from "@/lib/server/errors";

type Segment = { nextauth: string[] };

// Sign-in bodies are a few hundred bytes; anything far larger is refused before parsing.
const MAX_AUTH_BODY_BYTES = 16 * 1024;

function callNextAuth(request: Request, params: Segment) {
  const handler = NextAuth(getAuthOptions());
  return handler(request, { params: Promise.resolve(params) }) as Promise<Response>;
}

// GET /api/auth/*: next-auth's session, CSRF token and provider endpoints.
export const GET = withSessionRoute<Segment>("GET /api/auth/[...nextauth]", (request, _context, params) =>
  callNextAuth(request, params),
);

// POST /api/auth/*: sign-in and sign-out, same-origin only, with a body-size cap.
export const POST = withSessionRoute<Segment>("POST /api/auth/[...nextauth]", async (request, _context, params) => {
  const length = Number(request.headers.get("content-length") ?? "0");
  if (length > MAX_AUTH_BODY_BYTES) throw new DomainError("too_large", "The sign-in request is too large.");
  const body = await request.text();
  if (body.length > MAX_AUTH_BODY_BYTES) throw new DomainError("too_large", "The sign-in request is too large.");
  // next-auth reads nextUrl, so the re-wrapped request must stay a NextRequest.
  const copy = new NextRequest(request.url, { method: "POST", headers: request.headers, body });
  return callNextAuth(copy, params);
});
