import type { Metadata } from "next";
import Link from "next/link";

import { API_KEY_EXPIRES_DAYS_MAX, API_KEY_NAME_MAX_LENGTH } from "@/lib/server/api-keys/limits";
import { listApiKeys } from "@/lib/server/api-keys/list-api-keys";
import { adminScopes, listGrantableScopes, scopeDescriptions } from "@/lib/server/api-keys/scopes";
import { requirePage } from "@/lib/server/auth/guards";
import { roleLabels } from "@/lib/server/auth/permissions";
import { can } from "@/lib/server/auth/request-context";

import { PageHeader } from "../../_components/page-header";
import { CreateKeyForm } from "./_components/create-key-form";
import { KeyTable } from "./_components/key-table";

export const metadata: Metadata = { title: "API keys" };

// The console shows one long page; organizations hold a handful of keys, the API pages through more.
const CONSOLE_KEY_LIMIT = 200;

export default async function ApiKeysPage() {
  const context = await requirePage("/integrations/keys");
  // Integrators and administrators see every key; an engineer sees and revokes the keys they made.
  const ownOnly = !can(context, "integrations:manage");
  const { items, next } = await listApiKeys({ organizationId: context.active!.organizationId, limit: CONSOLE_KEY_LIMIT, madeByUserId: ownOnly ? context.user.id : undefined });
  // Only the scopes this person's role may grant (createApiKey enforces the same rule).
  const scopes = listGrantableScopes(context.active!.role).map((scope) => ({ scope, description: scopeDescriptions[scope], admin: adminScopes.includes(scope) }));
  return (
    <>
      <PageHeader title="API keys" lead={`Keys that let partner systems call the Sagline API for ${context.active!.organizationName}.`}>
        <Link href="/api-docs" className="text-action underline">
          API documentation
        </Link>
      </PageHeader>
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        <section aria-labelledby="keys-heading" className="min-w-0">
          {ownOnly ? (
            <p className="mb-3 rounded border border-rule bg-sheet px-3 py-2 text-sm text-ink-soft" data-testid="own-keys-note">
              Your role ({roleLabels[context.active!.role]}) makes and revokes keys of its own, with only the scopes it may grant. Integrators and administrators see and revoke
              every key of the organization.
            </p>
          ) : null}
          <h2 id="keys-heading" className="mb-2 font-semibold">
            {ownOnly ? "Your keys" : "Keys"} ({items.length}
            {next ? "+" : ""})
          </h2>
          <KeyTable keys={items} />
          {next ? <p className="mt-2 text-xs text-ink-soft">Showing the newest {CONSOLE_KEY_LIMIT}; GET /api/v1/api-keys pages through all of them.</p> : null}
          <p className="mt-3 text-xs text-ink-soft">
            Send a key as <code>Authorization: Bearer sgl_…</code>, never in a URL. Last use is recorded at most once a minute.
          </p>
        </section>
        <CreateKeyForm scopes={scopes} maxExpiresDays={API_KEY_EXPIRES_DAYS_MAX} maxNameLength={API_KEY_NAME_MAX_LENGTH} />
      </div>
    </>
  );
}
