import { describe, expect, it } from "vitest";
import {
  allSteps,
  BUILT_IN_PROCEDURES,
  checkStepValue,
  cuedHazards,
  evaluateReading,
  findStep,
  openSteps,
  procedureFor,
  procedureSchema,
  sheetView,
  validateProcedure,
  validateRevision,
  visibleSteps,
  type Procedure,
  type Results,
  type Step,
  type StepValue,
} from "@/lib/procedures";
import { cautionsFor, DEFER_TO_MANUAL, HAZARDOUS_STEP_KINDS } from "@/lib/trade/cautions";
import { ENGINE_TYPES, MACHINE_KINDS } from "@/lib/tickets/machine";

const choice = (...selected: string[]): StepValue => ({ kind: "choice", selected });
const reading = (value: number, unit: string): StepValue => ({ kind: "reading", value, unit });
const byId = (id: string): Procedure => {
  const p = BUILT_IN_PROCEDURES.find((x) => x.id === id);
  if (!p) throw new Error(`no procedure ${id}`);
  return p;
};
const step = (p: Procedure, id: string): Step => {
  const s = findStep(p, id);
  if (!s) throw new Error(`no step ${id} in ${p.id}`);
  return s;
};
const SAW = byId("chain-saw-2t");
const HANDHELD = byId("handheld-2t");
const MOWER = byId("walk-mower-4t");
const GENERATOR = byId("generator-4t");
const clone = (p: Procedure): Procedure => structuredClone(p);
const problemsOf = (input: unknown): string[] => {
  const r = validateProcedure(input);
  return r.ok ? [] : r.problems;
};

describe("built-in procedures", () => {
  it("there are the four the issue asks for, each with a whole-number version", () => {
    expect(BUILT_IN_PROCEDURES.map((p) => p.id)).toEqual(["chain-saw-2t", "handheld-2t", "walk-mower-4t", "generator-4t"]);
    for (const p of BUILT_IN_PROCEDURES) expect(Number.isInteger(p.version) && p.version >= 1).toBe(true);
  });

  it.each(BUILT_IN_PROCEDURES.map((p) => [p.id, p] as const))("%s validates (zod shape and every rule)", (_id, p) => {
    expect(procedureSchema.safeParse(p).success).toBe(true);
    expect(validateProcedure(p)).toEqual({ ok: true, procedure: p });
  });

  it("every hazardous step has cautions from the registry, each ending with the defer-to-manual line", () => {
    let hazardous = 0;
    for (const p of BUILT_IN_PROCEDURES) {
      for (const s of allSteps(p)) {
        for (const kind of s.hazards ?? []) {
          hazardous++;
          const cautions = cautionsFor(kind);
          expect(cautions.length, `${p.id}/${s.id}/${kind}`).toBeGreaterThan(0);
          for (const c of cautions) expect(c.text.endsWith(DEFER_TO_MANUAL)).toBe(true);
        }
      }
    }
    expect(hazardous).toBeGreaterThan(40);
  });

  it("hazard kinds are exactly the registry's ten names", () => {
    expect([...HAZARDOUS_STEP_KINDS].sort()).toEqual(
      ["blade-work", "chain-work", "compressed-air", "electrical-output", "fueling", "hot-muffler", "prime-start", "solvent-cleaning", "spark-test", "test-run"],
    );
  });

  it("the steps where work can hurt someone carry their hazard (issue 5, RULES safety cautions)", () => {
    const expectHazard = (p: Procedure, id: string, kind: string) => expect(step(p, id).hazards ?? [], `${p.id}/${id}`).toContain(kind);
    for (const p of [SAW, HANDHELD, MOWER, GENERATOR]) {
      expectHazard(p, "fuel-level", "fueling");
      expectHazard(p, "primed-start", "prime-start");
      expectHazard(p, "primed-start", "fueling");
      expectHazard(p, "spark-test", "spark-test");
      if (p === MOWER) expectHazard(p, "blade", "blade-work");
      if (p === GENERATOR) expectHazard(p, "load-volts", "electrical-output");
      expectHazard(p, "carb-clean", "solvent-cleaning");
      expectHazard(p, "carb-clean", "compressed-air");
      expectHazard(p, "final-starts", "test-run");
    }
    for (const id of ["chain-direction", "chain-tension", "bar-condition", "chain-brake", "cover-seated", "final-cut", "bar-oiling"]) {
      expectHazard(SAW, id, "chain-work");
    }
    expectHazard(SAW, "piston-look", "hot-muffler");
    expectHazard(HANDHELD, "spark-arrestor", "hot-muffler");
    expectHazard(GENERATOR, "load-volts", "test-run");
  });

  it("the chain saw sheet has everything the issue lists, in bench order", () => {
    const order = allSteps(SAW).map((s) => s.id);
    const expected = [
      "intake-damage", "chain-direction", "chain-tension", "bar-condition", // condition at intake
      "fuel-level", "bar-oil-level", "fuel-filter", "fuel-line", "fuel-condition", // tanks
      "pull-over-feel", "compression-gauge", // compression
      "primed-start", "spark-test", // prime-and-test start, spark test when it will not start
      "leak-where", // where fuel leaks
      "inlet-screen", "metering-diaphragm", "diaphragm-stem", "check-valve", "metering-lever", // carburetor
      "parts-used", "filter-position", // parts, filter at the back of the tank
      "chain-brake", "cover-seated", // brake, side cover and adjuster pin
      "tune", // tune log
      "final-starts", "final-idle", "final-accel", "final-cut", "bar-oiling", // final run
    ];
    const positions = expected.map((id) => order.indexOf(id));
    expect(positions.every((i) => i >= 0), `missing: ${expected.filter((id) => !order.includes(id))}`).toBe(true);
    expect(positions).toEqual([...positions].sort((a, b) => a - b));
  });

  it("the chain saw's choices carry the answers the issue names", () => {
    const options = (id: string) => {
      const s = step(SAW, id);
      return s.kind === "choice" ? s.options.map((o) => o.id) : [];
    };
    expect(options("pull-over-feel")).toEqual(["strong", "fair", "weak"]);
    expect(options("primed-start")).toEqual(["no-start", "ran-briefly", "kept-running"]);
    expect(options("spark-test")).toEqual(["strong", "weak", "none"]);
    expect(options("inlet-screen")).toEqual(["clean", "film", "blocked"]);
    expect(options("metering-diaphragm")).toEqual(["supple", "wrinkled", "stiff", "distorted"]);
    expect(options("diaphragm-stem")).toEqual(expect.arrayContaining(["long", "short"]));
    expect(options("check-valve")).toEqual(["flat", "bent"]);
    expect(options("leak-where")).toEqual(expect.arrayContaining(["line-off-port", "cracked-line", "tank", "vent", "carburetor"]));
    const parts = step(SAW, "parts-used");
    expect(parts.kind).toBe("parts");
    if (parts.kind !== "parts") return;
    expect(parts.catalog.map((p) => p.id)).toEqual(
      expect.arrayContaining(["fuel-line", "fuel-filter", "metering-diaphragm", "carb-gaskets", "carburetor", "spark-plug"]),
    );
    // [practice] common small-engine fuel line inside diameters: 3/32, 1/8, 3/16, 1/4 in (REFERENCES.md)
    expect(parts.catalog.find((p) => p.id === "fuel-line")?.sizes?.map((s) => s.label)).toEqual([
      "3/32 in ID", "1/8 in ID", "3/16 in ID", "1/4 in ID",
    ]);
    const tune = step(SAW, "tune");
    expect(tune.kind === "tune" && tune.screws).toEqual(["low", "high", "idle"]);
  });

  it("the mower and generator sheets have their own checks", () => {
    for (const id of ["oil-level", "oil-condition", "air-filter", "blade", "carb-bowl", "blade-control-stop"]) {
      expect(findStep(MOWER, id), id).toBeDefined();
    }
    for (const id of ["noload-volts", "noload-hertz", "load-volts", "load-hertz", "outlets"]) {
      expect(findStep(GENERATOR, id), id).toBeDefined();
    }
    const lv = step(GENERATOR, "load-volts");
    expect(lv.kind === "reading" && lv.reading).toMatchObject({ quantity: "volts", nominal: 120 });
    const lh = step(GENERATOR, "load-hertz");
    expect(lh.kind === "reading" && lh.reading).toMatchObject({ quantity: "hertz", nominal: 60 });
  });

  it("the same check has the same id everywhere it appears (the guide's rules rely on it)", () => {
    for (const id of ["primed-start", "spark-test", "pull-over-feel", "fuel-condition", "plug-condition", "final-starts"]) {
      const kinds = BUILT_IN_PROCEDURES.map((p) => findStep(p, id)?.kind);
      expect(new Set(kinds), id).toEqual(new Set(["choice"]));
    }
  });
});

describe("procedureFor", () => {
  it("picks the sheet by machine kind and engine type", () => {
    expect(procedureFor("chain_saw", "two_stroke")?.id).toBe("chain-saw-2t");
    for (const kind of ["string_trimmer", "blower", "hedge_trimmer"] as const) {
      expect(procedureFor(kind, "two_stroke")?.id).toBe("handheld-2t");
    }
    expect(procedureFor("walk_mower", "four_stroke")?.id).toBe("walk-mower-4t");
    expect(procedureFor("generator", "four_stroke")?.id).toBe("generator-4t");
  });

  it("has none for machines no sheet covers", () => {
    expect(procedureFor("chain_saw", "electric")).toBeUndefined();
    expect(procedureFor("walk_mower", "two_stroke")).toBeUndefined();
    expect(procedureFor("snow_thrower", "four_stroke")).toBeUndefined();
    // every kind × engine answers without throwing
    for (const k of MACHINE_KINDS) for (const e of ENGINE_TYPES) expect(() => procedureFor(k, e)).not.toThrow();
  });

  it("takes the highest version of a shop's own procedures", () => {
    const v2 = { ...clone(SAW), version: 2, title: "Chain saw (shop's own)" };
    const v3 = { ...clone(SAW), version: 3, title: "Chain saw, third edition" };
    expect(procedureFor("chain_saw", "two_stroke", [v2, SAW, v3])?.version).toBe(3);
  });
});

describe("validateProcedure refuses bad definitions with a clear reason", () => {
  it("a step id used twice", () => {
    const p = clone(SAW);
    p.sections[1]?.steps.push({ ...step(SAW, "fuel-level") });
    expect(problemsOf(p)).toContain('Step id "fuel-level" is used twice.');
  });

  it("a hazardous step without its hazard kind", () => {
    const p = clone(SAW);
    const s = step(p, "spark-test");
    delete s.hazards;
    expect(problemsOf(p).join("\n")).toMatch(/Step "spark-test".*must carry the hazard "spark-test"/);
    const q = clone(SAW);
    q.sections[0]?.steps.push({ id: "clean-it", kind: "pass-fail", title: "Wiped down with solvent" });
    expect(problemsOf(q).join("\n")).toMatch(/"clean-it".*"solvent-cleaning"/);
  });

  it("an unknown hazard kind", () => {
    const p = clone(SAW) as unknown as { sections: { steps: { hazards?: string[] }[] }[] };
    (p.sections[0]?.steps[0] as { hazards?: string[] }).hazards = ["welding"];
    expect(problemsOf(p).join("\n")).toMatch(/hazards/);
  });

  it("showIf on a later step, on a missing step, or on an answer the step cannot give", () => {
    const later = clone(SAW);
    step(later, "fuel-level").showIf = { step: "spark-test", anyOf: ["none"] };
    expect(problemsOf(later).join("\n")).toMatch(/"spark-test", which does not come before it/);

    const missing = clone(SAW);
    step(missing, "spark-test").showIf = { step: "primed-starting", anyOf: ["no-start"] };
    expect(problemsOf(missing).join("\n")).toMatch(/not a step of this procedure/);

    const self = clone(SAW);
    step(self, "spark-test").showIf = { step: "spark-test", anyOf: ["none"] };
    expect(problemsOf(self).join("\n")).toMatch(/does not come before it/);

    const token = clone(SAW);
    step(token, "spark-test").showIf = { step: "primed-start", anyOf: ["wont-start"] };
    expect(problemsOf(token).join("\n")).toMatch(/"primed-start" can never give "wont-start"/);

    const nested = clone(SAW);
    step(nested, "spark-test").showIf = { all: [{ not: { step: "final-cut", anyOf: ["bogs"] } }] };
    expect(problemsOf(nested).join("\n")).toMatch(/"final-cut", which does not come before it/);
  });

  it("a reading verdict in showIf needs a band", () => {
    const p = clone(MOWER);
    p.sections[0]?.steps.push({ id: "gap-check", kind: "pass-fail", title: "Gap re-checked", showIf: { step: "intake-damage", anyOf: ["none"] } });
    expect(problemsOf(p)).toEqual([]);
    const q = clone(MOWER);
    q.sections.at(-1)?.steps.push({ id: "gap-again", kind: "pass-fail", title: "Gap re-checked", showIf: { step: "plug-gap", anyOf: ["low"] } });
    expect(problemsOf(q).join("\n")).toMatch(/"plug-gap" can never give "low"/);
  });

  it("onlyFor outside the procedure's machine kinds, a band upside down, a single choice marked exclusive", () => {
    const only = clone(HANDHELD);
    step(only, "trimmer-head").onlyFor = ["chain_saw"];
    expect(problemsOf(only).join("\n")).toMatch(/onlyFor names "chain_saw"/);

    const band = clone(SAW);
    const gauge = step(band, "compression-gauge");
    if (gauge.kind === "reading" && gauge.reading.quantity === "compression") gauge.reading.ownerBandPsi = { min: 150, max: 100 };
    expect(problemsOf(band).join("\n")).toMatch(/low limit is above its high limit/);

    const excl = clone(SAW);
    const ps = step(excl, "primed-start");
    if (ps.kind === "choice") ps.options[0] = { ...ps.options[0]!, exclusive: true };
    expect(problemsOf(excl).join("\n")).toMatch(/"exclusive" only makes sense on a multi choice/);
  });

  it("bad ids and missing fields come back as zod problems, not throws", () => {
    expect(problemsOf({ ...clone(SAW), id: "Chain Saw" }).join("\n")).toMatch(/^id: /m);
    expect(problemsOf({ ...clone(SAW), version: 1.5 }).join("\n")).toMatch(/^version: /m);
    expect(problemsOf(null).length).toBeGreaterThan(0);
  });
});

describe("hazard cues in a step's words", () => {
  const cues = (title: string, help?: string) => cuedHazards({ title, help });
  it("names the hazardous activity", () => {
    expect(cues("Spark test")).toEqual(["spark-test"]);
    expect(cues("Prime and test start")).toEqual(["prime-start"]);
    expect(cues("Carburetor cleaning", "Parts cleaner spray, outdoors")).toEqual(["solvent-cleaning"]);
    expect(cues("Chain brake engages and releases")).toEqual(["chain-work"]);
    expect(cues("Blow out the fins", "Use compressed air")).toEqual(["compressed-air"]);
    expect(cues("Volts under load")).toEqual(["test-run", "electrical-output"]);
    expect(cues("Blade", "Plug lead off")).toEqual(["blade-work"]);
    expect(cues("Fuel line")).toEqual(["fueling"]);
    expect(cues("Piston through the exhaust port")).toEqual(["hot-muffler"]);
  });
  it("does not mistake look-alike words", () => {
    expect(cues("Spark plug condition")).toEqual([]);
    expect(cues("Spark arrestor screen")).toEqual(["hot-muffler"]);
    expect(cues("Bar-oil level")).toEqual([]);
    expect(cues("Bar oiling")).toEqual([]);
    expect(cues("Primer bulb")).toEqual([]);
    expect(cues("Pull-over compression feel")).toEqual([]);
  });
});

describe("showIf and the visible sheet", () => {
  it("the spark test is shown only when the primed start gave no start", () => {
    const ids = (r: Results) => visibleSteps(SAW, r).map((s) => s.id);
    expect(ids({})).not.toContain("spark-test");
    expect(ids({ "primed-start": choice("ran-briefly") })).not.toContain("spark-test");
    expect(ids({ "primed-start": choice("kept-running") })).not.toContain("spark-test");
    expect(ids({ "primed-start": choice("no-start") })).toContain("spark-test");
  });

  it("the stop switch and coil air gap follow a weak or missing spark", () => {
    const ids = (spark: string) => visibleSteps(SAW, { "primed-start": choice("no-start"), "spark-test": choice(spark) }).map((s) => s.id);
    expect(ids("none")).toEqual(expect.arrayContaining(["stop-switch", "coil-air-gap"]));
    expect(ids("weak")).toEqual(expect.arrayContaining(["stop-switch", "coil-air-gap"]));
    expect(ids("strong")).not.toContain("stop-switch");
  });

  it("a result on a step that became hidden no longer counts, and what hangs on it hides too", () => {
    const results: Results = {
      "primed-start": choice("kept-running"), // changed after the spark test was recorded
      "spark-test": choice("none"),
      "stop-switch": { kind: "pass-fail", pass: false },
    };
    const view = sheetView(SAW, results);
    expect(view.visible.map((s) => s.id)).not.toContain("spark-test");
    expect(view.visible.map((s) => s.id)).not.toContain("stop-switch");
    expect(view.effective["spark-test"]).toBeUndefined();
    expect(view.effective["stop-switch"]).toBeUndefined();
    expect(view.effective["primed-start"]).toEqual(choice("kept-running"));
  });

  it("the piston look follows a weak pull-over or a low gauge reading (verdict from lib/trade readings)", () => {
    const ids = (r: Results) => visibleSteps(SAW, r).map((s) => s.id);
    expect(ids({ "pull-over-feel": choice("strong") })).not.toContain("piston-look");
    expect(ids({ "pull-over-feel": choice("weak") })).toContain("piston-look");
    expect(ids({ "compression-gauge": reading(90, "psi") })).toContain("piston-look"); // [practice] soft band 100–150 psi
    expect(ids({ "compression-gauge": reading(120, "psi") })).not.toContain("piston-look");
  });

  it("onlyFor shows each handheld machine its own working parts", () => {
    const ids = (machineKind: "string_trimmer" | "blower" | "hedge_trimmer") => visibleSteps(HANDHELD, {}, { machineKind }).map((s) => s.id);
    expect(ids("blower")).toContain("blower-fan");
    expect(ids("blower")).not.toContain("trimmer-head");
    expect(ids("string_trimmer")).toContain("trimmer-head");
    expect(ids("hedge_trimmer")).toEqual(expect.arrayContaining(["hedge-blades"]));
    expect(ids("hedge_trimmer")).not.toContain("blower-fan");
  });

  it("open steps leave out optional and hidden ones and shrink as results come in", () => {
    const open0 = openSteps(SAW, {}).map((s) => s.id);
    expect(open0).toContain("primed-start");
    expect(open0).not.toContain("compression-gauge"); // optional
    expect(open0).not.toContain("spark-test"); // hidden
    const open1 = openSteps(SAW, { "primed-start": choice("no-start") }).map((s) => s.id);
    expect(open1).not.toContain("primed-start");
    expect(open1).toContain("spark-test");
  });
});

describe("readings against the step's spec (lib/trade readings)", () => {
  const gauge = step(SAW, "compression-gauge");
  const spec = gauge.kind === "reading" ? gauge.reading : (undefined as never);

  it("compression with no owner band: the soft default 100–150 psi [practice]", () => {
    const low = evaluateReading(spec, 90, "psi");
    expect(low.ok && low.value).toMatchObject({ verdict: "low", soft: true, basis: "common-practice" });
    const within = evaluateReading(spec, 125, "psi");
    expect(within.ok && within.value?.verdict).toBe("within");
  });

  it("compression in kPa against the psi band [NIST SP 811] 1 psi = 6.894757 kPa", () => {
    const r = evaluateReading(spec, 689.5, "kPa"); // 100.0 psi
    expect(r.ok && r.value?.verdict).toBe("within");
    const r2 = evaluateReading(spec, 680, "kPa"); // 98.6 psi
    expect(r2.ok && r2.value?.verdict).toBe("low");
  });

  it("an owner band is hard pass/fail", () => {
    const owned = { ...spec, ownerBandPsi: { min: 110, max: 160 } } as typeof spec;
    const r = evaluateReading(owned, 105, "psi");
    expect(r.ok && r.value).toMatchObject({ verdict: "low", soft: false, basis: "owner-spec" });
  });

  it("a unit the step does not offer, or a non-number, is refused with a message", () => {
    const bar = evaluateReading(spec, 7, "bar");
    expect(bar).toEqual({ ok: false, message: "Pick one of the units of this reading: psi, kPa." });
    const nan = evaluateReading(spec, Number.NaN, "psi");
    expect(nan.ok).toBe(false);
  });

  it("plug gap on a two-stroke: typical 0.5–0.65 mm as a soft band; 0.020 in = 0.508 mm is within [16 CFR 500.19, 1 in = 25.4 mm]", () => {
    const g = step(SAW, "plug-gap");
    if (g.kind !== "reading") throw new Error("not a reading");
    const inches = evaluateReading(g.reading, 0.02, "in");
    expect(inches.ok && inches.value).toMatchObject({ verdict: "within", soft: true, basis: "common-practice" });
    const wide = evaluateReading(g.reading, 0.8, "mm");
    expect(wide.ok && wide.value?.verdict).toBe("high");
    expect(wide.ok && wide.value?.message).toMatch(/common practice/);
  });

  it("plug gap on a four-stroke has no built-in band: recorded, no verdict", () => {
    const g = step(MOWER, "plug-gap");
    if (g.kind !== "reading") throw new Error("not a reading");
    expect(evaluateReading(g.reading, 0.76, "mm")).toEqual({ ok: true, value: null });
    expect(evaluateReading(g.reading, -1, "mm").ok).toBe(false);
  });

  it("generator volts: ANSI C84.1 Range A 114–126 V [memory]; hertz 60 ± 5 % = 57–63 Hz [practice]", () => {
    const v = step(GENERATOR, "load-volts");
    const h = step(GENERATOR, "load-hertz");
    if (v.kind !== "reading" || h.kind !== "reading") throw new Error("not readings");
    const vr = (x: number) => {
      const r = evaluateReading(v.reading, x, "V");
      return r.ok ? r.value?.verdict : r.message;
    };
    const hr = (x: number) => {
      const r = evaluateReading(h.reading, x, "Hz");
      return r.ok ? r.value?.verdict : r.message;
    };
    expect([vr(113.9), vr(114), vr(126), vr(126.1)]).toEqual(["low", "within", "within", "high"]);
    expect([hr(56.9), hr(57), hr(63), hr(63.1)]).toEqual(["low", "within", "within", "high"]);
  });
});

describe("checkStepValue", () => {
  it("a single choice takes one answer; options must exist; an exclusive option stands alone", () => {
    const ps = step(SAW, "primed-start");
    expect(checkStepValue(ps, choice("no-start")).ok).toBe(true);
    expect(checkStepValue(ps, choice("no-start", "kept-running"))).toEqual({ ok: false, message: 'Pick one answer for "Prime and test start".' });
    expect(checkStepValue(ps, choice("flooded"))).toEqual({ ok: false, message: '"flooded" is not one of the choices of "Prime and test start".' });
    const leak = step(SAW, "leak-where");
    expect(checkStepValue(leak, choice("tank", "vent")).ok).toBe(true);
    expect(checkStepValue(leak, choice("none", "vent"))).toEqual({ ok: false, message: '"No leak found" cannot be picked together with other answers.' });
  });

  it("a result of the wrong kind is refused", () => {
    expect(checkStepValue(step(SAW, "chain-brake"), choice("x")).ok).toBe(false);
  });

  it("a tune log is checked by lib/trade tune: a seated screw cannot go further in", () => {
    const tune = step(SAW, "tune");
    const ok = checkStepValue(tune, {
      kind: "tune",
      baselines: { high: { kind: "seated-then-out", eighths: 8 } },
      entries: [{ screw: "high", direction: "cw", eighths: 2 }],
    });
    expect(ok.ok).toBe(true);
    const refused = checkStepValue(tune, {
      kind: "tune",
      baselines: { high: { kind: "seated-then-out", eighths: 1 } },
      entries: [{ screw: "high", direction: "cw", eighths: 2 }],
    });
    expect(refused.ok).toBe(false);
    expect(!refused.ok && refused.message).toMatch(/^Entry 1: Refused/);
    const mower = checkStepValue(step(MOWER, "tune"), { kind: "tune", baselines: {}, entries: [{ screw: "low", direction: "ccw", eighths: 1 }] });
    expect(mower).toEqual({ ok: false, message: "This machine's tune log has no low screw." });
  });

  it("parts: from the step's list, with a size where the part has sizes", () => {
    const parts = step(SAW, "parts-used");
    expect(checkStepValue(parts, { kind: "parts", items: [{ partId: "fuel-line", sizeId: "id-1-8-in", quantity: 1 }] }).ok).toBe(true);
    expect(checkStepValue(parts, { kind: "parts", items: [{ partId: "fuel-line", quantity: 1 }] })).toEqual({
      ok: false,
      message: "Pick the size of the fuel line.",
    });
    expect(checkStepValue(parts, { kind: "parts", items: [{ partId: "muffler", quantity: 1 }] }).ok).toBe(false);
  });

  it("notes and photos must not be empty", () => {
    expect(checkStepValue(step(SAW, "final-note"), { kind: "note", text: "  " }).ok).toBe(false);
    expect(checkStepValue(step(SAW, "final-photo"), { kind: "photo", photoIds: [] }).ok).toBe(false);
    expect(checkStepValue(step(SAW, "final-photo"), { kind: "photo", photoIds: ["a".repeat(64)] }).ok).toBe(true);
  });
});

describe("validateRevision: step ids stay stable in meaning across versions", () => {
  it("a new version may add and remove steps", () => {
    const next = clone(SAW);
    next.version = 2;
    next.sections[0]!.steps = next.sections[0]!.steps.filter((s) => s.id !== "intake-photo");
    next.sections[0]!.steps.push({ id: "intake-hours", kind: "note", title: "Hour meter reading", optional: true });
    expect(validateRevision(SAW, next)).toEqual({ ok: true, removedSteps: ["intake-photo"], addedSteps: ["intake-hours"] });
  });

  it("refuses a kept id that changed kind, lost an option, or a version that did not rise", () => {
    const next = clone(SAW);
    const ps = step(next, "primed-start");
    if (ps.kind === "choice") ps.options = ps.options.filter((o) => o.id !== "ran-briefly");
    const idx = next.sections[1]!.steps.findIndex((s) => s.id === "fuel-level");
    next.sections[1]!.steps[idx] = { id: "fuel-level", kind: "note", title: "Fuel in the tank", hazards: ["fueling"] };
    const r = validateRevision(SAW, next);
    expect(r.ok).toBe(false);
    const text = r.ok ? "" : r.problems.join("\n");
    expect(text).toMatch(/version \(1\) must be higher than 1/);
    expect(text).toMatch(/"primed-start" lost its option "ran-briefly"/);
    expect(text).toMatch(/"fuel-level" changed from choice to note/);
  });
});
