import type { Metadata } from "next";
import Link from "next/link";

import { SelectField } from "@/components/ui/field";
import { deliveryStatuses } from "@/db/schema";
import { requirePage } from "@/lib/server/auth/guards";
import { listEndpoints } from "@/lib/server/webhooks/endpoints";
import { allEventTypes } from "@/lib/server/webhooks/events/event-types";
import { listDeliveries } from "@/lib/server/webhooks/list-deliveries";

import { PageHeader } from "../../../_components/page-header";
import { LiveDeliveries } from "../_components/live-deliveries";
import { readDeliveryFilter } from "../_components/read-delivery-filter";
import { ResendFailedForm } from "../_components/resend-failed-form";

export const metadata: Metadata = { title: "Webhook deliveries" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

function single(value: string | string[] | undefined): string | undefined {
  const v = Array.isArray(value) ? value[0] : value;
  return v && v.length <= 64 ? v : undefined;
}

export default async function WebhookDeliveriesPage({ searchParams }: { searchParams: SearchParams }) {
  const context = await requirePage("/integrations/webhooks/deliveries");
  const organizationId = context.active!.organizationId;
  const params = await searchParams;
  const endpoints = await listEndpoints(organizationId);
  const filter = readDeliveryFilter({ get: (name) => single(params[name]) ?? null }, endpoints.map((e) => e.id));
  const { endpointId, status, eventType } = filter;
  const deliveries = await listDeliveries(organizationId, filter);
  const queryString = new URLSearchParams(Object.entries({ endpoint: endpointId, status, event: eventType }).filter((e): e is [string, string] => e[1] !== undefined)).toString();
  const dayAgo = new Date(Date.now() - 86_400_000).toISOString().slice(0, 16);
  return (
    <>
      <PageHeader title="Webhook deliveries" lead="Every event sent to your endpoints, with every attempt. The newest 100 are shown.">
        <Link href="/integrations/webhooks" className="text-sm text-action underline">
          Endpoints
        </Link>
      </PageHeader>
      <form method="get" aria-label="Filter deliveries" className="mb-4 flex flex-wrap items-end gap-3">
        <SelectField label="Endpoint" name="endpoint" defaultValue={endpointId ?? ""}>
          <option value="">All</option>
          {endpoints.map((e) => (
            <option key={e.id} value={e.id}>
              {e.url}
            </option>
          ))}
        </SelectField>
        <SelectField label="Status" name="status" defaultValue={status ?? ""}>
          <option value="">All</option>
          {deliveryStatuses.map((s) => (
            <option key={s} value={s}>
              {s}
            </option>
          ))}
        </SelectField>
        <SelectField label="Event" name="event" defaultValue={eventType ?? ""}>
          <option value="">All</option>
          {allEventTypes.map((t) => (
            <option key={t} value={t}>
              {t}
            </option>
          ))}
        </SelectField>
        <button type="submit" className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm">
          Filter
        </button>
      </form>
      <div className="mb-4">
        <ResendFailedForm endpoints={endpoints.map((e) => ({ id: e.id, url: e.url }))} defaultSince={dayAgo} />
      </div>
      <LiveDeliveries initial={deliveries} queryString={queryString} />
    </>
  );
}
