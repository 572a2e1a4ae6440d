import { findSolvent } from "../../knowledge/reference";
import { GUIDE_ORDER, greenerSubstitutes, rankSolvents } from "../../knowledge/plan/solvent-choice";
import { KnowledgeInputError } from "../../knowledge/types";

const passing = (r: ReturnType<typeof rankSolvents>) => r.filter((x) => x.meetsConstraints).map((x) => x.key);

describe("ranking extraction solvents under constraints", () => {
  it("puts every solvent that meets the constraints first, in selection-guide order", () => {
    const r = rankSolvents({ organicLayer: "top" });
    const firstFail = r.findIndex((x) => !x.meetsConstraints);
    expect(r.slice(firstFail).every((x) => !x.meetsConstraints)).toBe(true);
    const ranks = r.slice(0, firstFail).map((x) => GUIDE_ORDER.indexOf(x.guideCategory));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
  });

  it("drops water-miscible solvents and says why", () => {
    const acetone = rankSolvents().find((x) => x.key === "acetone")!;
    expect(acetone.meetsConstraints).toBe(false);
    expect(acetone.failures).toContain("mixes with water");
  });

  it("only halogenated solvents sink in water (densities > 0.998 g/mL at 20 °C)", () => {
    const bottom = passing(rankSolvents({ organicLayer: "bottom" }));
    expect(bottom.length).toBeGreaterThan(0);
    expect(bottom.every((k) => findSolvent(k)!.halogenated)).toBe(true);
    expect(passing(rankSolvents({ organicLayer: "bottom", noHalogen: true }))).toEqual([]);
  });

  it("chlorobenzene (1.11 g/mL) floats on saturated brine (≈ 1.20 g/mL) (domain brief §2.4)", () => {
    const r = rankSolvents({ organicLayer: "bottom", aqueous: { solute: "brine", concentration: "saturated" } });
    const cb = r.find((x) => x.key === "chlorobenzene")!;
    expect(cb.meetsConstraints).toBe(false);
    expect(cb.densityDifferenceGPerMl!).toBeLessThan(0);
    expect(r.find((x) => x.key === "dichloromethane")!.meetsConstraints).toBe(true);
  });

  it("keeps only recommended, halogen- and peroxide-free solvents boiling at most 100 °C", () => {
    const keys = passing(rankSolvents({ organicLayer: "top", noHalogen: true, noPeroxideFormer: true, minGuideCategory: "recommended", bpMaxC: 100 }));
    expect(keys).toEqual(expect.arrayContaining(["ethyl-acetate", "isopropyl-acetate"]));
    expect(keys).not.toContain("toluene"); // problematic
    expect(keys).not.toContain("n-butyl-acetate"); // bp 126
    expect(keys).not.toContain("mtbe"); // hazardous
    const tol = rankSolvents({ minGuideCategory: "recommended", candidates: ["toluene"] })[0]!;
    expect(tol.failures.some((f) => f.includes("selection guide"))).toBe(true);
  });

  it("ranks solvents that barely mix with water ahead of ones that take up 10 wt% or more", () => {
    const keys = passing(rankSolvents({ candidates: ["2-butanone", "isopropyl acetate", "ethyl acetate"] }));
    expect(keys.indexOf("2-butanone")).toBeGreaterThan(keys.indexOf("isopropyl-acetate"));
  });

  it("names an unknown candidate", () => {
    expect(() => rankSolvents({ candidates: ["unobtainium"] })).toThrow(KnowledgeInputError);
  });
});

describe("greener substitutes (Pfizer replacement table, Alfonsi et al. 2008, recalled)", () => {
  it("replaces dichloromethane with lighter solvents and says the layer order flips", () => {
    const r = greenerSubstitutes("DCM");
    const keys = r.substitutes.map((s) => s.key);
    expect(keys).toEqual(expect.arrayContaining(["ethyl-acetate", "toluene", "2-methyltetrahydrofuran"]));
    expect(r.substitutes.every((s) => s.basis === "replacement-table")).toBe(true);
    for (const s of r.substitutes) expect(s.caveats.some((c) => c.startsWith("layer order flips"))).toBe(true);
    const etoac = r.substitutes.find((s) => s.key === "ethyl-acetate")!;
    expect(etoac.caveats.some((c) => c.includes("carries more water"))).toBe(true);
    expect(r.sources).toContain("alfonsi-2008-from-memory");
  });

  it("replaces hexane with heptane, slower to strip (bp 98 vs 69 °C)", () => {
    const r = greenerSubstitutes("hexane");
    expect(r.substitutes.map((s) => s.key)).toEqual(["heptane"]);
    expect(r.substitutes[0]!.caveats.some((c) => c.includes("slower to strip"))).toBe(true);
    expect(r.substitutes[0]!.pressureFor40CMbar).not.toBeNull();
  });

  it("replaces THF with 2-MeTHF, which forms two phases with water", () => {
    const r = greenerSubstitutes("THF");
    expect(r.substitutes[0]!.key).toBe("2-methyltetrahydrofuran");
    expect(r.substitutes[0]!.caveats.some((c) => c.includes("two phases"))).toBe(true);
  });

  it("falls back to better-ranked immiscible solvents for a solvent the table does not list", () => {
    const r = greenerSubstitutes("cyclohexane");
    expect(r.substitutes.length).toBeGreaterThan(0);
    expect(r.substitutes.every((s) => s.basis === "solvent-table" && s.guideCategory === "recommended")).toBe(true);
    expect(greenerSubstitutes("ethyl acetate").substitutes).toEqual([]);
  });
});

describe("a required layer position needs a sure split", () => {
  it("does not offer anisole (0.995 g/mL at 20 °C, CRC) as a sure top layer over water (0.998 g/mL)", () => {
    const anisole = rankSolvents({ organicLayer: "top" }).find((x) => x.key === "anisole");
    expect(anisole).toBeDefined();
    expect(Math.abs(anisole!.densityDifferenceGPerMl!)).toBeLessThan(0.03);
    expect(anisole!.meetsConstraints).toBe(false);
    expect(anisole!.failures.join(" ")).toMatch(/no sure top layer/);
  });

  it("still offers toluene (0.867 g/mL), well clear of water", () => {
    const toluene = rankSolvents({ organicLayer: "top" }).find((x) => x.key === "toluene")!;
    expect(toluene.meetsConstraints).toBe(true);
  });
});
