import { AQUEOUS_SOLUTES } from "../../knowledge/aqueous";
import {
  densityAtMassFractionGPerMl,
  fromMassFractionPct,
  gramsPerLitreFromMassFraction,
  interpolateDensity,
  massFractionFromGramsPerLitre,
  massFractionFromMolarity,
  maxMassFractionPct,
  molarityFromMassFraction,
  parseConcentration,
  parseQuantity,
  parseTemperatureC,
  parseVolumeMl,
  toMassFractionPct,
} from "../../knowledge/concentration";
import { findSolute } from "../../knowledge/reference";
import { KnowledgeInputError, type AqueousSolute } from "../../knowledge/types";

const solute = (q: string): AqueousSolute => {
  const s = findSolute(q);
  if (!s) throw new Error(`no solute ${q}`);
  return s;
};

describe("monotone cubic interpolation (Fritsch–Carlson)", () => {
  it.each(AQUEOUS_SOLUTES.filter((s) => s.points.value.length > 1).map((s) => [s.key, s] as const))(
    "%s: passes through every point and stays between neighbours",
    (_key, s) => {
      const pts = s.points.value;
      for (const p of pts) expect(interpolateDensity(pts, p.massFractionPct)).toBeCloseTo(p.densityGPerMl, 12);
      for (let k = 0; k < pts.length - 1; k++) {
        const a = pts[k]!;
        const b = pts[k + 1]!;
        const lo = Math.min(a.densityGPerMl, b.densityGPerMl);
        const hi = Math.max(a.densityGPerMl, b.densityGPerMl);
        for (let i = 1; i < 10; i++) {
          const w = a.massFractionPct + ((b.massFractionPct - a.massFractionPct) * i) / 10;
          const rho = interpolateDensity(pts, w);
          expect(rho).toBeGreaterThanOrEqual(lo - 1e-12);
          expect(rho).toBeLessThanOrEqual(hi + 1e-12);
        }
      }
    },
  );

  it("follows a decreasing table (aqueous ammonia gets lighter)", () => {
    const nh3 = solute("ammonia solution");
    // CRC: 10 % 0.9575, 11 % 0.9538
    const rho = densityAtMassFractionGPerMl(nh3, 10.5);
    expect(rho).toBeLessThan(0.9575);
    expect(rho).toBeGreaterThan(0.9538);
  });
});

describe("densities read from the CRC concentrative-properties table (20 °C)", () => {
  it.each([
    ["NaCl", 10, 1.0707],
    ["NaCl", 20, 1.1478],
    ["NaCl", 26, 1.1972],
    ["NaOH", 10, 1.1089],
    ["NaOH", 40, 1.4299],
    ["HCl", 10, 1.0476],
    ["HCl", 36, 1.1791],
    ["H2SO4", 98, 1.8361],
    ["KOH", 30, 1.2813],
    ["Na2CO3", 10, 1.1029],
    ["K2CO3", 50, 1.5404],
    ["NH4Cl", 20, 1.0567],
    ["LiCl", 5, 1.0272],
    ["CaCl2", 30, 1.2816],
    ["citric acid", 10, 1.0402],
    ["Na2SO4", 10, 1.0905],
    ["Na2S2O3", 10, 1.0827],
    ["NaHCO3", 5, 1.0337],
  ] as const)("%s %d %% → %f g/mL", (q, w, rho) => {
    expect(densityAtMassFractionGPerMl(solute(q), w)).toBeCloseTo(rho, 4);
  });

  it("interpolates between rows close to the straight line (NaCl 10.5 %: rows 1.0707 and 1.0781)", () => {
    expect(densityAtMassFractionGPerMl(solute("NaCl"), 10.5)).toBeCloseTo((1.0707 + 1.0781) / 2, 3);
  });

  it("50 % NaOH is 1.5253 g/mL (Perry's, recalled from memory)", () => {
    expect(densityAtMassFractionGPerMl(solute("NaOH"), 50)).toBeCloseTo(1.5253, 4);
  });
});

describe("molarity ↔ mass fraction (checked against the CRC molarity column)", () => {
  it("1 M NaOH ≈ 3.84 % w/w (CRC: 3 % = 0.774 M, 4 % = 1.043 M → 3.840 % by linear interpolation)", () => {
    expect(massFractionFromMolarity(solute("NaOH"), 1)).toBeCloseTo(3.84, 1);
  });
  it("1 M HCl ≈ 3.59 % w/w (CRC: 3 % = 0.833 M, 4 % = 1.117 M → 3.588 %)", () => {
    expect(massFractionFromMolarity(solute("HCl"), 1)).toBeCloseTo(3.59, 1);
  });
  it.each([
    ["HCl", 36, 11.642],
    ["NaCl", 26, 5.326],
    ["NaOH", 10, 2.772],
    ["NaOH", 40, 14.3],
    ["H2SO4", 50, 7.113],
    ["K2CO3", 20, 1.722],
  ] as const)("%s %d %% → %f mol/L", (q, w, c) => {
    expect(molarityFromMassFraction(solute(q), w)).toBeCloseTo(c, 2);
  });
  it("50 % NaOH is 19.07 M by hand: 0.5 × 1525.3 g/L / 39.997 g/mol", () => {
    expect(molarityFromMassFraction(solute("NaOH"), 50)).toBeCloseTo(19.07, 2);
  });
  it("10 % NaCl holds 107.07 g/L (10 % × 1.0707 g/mL × 1000 mL)", () => {
    expect(gramsPerLitreFromMassFraction(solute("NaCl"), 10)).toBeCloseTo(107.07, 2);
    expect(massFractionFromGramsPerLitre(solute("NaCl"), 107.07)).toBeCloseTo(10, 4);
  });
  it.each(["NaCl", "NaOH", "HCl", "H2SO4", "ammonia"])("%s: mol/L and g/L round-trip", (q) => {
    const s = solute(q);
    const w = maxMassFractionPct(s) * 0.37;
    const c = fromMassFractionPct(s, w, "mol/L");
    expect(toMassFractionPct(s, c)).toBeCloseTo(w, 6);
    const g = fromMassFractionPct(s, w, "g/L");
    expect(toMassFractionPct(s, g)).toBeCloseTo(w, 6);
    expect(fromMassFractionPct(s, w, "%w/w").value).toBe(w);
  });
});

describe("limits", () => {
  const field = (fn: () => unknown) => {
    try {
      fn();
    } catch (e) {
      expect(e).toBeInstanceOf(KnowledgeInputError);
      return e as KnowledgeInputError;
    }
    throw new Error("expected a KnowledgeInputError");
  };

  it("saturated brine is 26.4 % w/w (35.9 g per 100 g water)", () => {
    expect(toMassFractionPct(solute("brine"), "saturated")).toBe(26.4);
    // 35.9 / 135.9 = 26.42 %
    expect(35.9 / 135.9).toBeCloseTo(0.264, 3);
  });
  it("rejects a mass fraction above saturation", () => {
    const e = field(() => toMassFractionPct(solute("NaCl"), { value: 27, unit: "%w/w" }));
    expect(e.field).toBe("aqueous.concentration");
    expect(e.message).toMatch(/saturat/);
  });
  it("rejects beyond the table when saturation is higher (LiCl table ends at 30 %)", () => {
    expect(() => toMassFractionPct(solute("LiCl"), { value: 35, unit: "%w/w" })).toThrow(/ends at 30/);
    expect(() => toMassFractionPct(solute("LiCl"), "saturated")).toThrow(KnowledgeInputError);
  });
  it("rejects a molarity above saturation (saturated brine is about 5.4 M)", () => {
    expect(() => massFractionFromMolarity(solute("NaCl"), 6)).toThrow(/saturation/);
  });
  it("rejects negative and impossible values", () => {
    expect(() => toMassFractionPct(solute("NaCl"), { value: -1, unit: "%w/w" })).toThrow(KnowledgeInputError);
    expect(() => toMassFractionPct(solute("H2SO4"), { value: 120, unit: "%w/w" })).toThrow(KnowledgeInputError);
    expect(() => massFractionFromMolarity(solute("NaCl"), -0.1)).toThrow(KnowledgeInputError);
    expect(() => toMassFractionPct(solute("HCl"), { value: 20, unit: "mol/L" })).toThrow(/end of the density table/);
  });
  it("needs a concentration except for water, and none for water", () => {
    expect(toMassFractionPct(solute("water"), undefined)).toBe(0);
    expect(() => toMassFractionPct(solute("NaCl"), undefined)).toThrow(/Give a concentration/);
    expect(() => toMassFractionPct(solute("water"), { value: 1, unit: "%w/w" })).toThrow(KnowledgeInputError);
    expect(() => toMassFractionPct(solute("water"), "saturated")).toThrow(KnowledgeInputError);
  });
  it("uses a custom field path", () => {
    const e = field(() => toMassFractionPct(solute("NaCl"), { value: 40, unit: "%w/w" }, "washes[2].concentration"));
    expect(e.field).toBe("washes[2].concentration");
  });
});

describe("parseQuantity", () => {
  it.each([
    ["0.5 L", "volume", 500, "mL"],
    ["250 mL", "volume", 250, "mL"],
    ["250mL", "volume", 250, "mL"],
    ["1,5 L", "volume", 1500, "mL"],
    ["3 M", "molarity", 3, "mol/L"],
    ["0.5 mol/L", "molarity", 0.5, "mol/L"],
    ["250 mM", "molarity", 0.25, "mol/L"],
    ["10 %", "mass-fraction", 10, "%w/w"],
    ["10% w/w", "mass-fraction", 10, "%w/w"],
    ["25 °C", "temperature", 25, "°C"],
    ["298.15 K", "temperature", 25, "°C"],
    ["50 g/L", "mass-concentration", 50, "g/L"],
    ["2.5 g", "mass", 2.5, "g"],
    ["500 mg", "mass", 0.5, "g"],
  ] as const)("%s → %s %f %s", (text, kind, value, unit) => {
    const q = parseQuantity(text);
    expect(q.kind).toBe(kind);
    expect(q.value).toBeCloseTo(value, 9);
    expect(q.unit).toBe(unit);
  });

  it("takes a bare number in the expected unit", () => {
    expect(parseVolumeMl("40")).toBe(40);
    expect(parseTemperatureC("20")).toBe(20);
  });

  it("parses concentrations, including saturated", () => {
    expect(parseConcentration("1 M")).toEqual({ value: 1, unit: "mol/L" });
    expect(parseConcentration("10 %")).toEqual({ value: 10, unit: "%w/w" });
    expect(parseConcentration("sat.")).toBe("saturated");
    expect(parseConcentration("saturated")).toBe("saturated");
  });

  it.each(["", "abc", "10 furlongs", "5 m"])("rejects %j", (text) => {
    expect(() => parseQuantity(text, "volume")).toThrow(KnowledgeInputError);
  });

  it("rejects the wrong kind", () => {
    expect(() => parseVolumeMl("25 °C")).toThrow(/not a volume/);
    expect(() => parseConcentration("250 mL")).toThrow(KnowledgeInputError);
  });
});
