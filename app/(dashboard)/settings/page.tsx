import type { Metadata } from "next";
import Link from "next/link";

import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Settings" };

const criteria = [
  { href: "/settings/limit-profiles", label: "Limit profiles", lead: "Editable copies of the cited presets and the firm's own profiles, each versioned." },
  { href: "/settings/materials", label: "Materials", lead: "The firm's own materials (E, G, density, creep) beside the library ones." },
  { href: "/settings/section-catalogues", label: "Section catalogues", lead: "Named sections for schedules, and the lightest passing section for failing members." },
] as const;

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
      <h2 className="mb-2 mt-6 font-semibold">Criteria</h2>
      <p className="mb-2 text-sm text-ink-soft">{can(context, "criteria:manage") ? "You can change these." : "You can read these; engineers and administrators change them."}</p>
      <ul className="max-w-2xl divide-y divide-rule rounded border border-rule bg-sheet">
        {criteria.map((c) => (
          <li key={c.href} className="px-4 py-2">
            <Link href={c.href} className="font-medium text-action hover:underline">
              {c.label}
            </Link>
            <p className="text-sm text-ink-soft">{c.lead}</p>
          </li>
        ))}
      </ul>
    </>
  );
}
