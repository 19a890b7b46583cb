import type { CsvRecord } from "./csv-model";

export type PreviewTableProps = { header: CsvRecord; records: CsvRecord[]; totalRows: number };

/** The first rows exactly as the chosen delimiter splits them. Cells are text, never markup. */
export function PreviewTable({ header, records, totalRows }: PreviewTableProps) {
  return (
    <div>
      <div className="max-h-96 overflow-auto rounded border border-rule bg-sheet">
        <table className="border-collapse text-left text-xs">
          <caption className="sr-only">First rows of the file</caption>
          <thead className="sticky top-0 bg-paper">
            <tr>
              <th scope="col" className="border-b border-rule px-2 py-1 font-medium text-ink-soft">
                Row
              </th>
              {header.fields.map((h, i) => (
                <th key={i} scope="col" className="max-w-[14rem] border-b border-rule px-2 py-1 font-medium [overflow-wrap:anywhere]">
                  {h}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {records.map((r) => (
              <tr key={r.row} className="border-t border-rule align-top">
                <th scope="row" className="px-2 py-1 font-normal text-ink-soft">
                  {r.row}
                </th>
                {r.fields.map((f, i) => (
                  <td key={i} className="max-w-[14rem] whitespace-pre-wrap px-2 py-1 [overflow-wrap:anywhere]">
                    {f}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-1 text-xs text-ink-soft">
        Showing {records.length} of {totalRows.toLocaleString("en-GB")} data rows, with {header.fields.length} columns.
      </p>
    </div>
  );
}
