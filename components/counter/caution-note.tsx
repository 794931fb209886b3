import { TriangleAlert } from "lucide-react";
import type { Caution } from "@/lib/trade/cautions";

const BANDS = {
  DANGER: "bg-danger text-white",
  WARNING: "bg-warning text-black",
  CAUTION: "bg-caution text-black",
  NOTICE: "bg-notice text-white",
} as const;

/** A hazard note: the signal word on its standard colour (ANSI Z535 / ISO 3864), then our own words and the source. */
export function CautionNote({ caution }: { caution: Caution }) {
  return (
    <aside aria-label={`${caution.signalWord}: ${caution.title}`} className="overflow-hidden rounded-xl border-2 border-ink">
      <p className={`flex items-center gap-2 px-3 py-1 text-lg font-black tracking-wider ${BANDS[caution.signalWord]}`}>
        <TriangleAlert size={22} aria-hidden strokeWidth={2.5} />
        {caution.signalWord}
      </p>
      <div className="bg-surface px-3 py-2">
        <p className="font-bold">{caution.title}</p>
        <p>{caution.text}</p>
        <p className="mt-1 text-sm text-muted">Source: {caution.source}</p>
      </div>
    </aside>
  );
}
