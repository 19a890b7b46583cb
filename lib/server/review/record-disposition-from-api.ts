import { eq } from "drizzle-orm";

import { getDb } from "@/db/client";
import { apiKeys } from "@/db/schema";
import type { ApiKeyContext } from "@/lib/server/api-keys/authenticate-api-key";
import { DomainError } from "@/lib/server/errors";

import { dispositionInputSchema } from "./disposition-input";
import { assertMemberExists, recordDisposition } from "./record-disposition";

/** Next passes the segment percent-encoded; a malformed escape is a mark that does not exist. */
function decodeMark(segment: string): string {
  try {
    return decodeURIComponent(segment);
  } catch {
    throw new DomainError("not_found", "The member was not found.");
  }
}

/** The route's first step: the schedule and member must be the key's organization's (404 otherwise). */
export async function assertDispositionTarget(key: ApiKeyContext, scheduleId: string, markSegment: string): Promise<string> {
  const mark = decodeMark(markSegment);
  await assertMemberExists(key.organizationId, scheduleId, mark);
  return mark;
}

/**
 * The API's disposition: the body already matched its JSON Schema; the rules the schema cannot
 * say (a real justification to accept a failure) answer 422 with a pointer. The key's label is
 * recorded as who decided, with the key's id.
 */
export async function recordDispositionFromApi(key: ApiKeyContext, scheduleId: string, mark: string, body: unknown) {
  const parsed = dispositionInputSchema.safeParse(body);
  if (!parsed.success) {
    const errors = parsed.error.issues.slice(0, 20).map((issue) => ({ pointer: `/${issue.path.join("/")}`, message: issue.message }));
    throw new DomainError("invalid_input", `The disposition is not valid: ${errors[0]?.pointer} ${errors[0]?.message}.`, errors);
  }
  const [row] = await getDb().select({ name: apiKeys.name }).from(apiKeys).where(eq(apiKeys.id, key.apiKeyId));
  const recorded = await recordDisposition(key.organizationId, scheduleId, mark, parsed.data, { kind: "api_key", apiKeyId: key.apiKeyId, name: row?.name ?? key.apiKeyId });
  return { ...recorded, state: recorded.kind };
}
