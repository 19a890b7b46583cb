"use client";

import { Field } from "@/components/ui/field";

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

const labelClass = "mb-1 block text-xs font-medium uppercase tracking-wide text-ink-soft";
const selectClass = "w-full rounded border border-rule bg-sheet px-2 py-1.5 text-sm";

export function UploadOptions({ presets, unitsChoice, presetId, name, reference, onUnits, onPreset, onName, onReference }: UploadOptionsProps) {
  const preset = presets.find((p) => p.id === presetId);
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <label className="block">
        <span className={labelClass}>Unit system</span>
        <select value={unitsChoice} onChange={(e) => onUnits(e.currentTarget.value as UnitsChoice)} className={selectClass}>
          <option value="">Choose…</option>
          <option value="SI">SI (m, mm, kN, kN/m, kPa, MPa)</option>
          <option value="US">US customary (ft, in, kip, klf, psf, ksi)</option>
          <option value="none">None: every quantity column names its unit</option>
        </select>
        <span className="mt-1 block text-xs text-ink-soft">For quantity columns whose header has no [unit] and no unit chosen above.</span>
      </label>
      <label className="block">
        <span className={labelClass}>Limit preset</span>
        <select value={presetId} onChange={(e) => onPreset(e.currentTarget.value)} className={selectClass}>
          <option value="">Choose…</option>
          {presets.map((p) => (
            <option key={p.id} value={p.id} title={p.source}>
              {p.label}
            </option>
          ))}
        </select>
        <span className="mt-1 block text-xs text-ink-soft" data-testid="preset-source">
          {preset ? `Source: ${preset.source}` : "Each preset names the publication it follows; confirm it suits the project."}
        </span>
      </label>
      <Field label="Schedule name" name="name" value={name} maxLength={200} onChange={(e) => onName(e.currentTarget.value)} />
      <Field label="Reference (optional)" name="reference" value={reference} maxLength={200} onChange={(e) => onReference(e.currentTarget.value)} />
    </div>
  );
}
