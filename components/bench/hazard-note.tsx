import { TriangleAlert } from "lucide-react";
import { cautionsFor, DEFER_TO_MANUAL, type Caution, type HazardousStepKind, type SignalWord } from "@/lib/trade/cautions";

/**
 * Signal-word panels in the colours of ANSI Z535 (DANGER red with white text, WARNING orange with black,
 * CAUTION yellow with black, NOTICE blue with white). The safety alert symbol goes with the three personal-injury
 * words, not with NOTICE. These colours are used for hazard notes and nothing else.
 */
export const SIGNAL_STYLES: Record<SignalWord, { panel: string; hex: string; ink: string; alert: boolean }> = {
  DANGER: { panel: "bg-danger text-white", hex: "#c8102e", ink: "#ffffff", alert: true },
  WARNING: { panel: "bg-warning text-black", hex: "#f47920", ink: "#000000", alert: true },
  CAUTION: { panel: "bg-caution text-black", hex: "#ffd100", ink: "#000000", alert: true },
  NOTICE: { panel: "bg-notice text-white", hex: "#0054a6", ink: "#ffffff", alert: false },
};

export const CLOSING_LINE = DEFER_TO_MANUAL;

const RANK: Record<SignalWord, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };

/** The cautions for several hazard kinds, each once, most severe first. */
export function cautionsForKinds(kinds: readonly HazardousStepKind[]): Caution[] {
  const seen = new Map<string, Caution>();
  for (const k of kinds) for (const c of cautionsFor(k)) seen.set(c.id, c);
  return [...seen.values()].sort((a, b) => RANK[a.signalWord] - RANK[b.signalWord]);
}

const withoutClosing = (text: string) => (text.endsWith(DEFER_TO_MANUAL) ? text.slice(0, -DEFER_TO_MANUAL.length).trim() : text);

/**
 * The cautions at a hazardous step, from the registry (lib/trade/cautions), with their sources, closing with
 * "Follow the maker's manual, local codes and licensed practice."
 */
export function HazardNote({
  kinds,
  title = "Before you start this step",
  compact = false,
}: {
  kinds: readonly HazardousStepKind[];
  title?: string;
  /** Signal words and titles only, with the full text one tap away (for a step the tech repeats often). */
  compact?: boolean;
}) {
  const cautions = cautionsForKinds(kinds);
  if (cautions.length === 0) return null;
  return (
    <section aria-label="Safety cautions" className="overflow-hidden rounded-2xl border-2 border-ink bg-surface text-ink">
      <p className="border-b-2 border-ink px-4 py-2 text-base font-bold">{title}</p>
      {compact ? (
        <>
          <ul className="flex flex-col">
            {cautions.map((c) => (
              <li key={c.id} className="flex items-stretch border-b border-line" data-signal={c.signalWord}>
                <span className={`flex w-28 shrink-0 items-center gap-1 px-2 text-sm font-black ${SIGNAL_STYLES[c.signalWord].panel}`}>
                  {SIGNAL_STYLES[c.signalWord].alert ? <TriangleAlert aria-hidden size={16} strokeWidth={2.6} /> : null}
                  {c.signalWord}
                </span>
                <span className="px-3 py-2 text-base font-bold leading-snug">{c.title}</span>
              </li>
            ))}
          </ul>
          <details className="group">
            <summary className="tap-bench flex cursor-pointer items-center px-4 text-base font-bold underline">
              Read what each one means
            </summary>
            <FullList cautions={cautions} />
          </details>
        </>
      ) : (
        <FullList cautions={cautions} />
      )}
      <p className="border-t-2 border-ink bg-surface-2 px-4 py-3 text-base font-bold">{CLOSING_LINE}</p>
    </section>
  );
}

function FullList({ cautions }: { cautions: readonly Caution[] }) {
  return (
    <ul className="flex flex-col">
      {cautions.map((c) => {
        const style = SIGNAL_STYLES[c.signalWord];
        return (
          <li key={c.id} className="border-b border-line last:border-b-0" data-signal={c.signalWord}>
            <p className={`flex items-center gap-2 px-4 py-1.5 text-lg font-black tracking-wide ${style.panel}`}>
              {style.alert ? <TriangleAlert aria-hidden size={22} strokeWidth={2.6} /> : null}
              {c.signalWord}
            </p>
            <div className="px-4 py-3">
              <p className="text-lg font-bold leading-snug">{c.title}</p>
              <p className="mt-1 text-base">{withoutClosing(c.text)}</p>
              <p className="mt-1 text-sm text-muted">
                Source: {c.source}
                {c.markerNote ? ` (${c.markerNote.replace(/\.$/, "")})` : c.marker === "memory" ? " (from memory: confirm before relying on it)" : ""}
              </p>
            </div>
          </li>
        );
      })}
    </ul>
  );
}
