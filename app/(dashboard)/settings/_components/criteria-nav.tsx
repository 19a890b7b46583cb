import Link from "next/link";

const screens = [
  { href: "/settings/limit-profiles", label: "Limit profiles" },
  { href: "/settings/materials", label: "Materials" },
  { href: "/settings/section-catalogues", label: "Section catalogues" },
] as const;

export type CriteriaNavProps = { current?: (typeof screens)[number]["href"]; canEdit: boolean };

/** The three criteria screens, and who may change them. */
export function CriteriaNav({ current, canEdit }: CriteriaNavProps) {
  return (
    <div className="mb-4 flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
      <nav aria-label="Criteria" className="flex gap-3">
        {screens.map((s) => (
          <Link key={s.href} href={s.href} aria-current={current === s.href ? "page" : undefined} className="text-action underline-offset-2 hover:underline aria-[current=page]:font-semibold aria-[current=page]:text-ink">
            {s.label}
          </Link>
        ))}
      </nav>
      <span className="text-xs text-ink-soft">{canEdit ? "Engineers and administrators change these." : "Read only: engineers and administrators change these."}</span>
    </div>
  );
}
