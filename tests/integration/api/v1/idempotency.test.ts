// IETF Idempotency-Key draft behaviour of POST /api/v1/schedules, against the real server.
import { sql } from "drizzle-orm";
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { createBeam, createScheduleDoc } from "@/tests/helpers/schedules";

let key: string;
beforeAll(async () => {
  key = await createTestKey();
});

const post = (body: unknown, idempotencyKey: string) =>
  request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).set("idempotency-key", idempotencyKey).send(body as object);

describe("Idempotency-Key", () => {
  it("returns the original schedule for a repeat, and 422 for the same key with another body", async () => {
    const idem = `idem-${Date.now()}`;
    const doc = createScheduleDoc([createBeam("I-1")]);
    const first = await post(doc, idem);
    const again = await post(doc, idem);
    expect(first.status).toBe(202);
    expect(again.status).toBe(202);
    expect(again.body).toEqual(first.body);
    expect(again.headers["idempotent-replayed"]).toBe("true");
    const other = await post(createScheduleDoc([createBeam("I-2")]), idem);
    expect(other.status).toBe(422);
    expect(other.body).toMatchObject({ type: "https://sagline.dev/problems/idempotency-key-reused", status: 422 });
  });

  it("lets a rejected request be corrected and resent with the same key", async () => {
    const idem = `fix-${Date.now()}`;
    const bad = await post(createScheduleDoc([{ ...createBeam("F-1"), spans: [-1] }]), idem);
    expect(bad.status).toBe(422);
    const good = await post(createScheduleDoc([createBeam("F-1")]), idem);
    expect(good.status).toBe(202);
  });

  it("makes exactly one schedule from 100 concurrent duplicates; every answer is the original or a 409", async () => {
    const idem = `burst-${Date.now()}`;
    const name = `Burst ${idem}`;
    const doc = createScheduleDoc([createBeam("C-1"), createBeam("C-2")], name);
    const answers = await Promise.all(Array.from({ length: 100 }, () => post(doc, idem)));
    const created = answers.filter((a) => a.status === 202);
    const busy = answers.filter((a) => a.status === 409);
    expect(created.length + busy.length).toBe(100);
    expect(new Set(created.map((a) => a.body.id)).size).toBe(1);
    for (const a of busy) {
      expect(a.body).toMatchObject({ type: "https://sagline.dev/problems/idempotency-in-flight", status: 409 });
      expect(a.headers["retry-after"]).toBe("1");
    }
    const rows = await getDb().execute(sql`select count(*)::int as n from schedules where name = ${name}`);
    expect(rows[0]).toEqual({ n: 1 });
  });

  it("refuses a malformed key", async () => {
    const response = await post(createScheduleDoc([createBeam("M-1")]), "a".repeat(300));
    expect(response.status).toBe(400);
    expect(response.body.errors).toEqual([{ pointer: "/headers/idempotency-key", message: "1 to 255 visible ASCII characters" }]);
  });
});
