import { describe, expect, it } from "vitest";

import { anonymous } from "@/tests/helpers/app";

describe("GET /api/health", () => {
  it("answers 200 with every component up while the services run", async () => {
    const response = await anonymous().get("/api/health");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: "ok", components: { web: "up", postgres: "up", redis: "up" } });
  });
});
