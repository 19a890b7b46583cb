import Link from "next/link";

export type ResultsPagerProps = {
  base: string;
  /** The view's query parameters (filters, sort, columns) every link keeps. */
  params: Record<string, string>;
  page: number;
  pageCount: number;
  total: number;
  next: string | null;
  previous: string | null;
  pageSize: number;
};

function href(base: string, params: Record<string, string>): string {
  const query = new URLSearchParams(params).toString();
  return query ? `${base}?${query}` : base;
}

/** First, previous and next pages by keyset cursor, and a jump to any page by number. */
export function ResultsPager({ base, params, page, pageCount, total, next, previous, pageSize }: ResultsPagerProps) {
  return (
    <nav aria-label="Result pages" className="mt-3 flex flex-wrap items-center gap-x-4 gap-y-2 text-sm print:hidden">
      <span data-testid="page-position">
        Page {page.toLocaleString("en-GB")} of {pageCount.toLocaleString("en-GB")}
        <span className="text-ink-soft"> · {total.toLocaleString("en-GB")} members</span>
      </span>
      {page > 1 ? (
        <Link className="text-action underline" href={href(base, params)}>
          First page
        </Link>
      ) : null}
      {previous ? (
        <Link className="text-action underline" href={href(base, { ...params, cursor: previous })}>
          {`Previous ${pageSize} members`}
        </Link>
      ) : null}
      {next ? (
        <Link className="text-action underline" href={href(base, { ...params, cursor: next })}>
          {`Next ${pageSize} members`}
        </Link>
      ) : null}
      {pageCount > 1 ? (
        <form method="get" action={base} className="flex items-center gap-1.5">
          {Object.entries(params).map(([name, value]) => (
            <input key={name} type="hidden" name={name} value={value} />
          ))}
          <label className="flex items-center gap-1.5">
            Go to page
            <input type="number" name="page" min={1} max={pageCount} defaultValue={page} required className="w-20 rounded border border-rule bg-sheet px-2 py-1" />
          </label>
          <button type="submit" className="rounded border border-rule bg-sheet px-2 py-1 font-medium hover:bg-paper">
            Go
          </button>
        </form>
      ) : null}
    </nav>
  );
}
