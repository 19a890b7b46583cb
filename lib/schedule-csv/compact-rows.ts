/**
 * CSV records kept compactly: each record's fields as UTF-8 bytes, separated by NUL (the reader
 * refuses NUL in a file, so it never occurs in a field), in one byte arena, with one offset per
 * record. The fields are the file's own text less delimiters, quotes and line ends, so an arena
 * sized to the body's byte length holds every record without growing.
 */
const SEPARATOR = "\u0000";

export class CompactRows {
  private arena: Uint8Array;
  private used = 0;
  private ends = new Int32Array(1024);
  count = 0;
  private readonly encoder = new TextEncoder();
  private readonly decoder = new TextDecoder();

  constructor(capacityBytes: number) {
    this.arena = new Uint8Array(Math.max(1024, capacityBytes));
  }

  push(fields: readonly string[]): void {
    const text = fields.join(SEPARATOR);
    // UTF-8 takes at most 3 bytes per UTF-16 unit.
    if (this.used + 3 * text.length > this.arena.length) {
      const needed = this.used + new TextEncoder().encode(text).length;
      if (needed > this.arena.length) this.arena = grow(this.arena, Math.max(needed, Math.ceil(this.arena.length * 1.25)));
    }
    this.used += this.encoder.encodeInto(text, this.arena.subarray(this.used)).written;
    if (this.count === this.ends.length) {
      const grown = new Int32Array(this.ends.length * 2);
      grown.set(this.ends);
      this.ends = grown;
    }
    this.ends[this.count++] = this.used;
  }

  fields(index: number): string[] {
    const start = index === 0 ? 0 : this.ends[index - 1]!;
    return this.decoder.decode(this.arena.subarray(start, this.ends[index]!)).split(SEPARATOR);
  }

  /** Drops every record (a later row failed: only errors are kept from then on). */
  clear(): void {
    this.arena = new Uint8Array(0);
    this.used = 0;
    this.count = 0;
  }
}

function grow(arena: Uint8Array, size: number): Uint8Array {
  const grown = new Uint8Array(size);
  grown.set(arena);
  return grown;
}
