import type { Metadata } from "next";
import Link from "next/link";

import { requirePage } from "@/lib/server/auth/guards";
import { listEndpoints } from "@/lib/server/webhooks/endpoints";

import { PageHeader } from "../../_components/page-header";
import { EndpointCard } from "./_components/endpoint-card";
import { EndpointForm } from "./_components/endpoint-form";

export const metadata: Metadata = { title: "Webhooks" };

export default async function WebhooksPage() {
  const context = await requirePage("/integrations/webhooks");
  const endpoints = await listEndpoints(context.active!.organizationId);
  return (
    <>
      <PageHeader title="Webhooks" lead="Endpoints that receive signed events (Standard Webhooks) when schedules finish, fail or are dispositioned.">
        <Link href="/integrations/webhooks/deliveries" className="text-sm text-action underline">
          Delivery log
        </Link>
      </PageHeader>
      <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
        <section aria-labelledby="endpoints-heading">
          <h2 id="endpoints-heading" className="mb-2 font-semibold">
            Endpoints ({endpoints.length})
          </h2>
          {endpoints.length === 0 ? (
            <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">No webhook endpoints yet.</p>
          ) : (
            <ul className="space-y-3">
              {endpoints.map((e) => (
                <EndpointCard key={e.id} endpoint={e} />
              ))}
            </ul>
          )}
        </section>
        <EndpointForm />
      </div>
    </>
  );
}
