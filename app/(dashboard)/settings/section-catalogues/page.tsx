import type { Metadata } from "next";
import Link from "next/link";

import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { listSectionCatalogues, MAX_SECTIONS_IN_USE } from "@/lib/server/criteria/section-catalogues";

import { EndpointButton } from "../../integrations/webhooks/_components/endpoint-button";
import { PageHeader } from "../../_components/page-header";
import { ConfirmButton } from "../_components/confirm-button";
import { CriteriaNav } from "../_components/criteria-nav";
import { deleteCatalogue, setCatalogueInUse } from "./actions";
import { ImportCatalogueForm } from "./_components/import-form";

export const metadata: Metadata = { title: "Section catalogues" };

export default async function SectionCataloguesPage() {
  const context = await requirePage("/settings/section-catalogues");
  const catalogues = await listSectionCatalogues(context.active!.organizationId);
  const canEdit = can(context, "criteria:manage");
  return (
    <>
      <PageHeader
        title="Section catalogues"
        lead={`Catalogues in use resolve section names in schedules (case and spaces ignored) and give each failing member the lightest passing section, by mass per metre. At most ${MAX_SECTIONS_IN_USE.toLocaleString("en-US")} sections in use together. Changes apply to schedules submitted afterwards.`}
      />
      <CriteriaNav current="/settings/section-catalogues" canEdit={canEdit} />
      {catalogues.length === 0 ? (
        <p className="mb-6 rounded border border-dashed border-rule bg-sheet p-4 text-sm text-ink-soft">No catalogues yet: failing members get a minimum second moment of area only.</p>
      ) : (
        <table className="mb-6 w-full border-collapse text-left text-sm" aria-label="Section catalogues">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="pb-1 font-medium">Name</th>
              <th className="pb-1 font-medium">Sections</th>
              <th className="pb-1 font-medium">In use</th>
              <th className="pb-1 font-medium">Source</th>
              {canEdit ? (
                <th className="pb-1 font-medium">
                  <span className="sr-only">Change</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {catalogues.map((c) => (
              <tr key={c.id} className="border-t border-rule align-top">
                <td className="py-1.5 pr-3">
                  <Link href={`/settings/section-catalogues/${c.id}`} className="text-action hover:underline">
                    {c.name}
                  </Link>
                  <div>
                    <code className="text-xs">{c.id}</code>
                  </div>
                </td>
                <td className="py-1.5 pr-3 tabular-nums">{c.sectionCount}</td>
                <td className="py-1.5 pr-3">{c.inUse ? "yes" : "no"}</td>
                <td className="py-1.5 pr-3 text-xs text-ink-soft">{c.source}</td>
                {canEdit ? (
                  <td className="flex flex-wrap items-start gap-2 py-1.5">
                    <EndpointButton action={setCatalogueInUse} label={`${c.inUse ? "Take out of use" : "Put in use"}: ${c.name}`} fields={{ catalogueId: c.id, inUse: c.inUse ? "false" : "true" }}>
                      {c.inUse ? "Take out of use" : "Put in use"}
                    </EndpointButton>
                    <ConfirmButton
                      action={deleteCatalogue}
                      label={`Remove catalogue ${c.name}`}
                      fields={{ catalogueId: c.id }}
                      warning={`Remove ${c.name} and its ${c.sectionCount} sections? Schedules already submitted keep the sections they were checked with.`}
                      confirmLabel="Yes, remove it"
                    />
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canEdit ? <ImportCatalogueForm /> : null}
    </>
  );
}
