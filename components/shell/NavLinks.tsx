"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cx } from "../ui/cx";
import type { NavGroup } from "./nav";

export function NavLinks({ groups }: { groups: NavGroup[] }) {
  const path = usePathname();
  const isActive = (href: string) => (href === "/" ? path === "/" : path === href || path.startsWith(`${href}/`));
  return (
    <nav aria-label="Main" className="flex flex-col gap-4">
      {groups.map((g) => (
        <div key={g.label}>
          <p className="px-3 text-[11px] font-bold uppercase tracking-[0.14em] text-paper/50">{g.label}</p>
          <ul className="mt-1 flex flex-col">
            {g.items.map((item) => (
              <li key={item.href}>
                <Link
                  href={item.href}
                  aria-current={isActive(item.href) ? "page" : undefined}
                  className={cx(
                    "block rounded-md border-l-4 px-3 py-2 text-sm",
                    isActive(item.href) ? "border-copper bg-graphite-deep font-semibold text-white" : "border-transparent text-paper/80 hover:bg-graphite-deep hover:text-white",
                  )}
                >
                  {item.label}
                </Link>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </nav>
  );
}
