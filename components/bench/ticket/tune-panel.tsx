"use client";

import { AlertText } from "@/components/ui/alert-text";
import { useState } from "react";
import { Undo2 } from "lucide-react";
import { TuneButtons } from "../tune-buttons";
import { describePosition, formatTurnCount, formatTurns, SCREW_LABELS, SCREW_SHORT, type Screw } from "@/lib/trade/tune";
import { tuneScrews, type TuneLog } from "@/lib/bench/sheet";
import type { useRecord } from "./use-record";

type Save = ReturnType<typeof useRecord>["save"];

/** Baselines a tech picks with one tap: seated, then out this many eighths. */
const SEATED_OUT = [4, 6, 8, 10, 12, 16] as const;

const cap = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

/**
 * The tune log on the sheet: each screw's baseline first (seated then out N turns, or as found), then big ⅛ ¼ ½
 * buttons in and out with the running net position and what the change means (lib/trade/tune). A turn taken by
 * mistake is undone by the opposite turn, recorded as its own entry, so the log shows both.
 */
export function TunePanel({
  screws,
  ticketId,
  log,
  save,
  disabled,
  waiting,
}: {
  screws: readonly Screw[];
  ticketId: string;
  log: TuneLog;
  save: Save;
  disabled: boolean;
  waiting: number;
}) {
  const [error, setError] = useState<string | null>(null);
  const ordered = tuneScrews(screws);
  const ready = ordered.filter((s) => log.baselined.has(s));
  const needBaseline = ordered.filter((s) => !log.baselined.has(s));
  const lastTurn = log.turns.at(-1);

  const baseline = async (screw: Screw, eighths: number | null) => {
    const r = await save("tune.recorded", {
      ticketId,
      screw,
      kind: "baseline",
      eighths: eighths ?? 0,
      baselineKind: eighths === null ? "as-found" : "seated-then-out",
    });
    setError(r.ok ? null : r.message);
  };

  return (
    <div className="flex flex-col gap-4">
      {needBaseline.map((screw) => (
        <fieldset key={screw} className="rounded-2xl border-2 border-dashed border-line p-4">
          <legend className="px-1 text-lg font-bold">
            <span className="mr-2 rounded-lg bg-ink px-2 py-0.5 text-bg">{SCREW_SHORT[screw]}</span>
            {cap(SCREW_LABELS[screw])}: where does it start?
          </legend>
          {screw === "idle" ? (
            <p className="mb-3 text-base text-ink-2">The idle screw sets the throttle stop: turns are counted from where it was found.</p>
          ) : (
            <p className="mb-3 text-base text-ink-2">Turn it in gently until it just seats (never force it), then out to a start point — or log it as found.</p>
          )}
          <div className="flex flex-wrap gap-3">
            {screw !== "idle"
              ? SEATED_OUT.map((e) => (
                  <button
                    key={e}
                    type="button"
                    disabled={disabled}
                    onClick={() => void baseline(screw, e)}
                    aria-label={`${SCREW_SHORT[screw]} screw: seated, then ${formatTurns(e)}`}
                    className="tap-bench rounded-2xl border-2 border-line bg-surface-2 px-4 text-lg font-bold active:border-accent disabled:opacity-50"
                  >
                    {formatTurnCount(e)}
                  </button>
                ))
              : null}
            <button
              type="button"
              disabled={disabled}
              onClick={() => void baseline(screw, null)}
              aria-label={`${SCREW_SHORT[screw]} screw: as found`}
              className="tap-bench rounded-2xl border-2 border-line bg-surface px-4 text-lg font-bold active:border-accent disabled:opacity-50"
            >
              As found
            </button>
          </div>
        </fieldset>
      ))}
      {ready.length ? (
        <TuneButtons
          screws={ready}
          state={log.state}
          disabled={disabled}
          onEntry={(entry) => {
            void save("tune.recorded", { ticketId, screw: entry.screw, kind: "turn", direction: entry.direction, eighths: entry.eighths }).then((r) =>
              setError(r.ok ? null : r.message),
            );
          }}
        />
      ) : null}
      <AlertText message={error} boxed />
      {log.problem ? (
        <p role="status" className="rounded-xl border-l-8 border-warning bg-surface-2 px-3 py-2 font-semibold">
          The log from more than one phone does not add up: {log.problem}
        </p>
      ) : null}
      {ready.length ? (
        <section aria-label="Tune log" className="rounded-2xl bg-surface-2 p-3">
          <h4 className="text-base font-bold">Tune log</h4>
          <ul className="mt-1 flex flex-col gap-1 text-base" data-testid="tune-positions">
            {ready.map((s) => (
              <li key={s}>
                <span className="font-bold">{SCREW_SHORT[s]}:</span> {describePosition(log.state[s])}
              </li>
            ))}
          </ul>
          <p className="mt-1 text-sm text-ink-2">
            {log.turns.length} turn{log.turns.length === 1 ? "" : "s"} logged{waiting ? ` · ${waiting} not sent yet` : ""}
          </p>
          {lastTurn && lastTurn.direction ? (
            <button
              type="button"
              disabled={disabled}
              onClick={() =>
                void save("tune.recorded", {
                  ticketId,
                  screw: lastTurn.screw,
                  kind: "turn",
                  direction: lastTurn.direction === "cw" ? "ccw" : "cw",
                  eighths: lastTurn.eighths,
                }).then((r) => setError(r.ok ? null : r.message))
              }
              className="tap-bench mt-2 inline-flex items-center gap-2 rounded-2xl border-2 border-line bg-surface px-4 text-base font-bold disabled:opacity-50"
            >
              <Undo2 aria-hidden size={20} /> Turn back the last one ({SCREW_SHORT[lastTurn.screw]} {formatTurnCount(lastTurn.eighths)}{" "}
              {lastTurn.direction === "cw" ? "out" : "in"})
            </button>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}
