import type { Metadata } from "next";

import { requirePage } from "@/lib/server/auth/guards";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Integrations" };

export default async function IntegrationsPage() {
  await requirePage("/integrations");
  return (
    <>
      <PageHeader title="Integrations" lead="API keys for partner systems and the webhook endpoints that receive results." />
      <p className="rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">No API keys or webhook endpoints yet.</p>
    </>
  );
}
