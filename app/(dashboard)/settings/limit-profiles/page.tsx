import type { Metadata } from "next";
import Link from "next/link";

import { listPresets } from "@/lib/engine/presets";
import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { listLimitProfiles } from "@/lib/server/criteria/limit-profiles";

import { formatDateTime } from "../../_components/format-date-time";
import { PageHeader } from "../../_components/page-header";
import { CriteriaNav } from "../_components/criteria-nav";
import { NewProfileForm } from "./_components/profile-form";

export const metadata: Metadata = { title: "Limit profiles" };

export default async function LimitProfilesPage() {
  const context = await requirePage("/settings/limit-profiles");
  const profiles = await listLimitProfiles(context.active!.organizationId);
  const canEdit = can(context, "criteria:manage");
  return (
    <>
      <PageHeader title="Limit profiles" lead='Deflection limits the firm checks against. A schedule names one as profile: {"id": "lp_..."} (CSV: profile=lp_...) and records the version it was checked against.' />
      <CriteriaNav current="/settings/limit-profiles" canEdit={canEdit} />
      {profiles.length === 0 ? (
        <p className="mb-6 rounded border border-dashed border-rule bg-sheet p-4 text-sm text-ink-soft">No profiles yet. Schedules can still use the presets by name.</p>
      ) : (
        <table className="mb-6 w-full border-collapse text-left text-sm" aria-label="Limit profiles">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="pb-1 font-medium">Label</th>
              <th className="pb-1 font-medium">Id</th>
              <th className="pb-1 font-medium">Version</th>
              <th className="pb-1 font-medium">Source</th>
              <th className="pb-1 font-medium">Changed</th>
            </tr>
          </thead>
          <tbody>
            {profiles.map((p) => (
              <tr key={p.id} className="border-t border-rule align-top">
                <td className="py-1.5 pr-3">
                  <Link href={`/settings/limit-profiles/${p.id}`} className="text-action hover:underline">
                    {p.label}
                  </Link>
                  {p.basedOnPreset ? <div className="text-xs text-ink-soft">copy of {p.basedOnPreset}</div> : null}
                </td>
                <td className="py-1.5 pr-3">
                  <code className="text-xs">{p.id}</code>
                </td>
                <td className="py-1.5 pr-3 tabular-nums">{p.version}</td>
                <td className="py-1.5 pr-3 text-xs text-ink-soft">{p.source}</td>
                <td className="py-1.5 text-xs text-ink-soft">{formatDateTime(new Date(p.updatedAt))}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canEdit ? <NewProfileForm presets={listPresets().map((p) => ({ id: p.id, label: `${p.label} (${p.id})` }))} /> : null}
    </>
  );
}
