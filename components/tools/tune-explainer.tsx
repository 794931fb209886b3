"use client";

import { useState } from "react";
import { ChoiceChips } from "@/components/bench/choice-chips";
import { HazardNote } from "@/components/bench/hazard-note";
import { applyTuneEntry, describeEntry, describePosition, SCREW_LABELS, startTune, type Direction, type Screw } from "@/lib/trade/tune";
import { BigResult, ToolError } from "./result";

const AMOUNTS = [
  { id: "1", label: "⅛ turn" },
  { id: "2", label: "¼ turn" },
  { id: "4", label: "½ turn" },
  { id: "8", label: "1 turn" },
];
const BASELINES = [
  { id: "as-found", label: "As found" },
  { id: "0", label: "Seated" },
  { id: "8", label: "Seated, out 1" },
  { id: "10", label: "Seated, out 1 ¼" },
  { id: "12", label: "Seated, out 1 ½" },
];

/** What turning a carburetor screw means, and where it leaves the screw. */
export function TuneExplainer() {
  const [screw, setScrew] = useState<Screw>("low");
  const [direction, setDirection] = useState<Direction>("ccw");
  const [eighths, setEighths] = useState(2);
  const [baseline, setBaseline] = useState("10");

  const entry = { screw, direction, eighths };
  const meaning = describeEntry(entry);
  const usableBaseline = screw === "idle" ? "as-found" : baseline;
  const start = startTune({
    [screw]: usableBaseline === "as-found" ? { kind: "as-found" } : { kind: "seated-then-out", eighths: Number(usableBaseline) },
  });
  const after = start.ok ? applyTuneEntry(start.value, entry) : start;

  return (
    <div className="flex flex-col gap-6">
      <ChoiceChips
        label="Screw"
        mode="single"
        options={(["low", "high", "idle"] as const).map((s) => ({ id: s, label: SCREW_LABELS[s][0]!.toUpperCase() + SCREW_LABELS[s].slice(1) }))}
        value={[screw]}
        onChange={([s]) => setScrew((s as Screw) ?? "low")}
      />
      <ChoiceChips
        label="Turn it"
        mode="single"
        options={[
          { id: "cw", label: "In (clockwise)" },
          { id: "ccw", label: "Out (counter-clockwise)" },
        ]}
        value={[direction]}
        onChange={([d]) => setDirection((d as Direction) ?? "ccw")}
      />
      <ChoiceChips label="By" mode="single" options={AMOUNTS} value={[String(eighths)]} onChange={([a]) => setEighths(Number(a ?? 2))} />
      {screw === "idle" ? null : (
        <ChoiceChips label="Starting from" mode="single" options={BASELINES} value={[baseline]} onChange={([b]) => setBaseline(b ?? "as-found")} />
      )}
      <BigResult
        label={meaning.summary}
        value={meaning.meaning}
        detail={
          <>
            {meaning.warning ? <p className="font-bold text-bad">{meaning.warning}</p> : null}
            {after.ok ? <p>Afterwards: {describePosition(after.value[screw])}.</p> : null}
            <p className="text-sm">{meaning.basis}</p>
          </>
        }
      />
      {after.ok ? null : <ToolError>{after.message}</ToolError>}
      <HazardNote kinds={["test-run", "hot-muffler"]} compact title="Tuning means running the engine" />
    </div>
  );
}
