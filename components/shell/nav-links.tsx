"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ReactNode } from "react";
import { Calculator, ClipboardList, History, PackagePlus, Settings, Smartphone, Users } from "lucide-react";
import type { NavItem } from "./nav";

const ICONS: Record<NavItem["icon"], ReactNode> = {
  queue: <ClipboardList size={22} aria-hidden />,
  intake: <PackagePlus size={22} aria-hidden />,
  history: <History size={22} aria-hidden />,
  tools: <Calculator size={22} aria-hidden />,
  bench: <Smartphone size={22} aria-hidden />,
  people: <Users size={22} aria-hidden />,
  settings: <Settings size={22} aria-hidden />,
};

function isActive(current: string, href: string): boolean {
  return current === href || current.startsWith(href + "/");
}

export function NavLinks({ items }: { items: NavItem[] }) {
  const current = usePathname() ?? "";
  // The longest matching link wins, so "/counter/intake" does not also light up "/counter".
  const activeHref = items
    .filter((i) => isActive(current, i.href))
    .sort((a, b) => b.href.length - a.href.length)[0]?.href;
  return (
    <>
      {items.map((item) => {
        const active = item.href === activeHref;
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? "page" : undefined}
            className={
              "tap flex shrink-0 items-center gap-3 rounded-xl px-4 font-semibold " +
              (active ? "bg-accent text-accent-ink" : "text-ink hover:bg-surface-2")
            }
          >
            {ICONS[item.icon]}
            <span>{item.label}</span>
          </Link>
        );
      })}
    </>
  );
}
