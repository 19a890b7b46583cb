import { and, eq, sql } from "drizzle-orm";

import { getDb } from "@/db/client";
import { reviewDigestPreferences, type DigestFrequency } from "@/db/schema";

/** Without a saved choice an engineer gets the digest immediately: a failure nobody hears about is the risk. */
export const DEFAULT_DIGEST_FREQUENCY: DigestFrequency = "immediate";

export { digestFrequencyLabels } from "@/lib/review-vocabulary";

export async function getDigestFrequency(userId: string, organizationId: string): Promise<DigestFrequency> {
  const [row] = await getDb()
    .select({ frequency: reviewDigestPreferences.frequency })
    .from(reviewDigestPreferences)
    .where(and(eq(reviewDigestPreferences.userId, userId), eq(reviewDigestPreferences.organizationId, organizationId)));
  return row?.frequency ?? DEFAULT_DIGEST_FREQUENCY;
}

export async function setDigestFrequency(userId: string, organizationId: string, frequency: DigestFrequency): Promise<void> {
  await getDb()
    .insert(reviewDigestPreferences)
    .values({ userId, organizationId, frequency })
    .onConflictDoUpdate({ target: [reviewDigestPreferences.userId, reviewDigestPreferences.organizationId], set: { frequency, updatedAt: sql`now()` } });
}
