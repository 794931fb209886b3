/**
 * Guided next test: from the results so far, suggest the next test and the likely cause.
 *
 * The rules are data: each row says "when these results → this next test, this likely cause". They are
 * suggestions from common bench practice (no single source), shown labelled as a suggestion; the tech decides,
 * and the maker's manual overrides them.
 *
 * A rule applies to a procedure that has every step it refers to (and, if it names engine types, one of those).
 * It fires when its condition holds on the results that count (those of shown steps; see sheetView), and is left
 * out once its next test has been done (every step in `doneWhen`, by default its `nextStep`, is answered).
 * Suggestions come in table order: the rows are written most useful first.
 */
import type { EngineType } from "../tickets/machine";
import { conditionSteps, findStep, type Condition, type Procedure } from "./model";
import { evaluateCondition, sheetView, type SheetContext } from "./conditions";
import { possibleTokens, type Results } from "./values";

export type GuideRule = {
  id: string;
  when: Condition;
  /** Only for these engine types (by the procedure's engine types). */
  engineTypes?: EngineType[];
  /** The next test, in words. */
  nextTest: string;
  /** The step where that test is recorded, when the sheet has one. */
  nextStep?: string;
  likelyCause: string;
  /** The suggestion is left out once all these steps are answered. Default: [nextStep]. */
  doneWhen?: string[];
};

export const SUGGESTION_LABEL = "Suggestion";
export const GUIDE_BASIS = "Common bench practice, no single source. The maker's manual overrides it.";

const is = (step: string, ...anyOf: string[]): Condition => ({ step, anyOf });

export const GUIDE_RULES: readonly GuideRule[] = [
  // ---- Starting and ignition ---------------------------------------------------------------------------
  {
    id: "primed-no-start",
    when: is("primed-start", "no-start"),
    nextTest: "Spark test.",
    nextStep: "spark-test",
    likelyCause: "No spark, no compression, or a flooded engine. Fuel in the throat did not fire, so fuel delivery is not the first suspect.",
  },
  {
    id: "primed-ran-briefly",
    when: is("primed-start", "ran-briefly"),
    nextTest:
      "Spark and compression are there: look at fuel delivery — fuel filter, fuel line, tank vent, carburetor inlet screen and metering diaphragm.",
    nextStep: "inlet-screen",
    likelyCause: "Fuel is not reaching the engine: a blocked filter or screen, a cracked or loose line, a stuck vent or a stiff diaphragm.",
    doneWhen: ["inlet-screen", "metering-diaphragm"],
  },
  {
    id: "primed-ran-briefly-float",
    when: is("primed-start", "ran-briefly"),
    engineTypes: ["four_stroke"],
    nextTest: "Spark and compression are there: look at fuel delivery — fuel shut-off, fuel line, carburetor bowl and main jet.",
    nextStep: "carb-bowl",
    likelyCause: "Fuel is not reaching the engine: a blocked main jet, a stuck float or needle, or varnish in the bowl.",
    doneWhen: ["carb-bowl", "main-jet"],
  },
  {
    id: "no-spark",
    when: is("spark-test", "none"),
    nextTest: "Check the spark plug, the coil's air gap to the flywheel, the stop switch and its wire, then the coil itself.",
    nextStep: "plug-condition",
    likelyCause: "A fouled or cracked plug, a grounded stop-switch wire, a wrong coil air gap, or a failed coil.",
    doneWhen: ["plug-condition", "stop-switch", "coil-air-gap"],
  },
  {
    id: "weak-spark",
    when: is("spark-test", "weak"),
    nextTest: "Fit a known-good plug and set the coil air gap; if the spark stays weak, suspect the coil.",
    nextStep: "coil-air-gap",
    likelyCause: "A worn plug, a wide coil air gap, or a failing coil.",
  },
  {
    id: "spark-but-no-start",
    when: { all: [is("primed-start", "no-start"), is("spark-test", "strong")] },
    nextTest: "Spark is good: check compression with a gauge, and whether the engine is flooded (wet plug).",
    nextStep: "compression-gauge",
    likelyCause: "Low compression or a flooded engine.",
  },
  {
    id: "blade-strike-no-start",
    when: { all: [is("blade", "bent"), is("primed-start", "no-start")] },
    nextTest: "Check the flywheel key and the crankshaft for a bend before anything else.",
    likelyCause: "A blade strike can shear the flywheel key, which throws the ignition timing off.",
  },
  // ---- Compression ------------------------------------------------------------------------------------
  {
    id: "weak-pull-over",
    when: is("pull-over-feel", "weak"),
    engineTypes: ["two_stroke"],
    nextTest: "Gauge test: compression gauge in the plug hole, throttle wide open, pull until the needle stops.",
    nextStep: "compression-gauge",
    likelyCause: "Worn or scored cylinder and piston, or worn or stuck rings.",
  },
  {
    id: "weak-pull-over-4t",
    when: is("pull-over-feel", "weak"),
    engineTypes: ["four_stroke"],
    nextTest: "Check the valve clearance and the head gasket; a gauge reads low on engines with a compression release.",
    likelyCause: "Valves not sealing (tight clearance or a burnt valve), a leaking head gasket, or worn rings.",
  },
  {
    id: "low-compression",
    when: is("compression-gauge", "low"),
    nextTest: "Look at the piston and cylinder through the exhaust port (muffler off, engine cold).",
    nextStep: "piston-look",
    likelyCause: "A scored cylinder or piston, or worn rings — often from running lean or on the wrong mix.",
  },
  {
    id: "piston-scored",
    when: is("piston-look", "scored"),
    nextTest: "Price a cylinder and piston (or a replacement engine) before more work, and find why it ran lean.",
    likelyCause: "Lean-run damage: an air leak, a wrong mix, or a high-speed mixture set too lean.",
  },
  // ---- Fuel -------------------------------------------------------------------------------------------
  {
    id: "stale-fuel",
    when: is("fuel-condition", "stale", "water", "debris"),
    nextTest: "Drain the tank, look at the carburetor, and refill with fresh fuel of no more than 10 % ethanol.",
    likelyCause: "Old fuel leaves varnish that blocks screens, jets and passages.",
  },
  {
    id: "fuel-line-leak",
    when: is("leak-where", "line-off-port", "cracked-line"),
    nextTest: "Replace the fuel line (note its inside diameter) and the fuel filter, routed as the maker shows.",
    nextStep: "parts-used",
    likelyCause: "A hardened line that cracked or shrank off the carburetor port.",
  },
  {
    id: "inlet-screen-dirty",
    when: is("inlet-screen", "film", "blocked"),
    nextTest: "Clean or replace the inlet screen, drain the stale fuel and fit a new fuel filter.",
    likelyCause: "Varnish from old fuel blocking the flow into the carburetor.",
  },
  {
    id: "diaphragm-worn",
    when: is("metering-diaphragm", "wrinkled", "stiff", "distorted"),
    nextTest: "Rebuild the carburetor (metering and pump diaphragms, gaskets); check the new diaphragm's centre stem matches.",
    nextStep: "diaphragm-stem",
    likelyCause: "A tired metering diaphragm starves the engine: hard starting, dying, bogging.",
  },
  {
    id: "bowl-dirty",
    when: is("carb-bowl", "water", "varnish", "debris"),
    nextTest: "Clean the bowl and the main jet, drain the tank, and refill with fresh fuel.",
    nextStep: "main-jet",
    likelyCause: "Water or varnish in the bowl blocking the main jet.",
  },
  {
    id: "fuel-in-oil",
    when: is("oil-condition", "fuel-smell"),
    nextTest: "Check the carburetor float needle and seat; change the oil before running it.",
    nextStep: "carb-bowl",
    likelyCause: "A float needle that does not seal lets fuel run into the crankcase.",
  },
  // ---- Final run --------------------------------------------------------------------------------------
  {
    id: "dies-at-idle",
    when: is("final-idle", "dies-at-idle"),
    nextTest: "Set the idle speed, then the low-speed mixture, in small steps (⅛ turn).",
    nextStep: "tune",
    likelyCause: "Idle speed too low or the low-speed mixture off (often lean); also a dirty low-speed circuit.",
    doneWhen: [],
  },
  {
    id: "moves-at-idle",
    when: is("final-idle", "moves-at-idle"),
    nextTest: "Lower the idle speed; if it still moves at a correct idle, look at the clutch springs and shoes.",
    nextStep: "tune",
    likelyCause: "Idle speed set too high, or weak or broken clutch springs.",
    doneWhen: [],
  },
  {
    id: "hesitates",
    when: is("final-accel", "hesitates", "bogs"),
    nextTest: "Check the low-speed mixture (often a little lean) and the air filter, then the metering diaphragm.",
    nextStep: "tune",
    likelyCause: "A lean low-speed mixture or a tired metering diaphragm.",
    doneWhen: [],
  },
  {
    id: "bogs-in-cut",
    when: is("final-cut", "bogs"),
    nextTest: "Richen the high-speed mixture in ⅛-turn steps; check the air filter and the spark arrestor screen.",
    nextStep: "tune",
    likelyCause: "High-speed mixture too lean, or a restricted air filter or exhaust screen.",
    doneWhen: [],
    engineTypes: ["two_stroke"],
  },
  {
    id: "mower-bogs",
    when: is("final-cut", "bogs"),
    engineTypes: ["four_stroke"],
    nextTest: "Check the blade is sharp, the air filter is clean and the main jet is clear; then the governor linkage.",
    nextStep: "main-jet",
    likelyCause: "A dull blade, a restricted air filter, a partly blocked main jet, or a governor that cannot open the throttle.",
    doneWhen: [],
  },
  {
    id: "no-bar-oil",
    when: is("bar-oiling", "fail"),
    nextTest: "Check the oil pickup in the tank, the oil hole in the bar and the pump drive.",
    likelyCause: "A blocked oil passage, a clogged pickup, or a worn pump drive.",
  },
  {
    id: "mower-surges",
    when: is("final-runs", "surges"),
    nextTest: "Clean the main jet and emulsion tube; look for an air leak at the carburetor gasket and check the governor linkage.",
    nextStep: "main-jet",
    likelyCause: "A lean run from a partly blocked jet, or a sticking governor.",
    doneWhen: [],
  },
  {
    id: "mower-vibrates",
    when: is("final-cut", "vibrates"),
    nextTest: "Balance or replace the blade and check the crankshaft for a bend.",
    likelyCause: "A bent or unbalanced blade, or a bent crankshaft after a strike.",
  },
  // ---- Generator output --------------------------------------------------------------------------------
  {
    id: "gen-speed-drops",
    when: is("load-hertz", "low"),
    nextTest: "Engine speed drops under load: check the air filter, the carburetor main jet and the governor, and that the load is within the rating.",
    likelyCause: "The engine cannot hold speed: fuel delivery, a governor fault, or overload.",
  },
  {
    id: "gen-volts-low-speed-ok",
    when: {
      any: [
        { all: [is("noload-volts", "low"), is("noload-hertz", "within")] },
        { all: [is("load-volts", "low"), is("load-hertz", "within")] },
      ],
    },
    nextTest: "Speed is right but volts are low: check the voltage regulator (AVR), brushes and slip rings, or the capacitor on brushless heads.",
    likelyCause: "An excitation fault in the generator head.",
  },
  {
    id: "gen-noload-fast",
    when: is("noload-hertz", "high"),
    nextTest: "No-load speed too high: set the governor's no-load speed as the maker's manual gives.",
    likelyCause: "Governor speed adjustment off.",
  },
];

export type Suggestion = {
  ruleId: string;
  /** Always "Suggestion": the sheet shows it labelled as one. */
  label: typeof SUGGESTION_LABEL;
  nextTest: string;
  nextStep?: string;
  nextStepTitle?: string;
  likelyCause: string;
  basis: typeof GUIDE_BASIS;
};

/** The step ids a rule refers to. */
export function ruleSteps(rule: GuideRule): string[] {
  return [...new Set([...conditionSteps(rule.when), ...(rule.nextStep ? [rule.nextStep] : []), ...(rule.doneWhen ?? [])])];
}

/** True when a rule can apply to the procedure: every step it refers to is there, and the engine type fits. */
export function ruleAppliesTo(rule: GuideRule, procedure: Procedure): boolean {
  if (rule.engineTypes && !procedure.engineTypes.some((e) => rule.engineTypes?.includes(e))) return false;
  return ruleSteps(rule).every((id) => findStep(procedure, id) !== undefined);
}

/**
 * Problems with a rule table against a set of procedures: a rule that applies to none of them, or whose
 * condition names a token none of the procedures it applies to can give (it could never fire).
 */
export function checkGuideRules(rules: readonly GuideRule[], procedures: readonly Procedure[]): string[] {
  const problems: string[] = [];
  const ids = new Set<string>();
  for (const rule of rules) {
    if (ids.has(rule.id)) problems.push(`Rule id "${rule.id}" is used twice.`);
    ids.add(rule.id);
    const applicable = procedures.filter((p) => ruleAppliesTo(rule, p));
    if (applicable.length === 0) {
      problems.push(`Rule "${rule.id}" applies to none of the procedures.`);
      continue;
    }
    const canFire = applicable.some((p) => conditionTokensPossible(rule.when, p));
    if (!canFire) problems.push(`Rule "${rule.id}" names results that none of its procedures can give.`);
  }
  return problems;
}

function conditionTokensPossible(c: Condition, p: Procedure): boolean {
  if ("step" in c) {
    const step = findStep(p, c.step);
    return step !== undefined && c.anyOf.every((t) => possibleTokens(step).includes(t));
  }
  if ("all" in c) return c.all.every((x) => conditionTokensPossible(x, p));
  if ("any" in c) return c.any.every((x) => conditionTokensPossible(x, p));
  return conditionTokensPossible(c.not, p);
}

/** The suggestions for the results so far, in table order. */
export function suggest(
  procedure: Procedure,
  latestResults: Results,
  context: SheetContext = {},
  rules: readonly GuideRule[] = GUIDE_RULES,
): Suggestion[] {
  const { effective } = sheetView(procedure, latestResults, context);
  const out: Suggestion[] = [];
  for (const rule of rules) {
    if (!ruleAppliesTo(rule, procedure)) continue;
    if (!evaluateCondition(procedure, rule.when, effective)) continue;
    const done = rule.doneWhen ?? (rule.nextStep ? [rule.nextStep] : []);
    if (done.length > 0 && done.every((id) => effective[id] !== undefined)) continue;
    const next = rule.nextStep ? findStep(procedure, rule.nextStep) : undefined;
    out.push({
      ruleId: rule.id,
      label: SUGGESTION_LABEL,
      nextTest: rule.nextTest,
      ...(next ? { nextStep: next.id, nextStepTitle: next.title } : {}),
      likelyCause: rule.likelyCause,
      basis: GUIDE_BASIS,
    });
  }
  return out;
}
