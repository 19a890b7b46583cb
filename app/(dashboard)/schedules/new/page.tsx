import type { Metadata } from "next";
import Link from "next/link";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { listPresets } from "@/lib/engine/presets";
import { requirePage } from "@/lib/server/auth/guards";
import { loadUploadCriteria } from "@/lib/server/criteria/upload-criteria";
import { MAX_SCHEDULE_BODY_BYTES } from "@/lib/server/schedules/submit-from-request";

import { PageHeader } from "../../_components/page-header";
import { UploadWizard } from "./_components/upload-wizard";

export const metadata: Metadata = { title: "Submit a CSV" };

export default async function NewSchedulePage() {
  const context = await requirePage("/schedules/new");
  // the organization's own profiles beside the presets, and what the server reads catalogue names and materials with
  const criteria = await loadUploadCriteria(context.active!.organizationId);
  const presets = [...criteria.profiles.map((p) => ({ id: p.id, label: `${p.profile.label} (organization profile, v${p.version})`, source: p.profile.source })), ...listPresets().map((p) => ({ id: p.id, label: p.label, source: p.source }))];
  return (
    <>
      <p className="mb-2 text-xs">
        <Link href="/schedules" className="text-action underline">
          Schedules
        </Link>
      </p>
      <PageHeader title="Submit a CSV schedule" lead="One row per member. Sagline checks every row in your browser first, then the workers check every member.">
        <a href="/api/templates/schedule.csv" className="rounded border border-rule bg-sheet px-3 py-1.5 text-sm font-medium hover:bg-paper" download>
          Download the CSV template
        </a>
      </PageHeader>
      <SafetyCaution />
      <div className="mt-6">
        <UploadWizard presets={presets} maxBytes={MAX_SCHEDULE_BODY_BYTES} criteria={criteria} />
      </div>
    </>
  );
}
