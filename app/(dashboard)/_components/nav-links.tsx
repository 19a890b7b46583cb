"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export type NavItem = { href: string; label: string };
export type NavLinksProps = { items: NavItem[] };

export function NavLinks({ items }: NavLinksProps) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main">
      <ul className="flex gap-1">
        {items.map((item) => {
          const current = pathname === item.href || pathname.startsWith(`${item.href}/`);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                aria-current={current ? "page" : undefined}
                className="rounded px-2 py-1 text-ink-soft hover:bg-paper hover:text-ink aria-[current=page]:bg-paper aria-[current=page]:font-semibold aria-[current=page]:text-ink"
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
