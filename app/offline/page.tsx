import type { Metadata } from "next";
import { Check, CloudOff, Hourglass, Wrench } from "lucide-react";
import { buttonClass } from "@/components/ui/button";
import { RetryButton } from "@/components/pwa/retry-button";

export const metadata: Metadata = { title: "No network" };

/** Precached; the service worker shows it in place of a counter or owner page when there is no network. */
export const dynamic = "force-static";

const WORKS = [
  "The bench: today's work and the bench sheets of tickets already on this phone",
  "Scanning a machine's tag",
  "The shop tools: premix, units and the tune log",
  "Recording results, findings, photos and notes — they wait in the outbox and go to the shop at the next sync",
];

const WAITS = [
  "The queue and job details at the counter",
  "Taking a machine in and printing its tag",
  "Estimates, the customer's OK, invoices and payments",
  "People, shop settings and reports",
  "Signing in on this phone for the first time",
];

export default function OfflinePage() {
  return (
    <main className="mx-auto flex min-h-dvh max-w-2xl flex-col gap-6 px-5 py-10">
      <div className="flex items-center gap-3">
        <span className="grid size-14 shrink-0 place-items-center rounded-2xl bg-accent text-accent-ink" aria-hidden>
          <CloudOff size={30} strokeWidth={2.4} />
        </span>
        <h1 className="text-3xl font-bold tracking-tight">No network right now</h1>
      </div>
      <p className="text-lg text-ink-2">
        This screen needs the shop&apos;s server, and this device cannot reach it. Nothing you saved on this phone is
        lost.
      </p>

      <section aria-labelledby="works" className="rounded-2xl border border-line bg-surface p-5">
        <h2 id="works" className="mb-3 text-xl font-bold">
          Works with no network
        </h2>
        <ul className="flex flex-col gap-3">
          {WORKS.map((line) => (
            <li key={line} className="flex gap-3 text-lg">
              <Check size={24} aria-hidden className="mt-0.5 shrink-0 text-ok" strokeWidth={3} />
              {line}
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="waits" className="rounded-2xl border border-line bg-surface p-5">
        <h2 id="waits" className="mb-3 text-xl font-bold">
          Waits for the network
        </h2>
        <ul className="flex flex-col gap-3">
          {WAITS.map((line) => (
            <li key={line} className="flex gap-3 text-lg">
              <Hourglass size={24} aria-hidden className="mt-0.5 shrink-0 text-muted" />
              {line}
            </li>
          ))}
        </ul>
      </section>

      <div className="flex flex-col gap-3 sm:flex-row">
        {/* A full page load, so the service worker answers with the bench it keeps. */}
        <a href="/bench" className={buttonClass("primary", "bench", "sm:flex-1")}>
          <Wrench size={22} aria-hidden /> Open the bench
        </a>
        <RetryButton />
      </div>
    </main>
  );
}
