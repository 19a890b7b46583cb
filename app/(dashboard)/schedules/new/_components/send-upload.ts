import type { RowError } from "./row-errors";

export type UploadOutcome =
  | { ok: true; id: string; memberCount: number }
  | { ok: false; status: number; message: string; errors: RowError[]; total: number };

interface ProblemBody {
  title?: string;
  detail?: string;
  errors?: RowError[];
  errorCount?: number;
}

/** Posts the mapped CSV and its parameters; a problem+json answer comes back as a list of errors. */
export async function sendUpload(form: FormData): Promise<UploadOutcome> {
  let response: Response;
  try {
    response = await fetch("/api/schedules/upload", { method: "POST", body: form, credentials: "same-origin" });
  } catch {
    return { ok: false, status: 0, message: "Sagline could not be reached. Check the connection and submit again.", errors: [], total: 0 };
  }
  const body = (await response.json().catch(() => null)) as (ProblemBody & { id?: string; memberCount?: number }) | null;
  if (response.status === 202 && body?.id) return { ok: true, id: body.id, memberCount: body.memberCount ?? 0 };
  const errors = Array.isArray(body?.errors) ? body.errors : [];
  const message =
    response.status === 401
      ? "Your session has ended. Sign in again in another tab, then submit again."
      : (body?.detail ?? `The upload was refused (HTTP ${response.status}).`);
  return { ok: false, status: response.status, message, errors, total: body?.errorCount ?? errors.length };
}
