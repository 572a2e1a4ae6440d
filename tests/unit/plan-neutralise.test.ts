import { densityAtMassFractionGPerMl, massFractionFromMolarity } from "../../knowledge/concentration";
import { findSolute } from "../../knowledge/reference";
import { gasMlPerMmol, neutraliseExtract } from "../../knowledge/plan/neutralise";
import { KnowledgeInputError } from "../../knowledge/types";

const M = (value: number) => ({ value, unit: "mol/L" as const });
/** fraction of carbonate as CO2/H2CO3 at pH (pKa 6.35, 10.33; CRC): h² / (h² + h·K1 + K1·K2) */
const co2Share = (pH: number) => {
  const h = 10 ** -pH;
  const K1 = 10 ** -6.35;
  const K2 = 10 ** -10.33;
  return (h * h) / (h * h + h * K1 + K1 * K2);
};
const densityAt = (q: string, molL: number) => {
  const s = findSolute(q)!;
  return densityAtMassFractionGPerMl(s, massFractionFromMolarity(s, molL));
};

describe("CO2 as an ideal gas, V = nRT/P (R = 8.314 462 618 J/mol/K, 1 atm = 101 325 Pa)", () => {
  it.each([
    [25, 24.465], // ≈ 24.5 mL per mmol, the venting rule of thumb (domain brief §4.2)
    [0, 22.414], // molar volume of an ideal gas at 273.15 K and 101.325 kPa: 22.413 97 L/mol (CODATA)
    [20, 24.055],
  ])("%d °C → %d mL per mmol", (t, ml) => {
    expect(gasMlPerMmol(t)).toBeCloseTo(ml, 3);
  });

  it("halves at 2 atm", () => {
    expect(gasMlPerMmol(25, 2)).toBeCloseTo(gasMlPerMmol(25) / 2, 10);
  });
});

describe("recovering a product from its extract", () => {
  it("acidifies a 1 M NaOH extract holding 4 mmol of acid (pKa 4.2) to pH 2.2 with 6 M HCl", () => {
    const r = neutraliseExtract({
      extract: { solute: "NaOH", concentration: M(1), volumeMl: 20 },
      components: [{ name: "acid", kind: "acid", pKa: 4.2, mmol: 4 }],
      reagent: { solute: "HCl", concentration: M(6) },
    });
    expect(r.targetPh).toBeCloseTo(2.2, 10); // default pKa − 2
    // charge balance at pH 2.2: Cl⁻ = Na⁺ + H⁺ − A⁻, with Na⁺ 20 mmol, A⁻ = 4/(1 + 10²), H⁺ = 10^−2.2·(20 + x/6)
    const h = 10 ** -2.2;
    const x = (20 - 4 / 101 + 20 * h) / (1 - h / 6);
    expect(r.reagentMmol).toBeCloseTo(x, 3);
    expect(r.reagentVolumeMl).toBeCloseTo(x / 6, 4);
    expect(r.excessWashMmol).toBeCloseTo(16, 10);
    expect(r.componentsMmol).toBe(4);
    expect(r.componentsNeutralFraction[0]!.fractionNeutral).toBeCloseTo(100 / 101, 10);
    expect(r.co2Mmol).toBe(0);
  });

  it("warms by q/(m·cp): 50 mmol of free NaOH in 100 mL neutralised releases 50 mmol × 55.8 kJ/mol", () => {
    const r = neutraliseExtract({
      extract: { solute: "NaOH", concentration: M(0.5), volumeMl: 100 },
      components: [{ name: "acid", kind: "acid", pKa: 4.8, mmol: 0 }],
      reagent: { solute: "HCl", concentration: M(6) },
    });
    expect(r.waterFormedMmol).toBeCloseTo(50, 2);
    expect(r.heatJ).toBeCloseTo(0.05 * 55800, 0);
    const massG = 100 * densityAt("NaOH", 0.5) + r.reagentVolumeMl * densityAt("HCl", 6);
    expect(r.mixtureMassG).toBeCloseTo(massG, 6);
    expect(r.temperatureRiseK).toBeCloseTo(2790 / (massG * 4.18), 2); // ≈ 6 °C
    expect(r.warnings.map((w) => w.code)).toContain("exotherm");
  });

  it("releases CO2 when a bicarbonate extract is acidified, about 24.5 mL per mmol at 25 °C", () => {
    const r = neutraliseExtract({
      extract: { solute: "NaHCO3", concentration: M(1), volumeMl: 10 },
      components: [{ name: "acid", kind: "acid", pKa: 4.2, mmol: 0 }],
      reagent: { solute: "HCl", concentration: M(6) },
      targetPh: 2,
      temperatureC: 25,
    });
    const startPh = r.startPh;
    expect(startPh).toBeCloseTo(8.34, 1);
    const co2 = 10 * (co2Share(2) - co2Share(startPh));
    expect(r.co2Mmol).toBeCloseTo(co2, 3);
    expect(r.co2Ml).toBeCloseTo(co2 * 24.465, 1);
    expect(r.co2Ml / r.reagentMmol).toBeGreaterThan(24.5 * 0.95);
    expect(r.warnings.map((w) => w.code)).toContain("co2-gas");
  });

  it("gives no gas for the first equivalent of acid on carbonate (it makes bicarbonate)", () => {
    const toBicarbonate = neutraliseExtract({
      extract: { solute: "Na2CO3", concentration: M(1), volumeMl: 10 },
      components: [{ kind: "acid", pKa: 10.3, mmol: 0 }],
      reagent: { solute: "HCl", concentration: M(6) },
      targetPh: (6.35 + 10.33) / 2,
    });
    expect(toBicarbonate.reagentMmol).toBeCloseTo(10, 1); // one equivalent
    expect(toBicarbonate.co2Mmol).toBeLessThan(0.02 * 10); // only the bicarbonate's own 1 % disproportionation
    const toAcid = neutraliseExtract({
      extract: { solute: "Na2CO3", concentration: M(1), volumeMl: 10 },
      components: [{ kind: "acid", pKa: 10.3, mmol: 0 }],
      reagent: { solute: "HCl", concentration: M(6) },
      targetPh: 2,
    });
    expect(toAcid.reagentMmol).toBeCloseTo(20, 0); // two equivalents
    expect(toAcid.co2Mmol).toBeCloseTo(10 * co2Share(2), 2);
  });

  it("basifies an HCl extract of an amine (pKaH 9.5) to pH 11.5 with 2 M NaOH, the leftover acid first", () => {
    const r = neutraliseExtract({
      extract: { solute: "HCl", concentration: M(1), volumeMl: 40 },
      components: [{ name: "amine", kind: "base", pKa: 9.5, mmol: 4 }],
      reagent: { solute: "NaOH", concentration: M(2) },
    });
    expect(r.direction).toBe("basify");
    expect(r.targetPh).toBeCloseTo(11.5, 10);
    expect(r.excessWashMmol).toBeCloseTo(36, 10);
    // Na⁺ = Cl⁻ + OH⁻ − BH⁺ at pH 11.5: 40 + 10^(11.5−13.995)·V − 4/(1 + 10²)
    const oh = 10 ** (11.5 - 13.995);
    const x = (40 - 4 / 101 + 40 * oh) / (1 - oh / 2);
    expect(r.reagentMmol).toBeCloseTo(x, 2);
    expect(r.waterFormedMmol).toBeCloseTo(36, 1);
  });

  it("refuses a base to recover an acid, and mixed kinds", () => {
    const base = { extract: { solute: "NaOH", concentration: M(1), volumeMl: 20 }, reagent: { solute: "NaOH", concentration: M(2) } };
    expect(() => neutraliseExtract({ ...base, components: [{ kind: "acid", pKa: 4, mmol: 1 }] })).toThrow(KnowledgeInputError);
    expect(() =>
      neutraliseExtract({
        ...base,
        reagent: { solute: "HCl", concentration: M(6) },
        components: [
          { kind: "acid", pKa: 4, mmol: 1 },
          { kind: "base", pKa: 9, mmol: 1 },
        ],
      }),
    ).toThrow(KnowledgeInputError);
  });
});
