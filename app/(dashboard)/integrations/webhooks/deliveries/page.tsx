import type { Metadata } from "next";
import Link from "next/link";

import { deliveryStatuses } from "@/db/schema";
import { requirePage } from "@/lib/server/auth/guards";
import { listEndpoints } from "@/lib/server/webhooks/endpoints";
import { allEventTypes } from "@/lib/server/webhooks/events/event-types";
import { isDeliveryStatus, listDeliveries } from "@/lib/server/webhooks/list-deliveries";

import { PageHeader } from "../../../_components/page-header";
import { DeliveriesTable } from "../_components/deliveries-table";
import { ResendFailedForm } from "../_components/resend-failed-form";

export const metadata: Metadata = { title: "Webhook deliveries" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

function single(value: string | string[] | undefined): string | undefined {
  const v = Array.isArray(value) ? value[0] : value;
  return v && v.length <= 64 ? v : undefined;
}

const selectClass = "rounded border border-rule bg-sheet px-2 py-1.5 text-sm";

export default async function WebhookDeliveriesPage({ searchParams }: { searchParams: SearchParams }) {
  const context = await requirePage("/integrations/webhooks/deliveries");
  const organizationId = context.active!.organizationId;
  const params = await searchParams;
  const endpoints = await listEndpoints(organizationId);
  // Unknown filter values are ignored rather than trusted: only this organization's ids and known names pass.
  const endpointId = endpoints.find((e) => e.id === single(params.endpoint))?.id;
  const status = single(params.status);
  const eventType = (allEventTypes as readonly string[]).find((t) => t === single(params.event));
  const deliveries = await listDeliveries(organizationId, { endpointId, status: isDeliveryStatus(status) ? status : undefined, eventType });
  const dayAgo = new Date(Date.now() - 86_400_000).toISOString().slice(0, 16);
  return (
    <>
      <PageHeader title="Webhook deliveries" lead="Every event sent to your endpoints, with every attempt. The newest 100 are shown.">
        <Link href="/integrations/webhooks" className="text-sm text-action underline">
          Endpoints
        </Link>
      </PageHeader>
      <form method="get" aria-label="Filter deliveries" className="mb-4 flex flex-wrap items-end gap-3">
        <label className="block">
          <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">Endpoint</span>
          <select name="endpoint" defaultValue={endpointId ?? ""} className={selectClass}>
            <option value="">All</option>
            {endpoints.map((e) => (
              <option key={e.id} value={e.id}>
                {e.url}
              </option>
            ))}
          </select>
        </label>
        <label className="block">
          <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">Status</span>
          <select name="status" defaultValue={isDeliveryStatus(status) ? status : ""} className={selectClass}>
            <option value="">All</option>
            {deliveryStatuses.map((s) => (
              <option key={s} value={s}>
                {s}
              </option>
            ))}
          </select>
        </label>
        <label className="block">
          <span className="mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft">Event</span>
          <select name="event" defaultValue={eventType ?? ""} className={selectClass}>
            <option value="">All</option>
            {allEventTypes.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </select>
        </label>
        <button type="submit" className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm">
          Filter
        </button>
      </form>
      <div className="mb-4">
        <ResendFailedForm endpoints={endpoints.map((e) => ({ id: e.id, url: e.url }))} defaultSince={dayAgo} />
      </div>
      <DeliveriesTable deliveries={deliveries} />
    </>
  );
}
