import { Lightbulb } from "lucide-react";
import type { Suggestion } from "@/lib/procedures/guide";

/** A guided-next-test suggestion, always labelled as one. */
export function SuggestionCard({ suggestion, onGo }: { suggestion: Suggestion; onGo?: (stepId: string) => void }) {
  return (
    <article className="rounded-2xl border-2 border-accent bg-accent-soft px-4 py-3" data-rule={suggestion.ruleId}>
      <p className="flex items-center gap-2 text-sm font-black uppercase tracking-wider">
        <Lightbulb aria-hidden size={18} strokeWidth={2.6} />
        {suggestion.label}
      </p>
      <p className="mt-1 text-lg font-bold leading-snug">Next: {suggestion.nextTest}</p>
      <p className="mt-1 text-base">
        <span className="font-semibold">Likely cause: </span>
        {suggestion.likelyCause}
      </p>
      <p className="mt-1 text-sm text-muted">{suggestion.basis}</p>
      {onGo && suggestion.nextStep ? (
        <button
          type="button"
          onClick={() => onGo(suggestion.nextStep as string)}
          className="tap-bench mt-3 rounded-2xl bg-accent px-5 text-lg font-bold text-accent-ink"
        >
          Go to {suggestion.nextStepTitle}
        </button>
      ) : null}
    </article>
  );
}
