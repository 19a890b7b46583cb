import { API_KEY_EXPIRES_DAYS_MAX } from "./limits";

export const KEY_CREATE_USAGE = "usage: npm run key:create -- --org ORG_ID --name NAME --scopes schedules:write,results:read [--expires-days N]";

export class KeyCreateUsageError extends Error {}

export interface KeyCreateArgs {
  organizationId: string;
  name: string;
  scopes: string[];
  expiresInDays: number | null;
}

/** Command-line options of key:create; scopes are checked again by createApiKey, which names each bad one. */
export function parseKeyCreateArgs(argv: readonly string[]): KeyCreateArgs {
  const found: Partial<Record<"--org" | "--name" | "--scopes" | "--expires-days", string>> = {};
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i] as string;
    if (arg !== "--org" && arg !== "--name" && arg !== "--scopes" && arg !== "--expires-days") throw new KeyCreateUsageError(`unknown argument ${arg}`);
    const value = argv[++i];
    if (value === undefined || value.startsWith("--")) throw new KeyCreateUsageError(`${arg} needs a value`);
    if (found[arg] !== undefined) throw new KeyCreateUsageError(`${arg} given twice`);
    found[arg] = value;
  }
  if (!found["--org"]) throw new KeyCreateUsageError("--org is required (an organization id such as org_demoengineering)");
  if (!found["--name"]?.trim()) throw new KeyCreateUsageError("--name is required");
  if (!found["--scopes"]) throw new KeyCreateUsageError("--scopes is required (comma-separated)");
  let expiresInDays: number | null = null;
  const days = found["--expires-days"];
  if (days !== undefined) {
    if (!/^\d+$/.test(days) || Number(days) < 1 || Number(days) > API_KEY_EXPIRES_DAYS_MAX) {
      throw new KeyCreateUsageError(`--expires-days must be a whole number from 1 to ${API_KEY_EXPIRES_DAYS_MAX}`);
    }
    expiresInDays = Number(days);
  }
  const scopes = found["--scopes"].split(",").map((s) => s.trim()).filter(Boolean);
  return { organizationId: found["--org"], name: found["--name"], scopes, expiresInDays };
}
