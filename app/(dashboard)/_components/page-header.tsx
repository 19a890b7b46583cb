import type { ReactNode } from "react";

export type PageHeaderProps = { title: string; lead?: string; children?: ReactNode };

export function PageHeader({ title, lead, children }: PageHeaderProps) {
  return (
    <div className="mb-5 flex flex-wrap items-end justify-between gap-3 border-b border-rule pb-3">
      <div>
        <h1 className="text-lg font-semibold">{title}</h1>
        {lead ? <p className="mt-1 max-w-2xl text-ink-soft">{lead}</p> : null}
      </div>
      {children}
    </div>
  );
}
