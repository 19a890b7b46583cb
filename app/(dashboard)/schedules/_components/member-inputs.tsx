import { Fragment } from "react";

import type { QuantityKind } from "@/lib/engine/units";

import { prettyUnit, type DisplayUnits } from "./display-units";
import { formatMaterial, formatPlain, formatReinforcement, formatSection, formatSpan, formatSupport } from "./entered-values";
import { categoryLabels } from "./format";

export type MemberInputsProps = {
  input: Record<string, unknown>;
  /** The unit each kind of bare number was read in (the schedule's units). */
  units: DisplayUnits;
};

type Row = { label: string; value: string };

function listOf(value: unknown, format: (entry: unknown) => string): string {
  return Array.isArray(value) ? value.map(format).join(" · ") : formatPlain(value);
}

function describeOverhangs(value: unknown, units: DisplayUnits): string {
  if (typeof value !== "object" || value === null) return formatPlain(value);
  const { left, right } = value as { left?: unknown; right?: unknown };
  return `left ${left === undefined ? "none" : formatSpan(left, units)}, right ${right === undefined ? "none" : formatSpan(right, units)}`;
}

function describeMember(input: Record<string, unknown>, units: DisplayUnits): Row[] {
  const rows: Row[] = [];
  const add = (field: string, label: string, format: (value: unknown) => string) => {
    if (input[field] !== undefined) rows.push({ label, value: format(input[field]) });
  };
  add("mark", "Mark", formatPlain);
  add("category", "Category", (v) => (typeof v === "string" ? (categoryLabels[v] ?? v) : formatPlain(v)));
  add("quantity", "Quantity", formatPlain);
  add("material", "Material", (v) => formatMaterial(v, units));
  add("creep", "Creep", formatPlain);
  add("moistureCondition", "Moisture condition", formatPlain);
  add("section", "Section", (v) => formatSection(v, units));
  add("reinforcement", "Reinforcement", (v) => formatReinforcement(v, units));
  add("spans", "Spans, left to right", (v) => listOf(v, (entry) => formatSpan(entry, units)));
  add("overhangs", "Overhangs", (v) => describeOverhangs(v, units));
  add("supports", "Supports, left to right", (v) => listOf(v, (entry) => formatSupport(entry, units)));
  add("selfWeight", "Self-weight added", formatPlain);
  add("shearDeformation", "Shear deformation", formatPlain);
  add("notes", "Notes", formatPlain);
  return rows;
}

type LoadColumn = { field: string; words: string; kind: QuantityKind | null; align?: "right" };

/** Load fields of the public format, headed in words with the schedule's unit for bare numbers. */
const LOAD_COLUMNS: LoadColumn[] = [
  { field: "case", words: "Load case", kind: null },
  { field: "type", words: "Kind", kind: null },
  { field: "w", words: "Intensity", kind: "distributedLoad", align: "right" },
  { field: "pressure", words: "Area load", kind: "pressure", align: "right" },
  { field: "tributaryWidth", words: "Tributary width", kind: "length", align: "right" },
  { field: "wStart", words: "Intensity at start", kind: "distributedLoad", align: "right" },
  { field: "wEnd", words: "Intensity at end", kind: "distributedLoad", align: "right" },
  { field: "P", words: "Force", kind: "force", align: "right" },
  { field: "M", words: "Moment", kind: "moment", align: "right" },
  { field: "at", words: "At", kind: "length", align: "right" },
  { field: "start", words: "From", kind: "length", align: "right" },
  { field: "end", words: "To", kind: "length", align: "right" },
  { field: "fixed", words: "Never patterned", kind: null },
];

/** A cell: a bare number without its unit (the header has it), a number with its own unit in full. */
function formatLoadCell(value: unknown, column: LoadColumn): string {
  if (value === undefined) return "";
  if (column.field === "fixed") return value === true ? "yes" : formatPlain(value);
  return formatPlain(value);
}

function LoadsTable({ loads, units }: { loads: Record<string, unknown>[]; units: DisplayUnits }) {
  if (loads.length === 0) return <p className="text-ink-soft">No applied loads (self-weight only).</p>;
  const used = LOAD_COLUMNS.filter((column) => loads.some((load) => load[column.field] !== undefined));
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">Loads as submitted; positions are measured from the member&apos;s left end</caption>
        <thead className="text-xs text-ink-soft">
          <tr>
            {used.map((column) => (
              <th key={column.field} scope="col" className={`pb-1 pr-3 align-bottom font-medium ${column.align === "right" ? "text-right" : ""}`}>
                {column.words}
                {column.kind ? <span className="block font-normal">({prettyUnit(units[column.kind])})</span> : null}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {loads.map((load, i) => (
            <tr key={i} className="border-t border-rule">
              {used.map((column) => (
                <td key={column.field} className={`py-1 pr-3 [overflow-wrap:anywhere] ${column.align === "right" ? "text-right" : ""}`}>
                  {formatLoadCell(load[column.field], column)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The member as submitted (public schedule format), field by field, each number with its unit. */
export function MemberInputs({ input, units }: MemberInputsProps) {
  const rows = describeMember(input, units);
  const loads = Array.isArray(input.loads) ? (input.loads as Record<string, unknown>[]) : [];
  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
        {rows.map((row) => (
          <Fragment key={row.label}>
            <dt className="text-ink-soft">{row.label}</dt>
            <dd className="min-w-0 [overflow-wrap:anywhere]">{row.value}</dd>
          </Fragment>
        ))}
      </dl>
      <div>
        <h3 className="mb-1 text-sm font-medium">Loads</h3>
        <LoadsTable loads={loads} units={units} />
        <p className="mt-1 text-xs text-ink-soft">Positions are measured from the member&apos;s left end, a left overhang included. A value written with its own unit shows that unit.</p>
      </div>
    </div>
  );
}
