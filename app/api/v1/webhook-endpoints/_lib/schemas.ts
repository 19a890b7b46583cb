import createSchema from "@/api-schemas/v1/webhook-endpoint-create.schema.json";
import updateSchema from "@/api-schemas/v1/webhook-endpoint-update.schema.json";
import { DomainError } from "@/lib/server/errors";

import { compileSchema } from "../../_lib/validate-body";

export interface WebhookEndpointCreateBody {
  url: string;
  description?: string;
  eventTypes: string[];
}

export interface WebhookEndpointUpdateBody {
  url?: string;
  description?: string;
  eventTypes?: string[];
  enabled?: boolean;
}

export const validateEndpointCreate = compileSchema<WebhookEndpointCreateBody>(createSchema);
export const validateEndpointUpdate = compileSchema<WebhookEndpointUpdateBody>(updateSchema);

/** A malformed id cannot exist; it answers exactly like a missing one (or another organization's). */
export function assertEndpointIdShape(endpointId: string): void {
  if (!/^wh_[0-9a-z]{1,40}$/.test(endpointId)) throw new DomainError("not_found", "The webhook endpoint was not found.");
}

export const noStore = { "cache-control": "no-store" };

/** Domain errors name form fields ("url"); the public API names them as JSON pointers ("/url"). */
export async function withJsonPointers<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (error instanceof DomainError && error.errors.length > 0) {
      const errors = error.errors.map((f) => (f.pointer === undefined || f.pointer.startsWith("/") ? f : { ...f, pointer: `/${f.pointer}` }));
      throw new DomainError(error.code, error.message, errors, error.retryAfterSeconds, error.extensions);
    }
    throw error;
  }
}
