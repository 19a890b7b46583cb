import { getSql } from "@/db/client";
import { getRedis, waitForRedis } from "@/lib/server/redis";
import { withTimeout } from "@/lib/server/with-timeout";

export type ComponentStatus = "up" | "down";

export interface HealthReport {
  status: "ok" | "degraded";
  components: { web: ComponentStatus; postgres: ComponentStatus; redis: ComponentStatus };
}

async function probe(check: () => Promise<unknown>): Promise<ComponentStatus> {
  try {
    await withTimeout(check(), 2_000, "timeout");
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
