// Next.js calls register() once when a server process starts.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { warmUpScheduleIntake } = await import("@/lib/server/schedules/warm-up");
  try {
    warmUpScheduleIntake();
  } catch (error) {
    console.error("[sagline] schedule intake warm-up failed", error);
  }
}
