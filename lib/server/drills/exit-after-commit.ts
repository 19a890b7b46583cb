// A fault-drill hook (tests/faults/web-crash.test.ts): the web process dies the hardest way right
// after a schedule's transaction commits and before its answer leaves, the window a crash of the
// real service can hit. Only with the local fakes on (SAGLINE_FAKES=1, which a production start
// refuses, as it refuses this variable itself); otherwise it does nothing.
export const EXIT_AFTER_COMMIT_VARIABLE = "SAGLINE_DRILL_EXIT_AFTER_COMMIT";

export function isExitAfterCommitArmed(env: Record<string, string | undefined> = process.env): boolean {
  return env[EXIT_AFTER_COMMIT_VARIABLE] === "1" && env.SAGLINE_FAKES === "1";
}

/** SIGKILL to itself: no handlers, no flushing, no answer; what committed stays committed. */
export function exitIfArmedAfterCommit(): void {
  if (!isExitAfterCommitArmed()) return;
  console.error(`[sagline] ${EXIT_AFTER_COMMIT_VARIABLE}=1: killing the web process after the commit (fault drill)`);
  process.kill(process.pid, "SIGKILL");
}
