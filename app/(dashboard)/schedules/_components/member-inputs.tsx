import { Fragment, type ReactNode } from "react";

export type MemberInputsProps = { input: Record<string, unknown> };

const fieldLabels: Record<string, string> = {
  mark: "Mark",
  category: "Category",
  quantity: "Quantity",
  material: "Material",
  creep: "Creep",
  section: "Section",
  spans: "Spans",
  overhangs: "Overhangs",
  supports: "Supports",
  selfWeight: "Self-weight",
  shearDeformation: "Shear deformation",
  notes: "Notes",
};

function isQuantity(value: unknown): value is { value: number; unit: string } {
  return typeof value === "object" && value !== null && typeof (value as { value?: unknown }).value === "number" && typeof (value as { unit?: unknown }).unit === "string";
}

/** Renders a public-format input value as text: quantities with their unit, lists and objects spelled out. */
export function formatInput(value: unknown): string {
  if (value === null || value === undefined) return "—";
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "—";
  if (typeof value === "string") return value;
  if (isQuantity(value)) return `${value.value} ${value.unit}`;
  if (Array.isArray(value)) return value.map(formatInput).join(", ");
  if (typeof value === "object") {
    return Object.entries(value as Record<string, unknown>)
      .map(([k, v]) => `${k} ${formatInput(v)}`)
      .join(", ");
  }
  return String(value);
}

const loadFields = ["case", "type", "w", "pressure", "tributaryWidth", "P", "at", "M", "start", "end", "wStart", "wEnd"];

function LoadsTable({ loads }: { loads: Record<string, unknown>[] }) {
  if (loads.length === 0) return <p className="text-ink-soft">No applied loads (self-weight only).</p>;
  const used = loadFields.filter((f) => loads.some((l) => l[f] !== undefined));
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm">
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            {used.map((f) => (
              <th key={f} scope="col" className="pb-1 pr-3 font-medium">
                {f}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {loads.map((load, i) => (
            <tr key={i} className="border-t border-rule">
              {used.map((f) => (
                <td key={f} className="py-1 pr-3 [overflow-wrap:anywhere]">
                  {load[f] === undefined ? "" : formatInput(load[f])}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** The member as submitted (public schedule format), field by field. */
export function MemberInputs({ input }: MemberInputsProps) {
  const entries: [string, ReactNode][] = Object.entries(fieldLabels)
    .filter(([field]) => input[field] !== undefined)
    .map(([field, label]) => [label, formatInput(input[field])]);
  const loads = Array.isArray(input.loads) ? (input.loads as Record<string, unknown>[]) : [];
  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1">
        {entries.map(([label, value]) => (
          <Fragment key={label}>
            <dt className="text-ink-soft">{label}</dt>
            <dd className="min-w-0 [overflow-wrap:anywhere]">{value}</dd>
          </Fragment>
        ))}
      </dl>
      <div>
        <h3 className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Loads</h3>
        <LoadsTable loads={loads} />
      </div>
    </div>
  );
}
