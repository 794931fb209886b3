"use client";

/** DEV-ONLY: renders the bench building blocks on one page (app/bench/kit). Drop with that page. */
import { useEffect, useMemo, useState } from "react";
import { BenchShell } from "../bench-shell";
import { ChoiceChips } from "../choice-chips";
import { PassFail } from "../pass-fail";
import { ReadingInput, type RecordedReading } from "../reading-input";
import { HazardNote } from "../hazard-note";
import { TuneButtons } from "../tune-buttons";
import { PhotoButton } from "../photo-button";
import { SuggestionCard } from "../suggestion-card";
import { useWakeLock } from "../use-wake-lock";
import { findStep, procedureFor, visibleSteps, type Results, type Step } from "@/lib/procedures";
import { suggest } from "@/lib/procedures/guide";
import { startTune, type TuneState } from "@/lib/trade/tune";
import type { PreparedPhoto } from "@/lib/bench/photo";

const SAW = procedureFor("chain_saw", "two_stroke");

function need(id: string): Step {
  const s = SAW && findStep(SAW, id);
  if (!s) throw new Error(`kit: no step ${id}`);
  return s;
}

const initialTune = (): TuneState => {
  const r = startTune({ low: { kind: "seated-then-out", eighths: 8 }, high: { kind: "seated-then-out", eighths: 8 } });
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

export function KitDemo() {
  const wake = useWakeLock(true);
  const [results, setResults] = useState<Results>({});
  const [brake, setBrake] = useState<boolean | null>(null);
  const [reading, setReading] = useState<RecordedReading | null>(null);
  const [tune, setTune] = useState<TuneState>(initialTune);
  const [photo, setPhoto] = useState<(PreparedPhoto & { url: string }) | null>(null);

  useEffect(() => () => (photo ? URL.revokeObjectURL(photo.url) : undefined), [photo]);

  const primed = need("primed-start");
  const spark = need("spark-test");
  const leak = need("leak-where");
  const gauge = need("compression-gauge");
  const visible = useMemo(() => (SAW ? visibleSteps(SAW, results).map((s) => s.id) : []), [results]);
  const suggestions = useMemo(() => (SAW ? suggest(SAW, results) : []), [results]);
  const selected = (id: string) => {
    const v = results[id];
    return v && v.kind === "choice" ? v.selected : [];
  };
  const setChoice = (id: string) => (next: string[]) => setResults((r) => ({ ...r, [id]: { kind: "choice", selected: next } }));

  return (
    <BenchShell title="Bench kit" status={<span className="text-sm font-semibold text-muted">dev only</span>}>
      <div className="flex flex-col gap-8">
        <p className="text-base" data-testid="wake-lock">
          Screen wake lock: {wake.supported ? (wake.active ? "on" : `not held${wake.error ? ` (${wake.error})` : ""}`) : "not available in this browser"}
        </p>

        {primed.kind === "choice" ? (
          <div className="flex flex-col gap-4">
            {primed.hazards ? <HazardNote kinds={primed.hazards} /> : null}
            <ChoiceChips label={primed.title} hint={primed.help} mode={primed.mode} options={primed.options} value={selected(primed.id)} onChange={setChoice(primed.id)} />
          </div>
        ) : null}

        {spark.kind === "choice" && visible.includes(spark.id) ? (
          <div className="flex flex-col gap-4">
            {spark.hazards ? <HazardNote kinds={spark.hazards} compact /> : null}
            <ChoiceChips label={spark.title} hint={spark.help} mode={spark.mode} options={spark.options} value={selected(spark.id)} onChange={setChoice(spark.id)} />
          </div>
        ) : null}

        {suggestions.length ? (
          <div className="flex flex-col gap-3" aria-label="Suggestions">
            {suggestions.map((s) => (
              <SuggestionCard key={s.ruleId} suggestion={s} />
            ))}
          </div>
        ) : null}

        {leak.kind === "choice" ? (
          <ChoiceChips label={leak.title} hint={leak.help} mode={leak.mode} options={leak.options} value={selected(leak.id)} onChange={setChoice(leak.id)} />
        ) : null}

        <PassFail label="Chain brake engages and releases" value={brake} onChange={setBrake} passLabel="Works" failLabel="Faulty" />

        {gauge.kind === "reading" ? (
          <div className="flex flex-col gap-2">
            <ReadingInput label={gauge.title} hint={gauge.help} spec={gauge.reading} onRecord={setReading} />
            {reading ? (
              <p data-testid="recorded-reading" className="font-semibold">
                Recorded: {reading.value} {reading.unit}
                {reading.check ? ` (${reading.check.verdict})` : ""}
              </p>
            ) : null}
          </div>
        ) : null}

        <div className="flex flex-col gap-2">
          <h2 className="text-lg font-bold">Tune log</h2>
          <TuneButtons screws={["low", "high", "idle"]} state={tune} onEntry={(_e, next) => setTune(next)} />
        </div>

        <div className="flex flex-col gap-3">
          <h2 className="text-lg font-bold">Photo</h2>
          <PhotoButton onPhoto={(p) => setPhoto({ ...p, url: URL.createObjectURL(p.blob) })} />
          {photo ? (
            <figure className="flex items-center gap-3" data-testid="photo-result" data-sha256={photo.sha256} data-url={photo.url}>
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img src={photo.url} alt="Photo just taken" className="h-24 w-24 rounded-xl object-cover" />
              <figcaption className="text-base">
                <span data-testid="photo-size">
                  {photo.width}×{photo.height}
                </span>{" "}
                {photo.mime}, {Math.round(photo.bytes / 1024)} KiB
                <br />
                <span className="font-mono text-sm">{photo.sha256.slice(0, 16)}…</span>
              </figcaption>
            </figure>
          ) : null}
        </div>
      </div>
    </BenchShell>
  );
}
