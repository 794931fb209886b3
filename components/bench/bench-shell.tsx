"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ReactNode } from "react";
import { ListTodo, ScanLine, Calculator, Smartphone } from "lucide-react";

const ACTIONS = [
  { href: "/bench", label: "Today", icon: ListTodo },
  { href: "/bench/scan", label: "Scan tag", icon: ScanLine },
  { href: "/tools", label: "Tools", icon: Calculator },
  { href: "/bench/device", label: "Device", icon: Smartphone },
] as const;

/** The phone layout of the bench: content above, the main actions in thumb reach at the bottom. */
export function BenchShell({ title, status, children }: { title: ReactNode; status?: ReactNode; children: ReactNode }) {
  const current = usePathname() ?? "";
  return (
    <div className="flex min-h-dvh flex-col">
      <header className="sticky top-0 z-10 flex items-center justify-between gap-3 border-b border-line bg-surface/95 px-4 py-3 backdrop-blur">
        <h1 className="truncate text-xl font-bold">{title}</h1>
        {status}
      </header>
      <main className="mx-auto w-full max-w-2xl flex-1 px-4 pb-32 pt-4">{children}</main>
      <nav
        aria-label="Bench"
        className="fixed inset-x-0 bottom-0 z-10 border-t border-line bg-surface pb-[env(safe-area-inset-bottom)]"
      >
        <ul className="mx-auto grid max-w-2xl grid-cols-4 gap-2 px-2 py-2">
          {ACTIONS.map(({ href, label, icon: Icon }) => {
            const active = href === "/bench" ? current === "/bench" : current.startsWith(href);
            return (
              <li key={href}>
                <Link
                  href={href}
                  // No prefetching: the service worker answers these screens from the phone's own copy.
                  prefetch={false}
                  aria-current={active ? "page" : undefined}
                  className={
                    "tap-bench flex flex-col items-center justify-center gap-1 rounded-2xl text-sm font-bold " +
                    (active ? "bg-accent text-accent-ink" : "text-ink")
                  }
                >
                  <Icon size={26} aria-hidden strokeWidth={2.2} />
                  {label}
                </Link>
              </li>
            );
          })}
        </ul>
      </nav>
    </div>
  );
}
