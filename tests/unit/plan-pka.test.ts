import { PKA_TABLE, findPka, searchPka } from "../../knowledge/plan/pka";
import { planSourceEntry } from "../../knowledge/plan/sources";
import { WASH_CHEMISTRY } from "../../knowledge/plan/wash-chemistry";

describe("pKa table", () => {
  it("has unique keys and a known source for every value", () => {
    expect(new Set(PKA_TABLE.map((e) => e.key)).size).toBe(PKA_TABLE.length);
    for (const e of PKA_TABLE) expect(planSourceEntry(e.pKa.source)).toBeDefined();
    for (const w of WASH_CHEMISTRY) for (const s of w.systems) for (const p of s.pKas) expect(planSourceEntry(p.source)).toBeDefined();
  });

  it.each([
    // LibreTexts E1 (CRC-derived), read here
    ["acetic acid", 4.756],
    ["benzoic acid", 4.204],
    ["phenol", 9.99],
    // LibreTexts E5 (Martell & Smith, Critical Stability Constants): aminobenzene
    ["aniline", 4.601],
    // Reusch, Virtual Textbook of Organic Chemistry, onium-acid table
    ["pyridine", 5.2],
    ["DMAP", 9.7],
    ["imidazole", 7.0],
    ["morpholine", 8.3],
    ["diphenylamine", 0.8],
    // CRC inorganic dissociation constants (Perrin 1982): ammonium
    ["ammonia", 9.25],
  ])("%s: pKa %d as in the checked compilation", (name, pKa) => {
    expect(findPka(name)?.pKa.value).toBe(pKa);
  });

  it("orders the phenols as their substituents predict (nitro groups acidify)", () => {
    const v = (q: string) => findPka(q)!.pKa.value;
    expect(v("picric acid (2,4,6-trinitrophenol)")).toBeLessThan(v("2,4-dinitrophenol"));
    expect(v("2,4-dinitrophenol")).toBeLessThan(v("4-nitrophenol"));
    expect(v("4-nitrophenol")).toBeLessThan(v("phenol"));
  });

  it("finds by synonym and searches by group and kind", () => {
    expect(findPka("Et3N")?.key).toBe("triethylamine");
    expect(findPka("Hünig's base")?.kind).toBe("base");
    const phenols = searchPka("phenol", "acid").map((e) => e.key);
    expect(phenols).toEqual(expect.arrayContaining(["phenol", "4-nitrophenol"]));
    expect(searchPka("", "base").every((e) => e.kind === "base")).toBe(true);
  });
});
