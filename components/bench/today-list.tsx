"use client";

import { useId, useState } from "react";
import Link from "next/link";
import { ScanLine, Search, X } from "lucide-react";
import type { TicketCard } from "@/lib/sync/read";
import { filterToday, groupToday, localIsoDate } from "@/lib/bench/today";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";
import { useNow, useWatched } from "@/components/sync/use-sync";
import { TodayCard } from "./today-card";

/**
 * The tech's list for today, read from the device store only (so it works with no network): a search on top,
 * "Assigned to you" first, then every other open ticket, and the scan action below the list (thumb reach).
 */
export function TodayList({ fetching }: { fetching: boolean }) {
  // Sent by the device host after every change on the phone (lib/sync/watched.ts: "synced yet" read first).
  const data = useWatched("today");
  const cards = data?.cards;
  const synced = data?.synced ?? false;
  const [query, setQuery] = useState("");
  const today = localIsoDate(new Date(useNow(60_000)));
  const searchId = useId();

  if (cards === undefined) return <p className="text-lg text-muted">Loading today&apos;s work…</p>;

  if (cards.length === 0 && fetching && !synced) {
    // A phone's first sync: say so quietly rather than "no tickets" for the second before they arrive.
    return (
      <p className="text-lg text-muted" role="status">
        Fetching today&apos;s work from the shop…
      </p>
    );
  }

  if (cards.length === 0) {
    return (
      <div className="flex flex-col gap-4">
        {synced ? (
          <Notice tone="info" title="No open tickets right now">
            New tickets from the counter appear here after the next sync.
          </Notice>
        ) : (
          <Notice tone="info" title="No tickets on this phone yet">
            Tickets appear here after the first sync.{" "}
            <Link href="/bench/sync" prefetch={false} className="font-bold underline">
              Open Sync
            </Link>
          </Notice>
        )}
        <ScanButton />
      </div>
    );
  }

  const shown = filterToday(cards, query);
  const { mine, others } = groupToday(shown);

  return (
    <div className="flex flex-col gap-5">
      <div role="search" className="flex flex-col gap-1">
        <label htmlFor={searchId} className="text-lg font-bold">
          Search today&apos;s work
        </label>
        <div className="relative">
          <Search aria-hidden size={24} className="pointer-events-none absolute left-4 top-1/2 -translate-y-1/2 text-muted" />
          <input
            id={searchId}
            type="search"
            value={query}
            onChange={(e) => setQuery(e.target.value)}
            placeholder="Number, tag, make, name…"
            autoComplete="off"
            autoCorrect="off"
            spellCheck={false}
            enterKeyHint="search"
            className="tap-bench w-full rounded-2xl border-2 border-line bg-surface pl-13 pr-4 text-xl text-ink placeholder:text-muted focus:border-accent"
          />
        </div>
        {query.trim() ? (
          <p className="text-base text-ink-2" aria-live="polite">
            {shown.length} of {cards.length} tickets match
          </p>
        ) : null}
      </div>

      {shown.length === 0 ? (
        <div className="flex flex-col gap-3">
          <Notice tone="info" title="Nothing matches the search">
            No ticket on this phone matches “{query.trim()}”. Search by ticket number, tag code, make, model, customer or complaint.
          </Notice>
          <button type="button" onClick={() => setQuery("")} className={buttonClass("secondary", "bench")}>
            <X aria-hidden size={24} /> Clear search
          </button>
        </div>
      ) : (
        <>
          <Group title="Assigned to you" cards={mine} today={today} empty={query.trim() ? null : "Nothing assigned to you right now."} />
          <Group title="Open tickets" cards={others} today={today} empty={null} />
        </>
      )}
      <ScanButton />
    </div>
  );
}

function Group({ title, cards, today, empty }: { title: string; cards: TicketCard[]; today: string; empty: string | null }) {
  const headingId = useId();
  if (cards.length === 0 && !empty) return null;
  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-3">
      <h2 id={headingId} className="text-xl font-bold">
        {title} <span className="font-semibold text-ink-2">({cards.length})</span>
      </h2>
      {cards.length === 0 ? (
        <p className="text-lg text-ink-2">{empty}</p>
      ) : (
        <ul className="flex flex-col gap-3">
          {cards.map((c) => (
            <li key={c.ticket.id}>
              <TodayCard card={c} today={today} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

function ScanButton() {
  return (
    <Link href="/bench/scan" prefetch={false} className={buttonClass("primary", "bench", "w-full rounded-2xl text-xl font-bold")}>
      <ScanLine aria-hidden size={28} /> Scan tag
    </Link>
  );
}
