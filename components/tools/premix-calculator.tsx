"use client";

import { useState } from "react";
import { ChoiceChips } from "@/components/bench/choice-chips";
import { HazardNote } from "@/components/bench/hazard-note";
import { Field } from "@/components/ui/field";
import { COMMON_RATIOS, oilForGasoline, ratioOfMix, type PremixUnit } from "@/lib/trade/premix";
import { formatDecimal, UNIT_LABELS } from "@/lib/trade/units";
import { BigResult, ToolError, typedNumber } from "./result";

const GAS_UNITS = [
  { id: "gal", label: "US gal" },
  { id: "L", label: "Litres" },
];
const OIL_UNITS = [
  { id: "fl-oz", label: "US fl oz" },
  { id: "mL", label: "mL" },
];
const RATIOS = [...COMMON_RATIOS.map((r) => ({ id: String(r), label: `${r}:1` })), { id: "other", label: "Other" }];

/** How much two-stroke oil for this much gasoline; or what ratio a mix is. "R:1" = oil is gasoline ÷ R. */
export function PremixCalculator() {
  const [mode, setMode] = useState<"oil" | "ratio">("oil");
  const [gas, setGas] = useState("1");
  const [gasUnit, setGasUnit] = useState<PremixUnit>("gal");
  const [ratioPick, setRatioPick] = useState("50");
  const [ratioOther, setRatioOther] = useState("");
  const [oilUnit, setOilUnit] = useState<PremixUnit>("fl-oz");
  const [oil, setOil] = useState("");

  const ratio = ratioPick === "other" ? typedNumber(ratioOther) : Number(ratioPick);
  const oilAnswer = oilForGasoline({ value: typedNumber(gas), unit: gasUnit }, ratio, oilUnit);
  const ratioAnswer = ratioOfMix({ value: typedNumber(oil), unit: oilUnit }, { value: typedNumber(gas), unit: gasUnit });

  return (
    <div className="flex flex-col gap-6">
      <ChoiceChips
        label="What do you want to know?"
        mode="single"
        options={[
          { id: "oil", label: "How much oil?" },
          { id: "ratio", label: "What ratio is my mix?" },
        ]}
        value={[mode]}
        onChange={([m]) => setMode(m === "ratio" ? "ratio" : "oil")}
      />
      <Field label="Gasoline" name="gasoline" inputMode="decimal" autoComplete="off" value={gas} onChange={(e) => setGas(e.target.value)} />
      <ChoiceChips label="Gasoline measured in" mode="single" options={GAS_UNITS} value={[gasUnit]} onChange={([u]) => setGasUnit((u as PremixUnit) ?? "gal")} />
      {mode === "oil" ? (
        <>
          <ChoiceChips label="Ratio on the engine or oil" mode="single" options={RATIOS} value={[ratioPick]} onChange={([r]) => setRatioPick(r ?? "50")} />
          {ratioPick === "other" ? (
            <Field label="Ratio (the R in R:1)" name="ratio" inputMode="decimal" autoComplete="off" value={ratioOther} onChange={(e) => setRatioOther(e.target.value)} />
          ) : null}
          <ChoiceChips label="Answer oil in" mode="single" options={OIL_UNITS} value={[oilUnit]} onChange={([u]) => setOilUnit((u as PremixUnit) ?? "fl-oz")} />
          {oilAnswer.ok ? (
            <BigResult
              label={`Oil for ${gas} ${UNIT_LABELS[gasUnit]} at ${formatDecimal(ratio, 2)}:1`}
              value={oilAnswer.value.display}
              detail={
                <>
                  <p>
                    Exact: {formatDecimal(oilAnswer.value.oil.value, 4)} {UNIT_LABELS[oilUnit]} — oil is{" "}
                    {formatDecimal(oilAnswer.value.percentOfGasoline, 3)} % of the gasoline.
                  </p>
                  {oilAnswer.value.warnings.map((w) => (
                    <p key={w} className="font-semibold">{w}</p>
                  ))}
                </>
              }
            />
          ) : (
            <ToolError>{oilAnswer.message}</ToolError>
          )}
        </>
      ) : (
        <>
          <Field label="Oil in the mix" name="oil" inputMode="decimal" autoComplete="off" value={oil} onChange={(e) => setOil(e.target.value)} />
          <ChoiceChips label="Oil measured in" mode="single" options={OIL_UNITS} value={[oilUnit]} onChange={([u]) => setOilUnit((u as PremixUnit) ?? "fl-oz")} />
          {ratioAnswer.ok ? (
            <BigResult
              label="This mix is"
              value={ratioAnswer.value.display}
              detail={ratioAnswer.value.warnings.map((w) => (
                <p key={w} className="font-semibold">{w}</p>
              ))}
            />
          ) : (
            <ToolError>{oil.trim() === "" ? "Enter how much oil is in the mix." : ratioAnswer.message}</ToolError>
          )}
        </>
      )}
      <p className="text-base text-ink-2">
        Use the ratio in the maker&apos;s manual. Air-cooled two-stroke oil only (JASO FB/FC/FD or ISO-L-EGB/EGC/EGD), never
        outboard oil. Gasoline with at most 10 % ethanol.
      </p>
      <HazardNote kinds={["fueling"]} compact title="When you mix and pour fuel" />
    </div>
  );
}
