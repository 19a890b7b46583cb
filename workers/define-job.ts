import { UnrecoverableError, type Job } from "bullmq";
import type { z } from "zod";

/**
 * A job definition: its queue, a schema for its payload (a bad payload is unrecoverable, never
 * retried) and a handler that must be safe to run twice (at-least-once delivery).
 */
export interface JobDefinition<S extends z.ZodType = z.ZodType> {
  queue: string;
  /** Environment variable naming this queue's concurrency per process, and its default. */
  concurrency: { env: string; default: number };
  payload: S;
  handle: (payload: z.infer<S>, job: Job) => Promise<unknown>;
}

export function defineJob<S extends z.ZodType>(definition: JobDefinition<S>): JobDefinition<S> {
  return definition;
}

export async function runJob<S extends z.ZodType>(definition: JobDefinition<S>, job: Job): Promise<unknown> {
  const parsed = definition.payload.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`bad payload for ${definition.queue}: ${parsed.error.message}`);
  return definition.handle(parsed.data, job);
}
