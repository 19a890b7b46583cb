/** Columns of the results table a reader may add or remove; mark, category, utilization and the outcome always show. */
export const OPTIONAL_COLUMNS = ["section", "material", "quantity", "spans", "deflection", "allowed", "ratio", "disposition"] as const;
export type OptionalColumn = (typeof OPTIONAL_COLUMNS)[number];

export const optionalColumnLabels: Record<OptionalColumn, string> = {
  section: "Section",
  material: "Material",
  quantity: "Quantity",
  spans: "Spans",
  deflection: "Deflection",
  allowed: "Allowed deflection",
  ratio: "l/N achieved",
  disposition: "Disposition",
};

/** Shown until the reader chooses: the serviceability figures and the review state. */
export const DEFAULT_COLUMNS: readonly OptionalColumn[] = ["deflection", "allowed", "ratio", "disposition"];

/**
 * The chosen columns: the form's `col` boxes, or a link's `cols=a,b`, or the defaults when neither
 * is there. Unknown names are ignored: they only change the view.
 */
export function readColumns(boxes: readonly string[], text: string | null): OptionalColumn[] {
  if (boxes.length === 0 && text === null) return [...DEFAULT_COLUMNS];
  const asked = new Set([...boxes.slice(0, OPTIONAL_COLUMNS.length * 2), ...(text ?? "").slice(0, 200).split(",")]);
  return OPTIONAL_COLUMNS.filter((c) => asked.has(c));
}
