import type { Metadata } from "next";
import { notFound } from "next/navigation";

import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { getSectionCatalogueOrThrow } from "@/lib/server/criteria/section-catalogues";
import { DomainError } from "@/lib/server/errors";

import { PageHeader } from "../../../_components/page-header";
import { CriteriaNav } from "../../_components/criteria-nav";

export const metadata: Metadata = { title: "Section catalogue" };

const format = (value: number | undefined, digits = 0) => (value === undefined ? "—" : value.toLocaleString("en-US", { maximumFractionDigits: digits }));

export default async function SectionCataloguePage({ params }: { params: Promise<{ catalogueId: string }> }) {
  const { catalogueId } = await params;
  const context = await requirePage("/settings/section-catalogues/[catalogueId]", `/settings/section-catalogues/${catalogueId}`);
  const catalogue = await getSectionCatalogueOrThrow(context.active!.organizationId, catalogueId).catch((error: unknown) => {
    if (error instanceof DomainError && error.code === "not_found") notFound();
    throw error;
  });
  return (
    <>
      <PageHeader title={catalogue.name} lead={`${catalogue.sectionCount} sections, ${catalogue.inUse ? "in use" : "not in use"}. Source: ${catalogue.source}`} />
      <CriteriaNav canEdit={can(context, "criteria:manage")} />
      <table className="w-full max-w-4xl border-collapse text-left text-sm" aria-label="Sections">
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th className="pb-1 font-medium">Name</th>
            <th className="pb-1 text-right font-medium">I [mm^4]</th>
            <th className="pb-1 text-right font-medium">A [mm^2]</th>
            <th className="pb-1 text-right font-medium">Mass [kg/m]</th>
            <th className="pb-1 text-right font-medium">Shear area [mm^2]</th>
          </tr>
        </thead>
        <tbody>
          {catalogue.sections.map((s) => (
            <tr key={s.name} className="border-t border-rule">
              <td className="py-1 pr-3">{s.name}</td>
              <td className="py-1 pr-3 text-right tabular-nums">{format(s.iMm4)}</td>
              <td className="py-1 pr-3 text-right tabular-nums">{format(s.areaMm2, 1)}</td>
              <td className="py-1 pr-3 text-right tabular-nums">{format(s.massKgPerM, 2)}</td>
              <td className="py-1 text-right tabular-nums">{format(s.shearAreaMm2, 1)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
