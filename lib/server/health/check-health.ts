import { getSql } from "@/db/client";
import { getRedis, waitForRedis } from "@/lib/server/redis";

export type ComponentStatus = "up" | "down";

export interface HealthReport {
  status: "ok" | "degraded";
  components: { web: ComponentStatus; postgres: ComponentStatus; redis: ComponentStatus };
}

function withTimeout<T>(promise: Promise<T>, ms: number): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const timeout = new Promise<T>((_, reject) => {
    timer = setTimeout(() => reject(new Error("timeout")), ms);
  });
  return Promise.race([promise, timeout]).finally(() => clearTimeout(timer));
}

async function probe(check: () => Promise<unknown>): Promise<ComponentStatus> {
  try {
    await withTimeout(check(), 2_000);
    return "up";
  } catch {
    return "down";
  }
}

export async function checkHealth(): Promise<HealthReport> {
  const [postgres, redis] = await Promise.all([
    probe(() => getSql()`select 1`),
    probe(async () => {
      const redis = getRedis();
      await waitForRedis(redis, 1_500);
      return redis.ping();
    }),
  ]);
  const components = { web: "up" as const, postgres, redis };
  return { status: postgres === "up" && redis === "up" ? "ok" : "degraded", components };
}
