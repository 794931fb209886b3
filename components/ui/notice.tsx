import type { ReactNode } from "react";

type Tone = "info" | "ok" | "bad";
const tones: Record<Tone, string> = {
  info: "bg-accent-soft text-ink border-accent",
  ok: "bg-ok-soft text-ink border-ok",
  bad: "bg-bad-soft text-ink border-bad",
};

/** A plain message box (not a hazard note; those use components/ui/hazard-note). */
export function Notice({ tone = "info", title, children }: { tone?: Tone; title?: ReactNode; children?: ReactNode }) {
  return (
    <div role={tone === "bad" ? "alert" : "status"} className={`rounded-xl border-l-8 px-4 py-3 ${tones[tone]}`}>
      {title ? <p className="font-bold">{title}</p> : null}
      {children ? <div className="text-base">{children}</div> : null}
    </div>
  );
}
