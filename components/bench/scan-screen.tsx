"use client";

import { useRef, useState } from "react";
import { LoaderCircle, ScanLine } from "lucide-react";
import { BenchShell } from "./bench-shell";
import { LazyTagScanner, ManualTagEntry } from "./scanner";
import { formatTagCode } from "@/lib/trade/tag-code";

/**
 * Scan a tag: the camera scanner (loaded on this screen only) with typing as the fallback. For now it shows the
 * code and a "Looking up…" area; finding the ticket in the device store comes with the sync engine.
 */
export function ScanScreen() {
  const [code, setCode] = useState<string | null>(null);
  const [round, setRound] = useState(0);
  const manualRef = useRef<HTMLInputElement>(null);

  return (
    <BenchShell title="Scan tag">
      <div className="flex flex-col gap-6">
        {code ? (
          <section aria-label="Scanned tag" className="flex flex-col gap-4">
            <div className="rounded-2xl border-2 border-ok bg-ok-soft px-4 py-4">
              <p className="text-base font-semibold">Tag</p>
              <p className="font-mono text-5xl font-black tracking-widest" data-testid="tag-code">
                {formatTagCode(code)}
              </p>
            </div>
            <div role="status" aria-live="polite" className="flex items-center gap-3 rounded-2xl bg-surface-2 px-4 py-4 text-lg font-semibold" data-testid="ticket-lookup">
              <LoaderCircle aria-hidden size={26} className="animate-spin" />
              Looking up…
            </div>
            <button
              type="button"
              onClick={() => {
                setCode(null);
                setRound((n) => n + 1);
              }}
              className="tap-bench inline-flex items-center justify-center gap-2 rounded-2xl border-2 border-line bg-surface px-5 text-lg font-bold"
            >
              <ScanLine aria-hidden size={24} /> Scan another tag
            </button>
          </section>
        ) : (
          <>
            <LazyTagScanner key={round} onCode={setCode} onTypeInstead={() => manualRef.current?.focus()} />
            <ManualTagEntry onCode={setCode} inputRef={manualRef} />
          </>
        )}
      </div>
    </BenchShell>
  );
}
