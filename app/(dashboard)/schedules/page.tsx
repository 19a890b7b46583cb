import type { Metadata } from "next";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { requirePage } from "@/lib/server/auth/guards";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Schedules" };

export default async function SchedulesPage() {
  const context = await requirePage("/schedules");
  return (
    <>
      <PageHeader
        title="Schedules"
        lead={`Member schedules submitted to ${context.active?.organizationName ?? "this organization"}, with each member's serviceability result.`}
      />
      <SafetyCaution />
      <p className="mt-6 rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">
        No schedules have been submitted yet. Schedules arrive through the API or a CSV upload.
      </p>
    </>
  );
}
