// Public-API requests of the fault drills, over real HTTP to a web process of their own.
import { createDrillBeams } from "./drill";
import { createScheduleDoc } from "./schedules";

export interface PostAnswer {
  status: number;
  contentType: string;
  retryAfter: string | null;
  replayed: boolean;
  text: string;
  body: { id?: string; type?: string; [k: string]: unknown } | null;
}

/** A schedule body of `memberCount` simply supported beams under a name unique to the drill. */
export function createScheduleBody(name: string, memberCount: number): string {
  return JSON.stringify(createScheduleDoc(createDrillBeams("W", memberCount), name));
}

/** POST /api/v1/schedules with an Idempotency-Key; rejects only when no answer came back at all. */
export async function postSchedule(baseUrl: string, apiKey: string, idempotencyKey: string, body: string): Promise<PostAnswer> {
  const response = await fetch(`${baseUrl}/api/v1/schedules`, {
    method: "POST",
    headers: { authorization: `Bearer ${apiKey}`, "content-type": "application/json", "idempotency-key": idempotencyKey },
    body,
    signal: AbortSignal.timeout(60_000),
  });
  return readAnswer(response);
}

export async function getWithKey(baseUrl: string, apiKey: string, path: string): Promise<PostAnswer> {
  return readAnswer(await fetch(`${baseUrl}${path}`, { headers: { authorization: `Bearer ${apiKey}` }, signal: AbortSignal.timeout(30_000) }));
}

async function readAnswer(response: Response): Promise<PostAnswer> {
  const text = await response.text();
  let body: PostAnswer["body"] = null;
  try {
    body = JSON.parse(text) as PostAnswer["body"];
  } catch {
    body = null;
  }
  return {
    status: response.status,
    contentType: response.headers.get("content-type") ?? "",
    retryAfter: response.headers.get("retry-after"),
    replayed: response.headers.get("idempotent-replayed") === "true",
    text,
    body,
  };
}
