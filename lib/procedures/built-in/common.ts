/**
 * Steps shared by the built-in procedures. The same check has the same id in every procedure, so the guide's
 * rules (lib/procedures/guide.ts) apply wherever the step appears.
 *
 * Written in our own words from general trade knowledge (common practice, no single source). Nothing here
 * replaces the maker's manual: the cautions shown at hazardous steps say so.
 */
import type { ChoiceOption, PartOption, Step, StepOf } from "../model";
import type { Screw } from "../../trade/tune";

type Choice = StepOf<"choice">;

const single = (step: Omit<Choice, "kind" | "mode">): Choice => ({ kind: "choice", mode: "single", ...step });
const multi = (step: Omit<Choice, "kind" | "mode">): Choice => ({ kind: "choice", mode: "multi", ...step });

// ---- Intake ------------------------------------------------------------------------------------------

export const intakeDamage = (extra: ChoiceOption[] = []): Step =>
  multi({
    id: "intake-damage",
    title: "Damage at intake",
    help: "Look the machine over before any work and note what was already there.",
    options: [
      { id: "none", label: "No damage seen", exclusive: true },
      { id: "housing-cracked", label: "Cracked housing" },
      { id: "handle-broken", label: "Broken handle or grip" },
      { id: "cover-missing", label: "Cover or guard missing" },
      ...extra,
      { id: "other", label: "Other (see note)" },
    ],
  });

export const intakePhoto: Step = {
  id: "intake-photo",
  kind: "photo",
  title: "Photo as it came in",
  help: "One photo of each side, and a close-up of any damage.",
  optional: true,
  maxPhotos: 6,
};

// ---- Oil (four-strokes) ------------------------------------------------------------------------------

export const oilLevel: Step = single({
  id: "oil-level",
  title: "Engine oil level",
  help: "Machine level, dipstick wiped, put back in as the maker says (screwed in or resting), then read.",
  options: [
    { id: "none", label: "No oil on the stick" },
    { id: "low", label: "Below the low mark" },
    { id: "ok", label: "Between the marks" },
    { id: "over", label: "Above the full mark" },
  ],
});

export const oilCondition: Step = multi({
  id: "oil-condition",
  title: "Engine oil condition",
  help: "Look at the oil on the stick and smell it.",
  options: [
    { id: "clean", label: "Clean, amber", exclusive: true },
    { id: "dark", label: "Dark, due for a change" },
    { id: "fuel-smell", label: "Thin, smells of fuel" },
    { id: "milky", label: "Milky (water in it)" },
    { id: "metal", label: "Metal flecks" },
  ],
});

// ---- Fuel --------------------------------------------------------------------------------------------

export const fuelLevel: Step = single({
  id: "fuel-level",
  title: "Fuel in the tank",
  help: "Cap off, well away from sparks and flames.",
  hazards: ["fueling"],
  options: [
    { id: "empty", label: "Empty" },
    { id: "low", label: "Low" },
    { id: "half", label: "About half" },
    { id: "full", label: "Full" },
  ],
});

export const fuelCondition = (twoStroke: boolean): Step =>
  multi({
    id: "fuel-condition",
    title: "Fuel condition",
    help: "Pour a little into a clear cup: look at it and smell it.",
    hazards: ["fueling"],
    options: [
      { id: "fresh", label: "Fresh and clear", exclusive: true },
      { id: "stale", label: "Stale, varnish smell" },
      { id: "water", label: "Water or layers" },
      { id: "debris", label: "Dirt or debris" },
      ...(twoStroke ? [{ id: "no-oil", label: "No two-stroke oil in it" }] : []),
      { id: "unknown", label: "Tank empty, cannot tell", exclusive: true },
    ],
  });

/** The in-tank pickup filter of a handheld two-stroke. */
export const fuelFilter: Step = single({
  id: "fuel-filter",
  title: "Fuel filter in the tank",
  help: "Fish it out through the filler with a hooked wire. It belongs on the end of its line.",
  hazards: ["fueling"],
  options: [
    { id: "on-line", label: "On its line, clean" },
    { id: "clogged", label: "On its line, clogged" },
    { id: "off-line", label: "Off the line" },
    { id: "missing", label: "Missing" },
  ],
});

export const fuelLine: Step = multi({
  id: "fuel-line",
  title: "Fuel line",
  help: "Bend it gently along its length: it should be soft and spring back.",
  hazards: ["fueling"],
  options: [
    { id: "good", label: "Soft, no cracks", exclusive: true },
    { id: "hard", label: "Hard or cracked" },
    { id: "swollen", label: "Swollen or gummy" },
    { id: "kinked", label: "Kinked or pinched" },
    { id: "off-port", label: "Off the carburetor port" },
  ],
});

export const primerBulb: Step = single({
  id: "primer-bulb",
  title: "Primer bulb",
  help: "Press it a few times: it should fill with fuel and spring back.",
  hazards: ["fueling"],
  options: [
    { id: "fills", label: "Fills with fuel" },
    { id: "no-fill", label: "Does not fill" },
    { id: "cracked", label: "Cracked or stiff" },
  ],
});

export const leakWhere: Step = multi({
  id: "leak-where",
  title: "Where fuel leaks",
  help: "Tank filled a little, machine turned on each side over a tray. Wipe, wait, look.",
  hazards: ["fueling"],
  options: [
    { id: "none", label: "No leak found", exclusive: true },
    { id: "line-off-port", label: "Line off the carburetor port" },
    { id: "cracked-line", label: "Cracked line" },
    { id: "tank", label: "Tank" },
    { id: "vent", label: "Tank vent" },
    { id: "carburetor", label: "Carburetor" },
  ],
});

// ---- Compression -------------------------------------------------------------------------------------

export const pullOverFeel: Step = single({
  id: "pull-over-feel",
  title: "Pull-over compression feel",
  help: "Pull the starter slowly through a few turns and feel the resistance at the top of each one.",
  options: [
    { id: "strong", label: "Strong" },
    { id: "fair", label: "Fair" },
    { id: "weak", label: "Weak" },
  ],
});

export const compressionGauge: Step = {
  id: "compression-gauge",
  kind: "reading",
  title: "Compression gauge reading",
  help: "Gauge in the plug hole, throttle held wide open, pull until the needle stops rising. Keep the plug lead grounded.",
  hazards: ["spark-test"],
  optional: true,
  reading: { quantity: "compression", units: ["psi", "kPa"] },
};

export const pistonLook: Step = single({
  id: "piston-look",
  title: "Piston through the exhaust port",
  help: "Engine cold, muffler off: look at the piston and cylinder wall with a light.",
  hazards: ["hot-muffler"],
  showIf: { any: [{ step: "pull-over-feel", anyOf: ["weak"] }, { step: "compression-gauge", anyOf: ["low"] }] },
  options: [
    { id: "clean", label: "Clean, no marks" },
    { id: "scuffed", label: "Light scuffs" },
    { id: "scored", label: "Scored, metal smeared" },
    { id: "carbon", label: "Heavy carbon" },
  ],
});

// ---- Starting and ignition ---------------------------------------------------------------------------

export const primedStart: Step = single({
  id: "primed-start",
  title: "Prime and test start",
  help: "A few drops of fresh fuel (mix, for a two-stroke) in the carburetor throat, air filter back on, then start it as the maker describes.",
  hazards: ["prime-start", "fueling"],
  options: [
    { id: "no-start", label: "No start" },
    { id: "ran-briefly", label: "Ran briefly, then died" },
    { id: "kept-running", label: "Kept running" },
  ],
});

export const sparkTest: Step = single({
  id: "spark-test",
  title: "Spark test",
  help: "Gapped spark tester on the lead (or the plug grounded on the cylinder), crank, and watch in the shade.",
  hazards: ["spark-test"],
  showIf: { step: "primed-start", anyOf: ["no-start"] },
  options: [
    { id: "strong", label: "Strong blue spark" },
    { id: "weak", label: "Weak or orange" },
    { id: "none", label: "No spark" },
  ],
});

export const plugCondition: Step = multi({
  id: "plug-condition",
  title: "Spark plug condition",
  options: [
    { id: "clean", label: "Dry, light brown" },
    { id: "wet", label: "Wet with fuel" },
    { id: "carbon", label: "Black and sooty" },
    { id: "oily", label: "Oily" },
    { id: "cracked", label: "Cracked insulator" },
    { id: "worn", label: "Worn electrode" },
  ],
});

export const plugGapTwoStroke: Step = {
  id: "plug-gap",
  kind: "reading",
  title: "Spark plug gap",
  help: "Wire gauge, not a flat feeler, on a used plug.",
  optional: true,
  reading: { quantity: "plug-gap", units: ["mm", "in"], typical: "two-stroke" },
};

export const plugGapFourStroke: Step = {
  id: "plug-gap",
  kind: "reading",
  title: "Spark plug gap",
  help: "Often about 0.76 mm (0.030 in) on small four-strokes (common practice); the maker's figure wins.",
  optional: true,
  reading: { quantity: "plug-gap", units: ["mm", "in"] },
};

const noOrWeakSpark = { step: "spark-test", anyOf: ["none", "weak"] };

export const stopSwitch: Step = {
  id: "stop-switch",
  kind: "pass-fail",
  title: "Stop switch and its wire",
  help: "Switch on: its wire must not touch ground. Switch at stop: it must. Look for chafed insulation.",
  showIf: noOrWeakSpark,
  passLabel: "Works",
  failLabel: "Faulty",
};

export const coilAirGap: Step = single({
  id: "coil-air-gap",
  title: "Ignition coil air gap",
  help: "The gap between the coil legs and the flywheel magnets, set with the maker's gauge.",
  showIf: noOrWeakSpark,
  options: [
    { id: "ok", label: "Within spec" },
    { id: "wide", label: "Too wide" },
    { id: "rubbing", label: "Rubbing marks" },
  ],
});

// ---- Air and exhaust ---------------------------------------------------------------------------------

export const airFilter: Step = single({
  id: "air-filter",
  title: "Air filter",
  options: [
    { id: "clean", label: "Clean" },
    { id: "dirty", label: "Dirty" },
    { id: "oil-soaked", label: "Soaked with oil or fuel" },
    { id: "missing", label: "Missing or torn" },
  ],
});

export const sparkArrestor: Step = single({
  id: "spark-arrestor",
  title: "Spark arrestor screen",
  help: "Engine cold: take the screen out of the muffler and hold it to the light.",
  hazards: ["hot-muffler"],
  options: [
    { id: "clear", label: "Clear" },
    { id: "partly", label: "Partly blocked" },
    { id: "blocked", label: "Blocked with carbon" },
  ],
});

// ---- Carburetor --------------------------------------------------------------------------------------

export const carbClean: Step = single({
  id: "carb-clean",
  title: "Carburetor cleaning",
  help: "Parts cleaner spray, outdoors, then low-pressure air through the passages.",
  hazards: ["solvent-cleaning", "compressed-air"],
  options: [
    { id: "not-needed", label: "Not needed" },
    { id: "sprayed", label: "Cleaned with spray" },
    { id: "sprayed-air", label: "Cleaned, then air through the passages" },
  ],
});

/** Diaphragm carburetors (handheld two-strokes). */
export const diaphragmCarb: Step[] = [
  single({
    id: "inlet-screen",
    title: "Inlet screen",
    help: "The small screen under the pump cover, at the inlet.",
    options: [
      { id: "clean", label: "Clean" },
      { id: "film", label: "Film or varnish" },
      { id: "blocked", label: "Blocked" },
    ],
  }),
  single({
    id: "metering-diaphragm",
    title: "Metering diaphragm",
    options: [
      { id: "supple", label: "Supple and flat" },
      { id: "wrinkled", label: "Wrinkled" },
      { id: "stiff", label: "Stiff" },
      { id: "distorted", label: "Distorted or bulged" },
    ],
  }),
  single({
    id: "diaphragm-stem",
    title: "Replacement diaphragm's centre stem",
    help: "The new diaphragm's centre stem must be the same kind as the old one.",
    showIf: { step: "metering-diaphragm", anyOf: ["wrinkled", "stiff", "distorted"] },
    options: [
      { id: "long", label: "Long stem, matches the old" },
      { id: "short", label: "Short stem, matches the old" },
      { id: "mismatch", label: "Does not match the old" },
    ],
  }),
  single({
    id: "check-valve",
    title: "Check-valve flaps",
    help: "The small flaps in the pump diaphragm or metering body.",
    options: [
      { id: "flat", label: "Flat" },
      { id: "bent", label: "Bent or curled" },
    ],
  }),
  {
    id: "metering-lever",
    kind: "pass-fail",
    title: "Metering lever moves freely",
    help: "Press the lever: the needle lifts and drops back without sticking.",
    passLabel: "Free",
    failLabel: "Sticks",
  },
];

/** Float carburetors (four-strokes). */
export const floatCarb: Step[] = [
  multi({
    id: "carb-bowl",
    title: "Carburetor bowl",
    help: "Fuel shut off or tank drained, bowl off over a tray.",
    hazards: ["fueling"],
    options: [
      { id: "clean", label: "Clean", exclusive: true },
      { id: "water", label: "Water in it" },
      { id: "varnish", label: "Varnish or gum" },
      { id: "debris", label: "Dirt or debris" },
      { id: "float-sticks", label: "Float or needle sticks" },
    ],
  }),
  {
    id: "main-jet",
    kind: "pass-fail",
    title: "Main jet and emulsion tube clear",
    help: "Hold it to the light: a round hole you can see through.",
    passLabel: "Clear",
    failLabel: "Blocked",
  },
];

// ---- Parts, tune, final ------------------------------------------------------------------------------

/** Fuel line inside diameters common on small engines (common practice, no single source). */
export const FUEL_LINE_SIZES = [
  { id: "id-3-32-in", label: "3/32 in ID" },
  { id: "id-1-8-in", label: "1/8 in ID" },
  { id: "id-3-16-in", label: "3/16 in ID" },
  { id: "id-1-4-in", label: "1/4 in ID" },
];

export const partsUsed = (catalog: PartOption[]): Step => ({
  id: "parts-used",
  kind: "parts",
  title: "Parts replaced",
  help: "Each part fitted, with its size where it has one.",
  optional: true,
  catalog,
});

export const PART = {
  fuelLine: { id: "fuel-line", label: "Fuel line", sizes: FUEL_LINE_SIZES },
  fuelFilter: { id: "fuel-filter", label: "Fuel filter" },
  meteringDiaphragm: { id: "metering-diaphragm", label: "Metering diaphragm" },
  pumpDiaphragm: { id: "pump-diaphragm", label: "Pump diaphragm" },
  carbGaskets: { id: "carb-gaskets", label: "Carburetor gaskets" },
  carburetor: { id: "carburetor", label: "Carburetor assembly" },
  sparkPlug: { id: "spark-plug", label: "Spark plug" },
  airFilter: { id: "air-filter", label: "Air filter" },
  primerBulb: { id: "primer-bulb", label: "Primer bulb" },
  starterRope: { id: "starter-rope", label: "Starter rope" },
  bowlGasket: { id: "bowl-gasket", label: "Carburetor bowl gasket" },
  engineOil: { id: "engine-oil", label: "Engine oil" },
} satisfies Record<string, PartOption>;

export const tuneLog = (screws: Screw[], help: string): Step => ({
  id: "tune",
  kind: "tune",
  title: "Tune log",
  help,
  hazards: ["test-run", "hot-muffler"],
  optional: true,
  screws,
});

export const finalStarts: Step = single({
  id: "final-starts",
  title: "Starting on the final run",
  hazards: ["test-run"],
  options: [
    { id: "few-pulls", label: "Within a few pulls" },
    { id: "many-pulls", label: "Needs many pulls" },
    { id: "no-start", label: "Will not start" },
  ],
});

export const finalAccel: Step = single({
  id: "final-accel",
  title: "Acceleration",
  help: "Snap the throttle open from idle.",
  hazards: ["test-run"],
  options: [
    { id: "clean", label: "Clean to full speed" },
    { id: "hesitates", label: "Hesitates" },
    { id: "bogs", label: "Bogs or stalls" },
  ],
});

export const finalNote: Step = {
  id: "final-note",
  kind: "note",
  title: "Notes for the counter",
  optional: true,
  placeholder: "What you found and did, in plain words",
};

export const finalPhoto: Step = {
  id: "final-photo",
  kind: "photo",
  title: "Photo when done",
  optional: true,
  maxPhotos: 6,
};
