"use client";

import { useState } from "react";
import { ChoiceChips } from "@/components/bench/choice-chips";
import { Field } from "@/components/ui/field";
import { ETHANOL_BLENDS, ethanolVerdict, TWO_STROKE_OIL_CLASSES } from "@/lib/trade/premix";
import { BigResult, ToolError, typedNumber } from "./result";

export function EthanolGuide() {
  const [pick, setPick] = useState("E10");
  const [other, setOther] = useState("");
  const blend = ETHANOL_BLENDS.find((b) => b.label === pick);
  const percent = blend ? blend.percent : typedNumber(other);
  const verdict = ethanolVerdict(percent);
  return (
    <div className="flex flex-col gap-6">
      <ChoiceChips
        label="What does the pump say?"
        mode="single"
        options={[...ETHANOL_BLENDS.map((b) => ({ id: b.label, label: b.label })), { id: "other", label: "Other %" }]}
        value={[pick]}
        onChange={([p]) => setPick(p ?? "E10")}
      />
      {pick === "other" ? (
        <Field label="Ethanol (%)" name="ethanol" inputMode="decimal" autoComplete="off" value={other} onChange={(e) => setOther(e.target.value)} />
      ) : null}
      {verdict.ok ? (
        <BigResult
          label={blend ? blend.label : `${other} % ethanol`}
          value={verdict.value.allowed ? "OK for small engines" : "Do not use"}
          detail={
            <>
              <p className="font-semibold">{verdict.value.message}</p>
              {blend ? <p>{blend.note}</p> : null}
            </>
          }
        />
      ) : (
        <ToolError>{verdict.message}</ToolError>
      )}
      <section aria-labelledby="fuel-sources" className="rounded-2xl border border-line bg-surface p-4">
        <h3 id="fuel-sources" className="mb-2 text-lg font-bold">Where this comes from</h3>
        <ul className="flex list-disc flex-col gap-2 pl-5 text-base">
          {[...(verdict.ok ? verdict.value.sources : []), ...TWO_STROKE_OIL_CLASSES].map((s) => (
            <li key={s.text}>
              {s.text} <span className="text-ink-2">({s.source}{s.marker === "memory" ? ", from memory" : ""})</span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
