import { withSessionRoute } from "@/lib/server/auth/guards";
import { checkHealth } from "@/lib/server/health/check-health";

export const dynamic = "force-dynamic";

// GET /api/health: web, PostgreSQL and Redis status; 200 when all are up, 503 otherwise.
export const GET = withSessionRoute("GET /api/health", async () => {
  const report = await checkHealth();
  return Response.json(report, { status: report.status === "ok" ? 200 : 503, headers: { "cache-control": "no-store" } });
});
