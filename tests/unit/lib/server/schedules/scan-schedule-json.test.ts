// The compact JSON intake (issue 10): the scan hands out the same members JSON.parse would, keeps
// their text for the chunks, and gives way to the ordinary parse for anything it does not follow.
import { describe, expect, it } from "vitest";

import { getMemberSource } from "@/lib/schedule-members/lazy-members";
import { MemberTextError, scanScheduleJson } from "@/lib/server/schedules/scan-schedule-json";

const bytes = (text: string) => new TextEncoder().encode(text);

describe("scanScheduleJson", () => {
  const text = '\uFEFF { "format": "sagline.schedule/v1", "members" : [ {"mark":"B-1","notes":"a \\"quoted\\" ] } note"} ,\n {"mark":"Ж-2","spans":[3,[4]]} ], "name": "Invented", "name": "Later wins" }';

  it("reads the envelope and members as JSON.parse does, members read afresh, chunk text as submitted", () => {
    const doc = scanScheduleJson(bytes(text), 100_000)!;
    const parsed = JSON.parse(text.slice(1)) as Record<string, unknown>;
    expect(doc.name).toBe("Later wins");
    expect(Array.isArray(doc.members)).toBe(true);
    expect([...(doc.members as unknown[])]).toEqual(parsed.members);
    const source = getMemberSource(doc.members)!;
    expect(source.count).toBe(2);
    expect(JSON.parse(source.chunkText(0, 2))).toEqual(parsed.members);
    expect(JSON.parse(source.chunkText(1, 2))).toEqual([(parsed.members as unknown[])[1]]);
    expect(source.mayHoldNulEscape()).toBe(false);
  });

  it.each([
    ["a repeated members key", '{"members":[{}],"members":[{}]}'],
    ["members that are not an array", '{"members":{"a":1}}'],
    ["no members", '{"name":"x"}'],
    ["an unclosed array", '{"members":[{"a":1}'],
    ["text after the document", '{"members":[{}]} x'],
    ["a missing comma between members", '{"members":[{} {}]}'],
    ["bytes that are not UTF-8", '{"members":[{"a":"\xff"}]}'],
  ])("gives way to the ordinary parse for %s", (_what, body) => {
    const raw = body.includes("\xff") ? Uint8Array.from([...body].map((c) => c.charCodeAt(0))) : bytes(body);
    expect(scanScheduleJson(raw, 100_000)).toBeNull();
  });

  it("a member that does not parse throws MemberTextError when read", () => {
    const doc = scanScheduleJson(bytes('{"members":[{"a":1},{"a":tru}]}'), 100_000)!;
    expect(() => (doc.members as unknown[])[1]).toThrow(MemberTextError);
  });

  it("counts members beyond the cap without recording them, so the count alone refuses them", () => {
    const doc = scanScheduleJson(bytes(`{"members":[${Array.from({ length: 12 }, () => "{}").join(",")}]}`), 10)!;
    expect((doc.members as unknown[]).length).toBe(11);
  });

  it("notices the JSON escape of U+0000", () => {
    const doc = scanScheduleJson(bytes('{"members":[{"mark":"a\\u0000"}]}'), 100_000)!;
    expect(getMemberSource(doc.members)!.mayHoldNulEscape()).toBe(true);
  });
});
