import type { Metadata } from "next";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { requirePage } from "@/lib/server/auth/guards";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Review" };

export default async function ReviewPage() {
  await requirePage("/review");
  return (
    <>
      <PageHeader title="Review" lead="Members that failed a check, waiting for an engineer's disposition." />
      <SafetyCaution />
      <p className="mt-6 rounded border border-dashed border-rule bg-sheet p-6 text-ink-soft">Nothing is waiting for review.</p>
    </>
  );
}
