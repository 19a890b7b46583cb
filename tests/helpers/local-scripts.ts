// Runs the shell functions of docker-local (lib.sh, processes.sh) from tests, exactly as the
// start, test and stop scripts call them.
import { execFile } from "node:child_process";
import { readFileSync } from "node:fs";
import { promisify } from "node:util";

const execFileAsync = promisify(execFile);

/** Runs one function of docker-local/processes.sh with its arguments; resolves with its output. */
export async function runLocalFunction(args: string[], env: NodeJS.ProcessEnv = process.env): Promise<{ stdout: string; stderr: string }> {
  const script = 'source docker-local/lib.sh && source docker-local/processes.sh && "$@"';
  return execFileAsync("bash", ["-c", script, "bash", ...args], { env, encoding: "utf8", timeout: 120_000 });
}

/** Runs a command to its end without throwing on failure: its exit code and output. */
export function runCommand(command: string, args: string[], env: NodeJS.ProcessEnv, timeoutMs = 300_000): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(command, args, { env, encoding: "utf8", timeout: timeoutMs, maxBuffer: 16 * 1024 * 1024 }, (error, stdout, stderr) => {
      const code = error ? (typeof error.code === "number" ? error.code : -1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

/** The environment without the named variables (to run a command as a fresh shell would). */
export function withoutVariables(env: NodeJS.ProcessEnv, names: string[]): NodeJS.ProcessEnv {
  return Object.fromEntries(Object.entries(env).filter(([name]) => !names.includes(name))) as NodeJS.ProcessEnv;
}

/** Waits until `check` returns a value other than undefined, polling every 250 ms up to `timeoutMs`. */
export async function waitFor<T>(what: string, check: () => Promise<T | undefined> | T | undefined, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await Promise.resolve(check()).catch(() => undefined);
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`timed out after ${timeoutMs} ms waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

export function readPid(file: string): number | undefined {
  try {
    const pid = Number(readFileSync(file, "utf8").trim());
    return Number.isInteger(pid) && pid > 0 ? pid : undefined;
  } catch {
    return undefined;
  }
}

export function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}
