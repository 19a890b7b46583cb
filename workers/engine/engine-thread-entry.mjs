// Plain JavaScript entry of an engine thread: a worker thread does not inherit the TypeScript
// loader the process started with, so it registers tsx itself before loading the thread's code.
import { register } from "tsx/esm/api";

register();
await import("./engine-thread.ts");
