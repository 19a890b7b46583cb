// RELIABILITY figure 6: one invalid row at row 100,000 of a CSV: nothing written; the error
// names the row, the line and the column.
import { sql } from "drizzle-orm";
import request from "supertest";
import { describe, expect, it } from "vitest";

import { getDb } from "@/db/client";
import { APP_URL } from "@/tests/helpers/app";
import { createTestKey } from "@/tests/helpers/api-keys";

const header = "mark,category,quantity,material,section,bf [mm],tf [mm],d [mm],tw [mm],span_1 [m],supports,dead_uniform [kN/m],live_uniform [kN/m]";

describe("a 100,000-row CSV with one bad row", () => {
  it("writes nothing and reports row 100,000", { timeout: 120_000 }, async () => {
    const key = await createTestKey();
    const lines = [header];
    // Spreadsheet rows: the header is row 1, so data rows are 2..100,001; row 100,000 is bad.
    for (let row = 2; row <= 100_001; row += 1) {
      const span = row === 100_000 ? "-4" : String(3 + (row % 5));
      lines.push(`L-${row},floor_beam,1,steel-s355,i_plate,150,10.7,300,7.1,${span},pinned roller,3,7.5`);
    }
    const [before] = await getDb().execute(sql`select (select count(*) from schedules)::int as s, (select count(*) from schedule_chunks)::int as m`);
    const response = await request(APP_URL)
      .post("/api/v1/schedules?profile=ibc-2021-floor&name=Large")
      .set("authorization", `Bearer ${key}`)
      .set("content-type", "text/csv")
      .send(lines.join("\r\n") + "\r\n");
    expect(response.status).toBe(422);
    expect(response.body.errorCount).toBe(1);
    expect(response.body.errors).toHaveLength(1);
    expect(response.body.errors[0]).toMatchObject({ row: 100_000, line: 100_000, column: "span_1 [m]" });
    const [after] = await getDb().execute(sql`select (select count(*) from schedules)::int as s, (select count(*) from schedule_chunks)::int as m`);
    expect(after).toEqual(before);
  });
});
