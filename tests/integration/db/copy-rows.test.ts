// copyRows against the real PostgreSQL: every kind of cell the result tables hold comes back as
// written, the awkward strings included, and a failing COPY leaves the transaction's table empty.
import { describe, expect, it } from "vitest";

import { getSql } from "@/db/client";
import { copyRows, encodeCsvLine } from "@/lib/server/copy-rows";

const awkward = ["", 'say "when"', "a,b", "two\nlines", "cr\r\nlf", "\\.", " padded ", "NULL", "é ü ✓"];

describe("copyRows", () => {
  it("round-trips strings, numbers, booleans, nulls and json through COPY", async () => {
    const sql = getSql();
    const numbers = [0, -0, 0.1 + 0.2, 1e-300, -123456.789, Number.MAX_VALUE, Infinity, -Infinity];
    const rows = [
      ...awkward.map((text, i) => [i, text, 1.5, true, JSON.stringify({ text })] as const),
      ...numbers.map((value, i) => [100 + i, null, value, false, null] as const),
    ];
    const back = await sql.begin(async (tx) => {
      await tx`create temporary table copy_probe (id integer primary key, label text, value double precision, flag boolean, doc json) on commit drop`;
      await copyRows(tx, "copy_probe", ["id", "label", "value", "flag", "doc"], rows);
      return tx`select id, label, value, flag, doc from copy_probe order by id`;
    });
    expect(back.map((r) => r.label)).toEqual([...awkward, ...numbers.map(() => null)]);
    expect(back.slice(0, awkward.length).map((r) => r.doc)).toEqual(awkward.map((text) => ({ text })));
    expect(back.slice(awkward.length).map((r) => r.value)).toEqual(numbers);
    expect(Object.is(back[awkward.length + 1]!.value, -0)).toBe(true);
    expect(back.map((r) => r.flag)).toEqual(rows.map((r) => r[3]));
    expect(back.slice(awkward.length).every((r) => r.doc === null)).toBe(true);
  });

  it("writes nothing when a row is refused", async () => {
    const sql = getSql();
    await sql`create table if not exists copy_probe_refused (id integer primary key)`;
    try {
      await expect(sql.begin((tx) => copyRows(tx, "copy_probe_refused", ["id"], [[1], [2], [1]]))).rejects.toThrow(/duplicate key/);
      const [count] = await sql`select count(*)::int as n from copy_probe_refused`;
      expect(count!.n).toBe(0);
    } finally {
      await sql`drop table copy_probe_refused`;
    }
  });

  it("rejects when the COPY statement itself is refused", async () => {
    await expect(getSql().begin((tx) => copyRows(tx, "copy_probe_missing_table", ["id"], [[1]]))).rejects.toThrow(/does not exist/);
  });

  it("quotes every string and leaves numbers, booleans and nulls bare", () => {
    expect(encodeCsvLine(["a", "", 'q"', 1.25, true, false, null, 7, -0])).toBe('"a","","q""",1.25,t,f,,7,-0\n');
  });
});
