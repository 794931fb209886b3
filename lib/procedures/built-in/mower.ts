/**
 * Four-stroke walk-behind mower: oil, fuel, air filter, blade and deck, the float carburetor, starting and spark,
 * the blade-control stop check, tune log and the final run. Our own words from general trade knowledge
 * (common practice, no single source) unless a step names its source.
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
  tuneLog,
} from "./common";

export const WALK_MOWER: Procedure = {
  id: "walk-mower-4t",
  version: 1,
  title: "Four-stroke walk-behind mower",
  summary: "Bench sheet for a four-stroke walk-behind mower: oil, fuel, blade, carburetor, controls and a test cut.",
  machineKinds: ["walk_mower"],
  engineTypes: ["four_stroke"],
  sections: [
    {
      id: "intake",
      title: "Condition at intake",
      steps: [intakeDamage([{ id: "deck-dented", label: "Deck dented" }]), intakePhoto],
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
      id: "blade-deck",
      title: "Blade and deck",
      steps: [
        {
          id: "blade",
          kind: "choice",
          mode: "multi",
          title: "Blade",
          help: "Plug lead off and tucked away, gloves on. Tip the mower with the air filter and carburetor up so fuel and oil stay put.",
          hazards: ["fueling", "blade-work"],
          options: [
            { id: "sharp", label: "Sharp and balanced", exclusive: true },
            { id: "dull", label: "Dull" },
            { id: "bent", label: "Bent" },
            { id: "cracked", label: "Cracked" },
            { id: "loose", label: "Blade bolt loose" },
            { id: "unbalanced", label: "Out of balance" },
          ],
        },
        {
          id: "deck",
          kind: "choice",
          mode: "multi",
          title: "Deck underside",
          options: [
            { id: "good", label: "Good", exclusive: true },
            { id: "clogged", label: "Packed with grass" },
            { id: "rusted", label: "Rusted through" },
            { id: "dented", label: "Dented" },
          ],
        },
      ],
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
      id: "controls",
      title: "Controls",
      steps: [
        {
          id: "blade-control-stop",
          kind: "pass-fail",
          title: "Blade stops within 3 seconds of letting go of the control",
          help:
            "Engine running on a hard, clear surface: let go of the control bar and time how long the engine or blade takes to stop. Never reach under the deck. (US mower standard 16 CFR 1205, from memory.)",
          hazards: ["test-run", "blade-work"],
          passLabel: "Stops in time",
          failLabel: "Too slow",
        },
        {
          id: "self-propel",
          kind: "pass-fail",
          title: "Self-propel drive engages and releases",
          help: "Engine running: the drive pulls when engaged and frees when let go.",
          hazards: ["test-run"],
          optional: true,
          passLabel: "Works",
          failLabel: "Faulty",
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
          { id: "blade", label: "Blade" },
          PART.bowlGasket,
          PART.fuelLine,
          PART.fuelFilter,
          PART.carburetor,
          PART.starterRope,
          { id: "drive-belt", label: "Drive belt" },
        ]),
      ],
    },
    {
      id: "tune",
      title: "Tune log",
      steps: [
        tuneLog(
          ["idle"],
          "Many mower carburetors have a fixed main jet: only the idle speed screw, if there is one. Adjust with the engine warm and running.",
        ),
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
          title: "Running at mowing speed",
          hazards: ["test-run"],
          options: [
            { id: "steady", label: "Runs steady" },
            { id: "surges", label: "Surges or hunts" },
            { id: "smokes", label: "Smokes" },
            { id: "dies", label: "Dies" },
          ],
        },
        {
          id: "final-cut",
          kind: "choice",
          mode: "single",
          title: "Test cut on grass",
          hazards: ["test-run"],
          options: [
            { id: "clean", label: "Clean, even cut" },
            { id: "uneven", label: "Uneven or torn" },
            { id: "bogs", label: "Bogs in thick grass" },
            { id: "vibrates", label: "Vibrates" },
          ],
        },
        finalNote,
        finalPhoto,
      ],
    },
  ],
};
