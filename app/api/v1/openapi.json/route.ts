import { getEnv } from "@/lib/env";
import { toProblem } from "@/lib/server/http/problem";
import { getApiLimits, getOpenApiDocument } from "@/lib/server/openapi/build-openapi";

import { getRateLimits } from "../_lib/rate-limit";

export const dynamic = "force-dynamic";

// GET /api/v1/openapi.json: the OpenAPI 3.1 document of this API; public, no key needed.
export async function GET(request: Request): Promise<Response> {
  try {
    const document = getOpenApiDocument({ serverUrl: getEnv().APP_URL, limits: getApiLimits(getRateLimits()) });
    return Response.json(document, { headers: { "cache-control": "public, max-age=300", "access-control-allow-origin": "*" } });
  } catch (error) {
    return toProblem(error, new URL(request.url).pathname);
  }
}
