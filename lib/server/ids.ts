import { createHash, randomBytes } from "node:crypto";

const alphabet = "0123456789abcdefghjkmnpqrstvwxyz"; // Crockford base32, lower case

function encodeBase32(bytes: Uint8Array): string {
  let out = "";
  let bits = 0;
  let value = 0;
  for (const byte of bytes) {
    value = (value << 8) | byte;
    bits += 8;
    while (bits >= 5) {
      out += alphabet[(value >>> (bits - 5)) & 31];
      bits -= 5;
    }
  }
  if (bits > 0) out += alphabet[(value << (5 - bits)) & 31];
  return out;
}

/** A public id with a type prefix, e.g. `org_3k9...`: 80 random bits, not guessable across tenants. */
export function createId(prefix: string): string {
  return `${prefix}_${encodeBase32(randomBytes(10))}`;
}

/** A secret token (256 bits) for e-mail links; only its hash is stored. */
export function createSecretToken(): string {
  return randomBytes(32).toString("base64url");
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
