"use client";

import { useState } from "react";
import { ChoiceChips } from "@/components/bench/choice-chips";
import { PremixCalculator } from "./premix-calculator";
import { UnitConverter } from "./unit-converter";
import { TuneExplainer } from "./tune-explainer";
import { EthanolGuide } from "./ethanol-guide";

const TOOLS = [
  { id: "premix", label: "Premix" },
  { id: "units", label: "Units" },
  { id: "tune", label: "Tune screws" },
  { id: "fuel", label: "Ethanol" },
] as const;
type ToolId = (typeof TOOLS)[number]["id"];

/** The shop tools: pure calculations from lib/trade, so they work with no network at all. */
export function ShopTools() {
  const [tool, setTool] = useState<ToolId>("premix");
  return (
    <div className="flex flex-col gap-6">
      <ChoiceChips label="Tool" mode="single" options={TOOLS} value={[tool]} onChange={([t]) => setTool((t as ToolId) ?? "premix")} />
      <h2 className="text-2xl font-bold">{TOOLS.find((t) => t.id === tool)?.label}</h2>
      {tool === "premix" ? <PremixCalculator /> : null}
      {tool === "units" ? <UnitConverter /> : null}
      {tool === "tune" ? <TuneExplainer /> : null}
      {tool === "fuel" ? <EthanolGuide /> : null}
    </div>
  );
}
