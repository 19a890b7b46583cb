import { describe, expect, it } from "vitest";

import { tokenizeCsv } from "@/lib/schedule-csv";

describe("tokenizeCsv (RFC 4180)", () => {
  it("drops a UTF-8 BOM and splits CRLF lines", () => {
    const result = tokenizeCsv("\uFEFFa,b\r\n1,2\r\n", ",");
    expect(result).toEqual({ ok: true, records: [{ fields: ["a", "b"], line: 1 }, { fields: ["1", "2"], line: 2 }] });
  });

  it("keeps delimiters, doubled quotes and newlines inside quotes, and counts lines", () => {
    const result = tokenizeCsv('a,b\n"x, y","say ""hi"""\n"two\nlines",z\nlast,1', ",");
    expect(result).toEqual({
      ok: true,
      records: [
        { fields: ["a", "b"], line: 1 },
        { fields: ["x, y", 'say "hi"'], line: 2 },
        { fields: ["two\nlines", "z"], line: 3 },
        { fields: ["last", "1"], line: 5 },
      ],
    });
  });

  it("splits on the given delimiter only", () => {
    expect(tokenizeCsv("a;b,c\n", ";")).toEqual({ ok: true, records: [{ fields: ["a", "b,c"], line: 1 }] });
    expect(tokenizeCsv("a\tb\n", "\t")).toEqual({ ok: true, records: [{ fields: ["a", "b"], line: 1 }] });
  });

  it("keeps empty trailing fields", () => {
    expect(tokenizeCsv("a,,\n", ",")).toEqual({ ok: true, records: [{ fields: ["a", "", ""], line: 1 }] });
  });

  it("reports an unclosed quote with the line it opened on", () => {
    expect(tokenizeCsv('a\n"open,\nmore', ",")).toEqual({ ok: false, line: 2, message: "a quoted field is not closed" });
  });
});
