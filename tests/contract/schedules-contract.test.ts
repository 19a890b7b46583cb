// Real responses of the schedules API validated against the public JSON Schemas in api-schemas/.
import request from "supertest";
import { beforeAll, describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";
import { compileApiSchema, describeSchemaErrors } from "@/tests/helpers/schemas";
import { createBeam, createScheduleDoc, waitForSchedule } from "@/tests/helpers/schedules";

const load = (name: string) => compileApiSchema(name, { strict: false });
const validators = {
  accepted: load("schedule-accepted"),
  status: load("schedule-status"),
  results: load("results-page"),
  member: load("member-result"),
  problem: load("problem"),
};

function expectValid(name: keyof typeof validators, body: unknown) {
  const validate = validators[name];
  expect(validate(body), `${name}: ${describeSchemaErrors(validate.errors)}`).toBe(true);
}

let key: string;
let scheduleId: string;
beforeAll(async () => {
  key = await createTestKey();
  const accepted = await request(APP_URL).post("/api/v1/schedules").set("authorization", `Bearer ${key}`).send(createScheduleDoc([createBeam("K-1", 4), createBeam("K-2", 9)]));
  expectValid("accepted", accepted.body);
  scheduleId = accepted.body.id;
  await waitForSchedule(key, scheduleId);
});

describe("schedules API contract", () => {
  it("status, results and member answers match their schemas", async () => {
    const auth = { authorization: `Bearer ${key}` };
    expectValid("status", (await request(APP_URL).get(`/api/v1/schedules/${scheduleId}`).set(auth)).body);
    expectValid("results", (await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/results`).set(auth)).body);
    expectValid("member", (await request(APP_URL).get(`/api/v1/schedules/${scheduleId}/members/K-2`).set(auth)).body);
    const list = await request(APP_URL).get("/api/v1/schedules").set(auth);
    // The schedule made in beforeAll is listed, so the loop below checks at least one item.
    expect(list.body.data.length).toBeGreaterThan(0);
    for (const item of list.body.data) expectValid("status", item);
  });

  it("errors match the problem schema", async () => {
    const auth = { authorization: `Bearer ${key}` };
    const answers = [
      await request(APP_URL).get("/api/v1/schedules/sch_missing0000").set(auth),
      await request(APP_URL).post("/api/v1/schedules").set(auth).set("content-type", "application/json").send("{"),
      await request(APP_URL).post("/api/v1/schedules").set(auth).send(createScheduleDoc([{ ...createBeam("E-1"), spans: [0] }])),
      await request(APP_URL).get("/api/v1/schedules?cursor=zz").set(auth),
    ];
    for (const a of answers) {
      expect(a.headers["content-type"]).toContain("application/problem+json");
      expectValid("problem", a.body);
    }
  });
});
