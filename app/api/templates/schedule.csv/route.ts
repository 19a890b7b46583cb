import { withSessionRoute } from "@/lib/server/auth/guards";
import { buildCsvTemplate } from "@/lib/schedule-csv";

// GET /api/templates/schedule.csv: the CSV template (header with units and one example row), public.
export const GET = withSessionRoute("GET /api/templates/schedule.csv", async () => {
  return new Response(buildCsvTemplate(), {
    headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": 'attachment; filename="sagline-schedule-template.csv"' },
  });
});
