import { densityAtMassFractionGPerMl } from "../../knowledge/concentration";
import { findSolute } from "../../knowledge/reference";
import { PKW_25C } from "../../knowledge/plan/acid-base";
import { ACTIVITY_NOTE, washPh } from "../../knowledge/plan/wash-chemistry";
import { KnowledgeInputError } from "../../knowledge/types";

/*
 * Expected values are hand formulas with the tabulated constants (CRC, "Dissociation constants
 * of inorganic acids and bases": carbonic 6.35 / 10.33, ammonium 9.25, Kw 1.01e-14;
 * LibreTexts E1: citric 3.13 / 4.76 / 6.40, hydrogen sulfate 1.99), solved by the textbook
 * approximations rather than by the charge-balance bisection under test.
 */
const pKw = PKW_25C;
/** weak acid HA at c mol/L: [H+] = (−Ka + √(Ka² + 4·Ka·c)) / 2 */
const weakAcidPh = (pKa: number, c: number) => {
  const Ka = 10 ** -pKa;
  return -Math.log10((-Ka + Math.sqrt(Ka * Ka + 4 * Ka * c)) / 2);
};
/** weak base B at c mol/L, Kb = Kw / Ka(BH+), same quadratic for [OH−] */
const weakBasePh = (pKaH: number, c: number) => pKw - weakAcidPh(pKw - pKaH, c);
/** molarity from mass % and the density table: c = w·ρ·10 / M */
const molarityAt = (query: string, pct: number) => {
  const s = findSolute(query)!;
  return (pct * densityAtMassFractionGPerMl(s, pct) * 10) / s.molarMassGPerMol;
};

describe("pH of common washes (charge balance, activities = 1)", () => {
  it.each([
    ["1 M HCl: −log c", "HCl", { value: 1, unit: "mol/L" }, 0],
    ["0.1 M HCl: −log c", "HCl", { value: 0.1, unit: "mol/L" }, 1],
    ["1 M NaOH: pKw + log c", "NaOH", { value: 1, unit: "mol/L" }, pKw],
    ["0.1 M KOH: pKw + log c", "KOH", { value: 0.1, unit: "mol/L" }, pKw - 1],
    ["1 M NH4Cl: ½(pKa − log c)", "NH4Cl", { value: 1, unit: "mol/L" }, 0.5 * 9.25],
    ["1 M aqueous ammonia: weak-base quadratic", "NH3", { value: 1, unit: "mol/L" }, weakBasePh(9.25, 1)],
    ["0.1 M Na2CO3: carbonate as a weak base (Kb = Kw/Ka2)", "Na2CO3", { value: 0.1, unit: "mol/L" }, weakBasePh(10.33, 0.1)],
    ["1 M KHSO4: hydrogen sulfate as a weak acid", "KHSO4", { value: 1, unit: "mol/L" }, weakAcidPh(1.99, 1)],
    ["water", "water", undefined, pKw / 2],
    ["saturated brine (neutral salt)", "brine", "saturated", pKw / 2],
  ] as const)("%s", (_label, solute, concentration, expected) => {
    expect(washPh(solute, concentration).pH).toBeCloseTo(expected, 2);
  });

  it("saturated NaHCO3 ≈ 8.3: the amphiprotic salt sits at ½(pKa1 + pKa2) = 8.34 (domain brief §5.4 quotes ≈ 8.3)", () => {
    const r = washPh("NaHCO3", "saturated");
    expect(r.pH).toBeCloseTo((6.35 + 10.33) / 2, 2);
    expect(r.pH).toBeGreaterThan(8.2);
    expect(r.pH).toBeLessThan(8.4);
    expect(r.carbonate).toBe(true);
  });

  it("0.5 M H2SO4: first proton complete, second from pKa 1.99 (quadratic y² + (c + Ka)y − c·Ka = 0)", () => {
    const c = 0.5;
    const Ka = 10 ** -1.99;
    const y = (-(c + Ka) + Math.sqrt((c + Ka) ** 2 + 4 * c * Ka)) / 2;
    expect(washPh("H2SO4", { value: c, unit: "mol/L" }).pH).toBeCloseTo(-Math.log10(c + y), 3);
  });

  it("10 % w/w Na2CO3: 12.2 ideal (1.04 M), above the 11.5–11.9 a meter reads, because activities are ignored", () => {
    const c = molarityAt("Na2CO3", 10);
    const r = washPh("Na2CO3", { value: 10, unit: "%w/w" });
    expect(r.molarityMolL).toBeCloseTo(c, 6);
    expect(r.pH).toBeCloseTo(weakBasePh(10.33, c), 2);
    expect(r.assumptions).toContain(ACTIVITY_NOTE);
  });

  it("10 % w/w citric acid: first-dissociation quadratic gives 1.7 (0.54 M); the later protons add < 0.01", () => {
    const c = molarityAt("citric acid", 10);
    expect(washPh("citric acid", { value: 10, unit: "%w/w" }).pH).toBeCloseTo(weakAcidPh(3.13, c), 2);
  });

  it("saturated NH4Cl (27.1 % w/w, ≈ 5.4 M): ½(9.25 − log c) ≈ 4.3 ideal; meters read about 4.5–5", () => {
    const r = washPh("NH4Cl", "saturated");
    expect(r.molarityMolL).toBeGreaterThan(5.2);
    expect(r.molarityMolL).toBeLessThan(5.6);
    expect(r.pH).toBeCloseTo(0.5 * (9.25 - Math.log10(r.molarityMolL)), 2);
  });

  it("falls as NH4Cl gets stronger (concentration-dependent)", () => {
    const ph = [0.1, 1, 3].map((m) => washPh("NH4Cl", { value: m, unit: "mol/L" }).pH);
    expect(ph[0]!).toBeGreaterThan(ph[1]!);
    expect(ph[1]!).toBeGreaterThan(ph[2]!);
  });

  it("reports the wash's acid or base capacity per mL", () => {
    expect(washPh("H2SO4", { value: 1, unit: "mol/L" }).acidCapacityMmolPerMl).toBe(2);
    expect(washPh("citric acid", { value: 0.5, unit: "mol/L" }).acidCapacityMmolPerMl).toBeCloseTo(1.5, 10);
    expect(washPh("Na2CO3", { value: 1, unit: "mol/L" }).baseCapacityMmolPerMl).toBe(2);
    expect(washPh("NaCl", { value: 1, unit: "mol/L" }).baseCapacityMmolPerMl).toBe(0);
  });

  it("refuses a solute without acid–base data, and % w/w for one without a density table", () => {
    expect(() => washPh("ethanol", { value: 1, unit: "mol/L" })).toThrow(KnowledgeInputError);
    expect(() => washPh("KHSO4", { value: 10, unit: "%w/w" })).toThrow(KnowledgeInputError);
  });
});
