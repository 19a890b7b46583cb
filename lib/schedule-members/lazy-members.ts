/**
 * A schedule's members held in a compact form (their JSON text in the body, or their CSV fields)
 * and handed out as an array whose entries are read afresh on each access. Validation, intake and
 * chunk writing walk the members once each, in order, so only one member's objects are alive at a
 * time: a 100,000-member schedule never exists as a tree of objects (about 11x its body's size).
 * The array is a Proxy over an empty array: Array.isArray, length, indexing and the generic Array
 * methods (slice, map, for...of) all work, so code written for a plain document is unchanged.
 */
const MEMBER_SOURCE = Symbol("sagline.memberSource");

export interface MemberSource {
  readonly count: number;
  /** The public-format member at `index`, built afresh (nothing is cached). */
  memberAt(index: number): unknown;
  /** The JSON array text of members [first, last), e.g. `[{...},{...}]`; built on demand. */
  chunkText(first: number, last: number): string;
  /** False when no member can hold the JSON escape of U+0000 (checked once, cheaply). */
  mayHoldNulEscape(): boolean;
}

const INDEX = /^(?:0|[1-9]\d*)$/;

/** The members of `source` as a read-only array that reads each entry when it is asked for. */
export function createLazyMembers(source: MemberSource): unknown[] {
  return new Proxy<unknown[]>([], {
    get(target, property, receiver) {
      if (property === MEMBER_SOURCE) return source;
      if (property === "length") return source.count;
      if (typeof property === "string" && INDEX.test(property)) {
        const index = Number(property);
        return index < source.count ? source.memberAt(index) : undefined;
      }
      return Reflect.get(target, property, receiver);
    },
    has(target, property) {
      if (typeof property === "string" && INDEX.test(property)) return Number(property) < source.count;
      return Reflect.has(target, property);
    },
    set() {
      return false;
    },
  });
}

/** The compact source behind an array from createLazyMembers; undefined for a plain array. */
export function getMemberSource(members: unknown): MemberSource | undefined {
  if (!Array.isArray(members)) return undefined;
  return (members as unknown as Record<symbol, MemberSource | undefined>)[MEMBER_SOURCE];
}
