import { SHIPPED_REFERENCE } from "../../knowledge/reference";
import { computePlan, type PlanInput } from "../../knowledge/plan/plan";
import { gasMlPerMmol } from "../../knowledge/plan/neutralise";
import { co2SaturationMolL } from "../../knowledge/plan/wash-chemistry";
import { KnowledgeInputError, type ReferenceData } from "../../knowledge/types";

const M = (value: number) => ({ value, unit: "mol/L" as const });
const hh = { acid: (pKa: number, pH: number) => 1 / (1 + 10 ** (pH - pKa)), base: (pKa: number, pH: number) => 1 / (1 + 10 ** (pKa - pH)) };
/** fraction left in 50 mL organic after one pass against 20 mL: D·50 / (D·50 + 20) */
const left = (D: number) => (D * 50) / (D * 50 + 20);

// A fictional work-up: an amine, a carboxylic acid and a neutral product in 50 mL ethyl acetate.
const threeWashes: PlanInput = {
  organic: { solvent: "ethyl acetate", volumeMl: 50 },
  components: [
    { name: "amine", kind: "base", pKa: 9.5, partitionCoefficient: 40, amountMmol: 4 },
    { name: "carboxylic acid", kind: "acid", pKa: 4.2, partitionCoefficient: 100, amountMmol: 2 },
    { name: "neutral product", kind: "neutral", partitionCoefficient: 5, amountMmol: 3 },
  ],
  washes: [
    { aqueous: { solute: "HCl", concentration: M(1) }, volumeMl: 20, repeats: 2 },
    { aqueous: { solute: "NaHCO3", concentration: "saturated" }, volumeMl: 20 },
    { aqueous: { solute: "brine", concentration: "saturated" }, volumeMl: 20 },
  ],
  temperatureC: 20,
};

describe("three-wash plan (1 M HCl × 2, sat. NaHCO3, brine) tracking an amine, an acid and a neutral", () => {
  const plan = computePlan(threeWashes);
  const frac = (step: number, name: string) => plan.steps[step]!.components.find((c) => c.name === name)!.fractionInOrganic;

  it("has one step per pass, in order, with the organic layer on top throughout", () => {
    expect(plan.steps.map((s) => [s.wash, s.pass])).toEqual([[0, 1], [0, 2], [1, 1], [2, 1]]);
    expect(plan.steps.every((s) => s.top === "organic" && s.bottom === "aqueous")).toBe(true);
    expect(plan.steps.every((s) => s.totalVolumeMl === 70)).toBe(true);
    expect(plan.funnelMl).toBe(125); // 70 mL ≤ 3/4 of 125
  });

  it("neutral product: (250/270)ⁿ left after n passes at K = 5", () => {
    [1, 2, 3, 4].forEach((n, i) => expect(frac(i, "neutral product")).toBeCloseTo((250 / 270) ** n, 10));
  });

  it("amine: HCl pass 1 ends at pH −log(16 mmol / 20 mL) and leaves D·50/(D·50 + 20) with D = 40·f_neutral", () => {
    const pH1 = -Math.log10(16 / 20);
    expect(plan.steps[0]!.aqueousPh).toBeCloseTo(pH1, 4);
    expect(plan.steps[0]!.washPh).toBeCloseTo(0, 4);
    expect(frac(0, "amine")).toBeCloseTo(left(40 * hh.base(9.5, pH1)), 12);
    expect(frac(3, "amine")).toBeLessThan(1e-12);
  });

  it("acid: stays in the organic through the HCl passes (pH ≈ 0.1, then 0)", () => {
    const pH1 = -Math.log10(16 / 20);
    const after1 = left(100 * hh.acid(4.2, pH1));
    expect(frac(0, "carboxylic acid")).toBeCloseTo(after1, 8);
    expect(frac(1, "carboxylic acid")).toBeCloseTo(after1 * left(100 * hh.acid(4.2, 0)), 6);
  });

  it("acid: the bicarbonate pass buffers near pKa1 + log([HCO3⁻]/[CO2]sat) and leaves ≈ 6 %", () => {
    // hand iteration: 1.984 mmol acid meets 22.0 mmol HCO3⁻; ~1.86 mmol taken up → [HCO3⁻] ≈ 1.007 M;
    // CO2 held at its 1 atm solubility at 20 °C (Henry's law) → pH ≈ 6.35 + log(1.007/0.039) = 7.76
    const step = plan.steps[2]!;
    const s = co2SaturationMolL(20);
    expect(s).toBeCloseTo(0.039, 3);
    expect(step.washPh).toBeCloseTo(8.34, 2);
    expect(step.aqueousPh).toBeCloseTo(6.35 + Math.log10(1.007 / s), 1);
    const fracBefore = frac(1, "carboxylic acid");
    // Henderson–Hasselbalch at the pass's own pH, then one-pass split
    expect(frac(2, "carboxylic acid")).toBeCloseTo(fracBefore * left(100 * hh.acid(4.2, step.aqueousPh)), 8);
    expect(frac(2, "carboxylic acid")).toBeGreaterThan(0.055);
    expect(frac(2, "carboxylic acid")).toBeLessThan(0.07);
  });

  it("counts the CO2 the acid makes from bicarbonate (up to 1 mmol per mmol taken up) at 24.06 mL/mmol (20 °C)", () => {
    const step = plan.steps[2]!;
    const taken = 2 * (frac(1, "carboxylic acid") - frac(2, "carboxylic acid"));
    expect(step.co2Mmol).toBeGreaterThan(0.85 * taken);
    expect(step.co2Mmol).toBeLessThanOrEqual(taken);
    expect(step.co2Ml).toBeCloseTo(step.co2Mmol * gasMlPerMmol(20), 9);
    const co2 = plan.warnings.find((w) => w.code === "co2-gas");
    expect(co2?.message).toMatch(/about 4\d mL of CO2 \(/);
    expect(co2?.message).toMatch(/Acid wash 1/);
  });

  it("brine is neutral (pH 7.0) and takes almost none of the acid left", () => {
    const step = plan.steps[3]!;
    expect(step.washPh).toBeCloseTo(7.0, 2);
    expect(step.components.find((c) => c.name === "carboxylic acid")!.fractionInAqueousThisPass).toBeLessThan(0.002);
  });

  it("lists the washes that removed each component", () => {
    expect(plan.final.components.map((c) => [c.name, c.removedBy])).toEqual([
      ["amine", [0]],
      ["carboxylic acid", [1]],
      ["neutral product", [0, 1, 2]],
    ]);
    expect(plan.final.components[2]!.fractionInOrganic).toBeCloseTo((250 / 270) ** 4, 10);
    expect(plan.final.components[2]!.mmolInOrganic).toBeCloseTo(3 * (250 / 270) ** 4, 10);
  });

  it("warns about ethyl acetate's water uptake but not about hydrolysis, peroxides or halogenated waste", () => {
    const codes = plan.warnings.map((w) => w.code);
    expect(codes).toContain("partial-miscibility");
    expect(codes).not.toContain("ester-hydrolysis");
    expect(codes).not.toContain("peroxide-former");
    expect(codes).not.toContain("halogenated");
    expect(codes).not.toContain("wash-capacity");
  });
});

describe("plan warnings", () => {
  const base = (over: Partial<PlanInput>): PlanInput => ({ ...threeWashes, ...over });

  it("limits the transfer and warns when the wash runs out: 4 mmol amine vs 2 mL of 1 M HCl", () => {
    const plan = computePlan(
      base({
        components: [{ name: "amine", kind: "base", pKa: 9.5, partitionCoefficient: 40, amountMmol: 4 }],
        washes: [{ aqueous: { solute: "HCl", concentration: M(1) }, volumeMl: 2 }],
      }),
    );
    const step = plan.steps[0]!;
    expect(step.capacityExceeded).toBe(true);
    const removed = 4 * (1 - step.components[0]!.fractionInOrganic);
    expect(removed).toBeLessThanOrEqual(2 + (2 * 2) / (40 * 50 + 2) + 1e-6); // 2 mmol as salt + the free amine's share
    expect(removed).toBeGreaterThan(1.99);
    expect(step.aqueousPh).toBeCloseTo(6.5, 1); // 9.5 + log((2/50/40) / (2/2))
    expect(plan.warnings.find((w) => w.code === "wash-capacity")?.message).toMatch(/holds 2\.00 mmol of acid but the bases need 4\.00 mmol/);
  });

  it("warns that an ester solvent hydrolyses in strong base, and that greasy acids emulsify as soaps", () => {
    const plan = computePlan(
      base({
        components: [{ name: "fatty acid", kind: "acid", pKa: 4.8, logP: 5, amountMmol: 1 }],
        washes: [{ aqueous: { solute: "NaOH", concentration: M(1) }, volumeMl: 20 }],
      }),
    );
    const codes = plan.warnings.map((w) => w.code);
    expect(codes).toContain("ester-hydrolysis");
    expect(codes).toContain("emulsion-prone");
    expect(plan.assumptions.some((a) => a.includes("octanol–water"))).toBe(true);
  });

  it("puts dichloromethane below the aqueous layer and flags halogenated waste; 2-MeTHF flags peroxides", () => {
    const dcm = computePlan(base({ organic: { solvent: "DCM", volumeMl: 50 } }));
    expect(dcm.steps.every((s) => s.bottom === "organic")).toBe(true);
    expect(dcm.warnings.map((w) => w.code)).toContain("halogenated");
    const meTHF = computePlan(base({ organic: { solvent: "2-MeTHF", volumeMl: 50 } }));
    expect(meTHF.warnings.map((w) => w.code)).toContain("peroxide-former");
  });

  it("warns of litres of CO2 when a carbonate wash meets a lot of acid", () => {
    const plan = computePlan(
      base({
        organic: { solvent: "ethyl acetate", volumeMl: 400 },
        components: [{ name: "acid", kind: "acid", pKa: 3.5, partitionCoefficient: 20, amountMmol: 60 }],
        washes: [{ aqueous: { solute: "NaHCO3", concentration: "saturated" }, volumeMl: 300 }],
      }),
    );
    expect(plan.steps[0]!.co2Ml).toBeGreaterThan(1000);
    expect(plan.warnings.map((w) => w.code)).toContain("co2-litres");
    expect(plan.funnelMl).toBe(1000); // 700 mL ≤ 750
  });

  it("treats logP as K = P and grams with molar mass as mmol", () => {
    const a = computePlan(base({ components: [{ name: "x", kind: "acid", pKa: 4.2, partitionCoefficient: 100, amountMmol: 4 }] }));
    const b = computePlan(base({ components: [{ name: "x", kind: "acid", pKa: 4.2, logP: 2, amountG: 0.5, molarMassGPerMol: 125 }] }));
    expect(b.final.components[0]!.fractionInOrganic).toBeCloseTo(a.final.components[0]!.fractionInOrganic, 3);
    expect(b.final.components[0]!.mmolInOrganic).toBeCloseTo(4 * b.final.components[0]!.fractionInOrganic, 10);
  });
});

describe("plan input errors", () => {
  it.each([
    ["components[0].pKa", { components: [{ name: "b", kind: "base", partitionCoefficient: 1, amountMmol: 1 }] }],
    ["components[0].amountMmol", { components: [{ name: "n", kind: "neutral", partitionCoefficient: 1 }] }],
    ["components[0].molarMassGPerMol", { components: [{ name: "n", kind: "neutral", partitionCoefficient: 1, amountG: 1 }] }],
    ["components[0].partitionCoefficient", { components: [{ name: "n", kind: "neutral", amountMmol: 1 }] }],
    ["washes", { washes: [] }],
    ["washes[0].repeats", { washes: [{ aqueous: { solute: "water" }, volumeMl: 10, repeats: 0 }] }],
    ["washes[0].aqueous.solute", { washes: [{ aqueous: { solute: "ethanol" }, volumeMl: 10 }] }],
    ["organic.solvent", { organic: { solvent: "unobtainium", volumeMl: 10 } }],
    ["organic.volumeMl", { organic: { solvent: "toluene", volumeMl: 0 } }],
  ])("names %s", (field, over) => {
    try {
      computePlan({ ...threeWashes, ...(over as Partial<PlanInput>) });
      throw new Error("no error");
    } catch (e) {
      expect(e).toBeInstanceOf(KnowledgeInputError);
      expect((e as KnowledgeInputError).field).toBe(field);
    }
  });
});

describe("a lab group's corrected reference data flows through the plan", () => {
  it("uses the group's solvent density for the layer order", () => {
    const heavy: ReferenceData = {
      ...SHIPPED_REFERENCE,
      solvents: SHIPPED_REFERENCE.solvents.map((s) =>
        s.key === "ethyl-acetate" ? { ...s, densityGPerMl20C: { value: 1.3, source: "from-memory" } } : s,
      ),
    };
    const plan = computePlan(threeWashes, heavy);
    expect(plan.steps[0]!.top).toBe("aqueous");
    expect(computePlan(threeWashes).steps[0]!.top).toBe("organic");
  });
});

describe("CO2 from a bicarbonate wash repeated", () => {
  // 6 mmol of a carboxylic acid (pKa 4.2, K 100) against 2 × 20 mL sat. NaHCO3: the first pass
  // takes up most of the acid, so it makes most of the gas.
  const plan = computePlan({
    organic: { solvent: "ethyl acetate", volumeMl: 50 },
    components: [{ name: "carboxylic acid", kind: "acid", pKa: 4.2, partitionCoefficient: 100, amountMmol: 6 }],
    washes: [{ aqueous: { solute: "NaHCO3", concentration: "saturated" }, volumeMl: 20, repeats: 2 }],
    temperatureC: 20,
  });

  it("warns with the largest pass, not the average of the passes", () => {
    const [first, second] = plan.steps.map((s) => s.co2Ml);
    expect(first).toBeGreaterThan(2 * second!);
    const message = plan.warnings.find((w) => w.code === "co2-gas")!.message;
    expect(message).toContain(`up to ${Math.round(first!)} mL of CO2 in one pass`);
    const total = plan.steps.reduce((a, s) => a + s.co2Mmol, 0);
    expect(message).toContain(`${total.toFixed(1)} mmol over 2 passes`);
  });
});
