/**
 * Safety cautions shown at every bench step where harm is possible.
 *
 * Each caution is written in our own words, carries a signal word from the open safety-sign standards
 * (ANSI Z535 / ISO 3864: DANGER, WARNING, CAUTION, NOTICE), the source it rests on, and a marker:
 * "read" (read in a published copy), "memory" (recalled; confirm before relying on it) or
 * "practice" (common practice, no single source). Every caution's text ends with the deferral line
 * `DEFER_TO_MANUAL`. Nothing here replaces the maker's manual, local codes or licensed practice.
 */
import type { SourceMarker } from "./sources";

export const SIGNAL_WORDS = ["DANGER", "WARNING", "CAUTION", "NOTICE"] as const;
export type SignalWord = (typeof SIGNAL_WORDS)[number];

/** What each signal word means (ANSI Z535.4 / ISO 3864-2; wording from memory, in our own words). */
export const SIGNAL_WORD_MEANINGS: Record<SignalWord, string> = {
  DANGER: "Will cause death or serious injury if not avoided.",
  WARNING: "Could cause death or serious injury if not avoided.",
  CAUTION: "Could cause minor or moderate injury if not avoided.",
  NOTICE: "Could damage the machine or property; not a personal-injury hazard.",
};

export const DEFER_TO_MANUAL = "Follow the maker's manual, local codes and licensed practice.";

export const HAZARDOUS_STEP_KINDS = [
  "fueling",
  "prime-start",
  "spark-test",
  "solvent-cleaning",
  "test-run",
  "chain-work",
  "compressed-air",
  "hot-muffler",
  "blade-work",
  "electrical-output",
] as const;
export type HazardousStepKind = (typeof HAZARDOUS_STEP_KINDS)[number];

export const HAZARDOUS_STEP_LABELS: Record<HazardousStepKind, string> = {
  fueling: "Fueling",
  "prime-start": "Prime and test start",
  "spark-test": "Spark test",
  "solvent-cleaning": "Solvent cleaning",
  "test-run": "Test run / cut test",
  "chain-work": "Chain and bar work",
  "compressed-air": "Compressed-air cleaning",
  "hot-muffler": "Hot muffler and cylinder",
  "blade-work": "Blade work",
  "electrical-output": "Live electrical output",
};

export function isHazardousStepKind(kind: string): kind is HazardousStepKind {
  return (HAZARDOUS_STEP_KINDS as readonly string[]).includes(kind);
}

export type Caution = {
  id: string;
  signalWord: SignalWord;
  title: string;
  /** Our own wording, ending with DEFER_TO_MANUAL. */
  text: string;
  /** Citation, e.g. "OSHA 29 CFR 1910.266(e)(2)(iv)". */
  source: string;
  marker: SourceMarker;
  /** Which part of the source is from memory, when only part is. */
  markerNote?: string;
  appliesTo: readonly HazardousStepKind[];
};

type Draft = Omit<Caution, "text"> & { body: string };
const define = ({ body, ...rest }: Draft): Caution => ({ ...rest, text: `${body.trim()} ${DEFER_TO_MANUAL}` });

export const CAUTIONS: readonly Caution[] = [
  // ---- Blades and live output ---------------------------------------------------------------------
  define({
    id: "blade-plug-lead-off",
    signalWord: "WARNING",
    title: "Plug lead off before touching a blade",
    body: "Pull the spark plug lead and keep it away from the plug (on electric machines, take out the battery or key) so the engine cannot fire when the blade is turned by hand. Wear cut-resistant gloves and block the blade before loosening its bolt.",
    source: "Common practice, no single source (walk-behind mower safety is covered by ANSI/OPEI B71.1 and 16 CFR 1205)",
    marker: "practice",
    markerNote: "The standard numbers are from memory.",
    appliesTo: ["blade-work"],
  }),
  define({
    id: "blade-tip-carburetor-up",
    signalWord: "CAUTION",
    title: "Tip the mower carburetor side up",
    body: "Tip a mower with the air filter and carburetor facing up, on a drained or nearly empty tank, so fuel and oil do not run into the air filter or onto the floor.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["blade-work"],
  }),
  define({
    id: "output-live-outlets",
    signalWord: "WARNING",
    title: "Live outlets while the generator runs",
    body: "Outlets and terminals are live whenever the engine runs. Keep hands, floor and meter dry; hold meter probes by their insulation; use a meter and leads rated for the voltage; plug loads in and out with the switch off.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["electrical-output"],
  }),
  define({
    id: "output-no-backfeed",
    signalWord: "DANGER",
    title: "Never backfeed a building's wiring",
    body: "Never connect a generator to a building's wiring except through a transfer switch installed to the electrical code: backfed power can kill line workers and neighbours.",
    source: "NFPA 70 (National Electrical Code), Article 702 optional standby systems",
    marker: "memory",
    appliesTo: ["electrical-output"],
  }),
  // ---- Fuel -------------------------------------------------------------------------------------
  define({
    id: "fuel-away-from-ignition",
    signalWord: "WARNING",
    title: "Fuel at least 10 ft (3 m) from flames and sparks",
    body: "Fill the tank at least 10 ft (3 m) away from any open flame, spark or other source of ignition. No smoking nearby.",
    source: "OSHA 29 CFR 1910.266(e)(2)(iv)",
    marker: "read",
    appliesTo: ["fueling"],
  }),
  define({
    id: "fuel-engine-stopped",
    signalWord: "WARNING",
    title: "Engine stopped and cool, spills wiped",
    body: "Stop the engine and let it cool before refueling. Wipe up spilled fuel and close the can before the machine is started.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["fueling"],
  }),
  define({
    id: "ethanol-e10-max",
    signalWord: "NOTICE",
    title: "No more than 10 % ethanol (E10)",
    body: "Use gasoline with at most 10 % ethanol. Never put E15, E20 or E85 in a small engine: blends above 10 % are not allowed in nonroad engines and equipment.",
    source: "40 CFR 80.1504(a)(1) (now 40 CFR part 1090); US DOE Alternative Fuels Data Center, E15; NC State Extension AG-763W",
    marker: "read",
    markerNote: "The move of the rule into 40 CFR part 1090 is from memory.",
    appliesTo: ["fueling"],
  }),
  // ---- Starting and running -----------------------------------------------------------------------
  define({
    id: "start-away-from-fueling",
    signalWord: "WARNING",
    title: "Start at least 10 ft (3 m) from where you fueled",
    body: "Move the machine at least 10 ft (3 m) from the fueling spot before starting it.",
    source: "OSHA 29 CFR 1910.266(e)(2)",
    marker: "read",
    markerNote: "The clause letter within (e)(2) is from memory.",
    appliesTo: ["prime-start", "test-run"],
  }),
  define({
    id: "start-supported-no-drop-start",
    signalWord: "WARNING",
    title: "Start on the ground, never drop-start",
    body: "Start a saw on the ground or firmly supported, held with a firm grip. Never drop-start it (pulling the cord while throwing the saw down).",
    source: "OSHA 29 CFR 1910.266(e)(2)",
    marker: "read",
    appliesTo: ["prime-start", "test-run"],
  }),
  define({
    id: "start-chain-brake-on",
    signalWord: "WARNING",
    title: "Chain brake on to start",
    body: "Engage the chain brake before starting a chain saw, and keep the chain clear of the ground, the bench and your body.",
    source: "OSHA 29 CFR 1910.266(e)(2)",
    marker: "memory",
    markerNote: "The clause requiring the brake at start-up is from memory.",
    appliesTo: ["prime-start", "test-run"],
  }),
  define({
    id: "exhaust-carbon-monoxide",
    signalWord: "DANGER",
    title: "Exhaust can kill: run engines outdoors",
    body: "Engine exhaust carries carbon monoxide, which you cannot see or smell. Run engines only outdoors or with the exhaust vented outside, never in a closed room.",
    source: "Common practice; carbon-monoxide warnings on portable generators",
    marker: "memory",
    appliesTo: ["prime-start", "test-run"],
  }),
  define({
    id: "ppe-running-saw",
    signalWord: "WARNING",
    title: "Leg, foot and eye protection when running a saw",
    body: "When running a saw wear leg protection from the upper thigh to the boot top, protective footwear, and eye or face protection.",
    source: "OSHA 29 CFR 1910.266(d)(1)(iv), (d)(1)(v), (d)(1)(vii)",
    marker: "read",
    appliesTo: ["test-run"],
  }),
  define({
    id: "ppe-hearing",
    signalWord: "CAUTION",
    title: "Hearing protection",
    body: "Wear hearing protection whenever an engine is running on test; a day of small-engine noise can harm hearing.",
    source: "OSHA 29 CFR 1910.95 (85 dBA 8-hour action level)",
    marker: "memory",
    appliesTo: ["prime-start", "test-run"],
  }),
  // ---- Chain and bar ------------------------------------------------------------------------------
  define({
    id: "kickback-devices",
    signalWord: "WARNING",
    title: "Keep the chain brake and kickback devices working",
    body: "Never remove or disable a chain brake or other kickback device. Saws placed in service after 9 February 1995 have a chain brake and meet ANSI B175.1.",
    source: "OSHA 29 CFR 1910.266(e)(2)(i); ANSI/OPEI B175.1-2012",
    marker: "read",
    appliesTo: ["chain-work", "test-run"],
  }),
  define({
    id: "chain-brake-test",
    signalWord: "CAUTION",
    title: "Test the chain brake",
    body: "Check that the chain brake stops the chain before each use, and after any work on the brake, clutch or sprocket.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["test-run", "chain-work"],
  }),
  define({
    id: "chain-engine-off",
    signalWord: "WARNING",
    title: "Engine off before touching the chain",
    body: "Stop the engine before touching the chain, bar or sprocket. Pull the spark plug boot when working on the clutch or sprocket so the engine cannot start.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["chain-work"],
  }),
  define({
    id: "chain-sharp-gloves",
    signalWord: "CAUTION",
    title: "Cutters are sharp: wear gloves",
    body: "Chain cutters cut skin even when too dull to cut wood. Wear cut-resistant gloves to handle, file or fit a chain, with the chain brake on.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["chain-work"],
  }),
  define({
    id: "chain-tension",
    signalWord: "CAUTION",
    title: "Chain tension",
    body: "Set the chain snug on the bar, yet free to pull around by hand (gloved). A loose chain can jump off the bar. Check it again after the test cut.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["chain-work"],
  }),
  // ---- Cleaners ------------------------------------------------------------------------------------
  define({
    id: "aerosol-flammable",
    signalWord: "WARNING",
    title: "Cleaner spray is extremely flammable",
    body: "Aerosol carburetor and brake cleaners are extremely flammable, and a heated can may burst. Keep them away from sparks, flames and hot surfaces; never spray a running or hot engine.",
    source: "Safety data sheets of aerosol cleaners: GHS H222, H229; P210",
    marker: "read",
    markerNote: "The hazard and precaution code numbers are from memory.",
    appliesTo: ["solvent-cleaning"],
  }),
  define({
    id: "aerosol-ventilation",
    signalWord: "WARNING",
    title: "Clean outdoors or with good ventilation",
    body: "Use cleaners outdoors or where air moves freely. The vapour can make you drowsy or dizzy; do not breathe the spray.",
    source: "Safety data sheets of aerosol cleaners: GHS H336; P271",
    marker: "read",
    markerNote: "The hazard and precaution code numbers are from memory.",
    appliesTo: ["solvent-cleaning"],
  }),
  define({
    id: "aerosol-eyes",
    signalWord: "CAUTION",
    title: "Eye and face protection with cleaners",
    body: "Wear eye and face protection: the spray irritates eyes. If cleaner is swallowed it can get into the lungs; do not make the person vomit, get medical help.",
    source: "Safety data sheets of aerosol cleaners: GHS H319, H304; P280",
    marker: "read",
    markerNote: "The hazard and precaution code numbers are from memory.",
    appliesTo: ["solvent-cleaning"],
  }),
  define({
    id: "chlorinated-cleaner-heat",
    signalWord: "WARNING",
    title: "Chlorinated cleaners and heat",
    body: "Chlorinated cleaners can give off phosgene, a toxic gas, when heated. Never use them on hot parts or near welding, flames or heaters.",
    source: "Safety-data-sheet guidance for chlorinated solvents",
    marker: "memory",
    appliesTo: ["solvent-cleaning"],
  }),
  // ---- Ignition ------------------------------------------------------------------------------------
  define({
    id: "spark-test-fire",
    signalWord: "WARNING",
    title: "Spark test away from fuel",
    body: "Test for spark with a gapped spark tester, or with the plug body held against bare metal of the cylinder. Keep the spark away from spilled fuel, fuel vapour and the open spark-plug hole, where fuel mist can catch fire.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["spark-test"],
  }),
  define({
    id: "spark-test-shock",
    signalWord: "CAUTION",
    title: "Ignition can shock",
    body: "Hold the plug lead by its insulated boot only; the ignition gives a sharp shock. Keep the lead grounded or on a tester while cranking.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["spark-test"],
  }),
  // ---- Compressed air and heat ---------------------------------------------------------------------
  define({
    id: "compressed-air-30-psi",
    signalWord: "WARNING",
    title: "Compressed air below 30 psi, with guarding and eye protection",
    body: "Air used for cleaning must be reduced to less than 30 psi, with chip guarding and eye protection. Never aim it at skin or at anyone.",
    source: "OSHA 29 CFR 1910.242(b)",
    marker: "read",
    appliesTo: ["compressed-air"],
  }),
  define({
    id: "hot-muffler",
    signalWord: "WARNING",
    title: "Hot muffler and cylinder",
    body: "The muffler and cylinder stay hot long after the engine stops. Let them cool before touching or refueling, and keep them clear of dry grass, sawdust, rags and fuel.",
    source: "Common practice, no single source",
    marker: "practice",
    appliesTo: ["hot-muffler", "test-run", "fueling"],
  }),
];

const RANK: Record<SignalWord, number> = { DANGER: 0, WARNING: 1, CAUTION: 2, NOTICE: 3 };

/** Cautions for a step kind, most severe first. Non-hazardous kinds get an empty list. */
export function cautionsFor(stepKind: string): Caution[] {
  if (!isHazardousStepKind(stepKind)) return [];
  return CAUTIONS.filter((c) => c.appliesTo.includes(stepKind)).sort(
    (a, b) => RANK[a.signalWord] - RANK[b.signalWord],
  );
}

export function cautionById(id: string): Caution | undefined {
  return CAUTIONS.find((c) => c.id === id);
}
