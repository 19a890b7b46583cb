import { forbidden, redirect } from "next/navigation";
import { headers } from "next/headers";
import type { z } from "zod";

import { DomainError, type DomainErrorCode } from "@/lib/server/errors";
import { badOriginProblem, toProblem } from "@/lib/server/http/problem";
import { toFormFieldErrors } from "@/lib/server/http/to-form-field-errors";

import { actionAccess, pageAccess, routeAccess, type Access, type ActionKey, type PagePath } from "./access-table";
import { isSameOrigin } from "./origin";
import { hasPermission } from "./permissions";
import { getRequestContext, type RequestContext } from "./request-context";

type Decision = "allow" | "unauthenticated" | "forbidden";

/** The single decision every page, action and route goes through. */
export function decideAccess(access: Access, context: RequestContext | null): Decision {
  if (access === "public") return "allow";
  if (!context) return "unauthenticated";
  if (!context.active) return "forbidden";
  if (access === "signed-in") return "allow";
  return hasPermission(context.active.role, access) ? "allow" : "forbidden";
}

/** Server components: no session redirects to sign-in; not permitted renders the 403 page. */
export async function requirePage(path: PagePath, currentUrl: string = path): Promise<RequestContext> {
  const context = await getRequestContext();
  const decision = decideAccess(pageAccess[path], context);
  if (decision === "unauthenticated" || !context) redirect(`/sign-in?callbackUrl=${encodeURIComponent(currentUrl)}`);
  if (decision === "forbidden") forbidden();
  return context;
}

export type ActionResult<T = undefined> =
  | { ok: true; message: string; data?: T }
  | { ok: false; code: DomainErrorCode | "internal"; message: string; fieldErrors?: Record<string, string> };

function failure(code: DomainErrorCode | "internal", message: string, fieldErrors?: Record<string, string>) {
  return { ok: false as const, code, message, ...(fieldErrors ? { fieldErrors } : {}) };
}

/**
 * Wraps a server action body: same-origin check, session and permission from the access table,
 * input parsed with zod (first message per field), domain errors turned into a result.
 */
export async function runAction<S extends z.ZodType, T = undefined>(
  key: ActionKey,
  schema: S,
  formData: FormData | Record<string, unknown> | undefined,
  run: (input: z.infer<S>, context: RequestContext | null) => Promise<ActionResult<T>>,
): Promise<ActionResult<T>> {
  if (!isSameOrigin(await headers())) return failure("bad_origin", "This form must be sent from Sagline's own pages.");
  const context = await getRequestContext();
  const decision = decideAccess(actionAccess[key], context);
  if (decision === "unauthenticated") return failure("unauthenticated", "Your session has ended. Sign in again.");
  if (decision === "forbidden") return failure("forbidden", "Your role does not allow this.");

  const raw = formData instanceof FormData ? Object.fromEntries(formData.entries()) : isPlainObject(formData) ? formData : {};
  const parsed = schema.safeParse(raw);
  if (!parsed.success) {
    const fieldErrors: Record<string, string> = {};
    for (const issue of parsed.error.issues) {
      const field = issue.path.join(".") || "form";
      fieldErrors[field] ??= issue.message;
    }
    return failure("invalid_input", "Please correct the highlighted fields.", fieldErrors);
  }
  try {
    return await run(parsed.data, context);
  } catch (error) {
    if (error instanceof DomainError) {
      const fieldErrors = error.errors.length ? toFormFieldErrors(error.errors) : undefined;
      return failure(error.code, error.message, fieldErrors);
    }
    if (isNextControlFlow(error)) throw error;
    console.error(`[sagline] action ${key} failed`, error);
    return failure("internal", "Something went wrong on our side. Nothing was changed; try again.");
  }
}

/**
 * The active organization inside a runAction body. runAction runs the body only after the access
 * table has found a session with an active organization, so both are there.
 */
export function getActionOrganizationId(context: { active: { organizationId: string } | null } | null): string {
  return context!.active!.organizationId;
}

// Programmatic callers may send a plain object; the schema still decides what is valid.
function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && Object.getPrototypeOf(value) === Object.prototype;
}

// redirect() and notFound() work by throwing; they must pass through.
function isNextControlFlow(error: unknown): boolean {
  const digest = (error as { digest?: unknown } | null)?.digest;
  return typeof digest === "string" && (digest.startsWith("NEXT_REDIRECT") || digest.startsWith("NEXT_HTTP_ERROR_FALLBACK"));
}

type RouteKey = keyof typeof routeAccess;
type RouteHandler<P> = (request: Request, context: RequestContext | null, params: P) => Promise<Response>;

/** Route handlers on the cookie session: 401/403 problem+json, same-origin writes only. */
export function withSessionRoute<P = Record<string, string>>(key: RouteKey, handler: RouteHandler<P>) {
  return async (request: Request, segment: { params: Promise<P> }): Promise<Response> => {
    const instance = new URL(request.url).pathname;
    try {
      const method = request.method.toUpperCase();
      const unsafe = !["GET", "HEAD", "OPTIONS"].includes(method);
      if (unsafe && !isSameOrigin(request.headers)) {
        return badOriginProblem(instance);
      }
      const access = routeAccess[key];
      const context = access === "public" ? null : await getRequestContext();
      const decision = decideAccess(access, context);
      if (decision === "unauthenticated") throw new DomainError("unauthenticated", "Sign in first.");
      if (decision === "forbidden") throw new DomainError("forbidden", "Your role does not allow this.");
      return await handler(request, context, await segment.params);
    } catch (error) {
      return toProblem(error, instance);
    }
  };
}
