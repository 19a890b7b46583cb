"use client";

import { startTransition, useActionState, useId, useState, type FormEvent } from "react";

import { Button } from "@/components/ui/button";
import { Field, SELECT_CLASS, SelectField } from "@/components/ui/field";
import type { MemberCheckRow } from "@/lib/server/schedules/get-member-report";
import type { WhatIfOutcome, WhatIfShape } from "@/lib/server/schedules/recheck-member";

import { recheckMember } from "../[scheduleId]/members/actions";
import { formatQuantity, prettyUnit, type DisplayUnits } from "./display-units";
import { formatCheckKey, formatRatio, formatSpanRatio } from "./format";
import { OutcomeLabel } from "./outcome-label";
import { ShapeDiagram } from "./shape-diagram";

type ShapeOption = { value: WhatIfShape; label: string; fields: { name: string; label: string; kind: "sectionDimension" | "secondMoment" | "area"; optional?: boolean }[] };

const SHAPES: ShapeOption[] = [
  { value: "explicit", label: "Second moment of area I (and area A)", fields: [{ name: "I", label: "I", kind: "secondMoment" }, { name: "A", label: "A (optional; self-weight and frequency use it)", kind: "area", optional: true }] },
  { value: "rectangle", label: "Rectangle", fields: [{ name: "b", label: "Width b", kind: "sectionDimension" }, { name: "h", label: "Depth h", kind: "sectionDimension" }] },
  {
    value: "i_plate",
    label: "I-section from plates",
    fields: [
      { name: "bf", label: "Flange width bf", kind: "sectionDimension" },
      { name: "tf", label: "Flange thickness tf", kind: "sectionDimension" },
      { name: "d", label: "Overall depth d", kind: "sectionDimension" },
      { name: "tw", label: "Web thickness tw", kind: "sectionDimension" },
    ],
  },
  { value: "round", label: "Solid round", fields: [{ name: "d", label: "Diameter d", kind: "sectionDimension" }] },
  { value: "tube", label: "Round tube", fields: [{ name: "D", label: "Outside diameter D", kind: "sectionDimension" }, { name: "t", label: "Wall thickness t", kind: "sectionDimension" }] },
  {
    value: "hollow_rectangle",
    label: "Rectangular hollow section",
    fields: [
      { name: "B", label: "Outside width B", kind: "sectionDimension" },
      { name: "H", label: "Outside depth H", kind: "sectionDimension" },
      { name: "t", label: "Wall thickness t", kind: "sectionDimension" },
    ],
  },
];

export type MemberWhatIfProps = {
  scheduleId: string;
  mark: string;
  units: DisplayUnits;
  materialIds: string[];
  record: { pass: boolean; utilization: number | null; governingCheck: string | null; checks: MemberCheckRow[] };
};

// Checks go by combination id here (short, the column is narrow); the checks table gives the full labels.
function Comparison({ outcome, record, units }: { outcome: WhatIfOutcome; record: MemberWhatIfProps["record"]; units: DisplayUnits }) {
  const recordOf = (key: string) => record.checks.find((c) => c.checkKey === key);
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm">
        <caption className="mb-1 text-left font-medium">Each check: on record beside the trial</caption>
        <thead className="text-xs text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className="px-2 py-1 text-left font-medium">Check</th>
            <th scope="col" className="px-2 py-1 text-right font-medium">Allowed</th>
            <th scope="col" className="px-2 py-1 text-right font-medium">On record</th>
            <th scope="col" className="px-2 py-1 text-right font-medium">Trial</th>
            <th scope="col" className="px-2 py-1 text-right font-medium">Trial l/N</th>
            <th scope="col" className="px-2 py-1 text-left font-medium">Trial result</th>
          </tr>
        </thead>
        <tbody>
          {outcome.checks.map((check) => {
            const before = recordOf(check.checkKey);
            return (
              <tr key={check.checkKey} className="border-t border-rule">
                <th scope="row" className="px-2 py-1 text-left font-normal [overflow-wrap:anywhere]">
                  {`${check.combinationId}, span ${check.spanIndex + 1}`}
                </th>
                <td className="px-2 py-1 text-right whitespace-nowrap">{formatQuantity(check.allowedMm, "deflection", units, 3)}</td>
                <td className="px-2 py-1 text-right whitespace-nowrap">
                  {before ? `${formatQuantity(Math.abs(before.deflectionMm), "deflection", units, 3)} (${formatRatio(before.utilization)})` : "—"}
                </td>
                <td className="px-2 py-1 text-right whitespace-nowrap">
                  {formatQuantity(Math.abs(check.deflectionMm), "deflection", units, 3)} ({formatRatio(check.utilization)})
                </td>
                <td className="px-2 py-1 text-right">{formatSpanRatio(check.achievedRatio)}</td>
                <td className="px-2 py-1">
                  <OutcomeLabel status={check.pass ? "pass" : "fail"} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-soft">Deflection magnitudes, with utilization in brackets.</p>
    </div>
  );
}

/**
 * The what-if: a trial section or material for this member, checked at once by the engine with
 * the schedule's limits and units. The answer is shown beside the record and never stored.
 */
export function MemberWhatIf({ scheduleId, mark, units, materialIds, record }: MemberWhatIfProps) {
  const [state, action, pending] = useActionState(recheckMember, null);
  const [shape, setShape] = useState<string>("keep");
  const [material, setMaterial] = useState<string>("keep");
  const formId = useId();
  const fields = SHAPES.find((s) => s.value === shape)?.fields ?? [];
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const result = state?.ok ? state.data : undefined;
  // Sent by hand, not as the form's action: a form action clears the fields after it runs, and
  // the engineer compares trials by editing the last one.
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    startTransition(() => action(data));
  };

  return (
    <section aria-labelledby="what-if-heading" className="rounded border border-dashed border-ink-soft bg-sheet p-4 print:hidden" data-testid="what-if">
      <h2 id="what-if-heading" className="font-semibold">
        What-if: try another section or material
      </h2>
      <p className="mt-1 text-ink-soft">
        Rechecked on the spot with the same limits, loads and supports. <strong className="font-semibold text-ink">Nothing here changes the record</strong>: it is not saved, and the results above stay as checked.
        Numbers are in the schedule&apos;s units.
      </p>
      <form onSubmit={submit} aria-label="What-if recheck" className="mt-3 space-y-3" id={formId}>
        <input type="hidden" name="scheduleId" value={scheduleId} />
        <input type="hidden" name="mark" value={mark} />
        <SelectField label="Section" name="shape" value={shape} onChange={(e) => setShape(e.target.value)} className={`${SELECT_CLASS} w-full`}>
          <option value="keep">Keep the member&apos;s own section</option>
          {SHAPES.map((s) => (
            <option key={s.value} value={s.value}>
              {s.label}
            </option>
          ))}
        </SelectField>
        {fields.length > 0 ? (
          <div className="grid grid-cols-2 gap-3">
            {fields.map((field) => (
              <Field
                key={`${shape}-${field.name}`}
                label={`${field.label} (${prettyUnit(units[field.kind])})`}
                name={field.name}
                inputMode="decimal"
                autoComplete="off"
                required={!field.optional}
                error={errors[field.name]}
              />
            ))}
          </div>
        ) : null}
        <SelectField label="Material" name="material" value={material} onChange={(e) => setMaterial(e.target.value)} className={`${SELECT_CLASS} w-full`}>
          <option value="keep">Keep the member&apos;s own material</option>
          <option value="custom">Another modulus E (G and density kept)</option>
          {materialIds.map((id) => (
            <option key={id} value={id}>
              {id}
            </option>
          ))}
        </SelectField>
        {material === "custom" ? <Field label={`Modulus E (${prettyUnit(units.modulus)})`} name="E" inputMode="decimal" autoComplete="off" required error={errors.E} /> : null}
        {errors.material ? <p className="text-xs text-fail">{errors.material}</p> : null}
        {errors.shape ? <p className="text-xs text-fail">{errors.shape}</p> : null}
        <div className="flex items-center gap-3">
          <Button type="submit" disabled={pending}>
            {pending ? "Rechecking…" : "Recheck this member"}
          </Button>
          <p role="status" className="text-sm">
            {state && !state.ok ? <span className="text-fail">{errors.form ?? state.message}</span> : null}
          </p>
        </div>
      </form>

      {result && !result.ok ? (
        <div role="alert" className="mt-3 rounded border border-caution/40 bg-caution-bg p-3 text-caution">
          <p className="font-semibold">The engine could not check this trial:</p>
          <ul className="mt-1 list-disc pl-5">
            {result.issues.map((issue, i) => (
              <li key={i} className="[overflow-wrap:anywhere]">
                {issue.path ? `${issue.path}: ` : ""}
                {issue.message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      {result?.ok ? (
        <div className="mt-4 space-y-3 border-t border-dashed border-ink-soft pt-3" data-testid="what-if-result" aria-live="polite">
          <p className="text-xs font-semibold uppercase tracking-wide">Trial only, not saved</p>
          <p>Tried: {result.outcome.changes.join("; ")}.</p>
          <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
            <dt className="text-ink-soft">On record</dt>
            <dd>
              <OutcomeLabel status={record.pass ? "pass" : "fail"} /> · governing {formatCheckKey(record.governingCheck)} · utilization {formatRatio(record.utilization)}
            </dd>
            <dt className="text-ink-soft">Trial</dt>
            <dd data-testid="what-if-verdict">
              <OutcomeLabel status={result.outcome.pass ? "pass" : "fail"} /> · governing {formatCheckKey(result.outcome.governingCheck)} · utilization {formatRatio(result.outcome.utilization)}
            </dd>
            {result.outcome.suggestion ? (
              <>
                <dt className="text-ink-soft">Trial minimum I</dt>
                <dd>{result.outcome.suggestion.minIMm4 === null ? "none: no I alone passes" : formatQuantity(result.outcome.suggestion.minIMm4, "secondMoment", units)}</dd>
              </>
            ) : null}
          </dl>
          <Comparison outcome={result.outcome} record={record} units={units} />
          {result.outcome.notes.length > 0 ? (
            <ul className="list-disc pl-5 text-ink-soft">
              {result.outcome.notes.map((note) => (
                <li key={note}>{note}</li>
              ))}
            </ul>
          ) : null}
          <details>
            <summary className="cursor-pointer text-action underline">Diagrams of the trial</summary>
            <div className="mt-2">
              <ShapeDiagram shape={result.outcome.shape} model={result.outcome.model} checks={result.outcome.checks} units={units} idPrefix="what-if" />
            </div>
          </details>
        </div>
      ) : null}
    </section>
  );
}
