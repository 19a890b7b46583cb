import type { JobDefinition } from "./define-job";

/** Every job this worker process runs. Add a definition here to have workers/index.ts start it. */
export const jobDefinitions: JobDefinition[] = [];
