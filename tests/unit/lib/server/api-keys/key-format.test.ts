import { describe, expect, it } from "vitest";

import { demoApiKey } from "@/db/seed-data";
import {
  API_KEY_LENGTH,
  API_KEY_PREFIX,
  API_KEY_RANDOM_LENGTH,
  composeApiKey,
  computeChecksum,
  createApiKeySecret,
  displayPrefixOf,
  encodeBase62,
  hashApiKey,
  isWellFormedApiKey,
} from "@/lib/server/api-keys/key-format";

const BASE62 = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";

// Replaces the character at index with a different base62 character.
function mutate(key: string, index: number): string {
  const current = key[index]!;
  const other = current === "a" ? "b" : "a";
  return key.slice(0, index) + other + key.slice(index + 1);
}

describe("API key format", () => {
  it("is sgl_ + 32 base62 random characters + a 6-character checksum (42 characters)", () => {
    const key = createApiKeySecret();
    expect(API_KEY_LENGTH).toBe(4 + 32 + 6);
    expect(key).toHaveLength(42);
    expect(key).toMatch(/^sgl_[0-9A-Za-z]{38}$/);
    expect(key.startsWith(API_KEY_PREFIX)).toBe(true);
  });

  it("carries at least 128 random bits: 32 base62 characters are 32 * log2(62) bits", () => {
    const bits = API_KEY_RANDOM_LENGTH * Math.log2(62);
    expect(bits).toBeGreaterThanOrEqual(128);
    expect(bits).toBeCloseTo(190.5, 1);
  });

  it("never repeats across 2,000 keys and uses the whole alphabet evenly", () => {
    const keys = Array.from({ length: 2000 }, () => createApiKeySecret());
    expect(new Set(keys).size).toBe(keys.length);
    const counts = new Map<string, number>();
    for (const key of keys) for (const ch of key.slice(4, 36)) counts.set(ch, (counts.get(ch) ?? 0) + 1);
    expect(counts.size).toBe(62);
    // 64,000 characters over 62 symbols: about 1,032 each (standard deviation about 32). A biased
    // `% 62` over raw bytes would give the first 8 symbols 5/256 instead of 1/62, i.e. +21%;
    // +/-15% (about 4.8 standard deviations) catches that and almost never trips by chance.
    const expected = (2000 * 32) / 62;
    for (const [ch, n] of counts) expect(Math.abs(n - expected) / expected, ch).toBeLessThan(0.15);
  });

  it("accepts its own keys and the documented demo key", () => {
    for (let i = 0; i < 50; i++) expect(isWellFormedApiKey(createApiKeySecret())).toBe(true);
    expect(isWellFormedApiKey(demoApiKey.secret)).toBe(true);
  });

  it("refuses any single mistyped character (the CRC-32 catches every single-character change)", () => {
    const key = createApiKeySecret();
    for (let i = API_KEY_PREFIX.length; i < key.length; i++) expect(isWellFormedApiKey(mutate(key, i)), `index ${i}`).toBe(false);
  });

  it("refuses the wrong prefix, length or characters", () => {
    const key = createApiKeySecret();
    const bad = ["", "sgl_", key.slice(0, -1), `${key}0`, `sgk_${key.slice(4)}`, `SGL_${key.slice(4)}`, `${key.slice(0, 10)}-${key.slice(11)}`, ` ${key}`];
    for (const text of bad) expect(isWellFormedApiKey(text), JSON.stringify(text)).toBe(false);
  });

  it("composes a key from a given random part with its checksum", () => {
    const random = "A".repeat(32);
    const key = composeApiKey(random);
    expect(key).toBe(`sgl_${random}${computeChecksum(random)}`);
    expect(() => composeApiKey("short")).toThrow(RangeError);
    expect(() => composeApiKey(`${"A".repeat(31)}-`)).toThrow(RangeError);
  });
});

describe("checksum", () => {
  it("is CRC-32/ISO-HDLC: the check value of \"123456789\" is 0xCBF43926 (Greg Cook, Catalogue of parametrised CRC algorithms, CRC-32/ISO-HDLC)", () => {
    expect(computeChecksum("123456789")).toBe(encodeBase62(0xcbf43926, 6));
  });

  it("writes base62 with 0-9, A-Z, a-z, left-padded to the width", () => {
    expect(encodeBase62(0, 6)).toBe("000000");
    expect(encodeBase62(61, 6)).toBe("00000z");
    expect(encodeBase62(62, 6)).toBe("000010");
    expect(encodeBase62(62 * 62 - 1, 2)).toBe("zz");
    // 2^32 - 1 fits in 6 base62 characters because 62^6 = 56,800,235,584 > 4,294,967,295.
    expect(encodeBase62(0xffffffff, 6)).toHaveLength(6);
    expect(() => encodeBase62(62 ** 2, 2)).toThrow(RangeError);
    expect(() => encodeBase62(-1, 6)).toThrow(RangeError);
  });

  it("round-trips: every base62 digit is its alphabet position", () => {
    const text = encodeBase62(0xcbf43926, 6);
    const value = [...text].reduce((n, ch) => n * 62 + BASE62.indexOf(ch), 0);
    expect(value).toBe(0xcbf43926);
  });
});

describe("hashing and display", () => {
  it('stores SHA-256 hex: "abc" hashes to ba7816bf... (FIPS 180-2, Appendix B.1)', () => {
    expect(hashApiKey("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("hashes the whole key, and different keys differently", () => {
    const key = createApiKeySecret();
    // The first and the last character both count, so no part of the key is left out of the hash.
    expect(hashApiKey(key)).not.toBe(hashApiKey("x" + key.slice(1)));
    expect(hashApiKey(key)).not.toBe(hashApiKey(key.slice(0, -1) + (key.endsWith("0") ? "1" : "0")));
    expect(hashApiKey(key)).not.toBe(hashApiKey(createApiKeySecret()));
    expect(hashApiKey(key)).not.toContain(key.slice(4, 36));
  });

  it("shows the prefix and 8 random characters, never enough to use the key", () => {
    const key = createApiKeySecret();
    expect(displayPrefixOf(key)).toBe(key.slice(0, 12));
    expect(displayPrefixOf(key)).toMatch(/^sgl_[0-9A-Za-z]{8}$/);
  });
});
