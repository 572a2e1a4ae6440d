import {
  distributionCurve,
  distributionRatio,
  equilibratePass,
  fractionLeftInOrganic,
  fractionNeutral,
  partitionCoefficientOf,
} from "../../knowledge/plan/distribution";
import { washMixture, washChemistryFor } from "../../knowledge/plan/wash-chemistry";
import { KnowledgeInputError } from "../../knowledge/types";

const hcl = washChemistryFor("hydrochloric-acid")!;

describe("Henderson–Hasselbalch fraction of the neutral form", () => {
  // hand-computed: acid 1/(1 + 10^(pH − pKa)), base 1/(1 + 10^(pKa − pH))
  it.each([
    ["carboxylic acid in sat. NaHCO3", "acid", 4.2, 8.3, 1 / (1 + 10 ** 4.1)], // 99.992 % ionised
    ["phenol in sat. NaHCO3", "acid", 10.0, 8.3, 1 / (1 + 10 ** -1.7)], // ~2 % ionised
    ["4-nitrophenol in sat. NaHCO3", "acid", 7.15, 8.3, 1 / (1 + 10 ** 1.15)], // ~93 % ionised
    ["acid at its pKa", "acid", 4.76, 4.76, 0.5],
    ["base at its pKa", "base", 9.5, 9.5, 0.5],
    ["base two units above its pKa", "base", 9.5, 11.5, 1 / 1.01],
    ["amine in 1 M HCl", "base", 9.5, 0, 1 / (1 + 10 ** 9.5)],
  ] as const)("%s", (_label, kind, pKa, pH, expected) => {
    expect(fractionNeutral(kind, pKa, pH)).toBeCloseTo(expected, 10);
  });

  it("puts a carboxylic acid 99.99 % in its salt form at pH 8.3 and a phenol only about 2 %", () => {
    expect(1 - fractionNeutral("acid", 4.2, 8.3)).toBeGreaterThan(0.9999);
    expect(1 - fractionNeutral("acid", 10.0, 8.3)).toBeCloseTo(0.0196, 3);
  });

  it("treats a neutral component as always neutral and refuses an acid without pKa", () => {
    expect(fractionNeutral("neutral", undefined, 14)).toBe(1);
    expect(() => fractionNeutral("acid", undefined, 7)).toThrow(KnowledgeInputError);
  });
});

describe("distribution ratio and one pass", () => {
  it("gives D ≈ 47 for 2-nitroaniline (log P 1.85, pKaH −0.3) in 1 M HCl (pH 0)", () => {
    // hand-computed: 10^1.85 / (1 + 10^(−0.3 − 0)) = 70.8 × 0.666 = 47.2
    const K = partitionCoefficientOf({ logP: 1.85 });
    expect(K.estimated).toBe(true);
    expect(distributionRatio(K.value, "base", -0.3, 0)).toBeCloseTo(10 ** 1.85 / (1 + 10 ** -0.3), 6);
    expect(distributionRatio(K.value, "base", -0.3, 0)).toBeCloseTo(47.2, 0);
  });

  it("leaves D·Vorg/(D·Vorg + Vaq) in the organic layer", () => {
    // D = 5, 50 mL organic against 20 mL water: 250 / 270
    expect(fractionLeftInOrganic(5, 50, 20)).toBeCloseTo(250 / 270, 12);
    expect(fractionLeftInOrganic(0, 50, 20)).toBe(0);
  });

  it("draws D against pH: half the acid's K at its pKa, rising to K below it", () => {
    const curve = distributionCurve({ kind: "acid", pKa: 4.2, partitionCoefficient: 100 }, 50, 20, 0, 14, 0.1);
    expect(curve).toHaveLength(141);
    const at = (pH: number) => curve.find((p) => Math.abs(p.pH - pH) < 1e-9)!;
    expect(at(4.2).distributionRatio).toBeCloseTo(50, 6);
    expect(at(0).distributionRatio).toBeCloseTo(100 / (1 + 10 ** -4.2), 6);
    expect(at(8.2).fractionInOrganic).toBeCloseTo(fractionLeftInOrganic(100 / (1 + 10 ** 4), 50, 20), 10);
  });

  it("prefers a given K over log P and needs one of them", () => {
    expect(partitionCoefficientOf({ partitionCoefficient: 40, logP: 3 })).toEqual({ value: 40, estimated: false });
    expect(() => partitionCoefficientOf({ name: "x" })).toThrow(KnowledgeInputError);
  });
});

describe("capacity of a wash", () => {
  it("takes at most the 2 mmol of acid in 2 mL of 1 M HCl from 4 mmol of amine", () => {
    const r = equilibratePass(50, 2, washMixture(hcl, 1), [{ kind: "base", pKa: 9.5, partitionCoefficient: 40, mmol: 4 }]);
    const c = r.components[0]!;
    expect(c.mmolIonisedInAqueous).toBeLessThanOrEqual(2 + 1e-9);
    expect(c.mmolIonisedInAqueous).toBeGreaterThan(1.999);
    // the rest stays as free amine; its neutral share in 2 mL is K-partitioned: 2 mmol × 2 / (40 × 50 + 2)
    const neutralInWater = (2 * 2) / (40 * 50 + 2);
    expect(c.mmolInAqueous).toBeCloseTo(2 + neutralInWater, 3);
    // Henderson–Hasselbalch in the water: pH = pKa + log([B]aq/[BH+]) = 9.5 + log((2/50/40)/(2/2)) = 6.5
    expect(r.pH).toBeCloseTo(6.5, 1);
  });

  it("gives the available acid to the stronger base first", () => {
    const r = equilibratePass(50, 2, washMixture(hcl, 1), [
      { kind: "base", pKa: 10.75, partitionCoefficient: 100, mmol: 2 }, // triethylamine-like
      { kind: "base", pKa: 5.2, partitionCoefficient: 10, mmol: 2 }, // pyridine-like
    ]);
    expect(r.components[0]!.mmolIonisedInAqueous).toBeGreaterThan(0.95 * 2);
    expect(r.components[1]!.mmolIonisedInAqueous).toBeLessThan(0.05 * 2);
  });

  it("keeps the wash pH when the wash holds plenty", () => {
    // 20 mmol HCl, 4 mmol amine taken up: 16 mmol left in 20 mL → pH = −log 0.8
    const r = equilibratePass(50, 20, washMixture(hcl, 1), [{ kind: "base", pKa: 9.5, partitionCoefficient: 40, mmol: 4 }]);
    expect(r.pH).toBeCloseTo(-Math.log10(0.8), 4);
  });
});
