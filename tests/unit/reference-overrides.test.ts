import { applyOverrides } from "../../knowledge/overrides";
import { predictLayers } from "../../knowledge/layers";
import { SHIPPED_REFERENCE, findSolute, findSolvent } from "../../knowledge/reference";
import { densityAtMassFractionGPerMl } from "../../knowledge/concentration";
import { KnowledgeInputError } from "../../knowledge/types";

describe("applyOverrides", () => {
  it("returns new data and leaves the shipped tables untouched", () => {
    const before = JSON.stringify(SHIPPED_REFERENCE);
    const ref = applyOverrides(SHIPPED_REFERENCE, [
      { kind: "solvent-value", solventKey: "ethyl-acetate", field: "flashPointC", value: -3, source: "group SDS, 2024 lot" },
    ]);
    expect(ref).not.toBe(SHIPPED_REFERENCE);
    expect(findSolvent("EtOAc", ref)?.flashPointC).toEqual({ value: -3, source: "group SDS, 2024 lot" });
    expect(findSolvent("EtOAc")?.flashPointC.value).toBe(-4);
    expect(JSON.stringify(SHIPPED_REFERENCE)).toBe(before);
  });

  it("feeds a corrected density into the layer check", () => {
    // A measured 1.2100 g/mL for the lab's brine at 26.4 %: DCE (1.2527) − 1.2100 = 0.0427.
    const ref = applyOverrides(SHIPPED_REFERENCE, [
      { kind: "aqueous-point", soluteKey: "sodium-chloride", massFractionPct: 26.4, densityGPerMl: 1.21, source: "measured, pycnometer" },
    ]);
    const nacl = findSolute("NaCl", ref)!;
    expect(densityAtMassFractionGPerMl(nacl, 26.4)).toBeCloseTo(1.21, 6);
    expect(nacl.points.note).toMatch(/measured, pycnometer/);
    const p = predictLayers({ organic: [{ solvent: "DCE", volumeMl: 20 }], aqueous: { solute: "brine", concentration: "saturated", volumeMl: 20 }, temperatureC: 20 }, ref);
    expect(p.densityDifferenceGPerMl).toBeCloseTo(0.0427, 4);
    expect(densityAtMassFractionGPerMl(findSolute("NaCl")!, 26.4)).toBeCloseTo(1.2006, 4);
  });

  it("adds a new solvent", () => {
    const toluene = findSolvent("toluene")!;
    const ref = applyOverrides(SHIPPED_REFERENCE, [
      { kind: "solvent-new", solvent: { ...toluene, key: "p-cymene", name: "p-Cymene", synonyms: ["cymene"], cas: "99-87-6", formula: "C10H14", densityGPerMl20C: { value: 0.857, source: "group SDS" } } },
    ]);
    expect(ref.solvents.length).toBe(SHIPPED_REFERENCE.solvents.length + 1);
    expect(findSolvent("cymene", ref)?.densityGPerMl20C.value).toBe(0.857);
  });

  it.each([
    [{ kind: "solvent-value", solventKey: "nope", field: "boilingPointC", value: 50, source: "x" }, "overrides[0].solventKey"],
    [{ kind: "solvent-value", solventKey: "toluene", field: "densityGPerMl20C", value: 9, source: "x" }, "overrides[0].value"],
    [{ kind: "solvent-value", solventKey: "toluene", field: "densityGPerMl20C", value: 0.87, source: "" }, "overrides[0].source"],
    [{ kind: "solvent-value", solventKey: "acetone", field: "waterInSolventWtPct", value: 5, source: "x" }, "overrides[0].field"],
    [{ kind: "aqueous-point", soluteKey: "sodium-chloride", massFractionPct: 0, densityGPerMl: 1, source: "x" }, "overrides[0].massFractionPct"],
    [{ kind: "aqueous-point", soluteKey: "brine", massFractionPct: 5, densityGPerMl: 1.03, source: "x" }, "overrides[0].soluteKey"],
    [{ kind: "solvent-new", solvent: { ...SHIPPED_REFERENCE.solvents[0]! } }, "overrides[0].solvent.key"],
    [{ kind: "mystery" }, "overrides[0].kind"],
  ])("rejects %j at %s", (o, field) => {
    try {
      applyOverrides(SHIPPED_REFERENCE, [o as never]);
      throw new Error("expected an error");
    } catch (e) {
      expect(e).toBeInstanceOf(KnowledgeInputError);
      expect((e as KnowledgeInputError).field).toBe(field);
    }
  });
});
