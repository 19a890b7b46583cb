"use client";

import { ActionForm } from "@/components/forms/action-form";
import { FormField, FormSelectField } from "@/components/forms/form-field";
import { SubmitButton } from "@/components/forms/submit-button";
import type { OrganizationMaterialView } from "@/lib/server/criteria/organization-materials";

import { createMaterial, updateMaterial } from "../actions";

const families = [
  { value: "steel", label: "Steel (no creep)" },
  { value: "aluminium", label: "Aluminium (no creep)" },
  { value: "timber", label: "Timber (creep from the member's service class or condition)" },
  { value: "custom", label: "Other (creep factor below)" },
] as const;

export type MaterialFormProps = { material?: OrganizationMaterialView };

/** Adds a material, or changes one when given. Values in MPa and kg/m3. */
export function MaterialForm({ material }: MaterialFormProps) {
  const text = (value: number | null | undefined) => (value === null || value === undefined ? "" : String(value));
  return (
    <ActionForm action={material ? updateMaterial : createMaterial} label={material ? `Edit material ${material.name}` : "Add a material"} className="grid max-w-3xl grid-cols-2 gap-3 rounded border border-rule bg-sheet p-4 md:grid-cols-4">
      {material ? <input type="hidden" name="materialId" value={material.id} /> : <h2 className="col-span-full font-semibold">Add a material</h2>}
      <FormField label="Name" name="name" maxLength={100} defaultValue={material?.name} autoComplete="off" className="col-span-2" />
      <div className="col-span-2">
        <FormSelectField label="Family (creep behaviour)" name="family" defaultValue={material?.family ?? "steel"} className="w-full rounded border border-rule bg-sheet px-2 py-1.5 text-sm">
          {families.map((f) => (
            <option key={f.value} value={f.value}>
              {f.label}
            </option>
          ))}
        </FormSelectField>
      </div>
      <FormField label="E [MPa]" name="eMpa" inputMode="decimal" defaultValue={text(material?.eMpa)} />
      <FormField label="G [MPa], optional" name="gMpa" inputMode="decimal" defaultValue={text(material?.gMpa)} />
      <FormField label="Density [kg/m3], optional" name="densityKgPerM3" inputMode="decimal" defaultValue={text(material?.densityKgPerM3)} />
      <FormField label="Creep factor, optional" name="creepFactor" inputMode="decimal" defaultValue={text(material?.creepFactor)} />
      <FormField label="Source of the values" name="source" maxLength={500} defaultValue={material?.source} autoComplete="off" className="col-span-full" />
      <div className="col-span-full">
        <SubmitButton pendingLabel="Saving…">{material ? "Save material" : "Add material"}</SubmitButton>
      </div>
    </ActionForm>
  );
}
