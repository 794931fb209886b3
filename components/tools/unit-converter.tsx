"use client";

import { useState } from "react";
import { ChoiceChips } from "@/components/bench/choice-chips";
import { Field } from "@/components/ui/field";
import {
  convert,
  formatDecimal,
  formatInchFraction,
  LENGTH_UNITS,
  parseInches,
  PRESSURE_UNITS,
  SPEED_UNITS,
  TEMPERATURE_UNITS,
  TORQUE_UNITS,
  UNIT_LABELS,
  VOLUME_UNITS,
  type Dimension,
  type Unit,
} from "@/lib/trade/units";
import { BigResult, ToolError, typedNumber } from "./result";

const UNITS: Record<Dimension, readonly Unit[]> = {
  length: LENGTH_UNITS,
  pressure: PRESSURE_UNITS,
  torque: TORQUE_UNITS,
  volume: VOLUME_UNITS,
  temperature: TEMPERATURE_UNITS,
  speed: SPEED_UNITS,
};
const DEFAULTS: Record<Dimension, [Unit, Unit]> = {
  length: ["in", "mm"],
  pressure: ["psi", "kPa"],
  torque: ["lbf-in", "N-m"],
  volume: ["fl-oz", "mL"],
  temperature: ["F", "C"],
  speed: ["rpm", "rps"],
};
const DIMENSIONS: Array<{ id: Dimension; label: string }> = [
  { id: "length", label: "Length" },
  { id: "pressure", label: "Pressure" },
  { id: "torque", label: "Torque" },
  { id: "volume", label: "Volume" },
  { id: "temperature", label: "Temperature" },
  { id: "speed", label: "Speed" },
];

export function UnitConverter() {
  const [dimension, setDimension] = useState<Dimension>("length");
  const [[from, to], setUnits] = useState<[Unit, Unit]>(DEFAULTS.length);
  const [text, setText] = useState("3/16");

  const options = UNITS[dimension].map((u) => ({ id: u, label: UNIT_LABELS[u] }));
  const value = from === "in" ? parseInches(text) : Number.isNaN(typedNumber(text)) ? null : { ok: true as const, value: typedNumber(text) };
  const result = value && value.ok ? convert(value.value, from, to) : null;

  return (
    <div className="flex flex-col gap-6">
      <ChoiceChips
        label="Quantity"
        mode="single"
        options={DIMENSIONS}
        value={[dimension]}
        onChange={([d]) => {
          const next = (d as Dimension) ?? "length";
          setDimension(next);
          setUnits(DEFAULTS[next]);
        }}
      />
      <Field
        label={`Value in ${UNIT_LABELS[from]}`}
        name="value"
        inputMode={from === "in" ? "text" : "decimal"}
        autoComplete="off"
        value={text}
        onChange={(e) => setText(e.target.value)}
        hint={from === "in" ? "Fractions work: 3/16, 1 1/4, 0.25" : undefined}
      />
      <ChoiceChips label="From" mode="single" options={options} value={[from]} onChange={([u]) => setUnits([(u as Unit) ?? from, to])} />
      <ChoiceChips label="To" mode="single" options={options} value={[to]} onChange={([u]) => setUnits([from, (u as Unit) ?? to])} />
      {result?.ok ? (
        <BigResult
          label={`${text.trim()} ${UNIT_LABELS[from]} is`}
          value={to === "in" ? `${formatDecimal(result.value, 4)} in` : `${formatDecimal(result.value, 4)} ${UNIT_LABELS[to]}`}
          detail={to === "in" ? <p>Nearest fraction: {formatInchFraction(result.value)}</p> : undefined}
        />
      ) : (
        <ToolError>
          {value && !value.ok ? value.message : result && !result.ok ? result.message : "Enter a number to convert."}
        </ToolError>
      )}
    </div>
  );
}
