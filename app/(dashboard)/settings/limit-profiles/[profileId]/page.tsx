import type { Metadata } from "next";
import { notFound } from "next/navigation";

import { parseLimitProfile } from "@/lib/engine/intake";
import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { getLimitProfileOrThrow } from "@/lib/server/criteria/limit-profiles";
import { DomainError } from "@/lib/server/errors";

import { formatDateTime } from "../../../_components/format-date-time";
import { PageHeader } from "../../../_components/page-header";
import { ConfirmButton } from "../../_components/confirm-button";
import { CriteriaNav } from "../../_components/criteria-nav";
import { deleteLimitProfile } from "../actions";
import { EditProfileForm } from "../_components/profile-form";

export const metadata: Metadata = { title: "Limit profile" };

function formatFactors(factors: Record<string, number>): string {
  return Object.entries(factors)
    .map(([name, factor]) => (factor === 1 ? name : `${factor} ${name}`))
    .join(" + ");
}

export default async function LimitProfilePage({ params }: { params: Promise<{ profileId: string }> }) {
  const { profileId } = await params;
  const context = await requirePage("/settings/limit-profiles/[profileId]", `/settings/limit-profiles/${profileId}`);
  const profile = await getLimitProfileOrThrow(context.active!.organizationId, profileId).catch((error: unknown) => {
    if (error instanceof DomainError && error.code === "not_found") notFound();
    throw error;
  });
  const current = profile.versions[0]!;
  const parsed = parseLimitProfile({ id: `${profile.id}.v${current.version}`, label: current.label, source: current.source, ...current.definition });
  const canEdit = can(context, "criteria:manage");
  return (
    <>
      <PageHeader title={profile.label} lead={`${profile.id}, version ${profile.version}. Source: ${profile.source}`} />
      <CriteriaNav canEdit={canEdit} />
      {parsed.ok ? (
        <table className="mb-4 w-full max-w-4xl border-collapse text-left text-sm" aria-label="Combinations of the current version">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="pb-1 font-medium">Combination</th>
              <th className="pb-1 font-medium">Load cases</th>
              <th className="pb-1 font-medium">Long-term part</th>
              <th className="pb-1 font-medium">Limit</th>
              <th className="pb-1 font-medium">Cantilever</th>
            </tr>
          </thead>
          <tbody>
            {parsed.profile.combinations.map((c) => (
              <tr key={c.id} className="border-t border-rule align-top">
                <td className="py-1.5 pr-3">
                  <code className="text-xs">{c.id}</code>
                  <div className="text-xs text-ink-soft">{c.label}</div>
                </td>
                <td className="py-1.5 pr-3">{formatFactors(c.factors)}</td>
                <td className="py-1.5 pr-3 text-xs">{c.sustainedFactors ? `${c.creep ?? 0} creep x (${formatFactors(c.sustainedFactors)})` : "—"}</td>
                <td className="py-1.5 pr-3 tabular-nums">
                  l/{c.limitRatio}
                  {c.capMm !== undefined ? ` and ${c.capMm} mm` : ""}
                </td>
                <td className="py-1.5 text-xs">{c.cantileverLimitRatio !== undefined ? `own length, l/${c.cantileverLimitRatio}` : `${parsed.profile.cantileverSpanMultiplier} x its length`}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {parsed.ok && parsed.profile.frequency ? (
        <p className="mb-4 text-sm">
          First frequency at least {parsed.profile.frequency.minHz} Hz, mass from {formatFactors(parsed.profile.frequency.massFactors)}.
        </p>
      ) : null}
      {canEdit ? (
        <div className="mb-6 space-y-3">
          <EditProfileForm profileId={profile.id} version={profile.version} label={profile.label} source={profile.source} definition={JSON.stringify(current.definition, null, 2)} />
          <ConfirmButton
            action={deleteLimitProfile}
            label={`Remove profile ${profile.label}`}
            fields={{ profileId: profile.id }}
            warning="Remove this profile and its versions? Schedules naming it are refused from then on; schedules already checked keep the profile stored with them."
            confirmLabel="Yes, remove the profile"
          />
        </div>
      ) : null}
      <h2 className="mb-2 font-semibold">Versions</h2>
      <ol className="max-w-3xl divide-y divide-rule rounded border border-rule bg-sheet text-sm" aria-label="Versions">
        {profile.versions.map((v) => (
          <li key={v.version} className="px-3 py-1.5">
            <span className="tabular-nums font-medium">v{v.version}</span> · {v.label} · <span className="text-ink-soft">{formatDateTime(new Date(v.createdAt))}</span>
            <div className="text-xs text-ink-soft">{v.source}</div>
          </li>
        ))}
      </ol>
    </>
  );
}
