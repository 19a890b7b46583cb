"use client";

import { useQuery } from "@tanstack/react-query";

import { fetchJson } from "@/components/data/fetch-json";
import { QueryProvider } from "@/components/data/query-provider";
import type { DeliveryListItem } from "@/lib/server/webhooks/list-deliveries";

import { DeliveriesTable } from "./deliveries-table";

export type LiveDeliveriesProps = { initial: DeliveryListItem[]; queryString: string };

const POLL_MS = 5000;

type Wire<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] extends Date | null ? string | null : T[K] };
type WireDelivery = Omit<Wire<DeliveryListItem>, "attempts"> & { attempts: Wire<DeliveryListItem["attempts"][number]>[] };

const toDate = (value: string | null) => (value === null ? null : new Date(value));

function revive(d: WireDelivery): DeliveryListItem {
  return { ...d, createdAt: new Date(d.createdAt), nextAttemptAt: toDate(d.nextAttemptAt), attempts: d.attempts.map((a) => ({ ...a, createdAt: new Date(a.createdAt) })) };
}

function Deliveries({ initial, queryString }: LiveDeliveriesProps) {
  const query = useQuery({
    queryKey: ["webhook-deliveries", queryString],
    queryFn: async ({ signal }) => {
      const body = await fetchJson<{ data: WireDelivery[] }>(`/api/webhooks/deliveries${queryString ? `?${queryString}` : ""}`, signal);
      return body.data.map(revive);
    },
    initialData: initial,
    initialDataUpdatedAt: 0,
    refetchInterval: POLL_MS,
  });
  return (
    <div aria-live="polite">
      {query.isError ? (
        <p role="status" className="mb-2 text-xs text-caution">
          The log is not updating right now ({query.error.message}); showing what was last read, still trying.
        </p>
      ) : null}
      <DeliveriesTable deliveries={query.data} />
    </div>
  );
}

/** The delivery log, rendered on the server first and refreshed in the browser while the tab is visible. */
export function LiveDeliveries(props: LiveDeliveriesProps) {
  return (
    <QueryProvider>
      <Deliveries {...props} />
    </QueryProvider>
  );
}
