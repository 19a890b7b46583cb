import { randomBytes } from "node:crypto";
import { crc32 } from "node:zlib";

import { hashToken } from "@/lib/server/ids";

/**
 * API key format: `sgl_` + 32 base62 characters of randomness (32 * log2(62) = 190 bits) + a
 * 6-character base62 CRC-32 of those 32 characters. The fixed prefix and the checksum let secret
 * scanners find leaked keys with few false positives, and let us refuse a mistyped or invented key
 * before touching the database.
 */
export const API_KEY_PREFIX = "sgl_";
export const API_KEY_RANDOM_LENGTH = 32;
export const API_KEY_CHECKSUM_LENGTH = 6;
export const API_KEY_LENGTH = API_KEY_PREFIX.length + API_KEY_RANDOM_LENGTH + API_KEY_CHECKSUM_LENGTH;
/** Characters shown in lists: the prefix and the first 8 random characters (48 bits, harmless to show). */
export const API_KEY_DISPLAY_LENGTH = API_KEY_PREFIX.length + 8;

const BASE62 = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz";
const KEY_PATTERN = new RegExp(`^${API_KEY_PREFIX}[0-9A-Za-z]{${API_KEY_RANDOM_LENGTH + API_KEY_CHECKSUM_LENGTH}}$`);
/** What a secret scanner can match; exported so the docs print the same pattern the code uses. */
export const API_KEY_SCAN_PATTERN = `${API_KEY_PREFIX}[0-9A-Za-z]{${API_KEY_RANDOM_LENGTH + API_KEY_CHECKSUM_LENGTH}}`;

/** n written in base62, left-padded with "0" to width characters. */
export function encodeBase62(n: number, width: number): string {
  if (!Number.isSafeInteger(n) || n < 0) throw new RangeError("encodeBase62 takes a non-negative safe integer");
  let out = "";
  let rest = n;
  do {
    out = BASE62[rest % 62] + out;
    rest = Math.floor(rest / 62);
  } while (rest > 0);
  if (out.length > width) throw new RangeError(`${n} needs more than ${width} base62 characters`);
  return out.padStart(width, "0");
}

/** The 6-character checksum of a key's random part: CRC-32 (IEEE 802.3 polynomial) in base62. */
export function computeChecksum(randomPart: string): string {
  return encodeBase62(crc32(randomPart), API_KEY_CHECKSUM_LENGTH);
}

// Uniform base62: bytes of 248 or more are dropped so `% 62` has no bias (248 = 4 * 62).
function createRandomBase62(length: number): string {
  let out = "";
  while (out.length < length) {
    for (const byte of randomBytes(length * 2)) {
      if (byte >= 248) continue;
      out += BASE62[byte % 62];
      if (out.length === length) break;
    }
  }
  return out;
}

/** Builds a key around a given random part (the seed's fixed demo key uses this). */
export function composeApiKey(randomPart: string): string {
  if (!/^[0-9A-Za-z]+$/.test(randomPart) || randomPart.length !== API_KEY_RANDOM_LENGTH) {
    throw new RangeError(`the random part is ${API_KEY_RANDOM_LENGTH} base62 characters`);
  }
  return API_KEY_PREFIX + randomPart + computeChecksum(randomPart);
}

/** A fresh key. Show it once; store only hashApiKey(key) and displayPrefixOf(key). */
export function createApiKeySecret(): string {
  return composeApiKey(createRandomBase62(API_KEY_RANDOM_LENGTH));
}

/** True when the text has the key's shape and its checksum matches; says nothing about the database. */
export function isWellFormedApiKey(text: string): boolean {
  if (!KEY_PATTERN.test(text)) return false;
  const randomEnd = API_KEY_PREFIX.length + API_KEY_RANDOM_LENGTH;
  return computeChecksum(text.slice(API_KEY_PREFIX.length, randomEnd)) === text.slice(randomEnd);
}

/** SHA-256 (hex) of the whole key: the only form the database holds. */
export function hashApiKey(key: string): string {
  return hashToken(key);
}

export function displayPrefixOf(key: string): string {
  return key.slice(0, API_KEY_DISPLAY_LENGTH);
}
