// What npm run start:production refuses to start with: the local demo's settings (fakes, loopback
// webhook allowlist, the local SMTP capture), no stated TRUSTED_PROXY_COUNT, and the demo's published credentials in the database.
import { isIPv4, isIPv6 } from "node:net";

import type { Sql, TransactionSql } from "postgres";

import { demoApiKey, demoUsers } from "@/db/seed-data";
import { hashApiKey } from "@/lib/server/api-keys/key-format";
import { verifyPassword } from "@/lib/server/auth/passwords";
import { EXIT_AFTER_COMMIT_VARIABLE } from "@/lib/server/drills/exit-after-commit";

/** True for names and addresses that reach this machine itself: localhost, 127.0.0.0/8, ::1, the unspecified addresses. */
export function isLoopbackHost(host: string): boolean {
  const h = host.trim().toLowerCase().replace(/^\[(.*)\]$/, "$1").replace(/\.$/, "");
  if (h === "localhost" || h.endsWith(".localhost")) return true;
  if (isIPv4(h)) return h.startsWith("127.") || h === "0.0.0.0";
  if (isIPv6(h)) {
    // WHATWG URL parsing writes every IPv6 address in one compressed form (::ffff:127.0.0.1 is ::ffff:7f00:1).
    const compressed = new URL(`http://[${h}]/`).hostname.slice(1, -1);
    return compressed === "::1" || compressed === "::" || compressed === "::ffff:0:0" || compressed.startsWith("::ffff:7f");
  }
  return false;
}

/** The host of an allowlist entry: `host`, `host:port`, `[v6]` or `[v6]:port` (a bare IPv6 address has no port). */
function hostOfAllowlistEntry(entry: string): string {
  const bracketed = /^\[([^\]]*)\](?::\d+)?$/.exec(entry);
  if (bracketed) return bracketed[1]!;
  if (isIPv6(entry)) return entry;
  return entry.replace(/:\d+$/, "");
}

/** The environment's problems for a production start, one sentence each (empty when there are none). */
export function findProductionConfigProblems(env: Record<string, string | undefined>): string[] {
  const problems: string[] = [];
  if (env.SAGLINE_FAKES === "1") problems.push("SAGLINE_FAKES=1 turns on the local fakes (SMTP capture, partner receiver): unset it or set 0.");
  if ((env[EXIT_AFTER_COMMIT_VARIABLE] ?? "").trim() !== "") {
    problems.push(`${EXIT_AFTER_COMMIT_VARIABLE} is a fault-drill hook that kills the web process after a commit: unset it.`);
  }
  const loopback = (env.WEBHOOK_ALLOWLIST ?? "")
    .split(",")
    .map((s) => s.trim())
    .filter((entry) => entry && isLoopbackHost(hostOfAllowlistEntry(entry)));
  if (loopback.length > 0) problems.push(`WEBHOOK_ALLOWLIST lets webhooks reach this machine (${loopback.join(", ")}): remove the loopback entries.`);
  // Without a stated proxy count the per-address sign-in limit cannot know which address is the client's.
  if ((env.TRUSTED_PROXY_COUNT ?? "").trim() === "") {
    problems.push(
      "TRUSTED_PROXY_COUNT is not set: set it to the number of proxies in front of the web process that append to X-Forwarded-For (1 behind one load balancer), or to 0 to state that there is none; with 0 behind a proxy every client shares the proxy's address and the per-address sign-in limit is advisory.",
    );
  }
  const smtpHost = env.SMTP_HOST?.trim() ?? "";
  if (!smtpHost) problems.push("SMTP_HOST is not set: name the mail server that sends invitations and password resets.");
  else if (isLoopbackHost(smtpHost)) problems.push(`SMTP_HOST=${smtpHost} is this machine (where the local SMTP fake listens): name a real mail server.`);
  return problems;
}

/**
 * The demo's published credentials still usable in the database: the demo API key unless revoked,
 * and every demo account (seeded id or e-mail) whose password is still one of the demo passwords.
 * A database without the tables yet (before the first migration) has none. Bounded: at most the
 * five demo accounts, each tried against the five demo passwords.
 */
export async function findDemoDataProblems(sql: Sql | TransactionSql): Promise<string[]> {
  const [tables] = await sql<{ users: string | null; keys: string | null }[]>`select to_regclass('users')::text as users, to_regclass('api_keys')::text as keys`;
  const problems: string[] = [];
  if (tables?.keys) {
    const keys = await sql<{ id: string }[]>`select id from api_keys where (secret_hash = ${hashApiKey(demoApiKey.secret)} or id = ${demoApiKey.id}) and revoked_at is null`;
    for (const key of keys) problems.push(`the demo API key ${key.id} (published in the README) is active: revoke it under Integrations > API keys.`);
  }
  if (tables?.users) {
    const emails = demoUsers.map((u) => u.email.toLowerCase());
    const accounts = await sql<{ id: string; email: string; password_hash: string }[]>`
      select id, email, password_hash from users where id like 'usr\_demo%' or lower(email) = any(${emails}) order by id limit 20`;
    for (const account of accounts) {
      for (const demo of demoUsers) {
        if (await verifyPassword(account.password_hash, demo.password)) {
          problems.push(`the account ${account.email} still has a demo password (printed by npm start): change it or remove the account.`);
          break;
        }
      }
    }
  }
  return problems;
}
