import type { Metadata } from "next";

import { requirePage } from "@/lib/server/auth/guards";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage() {
  const context = await requirePage("/settings");
  return (
    <>
      <PageHeader title="Settings" lead="The organization's details and the deflection criteria its projects use." />
      <dl className="grid max-w-md grid-cols-[10rem_1fr] gap-y-2 rounded border border-rule bg-sheet p-4">
        <dt className="text-ink-soft">Organization</dt>
        <dd>{context.active?.organizationName}</dd>
        <dt className="text-ink-soft">Kind</dt>
        <dd className="capitalize">{context.active?.organizationKind}</dd>
      </dl>
    </>
  );
}
