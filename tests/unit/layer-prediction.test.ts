import {
  CLEAR_DENSITY_DIFFERENCE_G_PER_ML,
  CONFIRM_BY_DROP_TEST,
  CONFIRM_ONE_PHASE,
  TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML,
  mixOrganic,
  predictLayers,
  validateLayerInput,
  type LayerInput,
} from "../../knowledge/layers";
import { KnowledgeInputError } from "../../knowledge/types";

/*
 * Expected densities are hand-computed from the published tables, not from the code:
 *  - aqueous phases at 20 °C: CRC Handbook 102nd ed., "Concentrative properties of aqueous
 *    solutions" (water 0.9982; NaCl 10 % 1.0707, 26 % 1.1972 and the saturation point 26.4 %
 *    extrapolated from the 25–26 % slope 0.0085/% → 1.2006; NaOH 3 % 1.0318, 4 % 1.0428,
 *    10 % 1.1089; HCl 3 % 1.0130, 4 % 1.0179; NaHCO3 5 % 1.0337, 6 % 1.0408 → saturation
 *    8.7 % extrapolated 1.0600; K2CO3 48 % 1.5142, 50 % 1.5404 → 52.6 % extrapolated 1.5745).
 *    NaOH 50 % = 1.5253 (Perry's, recalled from memory).
 *  - solvents at 20 °C, handbook values recalled from memory (CRC / Riddick): DCM 1.3266,
 *    CHCl3 1.489, CCl4 1.594, 1,2-DCE 1.2527, PhCl 1.1058, Et2O 0.7134, MTBE 0.7405,
 *    2-MeTHF 0.854, EtOAc 0.9003, hexane 0.6594, toluene 0.8669, anisole 0.994, 1-BuOH 0.8098,
 *    THF 0.8892.
 * 1 M NaOH is 3.840 % w/w by linear interpolation of the CRC molarity column (3 % = 0.774 M,
 * 4 % = 1.043 M), so ρ ≈ 1.0318 + 0.840 × 0.0110 = 1.0410; 1 M HCl is 3.588 % (3 % = 0.833 M,
 * 4 % = 1.117 M), ρ ≈ 1.0130 + 0.588 × 0.0049 = 1.0159.
 */

const sat = "saturated" as const;
const pct = (value: number) => ({ value, unit: "%w/w" as const });
const molar = (value: number) => ({ value, unit: "mol/L" as const });

interface Case {
  label: string;
  organic: [string, number][];
  solute: string;
  concentration?: LayerInput["aqueous"]["concentration"];
  organicRho: number;
  aqueousRho: number;
  top: "organic" | "aqueous";
  confidence: "clear" | "close" | "too-close";
  warnings?: string[];
}

const cases: Case[] = [
  { label: "DCM over 10 % brine: DCM sinks (1.3266 − 1.0707 = +0.2559)", organic: [["DCM", 40]], solute: "NaCl", concentration: pct(10), organicRho: 1.3266, aqueousRho: 1.0707, top: "aqueous", confidence: "clear", warnings: ["halogenated"] },
  { label: "DCM / water (1.3266 − 0.9982 = +0.3284)", organic: [["methylene chloride", 30]], solute: "water", organicRho: 1.3266, aqueousRho: 0.9982, top: "aqueous", confidence: "clear" },
  { label: "DCM / saturated brine still sinks, by only +0.1260", organic: [["CH2Cl2", 30]], solute: "brine", concentration: sat, organicRho: 1.3266, aqueousRho: 1.2006, top: "aqueous", confidence: "clear", warnings: ["inversion-risk"] },
  { label: "DCM under 50 % NaOH floats (1.3266 − 1.5253 = −0.1987)", organic: [["DCM", 30]], solute: "NaOH", concentration: pct(50), organicRho: 1.3266, aqueousRho: 1.5253, top: "organic", confidence: "clear", warnings: ["inverted-order", "corrosive-aqueous"] },
  { label: "DCM on saturated K2CO3 floats (1.3266 − 1.5745 = −0.2479)", organic: [["DCM", 30]], solute: "K2CO3", concentration: sat, organicRho: 1.3266, aqueousRho: 1.5745, top: "organic", confidence: "clear", warnings: ["inverted-order", "gas-evolution"] },
  { label: "chloroform / water (1.489 − 0.9982 = +0.4908)", organic: [["CHCl3", 20]], solute: "water", organicRho: 1.489, aqueousRho: 0.9982, top: "aqueous", confidence: "clear" },
  { label: "chloroform floats on 50 % NaOH, narrowly (1.489 − 1.5253 = −0.0363)", organic: [["chloroform", 20]], solute: "caustic soda", concentration: pct(50), organicRho: 1.489, aqueousRho: 1.5253, top: "organic", confidence: "close", warnings: ["inverted-order", "near-density"] },
  { label: "CCl4 still sinks in 50 % NaOH (1.594 − 1.5253 = +0.0687)", organic: [["CCl4", 20]], solute: "NaOH", concentration: pct(50), organicRho: 1.594, aqueousRho: 1.5253, top: "aqueous", confidence: "close", warnings: ["inversion-risk"] },
  { label: "1,2-DCE vs saturated brine is close (1.2527 − 1.2006 = +0.0521)", organic: [["1,2-DCE", 25]], solute: "sat. brine", concentration: sat, organicRho: 1.2527, aqueousRho: 1.2006, top: "aqueous", confidence: "close", warnings: ["inversion-risk", "near-density"] },
  { label: "1,2-DCE / water (1.2527 − 0.9982 = +0.2545)", organic: [["ethylene dichloride", 25]], solute: "water", organicRho: 1.2527, aqueousRho: 0.9982, top: "aqueous", confidence: "clear" },
  { label: "chlorobenzene sinks in water (1.1058 − 0.9982 = +0.1076)", organic: [["PhCl", 25]], solute: "water", organicRho: 1.1058, aqueousRho: 0.9982, top: "aqueous", confidence: "clear" },
  { label: "chlorobenzene floats on saturated brine (1.1058 − 1.2006 = −0.0948)", organic: [["chlorobenzene", 25]], solute: "NaCl", concentration: sat, organicRho: 1.1058, aqueousRho: 1.2006, top: "organic", confidence: "clear", warnings: ["inverted-order"] },
  { label: "chlorobenzene vs 10 % brine is close (1.1058 − 1.0707 = +0.0351)", organic: [["chlorobenzene", 25]], solute: "NaCl", concentration: pct(10), organicRho: 1.1058, aqueousRho: 1.0707, top: "aqueous", confidence: "close", warnings: ["near-density"] },
  { label: "anisole vs water is too close (0.994 − 0.9982 = −0.0042)", organic: [["anisole", 25]], solute: "water", organicRho: 0.994, aqueousRho: 0.9982, top: "organic", confidence: "too-close", warnings: ["near-density"] },
  { label: "anisole clearly on top of saturated brine (0.994 − 1.2006 = −0.2066)", organic: [["methoxybenzene", 25]], solute: "NaCl", concentration: sat, organicRho: 0.994, aqueousRho: 1.2006, top: "organic", confidence: "clear" },
  { label: "ether over water (0.7134 − 0.9982 = −0.2848)", organic: [["ether", 50]], solute: "water", organicRho: 0.7134, aqueousRho: 0.9982, top: "organic", confidence: "clear", warnings: ["partial-miscibility", "peroxide-former", "very-low-flash-point"] },
  { label: "EtOAc over water (0.9003 − 0.9982 = −0.0979)", organic: [["EtOAc", 50]], solute: "water", organicRho: 0.9003, aqueousRho: 0.9982, top: "organic", confidence: "clear", warnings: ["partial-miscibility"] },
  { label: "EtOAc over saturated bicarbonate (0.9003 − 1.0600 = −0.1597)", organic: [["EA", 50]], solute: "sat. bicarb", concentration: sat, organicRho: 0.9003, aqueousRho: 1.06, top: "organic", confidence: "clear", warnings: ["gas-evolution"] },
  { label: "toluene over 1 M HCl (0.8669 − 1.0159 = −0.1490)", organic: [["toluene", 40]], solute: "HCl", concentration: molar(1), organicRho: 0.8669, aqueousRho: 1.0159, top: "organic", confidence: "clear" },
  { label: "MTBE over 1 M NaOH (0.7405 − 1.0410 = −0.3005)", organic: [["MTBE", 40]], solute: "NaOH", concentration: molar(1), organicRho: 0.7405, aqueousRho: 1.041, top: "organic", confidence: "clear", warnings: ["very-low-flash-point"] },
  { label: "hexane over water (0.6594 − 0.9982 = −0.3388)", organic: [["n-hexane", 40]], solute: "water", organicRho: 0.6594, aqueousRho: 0.9982, top: "organic", confidence: "clear" },
  { label: "DCM/hexane 1:1 vs water is too close ((1.3266 + 0.6594)/2 = 0.9930; −0.0052)", organic: [["DCM", 25], ["hexane", 25]], solute: "water", organicRho: 0.993, aqueousRho: 0.9982, top: "organic", confidence: "too-close", warnings: ["near-density"] },
  { label: "DCM/hexane 1:1 clearly floats on saturated brine (0.9930 − 1.2006 = −0.2076)", organic: [["DCM", 25], ["hexane", 25]], solute: "NaCl", concentration: sat, organicRho: 0.993, aqueousRho: 1.2006, top: "organic", confidence: "clear" },
  { label: "DCM/hexane 3:1 sinks ((3 × 1.3266 + 0.6594)/4 = 1.1598; +0.1616)", organic: [["DCM", 30], ["hexane", 10]], solute: "water", organicRho: 1.1598, aqueousRho: 0.9982, top: "aqueous", confidence: "clear" },
  { label: "DCM/hexane 1:3 floats ((1.3266 + 3 × 0.6594)/4 = 0.8262; −0.1720)", organic: [["DCM", 10], ["hexane", 30]], solute: "water", organicRho: 0.8262, aqueousRho: 0.9982, top: "organic", confidence: "clear" },
  { label: "2-MeTHF over water (0.854 − 0.9982 = −0.1442)", organic: [["2-MeTHF", 40]], solute: "water", organicRho: 0.854, aqueousRho: 0.9982, top: "organic", confidence: "clear", warnings: ["partial-miscibility", "peroxide-former"] },
  { label: "1-butanol over water (0.8098 − 0.9982 = −0.1884)", organic: [["n-BuOH", 40]], solute: "water", organicRho: 0.8098, aqueousRho: 0.9982, top: "organic", confidence: "clear", warnings: ["partial-miscibility"] },
  { label: "EtOAc with 25 % THF over water ((30 × 0.9003 + 10 × 0.8892)/40 = 0.8975; −0.1007)", organic: [["EtOAc", 30], ["THF", 10]], solute: "water", organicRho: 0.8975, aqueousRho: 0.9982, top: "organic", confidence: "clear", warnings: ["miscible-cosolvent"] },
];

describe("predictLayers: layer order against hand-computed densities", () => {
  it.each(cases)("$label", (c) => {
    const p = predictLayers({
      organic: c.organic.map(([solvent, volumeMl]) => ({ solvent, volumeMl })),
      aqueous: { solute: c.solute, concentration: c.concentration, volumeMl: 20 },
      temperatureC: 20,
    });
    expect(p.phases).toBe(2);
    expect(p.organicDensityGPerMl).toBeCloseTo(c.organicRho, 3);
    expect(Math.abs(p.aqueousDensityGPerMl - c.aqueousRho)).toBeLessThan(0.0006);
    expect(Math.abs(p.signedDensityDifferenceGPerMl - (c.organicRho - c.aqueousRho))).toBeLessThan(0.001);
    expect(p.densityDifferenceGPerMl).toBeCloseTo(Math.abs(p.signedDensityDifferenceGPerMl), 10);
    expect(p.top).toBe(c.top);
    expect(p.bottom).toBe(c.top === "organic" ? "aqueous" : "organic");
    expect(p.confidence).toBe(c.confidence);
    const codes = p.warnings.map((w) => w.code);
    for (const w of c.warnings ?? []) expect(codes).toContain(w);
    if (c.confidence === "clear") expect(p.confirm).toBeUndefined();
    else expect(p.confirm).toBe(CONFIRM_BY_DROP_TEST);
  });

  it("gives at least 20 cases, some inverted against the chlorinated-sinks rule", () => {
    expect(cases.length).toBeGreaterThanOrEqual(20);
    expect(cases.filter((c) => c.warnings?.includes("inverted-order")).length).toBeGreaterThanOrEqual(4);
  });

  it("reports volumes and the parts it used", () => {
    const p = predictLayers({ organic: [{ solvent: "DCM", volumeMl: 25 }, { solvent: "hexane", volumeMl: 15 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 20 });
    expect(p.organicVolumeMl).toBe(40);
    expect(p.aqueousVolumeMl).toBe(30);
    expect(p.totalVolumeMl).toBe(70);
    expect(p.organicParts.map((x) => x.key)).toEqual(["dichloromethane", "hexane"]);
    expect(p.aqueous).toMatchObject({ key: "water", massFractionPct: 0 });
    expect(p.assumptions.join(" ")).toMatch(/mix ideally/);
    expect(p.sources).toEqual(expect.arrayContaining(["layer-thresholds", "ideal-mixing", "kell-1975-from-memory", "riddick-from-memory"]));
  });
});

describe("predictLayers: water-miscible solvents", () => {
  it.each([
    ["THF", "water", undefined],
    ["acetone", "water", undefined],
    ["MeOH", "water", undefined],
    ["EtOH", "water", undefined],
    ["IPA", "water", undefined],
    ["MeCN", "water", undefined],
    ["DMF", "brine", sat],
    ["DMSO", "water", undefined],
    ["NMP", "water", undefined],
    ["1,4-dioxane", "water", undefined],
  ] as const)("%s with %s makes one phase", (solvent, solute, concentration) => {
    const p = predictLayers({ organic: [{ solvent, volumeMl: 30 }], aqueous: { solute, concentration, volumeMl: 30 }, temperatureC: 20 });
    expect(p.phases).toBe(1);
    expect(p.top).toBeNull();
    expect(p.bottom).toBeNull();
    expect(p.confidence).toBe("one-phase");
    expect(p.warnings.map((w) => w.code)).toContain("one-phase");
    expect(p.confirm).toBe(CONFIRM_ONE_PHASE);
  });

  it("warns that saturated brine can salt out a THF-rich layer", () => {
    const p = predictLayers({ organic: [{ solvent: "THF", volumeMl: 30 }], aqueous: { solute: "NaCl", concentration: sat, volumeMl: 30 }, temperatureC: 20 });
    expect(p.phases).toBe(1);
    expect(p.warnings.map((w) => w.code)).toContain("salting-out-possible");
  });

  it("treats an organic that is mostly acetonitrile as one phase with water (20 of 30 mL)", () => {
    const p = predictLayers({ organic: [{ solvent: "MeCN", volumeMl: 20 }, { solvent: "toluene", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 20 });
    expect(p.phases).toBe(1);
  });
});

describe("predictLayers: temperature and dissolved material", () => {
  it("corrects DCM and water to 30 °C", () => {
    // DCM 1.3266 − 10 K × 0.001885 (slope of Perry's DIPPR-105 fit) = 1.30775;
    // water 0.9982 × ρw(30)/ρw(20) = 0.9982 × 0.99565/0.99820 (CRC water table) = 0.99565.
    const p = predictLayers({ organic: [{ solvent: "DCM", volumeMl: 30 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 30 });
    expect(p.organicDensityGPerMl).toBeCloseTo(1.30775, 4);
    expect(p.aqueousDensityGPerMl).toBeCloseTo(0.99565, 4);
    expect(p.warnings.map((w) => w.code)).toContain("near-boiling");
  });

  it("adds dissolved material at the assumed 1.2 g/mL", () => {
    // 50 mL hexane (32.97 g) + 10 g → 42.97 g in 50 + 10/1.2 = 58.333 mL → 0.73663 g/mL.
    const p = predictLayers({ organic: [{ solvent: "hexane", volumeMl: 50 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 20, dissolvedSolidsG: 10 });
    expect(p.organicDensityGPerMl).toBeCloseTo(0.73663, 4);
    expect(p.organicVolumeMl).toBeCloseTo(58.333, 2);
  });

  it("lets a heavy dissolved product sink a toluene layer", () => {
    // 20 mL toluene (17.338 g) + 10 g at 2.0 g/mL → 27.338 g in 25 mL → 1.0935 g/mL, below water.
    const p = predictLayers({ organic: [{ solvent: "toluene", volumeMl: 20 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 20, dissolvedSolidsG: 10, dissolvedSolidsDensityGPerMl: 2.0 });
    expect(p.organicDensityGPerMl).toBeCloseTo(1.0935, 3);
    expect(p.bottom).toBe("organic");
    expect(p.warnings.map((w) => w.code)).toContain("load-changes-order");
  });

  it("mixOrganic is the volume-weighted mean plus the dissolved mass", () => {
    const m = mixOrganic([{ volumeMl: 10, densityGPerMl: 1.0 }, { volumeMl: 30, densityGPerMl: 0.8 }], 4, 2);
    // (10 + 24 + 4) g / (40 + 2) mL
    expect(m.densityGPerMl).toBeCloseTo(38 / 42, 10);
    expect(m.volumeMl).toBe(42);
  });
});

describe("predictLayers: thresholds", () => {
  it("orders the thresholds: clear above close above too-close", () => {
    expect(CLEAR_DENSITY_DIFFERENCE_G_PER_ML).toBeGreaterThan(TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML);
    expect(TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML).toBeGreaterThan(0);
  });
});

describe("predictLayers: input errors name the field", () => {
  const base: LayerInput = { organic: [{ solvent: "DCM", volumeMl: 40 }], aqueous: { solute: "NaCl", concentration: pct(10), volumeMl: 20 }, temperatureC: 20 };
  const expectField = (input: unknown, field: string) => {
    try {
      predictLayers(input as LayerInput);
    } catch (e) {
      expect(e).toBeInstanceOf(KnowledgeInputError);
      expect((e as KnowledgeInputError).field).toBe(field);
      return e as KnowledgeInputError;
    }
    throw new Error(`expected an error on ${field}`);
  };

  it("unknown solvent: field and closest names", () => {
    const e = expectField({ ...base, organic: [{ solvent: "chloro", volumeMl: 10 }] }, "organic[0].solvent");
    expect(e.suggestions).toEqual(expect.arrayContaining(["Chloroform", "Chlorobenzene"]));
  });
  it("unknown second solvent", () => {
    expectField({ ...base, organic: [{ solvent: "DCM", volumeMl: 10 }, { solvent: "unobtainium", volumeMl: 5 }] }, "organic[1].solvent");
  });
  it("unknown solute with suggestions", () => {
    const e = expectField({ ...base, aqueous: { solute: "sodium chlorde solution xyz", volumeMl: 20 } }, "aqueous.solute");
    expect(Array.isArray(e.suggestions)).toBe(true);
  });
  it.each([
    [{ organic: [] }, "organic"],
    [{ organic: [{ solvent: "DCM", volumeMl: 0 }] }, "organic[0].volumeMl"],
    [{ organic: [{ solvent: "DCM", volumeMl: -5 }] }, "organic[0].volumeMl"],
    [{ aqueous: { solute: "water", volumeMl: -1 } }, "aqueous.volumeMl"],
    [{ temperatureC: 90 }, "temperatureC"],
    [{ temperatureC: -5 }, "temperatureC"],
    [{ temperatureC: Number.NaN }, "temperatureC"],
    [{ temperatureC: 45 }, "temperatureC"], // above the boiling point of DCM (39.6 °C)
    [{ dissolvedSolidsG: -1 }, "dissolvedSolidsG"],
    [{ aqueous: { solute: "NaCl", concentration: pct(30), volumeMl: 20 } }, "aqueous.concentration"], // above saturation 26.4 %
    [{ aqueous: { solute: "NaCl", concentration: molar(7), volumeMl: 20 } }, "aqueous.concentration"], // saturated brine is 5.4 M
    [{ aqueous: { solute: "NaCl", volumeMl: 20 } }, "aqueous.concentration"],
    [{ aqueous: { solute: "HCl", concentration: sat, volumeMl: 20 } }, "aqueous.concentration"],
    [{ aqueous: { solute: "water", concentration: pct(5), volumeMl: 20 } }, "aqueous.concentration"],
    [{ aqueous: { solute: "NaCl", concentration: { value: 5, unit: "ppm" }, volumeMl: 20 } }, "aqueous.concentration.unit"],
    [{ aqueous: { solute: "NaCl", concentration: { value: -5, unit: "%w/w" }, volumeMl: 20 } }, "aqueous.concentration.value"],
    [{ organic: [{ solvent: "water", volumeMl: 10 }] }, "organic[0].solvent"],
  ])("%j → %s", (patch, field) => {
    expectField({ ...base, ...patch }, field);
  });

  it("validateLayerInput accepts a well-formed input unchanged", () => {
    expect(validateLayerInput(base)).toBe(base);
  });
});
