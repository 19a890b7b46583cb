export type RowError = { row?: number; line?: number; column?: string; message: string; code?: string; pointer?: string };

export type RowErrorsProps = { title: string; errors: RowError[]; total?: number; originOf?: Record<string, string> };

const MAX_SHOWN = 1000;

function describeColumn(column: string | undefined, originOf: Record<string, string>): string {
  if (!column) return "—";
  const own = originOf[column];
  return own && own !== column ? `${column} (your "${own}")` : column;
}

/** Every problem by row, line and column, in file order; schedule-wide problems (row 0 or 1) first. */
export function RowErrors({ title, errors, total, originOf = {} }: RowErrorsProps) {
  const sorted = [...errors].sort((a, b) => (a.row ?? 0) - (b.row ?? 0) || (a.line ?? 0) - (b.line ?? 0));
  const count = total ?? errors.length;
  return (
    <section aria-labelledby="row-errors-heading" className="rounded border border-fail/40 bg-sheet" data-testid="row-errors">
      <h3 id="row-errors-heading" role="alert" className="border-b border-fail/30 bg-red-50 px-3 py-2 font-semibold text-fail">
        {title}: {count.toLocaleString("en-GB")} problem{count === 1 ? "" : "s"}; nothing was submitted
      </h3>
      <div className="max-h-[28rem] overflow-auto">
        <table className="w-full border-collapse text-left">
          <thead className="sticky top-0 bg-sheet text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-1.5 font-medium">Row</th>
              <th scope="col" className="px-3 py-1.5 font-medium">Line</th>
              <th scope="col" className="px-3 py-1.5 font-medium">Column</th>
              <th scope="col" className="px-3 py-1.5 font-medium">Problem</th>
            </tr>
          </thead>
          <tbody>
            {sorted.slice(0, MAX_SHOWN).map((e, i) => (
              <tr key={i} className="border-t border-rule align-top" data-row={e.row}>
                <td className="px-3 py-1.5">{e.row === undefined || e.row === 0 ? (e.pointer ? "—" : "schedule") : e.row === 1 ? "1 (header)" : e.row}</td>
                <td className="px-3 py-1.5">{e.line ?? "—"}</td>
                <td className="max-w-[14rem] px-3 py-1.5 [overflow-wrap:anywhere]">{e.pointer && !e.column ? e.pointer : describeColumn(e.column, originOf)}</td>
                <td className="px-3 py-1.5 [overflow-wrap:anywhere]">{e.message}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {count > Math.min(sorted.length, MAX_SHOWN) ? (
        <p className="border-t border-rule px-3 py-2 text-xs text-ink-soft">
          The first {Math.min(sorted.length, MAX_SHOWN).toLocaleString("en-GB")} are listed; fix them and check again to see the rest.
        </p>
      ) : null}
    </section>
  );
}
