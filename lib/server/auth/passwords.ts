import { hash, verify } from "@node-rs/argon2";

// OWASP Password Storage Cheat Sheet: argon2id, m = 19 MiB, t = 2, p = 1 at least.
const argonOptions = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export const PASSWORD_MIN_LENGTH = 12;
/** Long enough for any passphrase, short enough that hashing cannot be used to exhaust the server. */
export const PASSWORD_MAX_LENGTH = 256;

export function hashPassword(password: string): Promise<string> {
  return hash(password, argonOptions);
}

// A fixed hash to verify against when the account does not exist, so both paths cost the same.
let dummyHash: Promise<string> | undefined;

export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (password.length === 0 || password.length > PASSWORD_MAX_LENGTH) return false;
  if (!passwordHash) {
    dummyHash ??= hashPassword("not-a-real-password-for-timing");
    await verify(await dummyHash, password).catch(() => false);
    return false;
  }
  return verify(passwordHash, password).catch(() => false);
}
