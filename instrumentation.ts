// Next.js calls register() once when a server process starts.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { loadScheduleRouteAtServerStart } = await import("@/lib/server/schedules/warm-up");
  loadScheduleRouteAtServerStart();
}
