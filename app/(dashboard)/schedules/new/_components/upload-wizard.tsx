"use client";

import { useMemo, useState } from "react";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { UnitSystem } from "@/lib/engine/units";

import { LiveProgress } from "../../_components/live-progress";
import { ColumnMapping } from "./column-mapping";
import {
  DELIMITERS,
  buildMappedHeader,
  decodeCsvBytes,
  describeHeaders,
  listTargetColumns,
  parseCsvText,
  relineErrors,
  suggestDelimiter,
  validateSchedule,
  type UploadCriteria,
  writeMappedCsv,
  type ColumnChoices,
  type DelimiterName,
} from "./csv-model";
import { FilePicker } from "./file-picker";
import { PreviewTable } from "./preview-table";
import { RowErrors, type RowError } from "./row-errors";
import { sendUpload } from "./send-upload";
import { UploadOptions, type PresetOption, type UnitsChoice } from "./upload-options";

export type UploadWizardProps = { presets: PresetOption[]; maxBytes: number; criteria?: UploadCriteria };

const PREVIEW_ROWS = 10;
const EMPTY_CHOICES: ColumnChoices = { targets: {}, units: {} };

type Loaded = { name: string; text: string; sizeBytes: number };
type Submitted = { id: string; memberCount: number };
type CheckOutcome = { ok: true; memberCount: number } | { ok: false; errors: RowError[] };
type ServerRefusal = { message: string; errors: RowError[]; total: number };

function Step({ n, title, children }: { n: number; title: string; children: React.ReactNode }) {
  return (
    <section aria-labelledby={`step-${n}`} className="space-y-3">
      <h2 id={`step-${n}`} className="font-semibold">
        <span className="mr-2 inline-flex h-5 w-5 items-center justify-center rounded-full border border-rule bg-sheet text-xs">{n}</span>
        {title}
      </h2>
      {children}
    </section>
  );
}

/** Choose, preview, map, check every row, then submit and follow the workers' progress. */
export function UploadWizard({ presets, maxBytes, criteria }: UploadWizardProps) {
  const [file, setFile] = useState<Loaded | null>(null);
  const [loadError, setLoadError] = useState<string | null>(null);
  const [delimiter, setDelimiter] = useState<DelimiterName>("comma");
  const [choices, setChoices] = useState<ColumnChoices>(EMPTY_CHOICES);
  const [unitsChoice, setUnitsChoice] = useState<UnitsChoice>("");
  const [presetId, setPresetId] = useState("");
  const [name, setName] = useState("");
  const [reference, setReference] = useState("");
  const [checked, setChecked] = useState<CheckOutcome | null>(null);
  const [sending, setSending] = useState(false);
  const [refusal, setRefusal] = useState<ServerRefusal | null>(null);
  const [submitted, setSubmitted] = useState<Submitted | null>(null);

  const system: UnitSystem | null = unitsChoice === "SI" || unitsChoice === "US" ? unitsChoice : null;
  const parsed = useMemo(() => (file ? parseCsvText(file.text, delimiter) : null), [file, delimiter]);
  const headers = useMemo(() => (parsed?.ok ? describeHeaders(parsed.header.fields) : []), [parsed]);
  const mapped = useMemo(() => buildMappedHeader(headers, { ...choices, system }), [headers, choices, system]);
  const targetGroups = useMemo(() => listTargetColumns(presetId || null), [presetId]);
  const suggestion = file ? suggestDelimiter(file.text) : null;

  // Any change invalidates the last check: the person must check what they will send.
  const changed = () => {
    setChecked(null);
    setRefusal(null);
  };

  // Another delimiter splits other columns, so earlier column choices no longer apply.
  const chooseDelimiter = (d: DelimiterName) => {
    changed();
    setChoices(EMPTY_CHOICES);
    setDelimiter(d);
  };

  const onFile = async (picked: File) => {
    changed();
    setFile(null);
    if (picked.size > maxBytes) {
      setLoadError(`The file is ${(picked.size / 1048576).toFixed(1)} MB; Sagline accepts at most ${maxBytes / 1048576} MB per upload.`);
      return;
    }
    const decoded = decodeCsvBytes(await picked.arrayBuffer());
    if (!decoded.ok) {
      setLoadError(decoded.message);
      return;
    }
    setLoadError(null);
    setChoices(EMPTY_CHOICES);
    setFile({ name: picked.name, text: decoded.text, sizeBytes: picked.size });
    setName((current) => current || picked.name.replace(/\.[^.]+$/, ""));
  };

  const runCheck = (): CheckOutcome | null => {
    if (!parsed) return null;
    const missing: RowError[] = [];
    if (unitsChoice === "") missing.push({ message: "choose a unit system (or None, when every quantity column names its unit)", pointer: "units" });
    if (presetId === "") missing.push({ message: "choose a limit profile", pointer: "profile" });
    if (name.trim() === "" || name.trim().length > 200) missing.push({ message: "give the schedule a name of 1 to 200 characters", pointer: "name" });
    const result: CheckOutcome = !parsed.ok
      ? parsed
      : missing.length > 0
        ? { ok: false, errors: missing }
        : validateSchedule({ criteria, parsed, mapped, system, presetId, name: name.trim(), reference: reference.trim() });
    setChecked(result);
    return result;
  };

  const submit = async () => {
    if (!parsed?.ok || !file || !checked?.ok) return;
    setSending(true);
    setRefusal(null);
    const form = new FormData();
    form.set("file", new Blob([writeMappedCsv(parsed, mapped, delimiter)], { type: "text/csv" }), file.name);
    form.set("name", name.trim());
    if (reference.trim()) form.set("reference", reference.trim());
    form.set("profile", presetId);
    form.set("delimiter", delimiter);
    if (system) form.set("units", system);
    const outcome = await sendUpload(form);
    setSending(false);
    if (outcome.ok) setSubmitted({ id: outcome.id, memberCount: outcome.memberCount });
    else setRefusal({ message: outcome.message, errors: relineErrors(outcome.errors, parsed), total: outcome.total });
  };

  if (submitted) {
    return (
      <section aria-labelledby="progress-heading" className="space-y-3 rounded border border-rule bg-sheet p-4">
        <h2 id="progress-heading" className="font-semibold">
          Submitted: {submitted.memberCount.toLocaleString("en-GB")} members
        </h2>
        <LiveProgress scheduleId={submitted.id} initial={{ status: "queued", checked: 0, members: submitted.memberCount }} finishedHref={`/schedules/${submitted.id}`} />
        <p className="text-xs text-ink-soft">
          You can leave this page; the check goes on. <a className="text-action underline" href={`/schedules/${submitted.id}`}>Open the schedule</a>
        </p>
      </section>
    );
  }

  return (
    <div className="space-y-8">
      <Step n={1} title="Choose the file">
        <FilePicker onFile={onFile} fileName={file?.name ?? null} />
        {loadError ? <Notice tone="error">{loadError}</Notice> : null}
      </Step>

      {file ? (
        <Step n={2} title="Delimiter and preview">
          <fieldset className="flex flex-wrap items-center gap-4">
            <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Fields are separated by</legend>
            {(Object.keys(DELIMITERS) as DelimiterName[]).map((d) => (
              <label key={d} className="flex items-center gap-1.5">
                <input
                  type="radio"
                  name="delimiter"
                  value={d}
                  checked={delimiter === d}
                  onChange={() => chooseDelimiter(d)}
                />
                {DELIMITERS[d].label}
              </label>
            ))}
          </fieldset>
          {suggestion && suggestion !== delimiter ? (
            <p className="text-sm text-caution" data-testid="delimiter-suggestion">
              The first line looks {DELIMITERS[suggestion].label.toLowerCase()}-separated.{" "}
              <button type="button" className="text-action underline" onClick={() => chooseDelimiter(suggestion)}>
                Use {DELIMITERS[suggestion].label.toLowerCase()}
              </button>
            </p>
          ) : null}
          {parsed?.ok ? (
            <PreviewTable header={parsed.header} records={parsed.records.slice(0, PREVIEW_ROWS)} totalRows={parsed.records.length} />
          ) : parsed ? (
            <RowErrors title="The file could not be split into rows" errors={parsed.errors} />
          ) : null}
        </Step>
      ) : null}

      {parsed?.ok ? (
        <Step n={3} title="Columns">
          <p className="text-ink-soft">
            Columns Sagline recognises are mapped already. For each other column choose what it holds, or ignore it. Quantity columns without a unit in their
            header take the unit you choose here, or the unit system&apos;s default.
          </p>
          <ColumnMapping
            headers={headers}
            choices={choices}
            targetGroups={targetGroups}
            system={system}
            onTarget={(index, target) => {
              changed();
              setChoices((c) => ({ ...c, targets: { ...c.targets, [index]: target } }));
            }}
            onUnit={(index, unit) => {
              changed();
              setChoices((c) => ({ ...c, units: { ...c.units, [index]: unit } }));
            }}
          />
        </Step>
      ) : null}

      {parsed?.ok ? (
        <Step n={4} title="Schedule options">
          <UploadOptions
            presets={presets}
            unitsChoice={unitsChoice}
            presetId={presetId}
            name={name}
            reference={reference}
            onUnits={(v) => {
              changed();
              setUnitsChoice(v);
            }}
            onPreset={(v) => {
              changed();
              setPresetId(v);
            }}
            onName={(v) => {
              changed();
              setName(v);
            }}
            onReference={(v) => {
              changed();
              setReference(v);
            }}
          />
        </Step>
      ) : null}

      {parsed?.ok ? (
        <Step n={5} title="Check and submit">
          <div className="flex flex-wrap items-center gap-3">
            <Button tone="quiet" onClick={runCheck}>
              Check every row
            </Button>
            <Button onClick={submit} disabled={!checked?.ok || sending}>
              {sending ? "Submitting…" : checked?.ok ? `Submit ${checked.memberCount.toLocaleString("en-GB")} members` : "Submit"}
            </Button>
          </div>
          {checked?.ok ? <Notice tone="ok">Every row is valid: {checked.memberCount.toLocaleString("en-GB")} members are ready to submit.</Notice> : null}
          {checked && !checked.ok ? <RowErrors title="The check found problems" errors={checked.errors} originOf={mapped.originOf} /> : null}
          {refusal ? (
            refusal.errors.length > 0 ? (
              <RowErrors title={`Sagline refused the upload (${refusal.message})`} errors={refusal.errors} total={refusal.total} originOf={mapped.originOf} />
            ) : (
              <Notice tone="error">{refusal.message}</Notice>
            )
          ) : null}
        </Step>
      ) : null}
    </div>
  );
}
