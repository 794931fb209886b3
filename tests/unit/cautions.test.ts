import { describe, expect, it } from "vitest";
import {
  CAUTIONS,
  cautionById,
  cautionsFor,
  DEFER_TO_MANUAL,
  HAZARDOUS_STEP_KINDS,
  HAZARDOUS_STEP_LABELS,
  isHazardousStepKind,
  SIGNAL_WORDS,
} from "@/lib/trade/cautions";

const byId = (id: string) => {
  const c = cautionById(id);
  if (!c) throw new Error(`missing caution ${id}`);
  return c;
};

describe("registry shape", () => {
  it("every hazardous step kind has at least one caution", () => {
    // The list: fueling, prime-and-test start, spark test, solvent cleaning, test run / cut test, chain work
    for (const kind of ["fueling", "prime-start", "spark-test", "solvent-cleaning", "test-run", "chain-work"]) {
      expect(HAZARDOUS_STEP_KINDS).toContain(kind);
    }
    for (const kind of HAZARDOUS_STEP_KINDS) {
      expect(cautionsFor(kind).length, kind).toBeGreaterThan(0);
      expect(HAZARDOUS_STEP_LABELS[kind]).toBeTruthy();
    }
  });

  it("every caution has an id, signal word, title, own text, source and marker; ids are unique", () => {
    const ids = new Set<string>();
    for (const c of CAUTIONS) {
      expect(ids.has(c.id), c.id).toBe(false);
      ids.add(c.id);
      expect(SIGNAL_WORDS).toContain(c.signalWord); // [ANSI Z535 / ISO 3864 signal words]
      expect(c.title.length).toBeGreaterThan(5);
      expect(c.source.length).toBeGreaterThan(5);
      expect(["read", "memory", "practice"]).toContain(c.marker);
      expect(c.appliesTo.length).toBeGreaterThan(0);
      for (const k of c.appliesTo) expect(isHazardousStepKind(k)).toBe(true);
      if (c.marker === "practice") expect(c.source).toMatch(/common practice/i);
    }
  });

  it("every caution's text ends with the deferral to the maker's manual, local codes and licensed practice", () => {
    expect(DEFER_TO_MANUAL).toBe("Follow the maker's manual, local codes and licensed practice.");
    for (const c of CAUTIONS) {
      expect(c.text.endsWith(DEFER_TO_MANUAL), c.id).toBe(true);
      expect(c.text.length).toBeGreaterThan(DEFER_TO_MANUAL.length + 20);
    }
  });

  it("non-hazardous steps get no cautions; lists come most severe first", () => {
    expect(cautionsFor("inspect")).toEqual([]);
    const rank = (w: string) => SIGNAL_WORDS.indexOf(w as (typeof SIGNAL_WORDS)[number]);
    for (const kind of HAZARDOUS_STEP_KINDS) {
      const words = cautionsFor(kind).map((c) => rank(c.signalWord));
      expect(words).toEqual([...words].sort((a, b) => a - b));
    }
  });
});

describe("content against the sources", () => {
  it("fueling: 10 ft (3 m) from ignition sources [OSHA 29 CFR 1910.266(e)(2)(iv)]", () => {
    const c = byId("fuel-away-from-ignition");
    expect(c.source).toBe("OSHA 29 CFR 1910.266(e)(2)(iv)");
    expect(c.marker).toBe("read");
    expect(c.text).toMatch(/10 ft \(3 m\)/);
    expect(cautionsFor("fueling")).toContainEqual(c);
  });

  it("starting: 10 ft from fueling, on the ground, chain brake on, no drop-start [OSHA 29 CFR 1910.266(e)(2)]", () => {
    const ids = cautionsFor("prime-start").map((c) => c.id);
    expect(ids).toEqual(expect.arrayContaining(["start-away-from-fueling", "start-supported-no-drop-start", "start-chain-brake-on"]));
    expect(byId("start-away-from-fueling").text).toMatch(/10 ft \(3 m\)/);
    expect(byId("start-supported-no-drop-start").text).toMatch(/drop-start/);
    expect(byId("start-chain-brake-on").marker).toBe("memory"); // [REFERENCES: memory for the clause]
    expect(byId("start-away-from-fueling").markerNote).toMatch(/memory/); // [REFERENCES: memory for the clause letter]
  });

  it("PPE: leg, foot, eye/face [OSHA 29 CFR 1910.266(d)(1)(iv),(v),(vii)] and hearing [29 CFR 1910.95, from memory]", () => {
    const ppe = byId("ppe-running-saw");
    expect(ppe.text).toMatch(/upper thigh to the boot top/);
    expect(ppe.text).toMatch(/footwear/);
    expect(ppe.text).toMatch(/eye or face/);
    expect(ppe.source).toMatch(/\(d\)\(1\)\(iv\).*\(d\)\(1\)\(v\).*\(d\)\(1\)\(vii\)/);
    const hearing = byId("ppe-hearing");
    expect(hearing.source).toMatch(/1910\.95/);
    expect(hearing.marker).toBe("memory");
    expect(cautionsFor("test-run").map((c) => c.id)).toEqual(expect.arrayContaining(["ppe-running-saw", "ppe-hearing"]));
  });

  it("aerosol cleaners: flammable, ventilation, eye protection; chlorinated + heat from memory [GHS SDS H222/H229/H336/H319/H304; P210/P271/P280]", () => {
    const kinds = cautionsFor("solvent-cleaning").map((c) => c.id);
    expect(kinds).toEqual(expect.arrayContaining(["aerosol-flammable", "aerosol-ventilation", "aerosol-eyes", "chlorinated-cleaner-heat"]));
    expect(byId("aerosol-flammable").source).toMatch(/H222.*H229.*P210/);
    expect(byId("aerosol-ventilation").source).toMatch(/H336.*P271/);
    expect(byId("aerosol-eyes").source).toMatch(/H319.*H304.*P280/);
    expect(byId("chlorinated-cleaner-heat").text).toMatch(/phosgene/);
    expect(byId("chlorinated-cleaner-heat").marker).toBe("memory"); // [REFERENCES: memory]
  });

  it("ethanol over 10 % is not for small engines [40 CFR 80.1504(a)(1); 40 CFR part 1090; NC State AG-763W]", () => {
    const c = byId("ethanol-e10-max");
    expect(c.source).toMatch(/40 CFR 80\.1504\(a\)\(1\)/);
    expect(c.source).toMatch(/part 1090/);
    expect(c.text).toMatch(/E15, E20 or E85/);
    expect(cautionsFor("fueling")).toContainEqual(c);
  });

  it("spark testing: grounded plug or gapped tester, away from fuel and the open plug hole [common practice, no single source]", () => {
    const c = byId("spark-test-fire");
    expect(c.text).toMatch(/gapped spark tester/);
    expect(c.text).toMatch(/open spark-plug hole/);
    expect(c.text).toMatch(/fuel/);
    expect(c.marker).toBe("practice");
  });

  it("compressed air below 30 psi with chip guarding [OSHA 29 CFR 1910.242(b)]", () => {
    const c = byId("compressed-air-30-psi");
    expect(c.source).toBe("OSHA 29 CFR 1910.242(b)");
    expect(c.text).toMatch(/less than 30 psi/);
    expect(c.text).toMatch(/chip guarding/);
    expect(cautionsFor("compressed-air")).toContainEqual(c);
  });

  it("hot muffler and chain handling [common practice, no single source]; kickback devices [OSHA 29 CFR 1910.266(e)(2)(i); ANSI/OPEI B175.1-2012]", () => {
    expect(cautionsFor("hot-muffler").map((c) => c.id)).toContain("hot-muffler");
    const chain = cautionsFor("chain-work").map((c) => c.id);
    expect(chain).toEqual(expect.arrayContaining(["chain-sharp-gloves", "chain-engine-off", "kickback-devices", "chain-brake-test"]));
    expect(byId("chain-sharp-gloves").text).toMatch(/gloves/);
    expect(byId("kickback-devices").text).toMatch(/9 February 1995/);
  });
});

describe("blades and live output", () => {
  it("blade work starts with the plug lead off [common practice, no single source]", () => {
    const ids = cautionsFor("blade-work").map((c) => c.id);
    expect(ids).toContain("blade-plug-lead-off");
    expect(byId("blade-plug-lead-off").marker).toBe("practice");
  });

  it("generator output work warns of live outlets and forbids backfeeding [NFPA 70 Art. 702, from memory]", () => {
    const cautions = cautionsFor("electrical-output");
    expect(cautions[0]).toMatchObject({ id: "output-no-backfeed", signalWord: "DANGER", marker: "memory" });
    expect(cautions.map((c) => c.id)).toContain("output-live-outlets");
    for (const c of cautions) expect(c.text.endsWith(DEFER_TO_MANUAL)).toBe(true);
  });
});
