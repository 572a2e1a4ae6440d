import { SOLVENTS } from "../../knowledge/solvents";
import { solventDensityGPerMl } from "../../knowledge/reference";
import type { AntoineConstants, Solvent } from "../../knowledge/types";

const byKey = (key: string): Solvent => {
  const s = SOLVENTS.find((x) => x.key === key);
  if (!s) throw new Error(`no solvent ${key}`);
  return s;
};

/*
 * Perry's Chemical Engineers' Handbook, 8th ed., Table 2-32 (DIPPR-105):
 * ρ [mol/dm³] = C1 / C2^(1 + (1 − T/C3)^C4); coefficients [C1, C2, C3, C4, M].
 * An independent check on the 20 °C densities, which were taken from other handbooks.
 */
const DIPPR: Record<string, [number, number, number, number, number]> = {
  acetone: [1.2332, 0.25886, 508.2, 0.2913, 58.07914],
  acetonitrile: [1.0693, 0.20656, 545.5, 0.24699, 41.0519],
  anisole: [0.77488, 0.26114, 645.6, 0.28234, 108.13782],
  benzene: [1.0259, 0.26666, 562.05, 0.28394, 78.11184],
  "1-butanol": [0.98279, 0.2683, 563.1, 0.25488, 74.1216],
  "n-butyl-acetate": [0.67794, 0.2637, 575.4, 0.29318, 116.15828],
  "carbon-tetrachloride": [0.99835, 0.274, 556.35, 0.287, 153.8227],
  chlorobenzene: [0.8711, 0.26805, 632.35, 0.2799, 112.5569],
  chloroform: [1.0841, 0.2581, 536.4, 0.2741, 119.37764],
  cyclohexane: [0.88998, 0.27376, 553.8, 0.28571, 84.15948],
  "1-2-dichloroethane": [1.2591, 0.27698, 561.6, 0.30492, 98.95916],
  dichloromethane: [1.3897, 0.25678, 510, 0.2902, 84.93258],
  "diethyl-ether": [0.9554, 0.26847, 466.7, 0.2814, 74.1216],
  dmf: [0.89615, 0.23478, 649.6, 0.28091, 73.09378],
  dmso: [1.1096, 0.25189, 729, 0.3311, 78.13344],
  "1-4-dioxane": [1.1819, 0.2813, 587, 0.3047, 88.10512],
  ethanol: [1.6288, 0.27469, 514, 0.23178, 46.06844],
  "ethyl-acetate": [0.8996, 0.25856, 523.3, 0.278, 88.10512],
  heptane: [0.61259, 0.26211, 540.2, 0.28141, 100.20194],
  hexane: [0.70824, 0.26411, 507.6, 0.27537, 86.17536],
  methanol: [2.3267, 0.27073, 512.5, 0.24713, 32.04186],
  "2-butanone": [0.93767, 0.25035, 535.5, 0.29964, 72.10572],
  mtbe: [0.817948, 0.269105, 497.1, 0.28571, 88.1482],
  pentane: [0.84947, 0.26726, 469.7, 0.27789, 72.14878],
  isopropanol: [1.1799, 0.2644, 508.3, 0.24653, 60.095],
  tetrahydrofuran: [1.2543, 0.28084, 540.15, 0.2912, 72.10572],
  toluene: [0.8792, 0.27136, 591.75, 0.29241, 92.13842],
  "o-xylene": [0.69962, 0.26143, 630.3, 0.27365, 106.165],
};
const dippr = (key: string, tC: number): number => {
  const [c1, c2, c3, c4, m] = DIPPR[key]!;
  return ((c1 / c2 ** (1 + (1 - (tC + 273.15) / c3) ** c4)) * m) / 1000;
};

describe("20 °C densities agree with Perry's DIPPR-105 correlations", () => {
  it.each(Object.keys(DIPPR))("%s within 0.5 %", (key) => {
    const s = byKey(key);
    const expected = dippr(key, 20);
    expect(Math.abs(s.densityGPerMl20C.value - expected) / expected).toBeLessThan(0.005);
  });

  it.each(Object.keys(DIPPR))("%s: 35 °C or the boiling point, whichever is lower, within 0.6 %", (key) => {
    const s = byKey(key);
    const t = Math.min(35, s.boilingPointC.value - 1);
    const expected = dippr(key, t);
    expect(Math.abs(solventDensityGPerMl(s, t) - expected) / expected).toBeLessThan(0.006);
  });
});

describe("named handbook densities at 20 °C (recalled from memory: CRC / Riddick; the CRC aqueous table's 100 % rows were read)", () => {
  it.each([
    ["dichloromethane", 1.3266],
    ["carbon-tetrachloride", 1.594],
    ["chlorobenzene", 1.1058],
    ["diethyl-ether", 0.7134],
    ["ethyl-acetate", 0.9003],
    ["toluene", 0.8669],
    ["hexane", 0.6594],
    ["methanol", 0.7917], // CRC concentrative table, 100 % methanol row (read)
    ["ethanol", 0.7893], // CRC concentrative table, 100 % ethanol row (read)
    ["isopropanol", 0.7848], // CRC concentrative table, 100 % 2-propanol row (read)
    ["anisole", 0.994],
  ] as const)("%s %f g/mL", (key, rho) => {
    expect(solventDensityGPerMl(byKey(key), 20)).toBeCloseTo(rho, 4);
  });
});

describe("normal boiling points from the Antoine constants", () => {
  const boilingPointC = (a: AntoineConstants): number => {
    const p760 = a.pressureUnit === "mmHg" ? 760 : a.pressureUnit === "kPa" ? 101.325 : 1.01325;
    const t = a.b / (a.a - Math.log10(p760)) - a.c;
    return a.temperatureUnit === "K" ? t - 273.15 : t;
  };
  // Normal boiling points, CRC Handbook "Physical constants of organic compounds" (recalled from memory).
  const PUBLISHED_BP: Record<string, number> = {
    dichloromethane: 39.6, chloroform: 61.2, "1-2-dichloroethane": 83.5, "carbon-tetrachloride": 76.7,
    chlorobenzene: 131.7, "diethyl-ether": 34.6, tetrahydrofuran: 66, "1-4-dioxane": 101.3,
    "ethyl-acetate": 77.1, "n-butyl-acetate": 126.1, pentane: 36.1, hexane: 68.7, heptane: 98.4,
    cyclohexane: 80.7, toluene: 110.6, benzene: 80.1, "o-xylene": 144.4, acetone: 56.1, "2-butanone": 79.6,
    methanol: 64.7, ethanol: 78.3, isopropanol: 82.3, "1-butanol": 117.7, acetonitrile: 81.6, water: 100,
  };
  const withAntoine = SOLVENTS.filter((s) => s.antoine !== null);

  it("covers at least 20 solvents", () => {
    expect(withAntoine.length).toBeGreaterThanOrEqual(20);
  });
  it.each(withAntoine.map((s) => [s.key, s] as const))("%s reproduces its normal bp within 1 °C", (key, s) => {
    const published = PUBLISHED_BP[key];
    expect(published).toBeDefined();
    expect(s.boilingPointC.value).toBeCloseTo(published!, 1);
    expect(Math.abs(boilingPointC(s.antoine!.value) - published!)).toBeLessThan(1);
    expect(s.antoine!.value.minC).toBeLessThan(s.antoine!.value.maxC);
  });
});

describe("molar masses from the formula (IUPAC standard atomic weights)", () => {
  const W: Record<string, number> = { H: 1.008, C: 12.011, N: 14.007, O: 15.999, S: 32.06, Cl: 35.45 };
  const molarMass = (formula: string): number =>
    [...formula.matchAll(/([A-Z][a-z]?)(\d*)/g)].reduce((sum, m) => sum + W[m[1]!]! * (m[2] ? Number(m[2]) : 1), 0);
  it.each(SOLVENTS.map((s) => [s.key, s] as const))("%s", (_key, s) => {
    expect(Math.abs(s.molarMassGPerMol.value - molarMass(s.formula))).toBeLessThan(0.02);
  });
});
