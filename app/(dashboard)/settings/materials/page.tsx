import type { Metadata } from "next";

import { requirePage } from "@/lib/server/auth/guards";
import { can } from "@/lib/server/auth/request-context";
import { listOrganizationMaterials } from "@/lib/server/criteria/organization-materials";

import { PageHeader } from "../../_components/page-header";
import { ConfirmButton } from "../_components/confirm-button";
import { CriteriaNav } from "../_components/criteria-nav";
import { deleteMaterial } from "./actions";
import { MaterialForm } from "./_components/material-form";

export const metadata: Metadata = { title: "Materials" };

const number = (value: number | null, unit: string) => (value === null ? "—" : `${value.toLocaleString("en-US")} ${unit}`);

export default async function MaterialsPage() {
  const context = await requirePage("/settings/materials");
  const materials = await listOrganizationMaterials(context.active!.organizationId);
  const canEdit = can(context, "criteria:manage");
  return (
    <>
      <PageHeader title="Materials" lead='The firm&apos;s own materials, named in schedules by id (material: "mat_...", or the CSV material column) beside the library ones. Concrete stays with the library ids (concrete-fc<f&apos;c>).' />
      <CriteriaNav current="/settings/materials" canEdit={canEdit} />
      {materials.length === 0 ? (
        <p className="mb-6 rounded border border-dashed border-rule bg-sheet p-4 text-sm text-ink-soft">No materials of the firm's own yet.</p>
      ) : (
        <table className="mb-6 w-full border-collapse text-left text-sm" aria-label="Materials">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="pb-1 font-medium">Name and id</th>
              <th className="pb-1 font-medium">Family</th>
              <th className="pb-1 font-medium">E</th>
              <th className="pb-1 font-medium">G</th>
              <th className="pb-1 font-medium">Density</th>
              <th className="pb-1 font-medium">Creep factor</th>
              <th className="pb-1 font-medium">Source</th>
              {canEdit ? (
                <th className="pb-1 font-medium">
                  <span className="sr-only">Change</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {materials.map((m) => (
              <tr key={m.id} className="border-t border-rule align-top">
                <td className="py-1.5 pr-3">
                  {m.name}
                  <div>
                    <code className="text-xs">{m.id}</code>
                  </div>
                </td>
                <td className="py-1.5 pr-3">{m.family === "custom" ? "other" : m.family}</td>
                <td className="py-1.5 pr-3 tabular-nums">{number(m.eMpa, "MPa")}</td>
                <td className="py-1.5 pr-3 tabular-nums">{number(m.gMpa, "MPa")}</td>
                <td className="py-1.5 pr-3 tabular-nums">{number(m.densityKgPerM3, "kg/m3")}</td>
                <td className="py-1.5 pr-3 tabular-nums">{m.creepFactor === null ? "family rule" : m.creepFactor}</td>
                <td className="py-1.5 pr-3 text-xs text-ink-soft">{m.source}</td>
                {canEdit ? (
                  <td className="space-y-1 py-1.5">
                    <details>
                      <summary className="cursor-pointer text-xs text-action" aria-label={`Edit ${m.name}`}>
                        Edit…
                      </summary>
                      <div className="mt-2">
                        <MaterialForm material={m} />
                      </div>
                    </details>
                    <ConfirmButton
                      action={deleteMaterial}
                      label={`Remove material ${m.name}`}
                      fields={{ materialId: m.id }}
                      warning={`Remove ${m.name}? Schedules naming ${m.id} are refused from then on; schedules already submitted keep the values they were checked with.`}
                      confirmLabel="Yes, remove it"
                    />
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {canEdit ? <MaterialForm /> : null}
    </>
  );
}
