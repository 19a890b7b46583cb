"use client";

import { Field, SELECT_CLASS, SelectField } from "@/components/ui/field";
import { TERMS } from "@/lib/vocabulary";

export type PresetOption = { id: string; label: string; source: string };
export type UnitsChoice = "" | "SI" | "US" | "none";

export type UploadOptionsProps = {
  presets: PresetOption[];
  unitsChoice: UnitsChoice;
  presetId: string;
  name: string;
  reference: string;
  onUnits: (value: UnitsChoice) => void;
  onPreset: (value: string) => void;
  onName: (value: string) => void;
  onReference: (value: string) => void;
};

const selectClass = `w-full ${SELECT_CLASS}`;

export function UploadOptions({ presets, unitsChoice, presetId, name, reference, onUnits, onPreset, onName, onReference }: UploadOptionsProps) {
  const preset = presets.find((p) => p.id === presetId);
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <SelectField
        label="Unit system"
        value={unitsChoice}
        onChange={(e) => onUnits(e.currentTarget.value as UnitsChoice)}
        className={selectClass}
        hint={<span className="mt-1 block text-xs text-ink-soft">For quantity columns whose header has no [unit] and no unit chosen above.</span>}
      >
        <option value="">Choose…</option>
        <option value="SI">SI (m, mm, kN, kN/m, kPa, MPa)</option>
        <option value="US">US customary (ft, in, kip, klf, psf, ksi)</option>
        <option value="none">None: every quantity column names its unit</option>
      </SelectField>
      <SelectField
        label={TERMS.profile.label}
        value={presetId}
        onChange={(e) => onPreset(e.currentTarget.value)}
        className={selectClass}
        hint={
          <span className="mt-1 block text-xs text-ink-soft" data-testid="preset-source">
            {preset ? `Source: ${preset.source}` : "Each preset names the publication it follows; confirm it suits the project."}
          </span>
        }
      >
        <option value="">Choose…</option>
        {presets.map((p) => (
          <option key={p.id} value={p.id} title={p.source}>
            {p.label}
          </option>
        ))}
      </SelectField>
      <Field label="Schedule name" name="name" value={name} maxLength={200} onChange={(e) => onName(e.currentTarget.value)} />
      <Field label="Reference (optional)" name="reference" value={reference} maxLength={200} onChange={(e) => onReference(e.currentTarget.value)} />
    </div>
  );
}
