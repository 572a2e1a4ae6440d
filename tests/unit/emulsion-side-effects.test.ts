import {
  brineAfter,
  componentsAtPh,
  neutralisationEffect,
  organicAfter,
  saltToSaturationG,
  saltingCanInvert,
  solidSaltAfter,
  systemFacts,
  vapourPressureKPa,
  warmingCheck,
  waterAfter,
  type EmulsionSystem,
} from "../../knowledge/emulsion";
import { findSolvent } from "../../knowledge/reference";

/*
 * Independent values used below (20 °C):
 * - CRC Handbook, "Concentrative properties of aqueous solutions", NaCl density vs mass %:
 *   6 % 1.0413, 8 % 1.0559, 10 % 1.0707, 12 % 1.0857, 14 % 1.1008, 16 % 1.1162, 18 % 1.1319,
 *   20 % 1.1478, 24 % 1.1804, 26 % 1.1972; saturation 35.9 g per 100 g water = 26.4 % w/w.
 * - Pure water 0.9982 g/mL (Kell 1975); chlorobenzene 1.1058 g/mL (CRC organic constants).
 * Interpolation by hand is linear between table points; the code's monotone cubic differs by
 * well under the 0.002 g/mL tolerance on these smooth tables.
 */
const WATER = 0.9982;
const CHLOROBENZENE = 1.1058;
const SAT_PCT = 26.4;
const nacl = (pct: number): number => {
  const table: [number, number][] = [
    [6, 1.0413], [8, 1.0559], [10, 1.0707], [12, 1.0857], [14, 1.1008], [16, 1.1162], [18, 1.1319], [20, 1.1478], [24, 1.1804], [26, 1.1972],
  ];
  for (let k = 0; k < table.length - 1; k++) {
    const [x0, y0] = table[k]!;
    const [x1, y1] = table[k + 1]!;
    if (pct >= x0 && pct <= x1) return y0 + ((pct - x0) / (x1 - x0)) * (y1 - y0);
  }
  // saturated brine: the 24–26 % slope carried on to 26.4 %
  return 1.1972 + ((pct - 26) * (1.1972 - 1.1804)) / 2;
};
const SAT_BRINE = nacl(SAT_PCT); // ≈ 1.2006

const sys = (solvent: string, organicMl: number, aqueous: EmulsionSystem["aqueous"]): EmulsionSystem => ({
  organic: [{ solvent, volumeMl: organicMl }],
  aqueous,
  temperatureC: 20,
});
const chlorobenzeneOverWater = systemFacts(sys("chlorobenzene", 100, { solute: "water", volumeMl: 100 }), undefined);

describe("salt: chlorobenzene, denser than water but lighter than brine", () => {
  it("sits under water to begin with", () => {
    expect(chlorobenzeneOverWater.layers.bottom).toBe("organic");
    expect(chlorobenzeneOverWater.layers.densityDifferenceGPerMl).toBeCloseTo(CHLOROBENZENE - WATER, 3);
  });

  it("a 25 mL portion of saturated brine in 100 mL water narrows the gap without swapping", () => {
    // NaCl 25 × 1.2006 × 0.264 = 7.92 g in 99.82 + 30.02 = 129.84 g → 6.10 % w/w → 1.0421 g/mL
    const brineG = 25 * SAT_BRINE;
    const pct = ((brineG * SAT_PCT) / 100 / (100 * WATER + brineG)) * 100;
    expect(pct).toBeCloseTo(6.1, 1);
    const after = brineAfter(chlorobenzeneOverWater, 25);
    expect(after.aqueousDensityGPerMl).toBeCloseTo(nacl(pct), 2);
    expect(Math.abs(after.aqueousDensityGPerMl - nacl(pct))).toBeLessThan(0.002);
    expect(after.swapsLayers).toBe(false);
    expect(after.densityDifferenceGPerMl).toBeCloseTo(CHLOROBENZENE - nacl(pct), 2);
  });

  it("enough brine flips the order: 150 mL into 100 mL water floats the chlorobenzene", () => {
    // NaCl 150 × 1.2006 × 0.264 = 47.54 g in 99.82 + 180.09 = 279.91 g → 16.99 % → 1.1240 g/mL > 1.1058
    const brineG = 150 * SAT_BRINE;
    const pct = ((brineG * SAT_PCT) / 100 / (100 * WATER + brineG)) * 100;
    const expected = nacl(pct);
    expect(expected).toBeGreaterThan(CHLOROBENZENE);
    const after = brineAfter(chlorobenzeneOverWater, 150);
    expect(Math.abs(after.aqueousDensityGPerMl - expected)).toBeLessThan(0.002);
    expect(after.top).toBe("organic");
    expect(after.bottom).toBe("aqueous");
    expect(after.swapsLayers).toBe(true);
    expect(after.totalVolumeMl).toBeCloseTo(100 + (100 * WATER + brineG) / expected, 0);
  });

  it("half-saturating with solid salt (18 g in 100 mL) swaps the layers and leaves them isodense", () => {
    // 18 / (99.82 + 18) = 15.28 % → 1.1106 g/mL: 0.005 above chlorobenzene
    const pct = (18 / (100 * WATER + 18)) * 100;
    const after = solidSaltAfter(chlorobenzeneOverWater, 18);
    expect(Math.abs(after.aqueousDensityGPerMl - nacl(pct))).toBeLessThan(0.002);
    expect(after.swapsLayers).toBe(true);
    expect(after.isodense).toBe(true);
  });

  it("salt to saturation is 35.9 g per 100 g of water, and more is refused", () => {
    const expected = 100 * WATER * (SAT_PCT / (100 - SAT_PCT));
    expect(saltToSaturationG(chlorobenzeneOverWater)).toBeCloseTo(expected, 1);
    expect(() => solidSaltAfter(chlorobenzeneOverWater, 40)).toThrow(/dissolves/);
  });

  it.each([
    ["chlorobenzene", true],
    ["1,2-dichloroethane", true],
    ["dichloromethane", false],
    ["ethyl acetate", false],
  ])("salting %s all the way is flagged as inverting or unclear: %s", (solvent, flagged) => {
    const facts = systemFacts(sys(solvent, 50, { solute: "water", volumeMl: 50 }), undefined);
    expect(saltingCanInvert(facts)).toBe(flagged);
  });
});

describe("water and organic solvent added", () => {
  it("diluting 50 mL of 20 % NaCl with 50 mL water puts chlorobenzene back at the bottom", () => {
    const facts = systemFacts(sys("chlorobenzene", 50, { solute: "NaCl", concentration: { value: 20, unit: "%w/w" }, volumeMl: 50 }), undefined);
    expect(facts.layers.top).toBe("organic"); // 1.1058 over 1.1478
    // 50 × 1.1478 = 57.39 g with 11.48 g NaCl, + 49.91 g water → 10.70 % → 1.0759 g/mL
    const massG = 50 * nacl(20) + 50 * WATER;
    const pct = ((50 * nacl(20) * 0.2) / massG) * 100;
    expect(pct).toBeCloseTo(10.7, 1);
    const after = waterAfter(facts, 50);
    expect(Math.abs(after.aqueousDensityGPerMl - nacl(pct))).toBeLessThan(0.002);
    expect(after.bottom).toBe("organic");
    expect(after.swapsLayers).toBe(true);
    expect(after.aqueousVolumeMl).toBeCloseTo(massG / nacl(pct), 0);
  });

  it("more DCM in a DCM–hexane layer raises its density by ideal mixing, and a full funnel is flagged", () => {
    const system: EmulsionSystem = {
      organic: [
        { solvent: "dichloromethane", volumeMl: 50 },
        { solvent: "hexane", volumeMl: 50 },
      ],
      aqueous: { solute: "water", volumeMl: 100 },
      temperatureC: 20,
    };
    const facts = systemFacts(system, undefined);
    const dcm = findSolvent("dichloromethane")!.densityGPerMl20C.value;
    const hexane = findSolvent("hexane")!.densityGPerMl20C.value;
    const after = organicAfter(facts, "dichloromethane", 50, 250);
    expect(after.organicDensityGPerMl).toBeCloseTo((100 * dcm + 50 * hexane) / 150, 4);
    expect(after.totalVolumeMl).toBeCloseTo(250, 6);
    expect(after.funnelFillFraction).toBeCloseTo(1, 6);
    expect(after.overfilled).toBe(true);
    expect(organicAfter(facts, "dichloromethane", 20, 500).overfilled).toBe(false); // 220 / 500 = 0.44
  });
});

describe("pH change: which component moves", () => {
  const facts = systemFacts(sys("dichloromethane", 50, { solute: "NaOH", concentration: { value: 1, unit: "mol/L" }, volumeMl: 50 }), undefined);

  it("takes the 1 M NaOH wash as pH 14 (−log of 1 M hydroxide, pKw 14)", () => {
    expect(facts.ph).toBeCloseTo(14, 1);
  });

  it.each([
    // benzoic acid pKa 4.20, log P 1.87: D(pH 2) = 10^1.87 / (1 + 10^(2 − 4.2)) = 73.7
    { name: "benzoic acid", kind: "acid" as const, pKa: 4.2, logP: 1.87, from: "aqueous", to: "organic", dAfter: 10 ** 1.87 / (1 + 10 ** (2 - 4.2)) },
    // a tertiary amine, pKaH 10.6, log P 2.0: D(pH 2) = 100 / (1 + 10^8.6) = 2.5 × 10⁻⁷
    { name: "tertiary amine", kind: "base" as const, pKa: 10.6, logP: 2.0, from: "organic", to: "aqueous", dAfter: 100 / (1 + 10 ** 8.6) },
    { name: "neutral amide", kind: "neutral" as const, logP: 2.5, from: "organic", to: "organic", dAfter: 10 ** 2.5 },
  ])("$name: $from → $to on acidifying to pH 2", ({ name, kind, pKa, logP, from, to, dAfter }) => {
    const check = componentsAtPh(facts, [{ name, kind, logP, ...(pKa !== undefined ? { pKa } : {}) }], 14, 2);
    const move = check.moves[0]!;
    expect(move.from).toBe(from);
    expect(move.to).toBe(to);
    expect(move.distributionRatioAfter).toBeCloseTo(dAfter, 6);
    expect(move.fractionInOrganicAfter).toBeCloseTo((dAfter * 50) / (dAfter * 50 + 50), 6);
  });

  it("reports a component without a pKa as unchecked instead of guessing", () => {
    const check = componentsAtPh(facts, [{ name: "mystery acid", kind: "acid", logP: 3 }], 14, 2);
    expect(check.moves).toHaveLength(0);
    expect(check.unchecked[0]?.name).toBe("mystery acid");
  });

  it("acidifying 40 mL of 0.5 M bicarbonate releases about 20 mmol of CO2, ~480 mL at 20 °C", () => {
    const bicarb = systemFacts(sys("ethyl acetate", 40, { solute: "NaHCO3", concentration: { value: 0.5, unit: "mol/L" }, volumeMl: 40 }), undefined);
    const effect = neutralisationEffect(bicarb, 2)!;
    // n = 0.5 mol/L × 40 mL = 20 mmol; V = nRT/P = 20 × 8.314 × 293.15 / 101325 × 1000 = 481 mL
    const expected = (20 * 8.314462618 * 293.15) / 101325 * 1000;
    expect(effect.result.co2Ml).toBeGreaterThan(expected * 0.97);
    expect(effect.result.co2Ml).toBeLessThan(expected * 1.01);
    expect(effect.cautions.join(" ")).toMatch(/CO2/);
  });
});

describe("warming against the solvent's boiling point", () => {
  // Lange's Handbook Antoine constants as in the solvent table; published vapour pressures at
  // 40 °C: DCM ≈ 103 kPa (it boils at 39.6 °C), toluene 7.9 kPa (NIST WebBook).
  it("refuses a 40 °C bath for dichloromethane: its vapour pressure there is above 1 atm", () => {
    const facts = systemFacts(sys("dichloromethane", 100, { solute: "water", volumeMl: 100 }), undefined);
    const check = warmingCheck(facts, 40);
    expect(check.verdict).toBe("refuse");
    const hand = (10 ** (7.0803 - 1138.91 / (231.45 + 40)) * 101.325) / 760;
    expect(check.solvents[0]!.vapourPressureKPa).toBeCloseTo(hand, 1);
    expect(check.solvents[0]!.vapourPressureKPa!).toBeGreaterThan(101.325);
    expect(check.cautions[0]).toMatch(/Do not warm/);
  });

  it("allows it for toluene and reports 7.9 kPa", () => {
    const facts = systemFacts(sys("toluene", 100, { solute: "water", volumeMl: 100 }), undefined);
    const check = warmingCheck(facts, 40);
    expect(check.verdict).toBe("ok");
    expect(check.solvents[0]!.vapourPressureKPa!).toBeGreaterThan(7.6);
    expect(check.solvents[0]!.vapourPressureKPa!).toBeLessThan(8.2);
  });

  it("cautions for MTBE (bp 55 °C), which has no Antoine constants here", () => {
    const facts = systemFacts(sys("MTBE", 100, { solute: "water", volumeMl: 100 }), undefined);
    const check = warmingCheck(facts, 40);
    expect(check.verdict).toBe("caution");
    expect(check.solvents[0]!.vapourPressureKPa).toBeNull();
  });

  it("returns no pressure outside the constants' range", () => {
    expect(vapourPressureKPa({ a: 7, b: 1200, c: 230, pressureUnit: "mmHg", temperatureUnit: "C", minC: 0, maxC: 50 }, 80)).toBeNull();
  });
});
