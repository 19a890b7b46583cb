import type { Metadata } from "next";
import Link from "next/link";

import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Integrations" };

export default async function IntegrationsPage() {
  const context = await requirePage("/integrations");
  const managesIntegrations = can(context, "integrations:manage");
  return (
    <>
      <PageHeader title="Integrations" lead="API keys for partner systems and the webhook endpoints that receive results." />
      <ul className="grid gap-3 sm:grid-cols-2">
        <li className="rounded border border-rule bg-sheet p-4">
          <Link href="/integrations/keys" className="font-semibold text-action underline">
            API keys
          </Link>
          <p className="mt-1 text-ink-soft">Create, list and revoke the keys partner systems call the API with.</p>
        </li>
        {managesIntegrations ? (
          <li className="rounded border border-rule bg-sheet p-4">
            <Link href="/integrations/webhooks" className="font-semibold text-action underline">
              Webhooks
            </Link>
            <p className="mt-1 text-ink-soft">Endpoints that receive signed results when a schedule completes.</p>
          </li>
        ) : null}
      </ul>
      <p className="mt-4 text-ink-soft">
        <Link href="/api-docs" className="text-action underline">
          API documentation
        </Link>
      </p>
    </>
  );
}
