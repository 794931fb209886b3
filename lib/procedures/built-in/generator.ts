/**
 * Portable generator (four-stroke engine): oil, fuel, air filter, float carburetor, starting and spark, then the
 * output at no load and under load (volts and hertz), outlets, and a final run. Our own words from general trade
 * knowledge (common practice, no single source); the 120 V band is ANSI C84.1 Range A (from memory) and the
 * 60 Hz window nominal ± 5 % (common practice), both soft unless the owner sets the band.
 */
import type { Procedure } from "../model";
import {
  airFilter,
  carbClean,
  finalNote,
  finalPhoto,
  finalStarts,
  floatCarb,
  fuelCondition,
  fuelLevel,
  fuelLine,
  intakeDamage,
  intakePhoto,
  oilCondition,
  oilLevel,
  PART,
  partsUsed,
  plugCondition,
  plugGapFourStroke,
  primedStart,
  pullOverFeel,
  sparkTest,
} from "./common";

const PROBES = "Meter on AC volts at a 120 V outlet; hold the probes by their insulation only.";

export const GENERATOR: Procedure = {
  id: "generator-4t",
  version: 1,
  title: "Portable generator",
  summary: "Bench sheet for a portable generator: engine checks, then output volts and hertz at no load and under load.",
  machineKinds: ["generator"],
  engineTypes: ["four_stroke"],
  sections: [
    {
      id: "intake",
      title: "Condition at intake",
      steps: [intakeDamage([{ id: "outlet-damaged", label: "Outlet or panel damaged" }]), intakePhoto],
    },
    {
      id: "oil",
      title: "Engine oil",
      steps: [oilLevel, oilCondition],
    },
    {
      id: "fuel",
      title: "Fuel",
      steps: [fuelLevel, fuelCondition(false), fuelLine],
    },
    {
      id: "air",
      title: "Air filter",
      steps: [airFilter],
    },
    {
      id: "carburetor",
      title: "Carburetor",
      steps: [...floatCarb, carbClean],
    },
    {
      id: "starting",
      title: "Compression, starting and spark",
      steps: [pullOverFeel, primedStart, sparkTest, plugCondition, plugGapFourStroke],
    },
    {
      id: "output",
      title: "Output",
      steps: [
        {
          id: "noload-volts",
          kind: "reading",
          title: "Volts with no load",
          help: `Engine warm and running, nothing plugged in. ${PROBES}`,
          hazards: ["test-run", "electrical-output"],
          reading: { quantity: "volts", units: ["V"], nominal: 120 },
        },
        {
          id: "noload-hertz",
          kind: "reading",
          title: "Frequency with no load",
          help: "Same outlet, meter on Hz.",
          hazards: ["test-run", "electrical-output"],
          reading: { quantity: "hertz", units: ["Hz"], nominal: 60 },
        },
        {
          id: "load-volts",
          kind: "reading",
          title: "Volts under load",
          help: `A known load of about half the rating plugged in (a heater or lamp bank). ${PROBES}`,
          hazards: ["test-run", "electrical-output"],
          reading: { quantity: "volts", units: ["V"], nominal: 120 },
        },
        {
          id: "load-hertz",
          kind: "reading",
          title: "Frequency under load",
          help: "Same load, meter on Hz.",
          hazards: ["test-run", "electrical-output"],
          reading: { quantity: "hertz", units: ["Hz"], nominal: 60 },
        },
        {
          id: "outlets",
          kind: "pass-fail",
          title: "Outlets and breakers; GFCI trips and resets",
          help: "Engine running: press the GFCI test button (power cuts off) and reset it; each outlet powers a test lamp.",
          hazards: ["test-run", "electrical-output"],
          passLabel: "All work",
          failLabel: "Fault",
        },
      ],
    },
    {
      id: "parts",
      title: "Parts",
      steps: [
        partsUsed([
          PART.sparkPlug,
          PART.airFilter,
          PART.engineOil,
          PART.bowlGasket,
          PART.fuelLine,
          PART.fuelFilter,
          PART.carburetor,
          PART.starterRope,
          { id: "voltage-regulator", label: "Voltage regulator (AVR)" },
          { id: "brushes", label: "Brush set" },
          { id: "capacitor", label: "Capacitor" },
        ]),
      ],
    },
    {
      id: "final",
      title: "Final run",
      steps: [
        finalStarts,
        {
          id: "final-runs",
          kind: "choice",
          mode: "single",
          title: "Running under load",
          hazards: ["test-run"],
          options: [
            { id: "steady", label: "Runs steady" },
            { id: "surges", label: "Surges or hunts" },
            { id: "smokes", label: "Smokes" },
            { id: "dies", label: "Dies" },
          ],
        },
        finalNote,
        finalPhoto,
      ],
    },
  ],
};
