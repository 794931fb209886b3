/**
 * The guided next test, rule by rule: each rule fires when its results are there and does not fire on near
 * misses (a neighbouring answer, the next test already done, another machine's sheet, a hidden step).
 *
 * The rules themselves are common bench practice, no single source [practice]; what these tests check is that
 * the table does what each row says. Reading verdicts come from lib/trade readings: compression soft band
 * 100–150 psi [practice]; 120 V band 114–126 V, ANSI C84.1 Range A [memory]; 60 Hz ± 5 % = 57–63 Hz [practice].
 */
import { describe, expect, it } from "vitest";
import { BUILT_IN_PROCEDURES, type Procedure, type Results, type StepValue } from "@/lib/procedures";
import {
  checkGuideRules,
  GUIDE_BASIS,
  GUIDE_RULES,
  ruleAppliesTo,
  suggest,
  SUGGESTION_LABEL,
  type GuideRule,
} from "@/lib/procedures/guide";

const byId = (id: string): Procedure => {
  const p = BUILT_IN_PROCEDURES.find((x) => x.id === id);
  if (!p) throw new Error(`no procedure ${id}`);
  return p;
};
const SAW = byId("chain-saw-2t");
const HANDHELD = byId("handheld-2t");
const MOWER = byId("walk-mower-4t");
const GEN = byId("generator-4t");

const c = (...selected: string[]): StepValue => ({ kind: "choice", selected });
const pf = (pass: boolean): StepValue => ({ kind: "pass-fail", pass });
const r = (value: number, unit: string): StepValue => ({ kind: "reading", value, unit });
const ids = (p: Procedure, results: Results) => suggest(p, results).map((s) => s.ruleId);

type Miss = { why: string; procedure?: Procedure; results: Results };
type Case = { rule: string; procedure: Procedure; fires: Results; misses: Miss[] };

const CASES: Case[] = [
  {
    rule: "primed-no-start",
    procedure: SAW,
    fires: { "primed-start": c("no-start") },
    misses: [
      { why: "it ran briefly", results: { "primed-start": c("ran-briefly") } },
      { why: "the spark test is done", results: { "primed-start": c("no-start"), "spark-test": c("strong") } },
    ],
  },
  {
    rule: "primed-ran-briefly",
    procedure: SAW,
    fires: { "primed-start": c("ran-briefly") },
    misses: [
      { why: "it kept running", results: { "primed-start": c("kept-running") } },
      {
        why: "screen and diaphragm already looked at",
        results: { "primed-start": c("ran-briefly"), "inlet-screen": c("clean"), "metering-diaphragm": c("supple") },
      },
      { why: "a mower has no diaphragm carburetor", procedure: MOWER, results: { "primed-start": c("ran-briefly") } },
    ],
  },
  {
    rule: "primed-ran-briefly-float",
    procedure: MOWER,
    fires: { "primed-start": c("ran-briefly") },
    misses: [
      { why: "it kept running", results: { "primed-start": c("kept-running") } },
      { why: "bowl and jet already looked at", results: { "primed-start": c("ran-briefly"), "carb-bowl": c("clean"), "main-jet": pf(true) } },
      { why: "a saw has no float bowl", procedure: SAW, results: { "primed-start": c("ran-briefly") } },
    ],
  },
  {
    rule: "no-spark",
    procedure: SAW,
    fires: { "primed-start": c("no-start"), "spark-test": c("none") },
    misses: [
      { why: "a weak spark is another rule", results: { "primed-start": c("no-start"), "spark-test": c("weak") } },
      { why: "the spark test is hidden once the saw started", results: { "primed-start": c("kept-running"), "spark-test": c("none") } },
      {
        why: "plug, stop switch and coil gap all checked",
        results: {
          "primed-start": c("no-start"),
          "spark-test": c("none"),
          "plug-condition": c("clean"),
          "stop-switch": pf(true),
          "coil-air-gap": c("ok"),
        },
      },
    ],
  },
  {
    rule: "weak-spark",
    procedure: SAW,
    fires: { "primed-start": c("no-start"), "spark-test": c("weak") },
    misses: [
      { why: "strong spark", results: { "primed-start": c("no-start"), "spark-test": c("strong") } },
      { why: "coil gap already checked", results: { "primed-start": c("no-start"), "spark-test": c("weak"), "coil-air-gap": c("ok") } },
    ],
  },
  {
    rule: "spark-but-no-start",
    procedure: SAW,
    fires: { "primed-start": c("no-start"), "spark-test": c("strong") },
    misses: [
      { why: "spark only weak", results: { "primed-start": c("no-start"), "spark-test": c("weak") } },
      { why: "no spark test yet", results: { "primed-start": c("no-start") } },
      { why: "gauge test done", results: { "primed-start": c("no-start"), "spark-test": c("strong"), "compression-gauge": r(120, "psi") } },
    ],
  },
  {
    rule: "blade-strike-no-start",
    procedure: MOWER,
    fires: { blade: c("bent", "dull"), "primed-start": c("no-start") },
    misses: [
      { why: "blade only dull", results: { blade: c("dull"), "primed-start": c("no-start") } },
      { why: "it starts", results: { blade: c("bent"), "primed-start": c("kept-running") } },
    ],
  },
  {
    rule: "weak-pull-over",
    procedure: SAW,
    fires: { "pull-over-feel": c("weak") },
    misses: [
      { why: "fair pull-over", results: { "pull-over-feel": c("fair") } },
      { why: "gauge test done", results: { "pull-over-feel": c("weak"), "compression-gauge": r(95, "psi") } },
      { why: "four-strokes get their own rule", procedure: MOWER, results: { "pull-over-feel": c("weak") } },
    ],
  },
  {
    rule: "weak-pull-over-4t",
    procedure: MOWER,
    fires: { "pull-over-feel": c("weak") },
    misses: [
      { why: "strong pull-over", results: { "pull-over-feel": c("strong") } },
      { why: "two-strokes get the gauge test", procedure: HANDHELD, results: { "pull-over-feel": c("weak") } },
    ],
  },
  {
    rule: "low-compression",
    procedure: SAW,
    fires: { "compression-gauge": r(80, "psi") },
    misses: [
      { why: "120 psi is within the soft band", results: { "compression-gauge": r(120, "psi") } },
      // [NIST SP 811] 1 psi = 6.894757 kPa: 827 kPa ≈ 120 psi
      { why: "827 kPa is within", results: { "compression-gauge": r(827, "kPa") } },
      { why: "piston already looked at", results: { "compression-gauge": r(80, "psi"), "piston-look": c("clean") } },
    ],
  },
  {
    rule: "piston-scored",
    procedure: SAW,
    fires: { "pull-over-feel": c("weak"), "piston-look": c("scored") },
    misses: [
      { why: "light scuffs only", results: { "pull-over-feel": c("weak"), "piston-look": c("scuffed") } },
      { why: "piston look hidden on a strong pull-over", results: { "pull-over-feel": c("strong"), "piston-look": c("scored") } },
    ],
  },
  {
    rule: "stale-fuel",
    procedure: SAW,
    fires: { "fuel-condition": c("stale") },
    misses: [
      { why: "fresh fuel", results: { "fuel-condition": c("fresh") } },
      { why: "empty tank", results: { "fuel-condition": c("unknown") } },
    ],
  },
  {
    rule: "fuel-line-leak",
    procedure: SAW,
    fires: { "leak-where": c("line-off-port") },
    misses: [
      { why: "no leak", results: { "leak-where": c("none") } },
      { why: "tank leak", results: { "leak-where": c("tank") } },
      {
        why: "parts already recorded",
        results: { "leak-where": c("cracked-line"), "parts-used": { kind: "parts", items: [{ partId: "fuel-line", sizeId: "id-1-8-in", quantity: 1 }] } },
      },
    ],
  },
  {
    rule: "inlet-screen-dirty",
    procedure: HANDHELD,
    fires: { "inlet-screen": c("blocked") },
    misses: [{ why: "clean screen", results: { "inlet-screen": c("clean") } }],
  },
  {
    rule: "diaphragm-worn",
    procedure: SAW,
    fires: { "metering-diaphragm": c("stiff") },
    misses: [
      { why: "supple diaphragm", results: { "metering-diaphragm": c("supple") } },
      { why: "replacement stem checked", results: { "metering-diaphragm": c("wrinkled"), "diaphragm-stem": c("short") } },
    ],
  },
  {
    rule: "bowl-dirty",
    procedure: MOWER,
    fires: { "carb-bowl": c("varnish") },
    misses: [
      { why: "clean bowl", results: { "carb-bowl": c("clean") } },
      { why: "main jet checked", results: { "carb-bowl": c("water"), "main-jet": pf(true) } },
    ],
  },
  {
    rule: "fuel-in-oil",
    procedure: GEN,
    fires: { "oil-condition": c("dark", "fuel-smell") },
    misses: [
      { why: "dark oil only", results: { "oil-condition": c("dark") } },
      { why: "bowl looked at", results: { "oil-condition": c("fuel-smell"), "carb-bowl": c("float-sticks") } },
    ],
  },
  {
    rule: "dies-at-idle",
    procedure: SAW,
    fires: { "final-idle": c("dies-at-idle") },
    misses: [{ why: "steady idle", results: { "final-idle": c("steady") } }],
  },
  {
    rule: "moves-at-idle",
    procedure: HANDHELD,
    fires: { "final-idle": c("moves-at-idle") },
    misses: [{ why: "idle hunts", results: { "final-idle": c("hunts") } }],
  },
  {
    rule: "hesitates",
    procedure: SAW,
    fires: { "final-accel": c("hesitates") },
    misses: [{ why: "clean acceleration", results: { "final-accel": c("clean") } }],
  },
  {
    rule: "bogs-in-cut",
    procedure: SAW,
    fires: { "final-cut": c("bogs") },
    misses: [
      { why: "clean cut", results: { "final-cut": c("clean") } },
      { why: "a mower bogging is another rule", procedure: MOWER, results: { "final-cut": c("bogs") } },
    ],
  },
  {
    rule: "mower-bogs",
    procedure: MOWER,
    fires: { "final-cut": c("bogs") },
    misses: [
      { why: "clean cut", results: { "final-cut": c("clean") } },
      { why: "a saw bogging is another rule", procedure: SAW, results: { "final-cut": c("bogs") } },
    ],
  },
  {
    rule: "no-bar-oil",
    procedure: SAW,
    fires: { "bar-oiling": pf(false) },
    misses: [{ why: "it oils", results: { "bar-oiling": pf(true) } }],
  },
  {
    rule: "mower-surges",
    procedure: MOWER,
    fires: { "final-runs": c("surges") },
    misses: [{ why: "steady", results: { "final-runs": c("steady") } }],
  },
  {
    rule: "mower-vibrates",
    procedure: MOWER,
    fires: { "final-cut": c("vibrates") },
    misses: [{ why: "clean cut", results: { "final-cut": c("clean") } }],
  },
  {
    rule: "gen-speed-drops",
    procedure: GEN,
    fires: { "load-hertz": r(55, "Hz") },
    misses: [
      { why: "58 Hz is within 57–63", results: { "load-hertz": r(58, "Hz") } },
      { why: "57 Hz is on the limit, within", results: { "load-hertz": r(57, "Hz") } },
    ],
  },
  {
    rule: "gen-volts-low-speed-ok",
    procedure: GEN,
    fires: { "load-volts": r(105, "V"), "load-hertz": r(60, "Hz") },
    misses: [
      { why: "speed low too: the speed rule", results: { "load-volts": r(105, "V"), "load-hertz": r(55, "Hz") } },
      { why: "volts within 114–126", results: { "load-volts": r(118, "V"), "load-hertz": r(60, "Hz") } },
      { why: "no frequency reading yet", results: { "load-volts": r(105, "V") } },
    ],
  },
  {
    rule: "gen-noload-fast",
    procedure: GEN,
    fires: { "noload-hertz": r(64, "Hz") },
    misses: [{ why: "62.5 Hz is within", results: { "noload-hertz": r(62.5, "Hz") } }],
  },
];

describe("every rule has its own test case", () => {
  it("one case per rule in the table, no case for a rule that is not there", () => {
    expect(CASES.map((x) => x.rule).sort()).toEqual(GUIDE_RULES.map((x) => x.id).sort());
  });
});

describe.each(CASES.map((x) => [x.rule, x] as const))("rule %s", (_name, x) => {
  it("fires when its results are there", () => {
    expect(ids(x.procedure, x.fires)).toContain(x.rule);
  });
  it.each(x.misses.map((m) => [m.why, m] as const))("does not fire: %s", (_why, m) => {
    expect(ids(m.procedure ?? x.procedure, m.results)).not.toContain(x.rule);
  });
});

describe("the suggestion list", () => {
  it("is empty before anything is recorded", () => {
    for (const p of BUILT_IN_PROCEDURES) expect(suggest(p, {})).toEqual([]);
  });

  it("is labelled a suggestion, names the next step and the likely cause, with its basis", () => {
    const [first] = suggest(SAW, { "primed-start": c("no-start") });
    expect(first).toEqual({
      ruleId: "primed-no-start",
      label: SUGGESTION_LABEL,
      nextTest: "Spark test.",
      nextStep: "spark-test",
      nextStepTitle: "Spark test",
      likelyCause: expect.stringMatching(/flooded/),
      basis: GUIDE_BASIS,
    });
    expect(SUGGESTION_LABEL).toBe("Suggestion");
    expect(GUIDE_BASIS).toMatch(/no single source.*maker's manual/);
  });

  it("comes in table order when several rules fire", () => {
    const results: Results = {
      "fuel-condition": c("stale"),
      "pull-over-feel": c("weak"),
      "primed-start": c("no-start"),
      "spark-test": c("none"),
      "final-cut": c("bogs"),
    };
    const got = ids(SAW, results);
    expect(got).toEqual(["no-spark", "weak-pull-over", "stale-fuel", "bogs-in-cut"]);
    const order = GUIDE_RULES.map((x) => x.id);
    expect(got.map((id) => order.indexOf(id))).toEqual([...got.map((id) => order.indexOf(id))].sort((a, b) => a - b));
  });

  it("moves on as the tech follows it: no start → spark test → no spark → plug, switch, coil", () => {
    const step1 = ids(SAW, { "primed-start": c("no-start") });
    expect(step1).toEqual(["primed-no-start"]);
    const step2 = ids(SAW, { "primed-start": c("no-start"), "spark-test": c("none") });
    expect(step2).toEqual(["no-spark"]);
    const step3 = ids(SAW, {
      "primed-start": c("no-start"),
      "spark-test": c("none"),
      "plug-condition": c("clean"),
      "stop-switch": pf(false),
      "coil-air-gap": c("ok"),
    });
    expect(step3).toEqual([]);
  });
});

describe("the rule table itself", () => {
  it("every rule applies to a built-in sheet and can fire there", () => {
    expect(checkGuideRules(GUIDE_RULES, BUILT_IN_PROCEDURES)).toEqual([]);
  });

  it("reports a rule naming a step no sheet has, a result no step gives, and a doubled id", () => {
    const bad: GuideRule[] = [
      { id: "x", when: { step: "carb-float-height", anyOf: ["high"] }, nextTest: "-", likelyCause: "-" },
      { id: "y", when: { step: "primed-start", anyOf: ["backfired"] }, nextTest: "-", likelyCause: "-" },
      { id: "y", when: { step: "primed-start", anyOf: ["no-start"] }, nextTest: "-", likelyCause: "-" },
    ];
    expect(checkGuideRules(bad, BUILT_IN_PROCEDURES)).toEqual([
      'Rule "x" applies to none of the procedures.',
      'Rule "y" names results that none of its procedures can give.',
      'Rule id "y" is used twice.',
    ]);
  });

  it("engine-type rules stay on their engines", () => {
    const rule = GUIDE_RULES.find((x) => x.id === "weak-pull-over");
    expect(rule && ruleAppliesTo(rule, SAW)).toBe(true);
    expect(rule && ruleAppliesTo(rule, MOWER)).toBe(false);
  });
});
