// Idempotency-Key leases: a request that died does not hold its key for 24 hours, a slow one that
// lost its lease cannot also commit, and the key's answer commits with the work or not at all.
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { demoOrganizations } from "@/db/seed-data";
import { DomainError } from "@/lib/server/errors";
import { hashRequest, runIdempotent, type StoredResponse } from "@/lib/server/http/idempotency";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

const organizationId = demoOrganizations.engineering.id;
let key: string;
beforeAll(async () => {
  key = await createTestKey();
});

const post = (body: unknown, idempotencyKey: string) =>
  request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).set("idempotency-key", idempotencyKey).send(body as object);

async function countSchedules(name: string): Promise<number> {
  const [row] = await getSql()`select count(*)::int as n from schedules where name = ${name}`;
  return row!.n as number;
}

/** Work that commits one row in its own transaction together with the key's answer. */
function workThatCommits(label: string, commits: string[], beforeCommit?: () => Promise<void>) {
  return async (completeKey: (tx: never, r: StoredResponse) => Promise<void>) => {
    const response = { status: 201, body: { made: label } };
    await getSql().begin(async (tx) => {
      await tx`select 1`;
      await beforeCommit?.();
      await completeKey(tx as never, response);
    });
    commits.push(label);
    return response;
  };
}

describe("Idempotency-Key leases", () => {
  it("a key left in flight by a request that died is taken over once its lease lapses", async () => {
    const idem = `dead-${Date.now()}`;
    const name = `Lease takeover ${idem}`;
    const doc = createScheduleDoc([createBeam("L-1")], name);
    // What a crashed request leaves behind: a claim whose lease has run out (the hash does not matter).
    await getSql()`
      insert into idempotency_keys (organization_id, key, request_hash, state, lease_token, lease_expires_at, expires_at)
      values (${organizationId}, ${idem}, 'from-a-request-that-died', 'in_flight', 'dead', now() - interval '1 second', now() + interval '24 hours')`;
    const retry = await post(doc, idem);
    expect(retry.status).toBe(202);
    const replay = await post(doc, idem);
    expect(replay.status).toBe(202);
    expect(replay.headers["idempotent-replayed"]).toBe("true");
    expect(replay.body).toEqual(retry.body);
    expect(await countSchedules(name)).toBe(1);
  });

  it("a key whose holder's lease is still live answers 409", async () => {
    const idem = `live-${Date.now()}`;
    const doc = createScheduleDoc([createBeam("L-2")]);
    // The hash the server computes for this very request (content type, query, body bytes).
    const sameRequest = hashRequest(["application/json", "", new TextEncoder().encode(JSON.stringify(doc))]);
    await getSql()`
      insert into idempotency_keys (organization_id, key, request_hash, state, lease_token, lease_expires_at, expires_at)
      values (${organizationId}, ${idem}, ${sameRequest}, 'in_flight', 'live', now() + interval '1 minute', now() + interval '24 hours')`;
    const busy = await post(doc, idem);
    expect(busy.status).toBe(409);
    expect(busy.body).toMatchObject({ type: "https://sagline.dev/problems/idempotency-in-flight", status: 409 });
  });

  it("a slow request that lost its lease to a retry rolls back: the work commits once", async () => {
    const idem = `slow-${Date.now()}`;
    const commits: string[] = [];
    let expireLease!: () => void;
    const leaseLost = new Promise<void>((resolve) => (expireLease = resolve));
    const slow = runIdempotent(organizationId, idem, () => "same-request", workThatCommits("slow", commits, () => leaseLost));
    // Let the slow request claim the key, then end its lease and let a retry take over.
    const deadline = Date.now() + 10_000;
    while (Date.now() < deadline && (await getSql()`select 1 from idempotency_keys where organization_id = ${organizationId} and key = ${idem}`).length === 0) {
      await new Promise((r) => setTimeout(r, 20));
    }
    await getSql()`update idempotency_keys set lease_expires_at = now() - interval '1 second' where organization_id = ${organizationId} and key = ${idem}`;
    const retry = await runIdempotent(organizationId, idem, () => "same-request", workThatCommits("retry", commits));
    expireLease();
    await expect(slow).rejects.toMatchObject({ code: "idempotency_in_flight" });
    expect(retry).toMatchObject({ status: 201, body: { made: "retry" }, replayed: false });
    expect(commits).toEqual(["retry"]);
    const replay = await runIdempotent(organizationId, idem, () => "same-request", workThatCommits("third", commits));
    expect(replay).toMatchObject({ body: { made: "retry" }, replayed: true });
  });

  it("work that fails after recording its answer leaves no answer: the retry runs it, once", async () => {
    const idem = `rollback-${Date.now()}`;
    const commits: string[] = [];
    const failing = runIdempotent(organizationId, idem, () => "r", async (completeKey) => {
      await getSql().begin(async (tx) => {
        await completeKey(tx, { status: 201, body: { made: "first" } });
        throw new DomainError("unavailable", "the database went away before the commit");
      });
      return { status: 201, body: {} };
    });
    await expect(failing).rejects.toMatchObject({ code: "unavailable" });
    const [left] = await getSql()`select count(*)::int as n from idempotency_keys where organization_id = ${organizationId} and key = ${idem}`;
    expect(left!.n).toBe(0);
    const retry = await runIdempotent(organizationId, idem, () => "r", workThatCommits("retry", commits));
    expect(retry).toMatchObject({ body: { made: "retry" }, replayed: false });
    expect(commits).toEqual(["retry"]);
  });
});
