import { Buffer, isUtf8 } from "node:buffer";

import { createLazyMembers, type MemberSource } from "@/lib/schedule-members/lazy-members";

/**
 * Reads a JSON schedule body without building the whole tree: one linear pass over the bytes
 * finds the top-level `members` array and each member's byte range; the rest of the document (the
 * envelope) is parsed as usual. Members are parsed one at a time when asked for, and a chunk's
 * text is its members' bytes as submitted. Structural characters are ASCII, and UTF-8 never uses
 * ASCII bytes inside a multi-byte character, so scanning bytes is exact.
 *
 * Anything this pass does not follow (no members array, a repeated `members` key, a syntax
 * error) returns null, and the caller parses the body the ordinary way, which also gives
 * JSON.parse's own error message. A member that later fails to parse does the same.
 */
const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const COMMA = 0x2c;
const COLON = 0x3a;
const OPEN_BRACE = 0x7b;
const CLOSE_BRACE = 0x7d;
const OPEN_BRACKET = 0x5b;
const CLOSE_BRACKET = 0x5d;

/** Members parsed at once, and the most text parsed at once (a window holds at least one member). */
const WINDOW_MEMBERS = 500;
const WINDOW_BYTES = 1 << 20;

const isSpace = (c: number | undefined) => c === 0x20 || c === 0x0a || c === 0x0d || c === 0x09;

/** The member's text did not parse although the scan accepted it: read the whole body instead. */
export class MemberTextError extends Error {
  constructor() {
    super("a member's text is not valid JSON");
    this.name = "MemberTextError";
  }
}

/** Growable pairs of byte offsets (start, end) without an object per member. */
class SpanList {
  private data = new Int32Array(2 * 1024);
  count = 0;
  push(start: number, end: number): void {
    if (2 * this.count + 2 > this.data.length) {
      const grown = new Int32Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    this.data[2 * this.count] = start;
    this.data[2 * this.count + 1] = end;
    this.count += 1;
  }
  start(index: number): number {
    return this.data[2 * index]!;
  }
  end(index: number): number {
    return this.data[2 * index + 1]!;
  }
}

function skipSpace(bytes: Uint8Array, at: number): number {
  let i = at;
  while (isSpace(bytes[i])) i++;
  return i;
}

/** The index after the string that starts at `at` (a quote), or -1 when it never closes. */
function skipString(bytes: Uint8Array, at: number): number {
  for (let i = at + 1; i < bytes.length; i++) {
    const c = bytes[i];
    if (c === QUOTE) return i + 1;
    if (c === BACKSLASH) i++;
  }
  return -1;
}

/** The index after the value that starts at `at`, or -1. Nesting is counted, not recursed into. */
function skipValue(bytes: Uint8Array, at: number): number {
  const first = bytes[at];
  if (first === QUOTE) return skipString(bytes, at);
  if (first === OPEN_BRACE || first === OPEN_BRACKET) {
    let depth = 0;
    for (let i = at; i < bytes.length; ) {
      const c = bytes[i];
      if (c === QUOTE) {
        i = skipString(bytes, i);
        if (i < 0) return -1;
        continue;
      }
      if (c === OPEN_BRACE || c === OPEN_BRACKET) depth++;
      else if (c === CLOSE_BRACE || c === CLOSE_BRACKET) {
        depth--;
        if (depth === 0) return i + 1;
      }
      i++;
    }
    return -1;
  }
  let i = at;
  while (i < bytes.length) {
    const c = bytes[i];
    if (c === COMMA || c === CLOSE_BRACE || c === CLOSE_BRACKET || isSpace(c)) break;
    i++;
  }
  return i > at ? i : -1;
}

interface ScannedBody {
  envelopeText: string;
  members: SpanList;
  /** Members beyond `maxRecorded` are counted, not recorded (the count alone refuses them). */
  memberCount: number;
}

function scanTopLevel(bytes: Uint8Array, decode: (from: number, to: number) => string, maxRecorded: number): ScannedBody | null {
  let i = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  const bodyStart = i;
  i = skipSpace(bytes, i);
  if (bytes[i] !== OPEN_BRACE) return null;
  i = skipSpace(bytes, i + 1);
  let range: { start: number; end: number } | null = null;
  let members = new SpanList();
  let memberCount = 0;
  while (bytes[i] !== CLOSE_BRACE) {
    if (bytes[i] !== QUOTE) return null;
    const keyEnd = skipString(bytes, i);
    if (keyEnd < 0) return null;
    const key = JSON.parse(decode(i, keyEnd)) as string;
    i = skipSpace(bytes, keyEnd);
    if (bytes[i] !== COLON) return null;
    i = skipSpace(bytes, i + 1);
    if (key === "members" && range) return null;
    if (key === "members" && bytes[i] === OPEN_BRACKET) {
      const start = i;
      members = new SpanList();
      i = skipSpace(bytes, i + 1);
      while (bytes[i] !== CLOSE_BRACKET) {
        const end = skipValue(bytes, i);
        if (end < 0) return null;
        if (memberCount < maxRecorded) members.push(i, end);
        memberCount++;
        i = skipSpace(bytes, end);
        if (bytes[i] === COMMA) i = skipSpace(bytes, i + 1);
        else if (bytes[i] !== CLOSE_BRACKET) return null;
      }
      i += 1;
      range = { start, end: i };
    } else {
      if (key === "members") return null;
      const end = skipValue(bytes, i);
      if (end < 0) return null;
      i = end;
    }
    i = skipSpace(bytes, i);
    if (bytes[i] === COMMA) i = skipSpace(bytes, i + 1);
    else if (bytes[i] !== CLOSE_BRACE) return null;
  }
  if (skipSpace(bytes, i + 1) !== bytes.length || !range) return null;
  const envelopeText = `${decode(bodyStart, range.start)}[]${decode(range.end, bytes.length)}`;
  return { envelopeText, members, memberCount };
}

const NUL_ESCAPE = new TextEncoder().encode("\\u0000");

function holdsSequence(bytes: Uint8Array, sequence: Uint8Array): boolean {
  for (let i = bytes.indexOf(sequence[0]!); i !== -1 && i + sequence.length <= bytes.length; i = bytes.indexOf(sequence[0]!, i + 1)) {
    let all = true;
    for (let k = 1; k < sequence.length && all; k++) all = bytes[i + k] === sequence[k];
    if (all) return true;
  }
  return false;
}

/**
 * The schedule document with its members as a lazy array (see lazy-members.ts), or null when the
 * body needs the ordinary parse. Member access throws
 * MemberTextError (from member access) for a member that does not parse.
 */
export function scanScheduleJson(bytes: Uint8Array, maxMembers: number): Record<string, unknown> | null {
  // Checked once here (the ordinary parse reports bytes that are not UTF-8); slices then decode fast.
  if (!isUtf8(bytes)) return null;
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const decode = (from: number, to: number) => text.toString("utf8", from, to);
  let scanned: ScannedBody | null;
  let envelope: unknown;
  try {
    scanned = scanTopLevel(bytes, decode, maxMembers + 1);
    if (!scanned) return null;
    envelope = JSON.parse(scanned.envelopeText);
  } catch {
    return null;
  }
  if (typeof envelope !== "object" || envelope === null || Array.isArray(envelope)) return null;
  const { members: spans, memberCount } = scanned;
  // Readers walk the members in order: parse a window of them with one JSON.parse (per-member
  // calls cost twice as much), and keep only the current window.
  let window: { first: number; members: unknown[] } = { first: 0, members: [] };
  const readWindow = (first: number) => {
    let last = first + 1;
    while (last < spans.count && last - first < WINDOW_MEMBERS && spans.end(last) - spans.start(first) < WINDOW_BYTES) last++;
    let members: unknown;
    try {
      members = JSON.parse(`[${decode(spans.start(first), spans.end(last - 1))}]`);
    } catch {
      throw new MemberTextError();
    }
    // Text between members is only commas and spaces (the scan saw to it), so the count holds.
    if (!Array.isArray(members) || members.length !== last - first) throw new MemberTextError();
    window = { first, members };
  };
  const source: MemberSource = {
    // Past the limit only the count matters; the first maxMembers + 1 are readable.
    count: Math.min(memberCount, spans.count),
    memberAt(index) {
      if (index < window.first || index >= window.first + window.members.length) readWindow(index);
      return window.members[index - window.first];
    },
    chunkText(first, last) {
      return `[${decode(spans.start(first), spans.end(last - 1))}]`;
    },
    mayHoldNulEscape: () => holdsSequence(bytes, NUL_ESCAPE),
  };
  return { ...envelope, members: createLazyMembers(source) };
}
