import { AQUEOUS_SOLUTES } from "../../knowledge/aqueous";
import { normaliseName } from "../../knowledge/reference";
import { SOLVENTS } from "../../knowledge/solvents";
import { SOURCES } from "../../knowledge/sources";
import type { Sourced } from "../../knowledge/types";

const isSourced = (v: unknown): v is Sourced<unknown> =>
  typeof v === "object" && v !== null && "value" in v && "source" in v;

describe("curated tables", () => {
  it("holds the requested solvents", () => {
    const required = [
      "dichloromethane", "chloroform", "1-2-dichloroethane", "carbon-tetrachloride", "chlorobenzene", "diethyl-ether",
      "mtbe", "cpme", "2-methyltetrahydrofuran", "tetrahydrofuran", "1-4-dioxane", "ethyl-acetate", "isopropyl-acetate",
      "n-butyl-acetate", "pentane", "hexane", "heptane", "cyclohexane", "toluene", "benzene", "o-xylene", "anisole",
      "acetone", "2-butanone", "methanol", "ethanol", "isopropanol", "1-butanol", "acetonitrile", "dmf", "dmso", "nmp", "water",
    ];
    const keys = SOLVENTS.map((s) => s.key);
    expect(keys).toEqual(expect.arrayContaining(required));
    expect(SOLVENTS.length).toBeGreaterThanOrEqual(32);
  });

  it("holds the requested aqueous solutes", () => {
    const required = ["water", "sodium-chloride", "hydrochloric-acid", "sodium-hydroxide", "potassium-hydroxide", "sodium-bicarbonate",
      "sodium-carbonate", "potassium-carbonate", "ammonium-chloride", "sulfuric-acid", "lithium-chloride", "calcium-chloride"];
    expect(AQUEOUS_SOLUTES.map((s) => s.key)).toEqual(expect.arrayContaining(required));
    expect(AQUEOUS_SOLUTES.length).toBeGreaterThanOrEqual(14);
  });

  it.each(SOLVENTS.map((s) => [s.key, s] as const))("%s: every value carries a known source", (_key, s) => {
    const sourced = Object.values(s).filter(isSourced);
    expect(sourced.length).toBe(s.antoine ? 12 : 11); // every Sourced field of Solvent; Antoine may be null
    for (const v of sourced) expect(SOURCES[v.source]).toBeDefined();
    if (s.antoine) expect(SOURCES[s.antoine.source]).toBeDefined();
    expect(s.cas).toMatch(/^\d{2,7}-\d{2}-\d$/);
    expect(s.halogenated).toBe(/Cl|Br|I|F/.test(s.formula));
    expect(s.densityTempCoeffGPerMlPerK.value).toBeLessThan(0);
    expect(s.meltingPointC.value).toBeLessThan(s.boilingPointC.value);
    const miscible = s.miscibility.value === "miscible";
    expect(s.solubilityInWaterWtPct.value === null).toBe(miscible);
    expect(s.waterInSolventWtPct.value === null).toBe(miscible);
  });

  it.each(AQUEOUS_SOLUTES.map((s) => [s.key, s] as const))("%s: table starts at water and ascends", (_key, s) => {
    const pts = s.points.value;
    expect(pts[0]).toEqual({ massFractionPct: 0, densityGPerMl: 0.9982 });
    for (let k = 1; k < pts.length; k++) expect(pts[k]!.massFractionPct).toBeGreaterThan(pts[k - 1]!.massFractionPct);
    expect(SOURCES[s.points.source]).toBeDefined();
    if (s.saturationWtPct) expect(SOURCES[s.saturationWtPct.source]).toBeDefined();
  });

  it("names every source with a kind and a title, including common practice and from memory", () => {
    expect(SOURCES["common-practice"]?.kind).toBe("common-practice");
    expect(SOURCES["from-memory"]?.kind).toBe("from-memory");
    for (const [key, s] of Object.entries(SOURCES)) {
      expect(s.title.length).toBeGreaterThan(10);
      // a source recalled rather than read says so in its key and its title
      if (key.endsWith("-from-memory")) expect(s.title).toMatch(/memory/);
    }
  });

  it.each([
    ["solvents", SOLVENTS],
    ["solutes", AQUEOUS_SOLUTES],
  ] as const)("no name, synonym or CAS of the %s points at two entries", (_label, items) => {
    const owner = new Map<string, string>();
    for (const item of items) {
      for (const n of new Set([item.key, item.name, item.cas, ...item.synonyms].map(normaliseName))) {
        const prev = owner.get(n);
        expect(prev === undefined || prev === item.key ? true : `${n}: ${prev} and ${item.key}`).toBe(true);
        owner.set(n, item.key);
      }
    }
  });
});
