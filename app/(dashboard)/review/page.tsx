import type { Metadata } from "next";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { DomainError } from "@/lib/server/errors";
import { getDigestFrequency } from "@/lib/server/review/digest-preferences";
import { listQueueOptions } from "@/lib/server/review/list-queue-options";
import { getQueueView } from "@/lib/server/review/get-queue-view";
import { REVIEW_PAGE_SIZE } from "@/lib/server/review/list-review-queue";
import { queueQuerySchema, readQueueQuery, toQueueSearchParams, type QueueQuery } from "@/lib/server/review/queue-filters";

import { PageHeader } from "../_components/page-header";
import { ReviewPageClient } from "./page-client";

export const metadata: Metadata = { title: "Review" };

type ReviewPageProps = { searchParams: Promise<Record<string, string | string[] | undefined>> };

function toSearchParams(raw: Record<string, string | string[] | undefined>): URLSearchParams {
  const params = new URLSearchParams();
  for (const [name, value] of Object.entries(raw)) if (typeof value === "string") params.set(name, value);
  return params;
}

export default async function ReviewPage({ searchParams }: ReviewPageProps) {
  const context = await requirePage("/review");
  const organizationId = context.active!.organizationId;
  const params = toSearchParams(await searchParams);
  let query: QueueQuery = queueQuerySchema.parse({});
  let notice: string | null = null;
  try {
    query = readQueueQuery(params);
  } catch (error) {
    if (!(error instanceof DomainError)) throw error;
    notice = `${error.message} Showing the whole queue instead.`;
  }
  let view;
  let cursor = notice ? null : params.get("cursor");
  try {
    view = await getQueueView(organizationId, query, { limit: REVIEW_PAGE_SIZE, cursor });
  } catch (error) {
    if (!(error instanceof DomainError)) throw error;
    notice = "That page link is not one Sagline issued; showing the first page.";
    cursor = null;
    view = await getQueueView(organizationId, query, { limit: REVIEW_PAGE_SIZE });
  }
  const canDisposition = can(context, "review:disposition");
  const [options, digestFrequency] = await Promise.all([listQueueOptions(organizationId), canDisposition ? getDigestFrequency(context.user.id, organizationId) : null]);
  const linkParams = toQueueSearchParams(query);
  const liveParams = new URLSearchParams(linkParams);
  if (cursor) liveParams.set("cursor", cursor);

  return (
    <>
      <PageHeader title="Review" lead="Members that failed a check or could not be checked, across every schedule and project, each waiting for an engineer's disposition." />
      <SafetyCaution />
      <ReviewPageClient
        view={view}
        query={query}
        queryString={liveParams.toString()}
        linkParams={linkParams.toString()}
        options={options}
        notice={notice}
        firstPage={!cursor}
        canDisposition={canDisposition}
        roleLabel={context.active!.role}
        digestFrequency={digestFrequency}
      />
    </>
  );
}
