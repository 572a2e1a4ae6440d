import { applyOverrides } from "../../knowledge/overrides";
import {
  MAX_TEMPERATURE_C,
  MIN_TEMPERATURE_C,
  SHIPPED_REFERENCE,
  allowedTypos,
  editDistance,
  findSolute,
  findSolvent,
  normaliseName,
  requireSolvent,
  solventDensityGPerMl,
  suggestSolutes,
  suggestSolvents,
} from "../../knowledge/reference";
import { KnowledgeInputError } from "../../knowledge/types";

describe("findSolvent", () => {
  it.each([
    ["DCM", "dichloromethane"],
    ["methylene chloride", "dichloromethane"],
    ["CH2Cl2", "dichloromethane"],
    ["75-09-2", "dichloromethane"],
    ["  dichloro-methane ", "dichloromethane"],
    ["EtOAc", "ethyl-acetate"],
    ["EA", "ethyl-acetate"],
    ["ethyl ethanoate", "ethyl-acetate"],
    ["Et2O", "diethyl-ether"],
    ["ether", "diethyl-ether"],
    ["THF", "tetrahydrofuran"],
    ["thf", "tetrahydrofuran"],
    ["IPA", "isopropanol"],
    ["2-propanol", "isopropanol"],
    ["MeCN", "acetonitrile"],
    ["MTBE", "mtbe"],
    ["2-MeTHF", "2-methyltetrahydrofuran"],
    ["MEK", "2-butanone"],
    ["PhMe", "toluene"],
    ["xylenes", "o-xylene"],
    ["CHCl3", "chloroform"],
    ["CCl4", "carbon-tetrachloride"],
    ["1,2-DCE", "1-2-dichloroethane"],
    ["DMSO", "dmso"],
    ["67-64-1", "acetone"],
    ["C6H6", "benzene"],
    // one or two typing slips in a long name
    ["tolune", "toluene"],
    ["acetonitril", "acetonitrile"],
    ["tetrahydrofuan", "tetrahydrofuran"],
  ])("%j → %s", (q, key) => {
    expect(findSolvent(q)?.key).toBe(key);
  });

  it.each(["chloro", "hex", "xyz", "", "C4H10O" /* ether and 1-butanol share it */, "DCMM"])("%j is not a confident match", (q) => {
    expect(findSolvent(q)).toBeUndefined();
  });

  it("suggests close names", () => {
    expect(suggestSolvents("chloro").map((s) => s.key)).toEqual(expect.arrayContaining(["chloroform", "chlorobenzene"]));
    expect(suggestSolvents("DCM", SHIPPED_REFERENCE, 3)).toHaveLength(3);
    expect(suggestSolvents("DCM")[0]?.key).toBe("dichloromethane");
    expect(suggestSolvents("")).toEqual([]);
  });

  it("requireSolvent throws with the field and suggestions", () => {
    try {
      requireSolvent("chloro", "organic[0].solvent");
      throw new Error("expected an error");
    } catch (e) {
      expect(e).toBeInstanceOf(KnowledgeInputError);
      expect((e as KnowledgeInputError).field).toBe("organic[0].solvent");
      expect((e as KnowledgeInputError).suggestions.length).toBeGreaterThan(0);
    }
  });

  it("looks up in the reference it is given (a new solvent added by a group)", () => {
    const base = SHIPPED_REFERENCE.solvents.find((s) => s.key === "toluene")!;
    const ref = applyOverrides(SHIPPED_REFERENCE, [
      { kind: "solvent-new", solvent: { ...base, key: "group-solvent-a", name: "Solvent A", synonyms: ["SA-1"], cas: "0000-00-0", formula: "C9H12" } },
    ]);
    expect(findSolvent("SA-1", ref)?.key).toBe("group-solvent-a");
    expect(findSolvent("SA-1")).toBeUndefined();
  });
});

describe("findSolute", () => {
  it.each([
    ["brine", "sodium-chloride"],
    ["sat. brine", "sodium-chloride"],
    ["saturated NaCl", "sodium-chloride"],
    ["sodium chloride", "sodium-chloride"],
    ["7647-14-5", "sodium-chloride"],
    ["bicarb", "sodium-bicarbonate"],
    ["sodium bicarbonate", "sodium-bicarbonate"],
    ["NaHCO3", "sodium-bicarbonate"],
    ["HCl", "hydrochloric-acid"],
    ["caustic soda", "sodium-hydroxide"],
    ["NH4Cl", "ammonium-chloride"],
    ["sulphuric acid", "sulfuric-acid"],
    ["water", "water"],
    ["H2O", "water"],
    ["ammonium hydroxide", "ammonia"],
    ["thiosulfate", "sodium-thiosulfate"],
  ])("%j → %s", (q, key) => {
    expect(findSolute(q)?.key).toBe(key);
  });
  it("suggests solutes", () => {
    expect(suggestSolutes("sodium").length).toBeGreaterThan(1);
  });
});

describe("name helpers", () => {
  it("normalises case, spaces and punctuation", () => {
    expect(normaliseName("1,2-DCE")).toBe("12dce");
    expect(normaliseName(" Methylene  Chloride ")).toBe("methylenechloride");
  });
  it("edit distance counts single slips, including swapped neighbours", () => {
    expect(editDistance("toluene", "toluene")).toBe(0);
    expect(editDistance("tolune", "toluene")).toBe(1);
    expect(editDistance("tolueen", "toluene")).toBe(1);
    expect(editDistance("kitten", "sitting")).toBe(3);
  });
  it("allows no slips in short abbreviations", () => {
    expect(allowedTypos(3)).toBe(0);
    expect(allowedTypos(6)).toBe(1);
    expect(allowedTypos(12)).toBe(2);
  });
});

describe("solventDensityGPerMl", () => {
  const dcm = findSolvent("DCM")!;
  it("is linear in temperature from the 20 °C value", () => {
    // 1.3266 + 5 K × (−0.001885) = 1.3266 − 0.009425 = 1.317175
    expect(solventDensityGPerMl(dcm, 25)).toBeCloseTo(1.317175, 6);
  });
  it("refuses a boiling or frozen solvent", () => {
    expect(() => solventDensityGPerMl(dcm, 40)).toThrow(/boils/);
    expect(() => solventDensityGPerMl(findSolvent("benzene")!, 5)).toThrow(/freezes/);
  });
  it("documents its temperature range", () => {
    expect(MIN_TEMPERATURE_C).toBe(0);
    expect(MAX_TEMPERATURE_C).toBe(60);
  });
});

describe("bench names of washes", () => {
  it.each([
    ["bicarbonate", "sodium-bicarbonate"],
    ["sat. sodium bicarbonate", "sodium-bicarbonate"],
    ["saturated NaHCO3", "sodium-bicarbonate"],
    ["sat ammonium chloride", "ammonium-chloride"],
    ["aq. NaOH", "sodium-hydroxide"],
  ])("reads %s as %s (the qualifier says how strong, not what)", (typed, key) => {
    expect(findSolute(typed)?.key).toBe(key);
  });

  it("does not read a bare qualifier, or a word that merely starts like one, as a solute", () => {
    expect(findSolute("saturated")).toBeUndefined();
    expect(findSolute("sat.")).toBeUndefined();
    expect(findSolute("aqua regia")).toBeUndefined();
  });
});
