import Link from "next/link";
import type { ReactNode } from "react";
import { LogOut, Wrench } from "lucide-react";
import type { CurrentUser } from "@/lib/auth/guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { signOutAction } from "@/lib/auth/actions";
import { navFor } from "./nav";
import { NavLinks } from "./nav-links";

/** Counter and owner layout: side navigation on wide screens, a scrolling top bar on phones. */
export function StaffShell({ user, children }: { user: CurrentUser; children: ReactNode }) {
  const items = navFor(user.role);
  const shop = items.filter((i) => i.section === "shop");
  const owner = items.filter((i) => i.section === "owner");
  return (
    <div className="min-h-dvh md:flex">
      <aside className="border-line bg-surface md:sticky md:top-0 md:flex md:h-dvh md:w-64 md:shrink-0 md:flex-col md:border-r">
        <div className="flex items-center justify-between gap-3 px-4 py-3 md:py-5">
          <Link href="/" className="flex items-center gap-2 text-xl font-bold tracking-tight">
            <span className="grid size-10 place-items-center rounded-xl bg-accent text-accent-ink" aria-hidden>
              <Wrench size={22} strokeWidth={2.4} />
            </span>
            Benchwright
          </Link>
        </div>
        <nav aria-label="Main" className="flex gap-2 overflow-x-auto px-3 pb-3 md:flex-1 md:flex-col md:overflow-visible">
          <NavLinks items={shop} />
          {owner.length ? (
            <>
              <p className="hidden px-4 pt-4 text-sm font-bold uppercase tracking-wide text-muted md:block">Owner</p>
              <NavLinks items={owner} />
            </>
          ) : null}
        </nav>
        <div className="hidden border-t border-line px-4 py-4 md:block">
          <p className="font-semibold">{user.name}</p>
          <p className="text-sm text-muted">{ROLE_LABELS[user.role]}</p>
          <form action={signOutAction} className="mt-3">
            <button type="submit" className="tap flex w-full items-center gap-2 rounded-xl px-3 font-semibold hover:bg-surface-2">
              <LogOut size={20} aria-hidden /> Sign out
            </button>
          </form>
        </div>
      </aside>
      <div className="min-w-0 flex-1">
        <main className="mx-auto max-w-7xl px-4 py-6 md:px-8 md:py-8">{children}</main>
        <footer className="border-t border-line px-4 py-4 md:hidden">
          <p className="text-sm text-muted">
            Signed in as <span className="font-semibold text-ink">{user.name}</span> ({ROLE_LABELS[user.role]})
          </p>
          <form action={signOutAction} className="mt-2">
            <button type="submit" className="tap flex items-center gap-2 rounded-xl px-3 font-semibold hover:bg-surface-2">
              <LogOut size={20} aria-hidden /> Sign out
            </button>
          </form>
        </footer>
      </div>
    </div>
  );
}
