// The scheduled purge removes throttle, Idempotency-Key and reset rows whose time is over, and
// keeps every row that still does something.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { createId, hashToken } from "@/lib/server/ids";
import { purgeExpiredRows } from "@/lib/server/maintenance/purge-expired-rows";
import { createTestMember } from "@/tests/helpers/people";

describe("purgeExpiredRows", () => {
  it("deletes what has expired and keeps live throttles, locks, keys and links", async () => {
    const sql = getSql();
    const tag = createId("purge");
    const org = demoOrganizations.engineering.id;
    await sql`insert into sign_in_throttles (email_key, failures, window_started_at, locked_until, updated_at) values
      (${`${tag}-old`}, 3, now() - interval '2 days', null, now() - interval '2 days'),
      (${`${tag}-old-lock-over`}, 6, now() - interval '2 days', now() - interval '1 day', now() - interval '2 days'),
      (${`${tag}-window`}, 2, now(), null, now()),
      (${`${tag}-locked`}, 6, now() - interval '2 days', now() + interval '10 minutes', now() - interval '2 days')`;
    await sql`insert into idempotency_keys (organization_id, key, request_hash, state, lease_token, lease_expires_at, expires_at) values
      (${org}, ${`${tag}-expired`}, 'h', 'completed', null, null, now() - interval '1 hour'),
      (${org}, ${`${tag}-dead-claim`}, 'h', 'in_flight', 'x', now() - interval '2 hours', now() - interval '1 hour'),
      (${org}, ${`${tag}-live`}, 'h', 'completed', null, null, now() + interval '23 hours'),
      (${org}, ${`${tag}-running`}, 'h', 'in_flight', 'y', now() + interval '1 minute', now() - interval '1 second')`;
    const member = await createTestMember("viewer");
    await sql`insert into password_resets (id, user_id, token_hash, expires_at) values
      (${createId("rst")}, ${member.id}, ${hashToken(`${tag}-old`)}, now() - interval '2 days'),
      (${createId("rst")}, ${member.id}, ${hashToken(`${tag}-open`)}, now() + interval '1 hour')`;

    const counts = await purgeExpiredRows();
    expect(counts.signInThrottles).toBeGreaterThanOrEqual(2);
    expect(counts.idempotencyKeys).toBeGreaterThanOrEqual(2);
    expect(counts.passwordResets).toBeGreaterThanOrEqual(1);

    const throttles = await sql`select email_key from sign_in_throttles where email_key like ${`${tag}%`} order by email_key`;
    expect(throttles.map((r) => r.email_key)).toEqual([`${tag}-locked`, `${tag}-window`]);
    const keys = await sql`select key from idempotency_keys where key like ${`${tag}%`} order by key`;
    expect(keys.map((r) => r.key)).toEqual([`${tag}-live`, `${tag}-running`]);
    const resets = await sql`select token_hash from password_resets where user_id = ${member.id}`;
    expect(resets.map((r) => r.token_hash)).toEqual([hashToken(`${tag}-open`)]);
  });
});
