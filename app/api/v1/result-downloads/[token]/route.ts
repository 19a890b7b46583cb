import { toProblem } from "@/lib/server/http/problem";
import { downloadResults } from "@/lib/server/schedules/download-results";

export const dynamic = "force-dynamic";

// GET /api/v1/result-downloads/{token}: the full result table behind a signed, expiring link from schedule.completed; no API key.
export async function GET(request: Request, context: { params: Promise<{ token: string }> }): Promise<Response> {
  try {
    const { token } = await context.params;
    return await downloadResults(token, new Date());
  } catch (error) {
    // The instance leaves the token out: a problem body is no place to echo a credential.
    return toProblem(error, "/api/v1/result-downloads");
  }
}
