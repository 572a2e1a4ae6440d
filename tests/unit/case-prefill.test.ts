import { caseStartHref, decodeCasePrefill, encodeCasePrefill, type CasePrefill } from "../../hooks/case-prefill";

describe("Start-a-case link", () => {
  const full: CasePrefill = {
    organic: [
      { solvent: "dichloromethane", volumeMl: 50 },
      { solvent: "methanol", volumeMl: 5 },
    ],
    aqueous: { solute: "sodium bicarbonate", concentration: "saturated", volumeMl: 40 },
    temperatureC: 22,
    seen: { emulsionFractionPct: 30, solids: true, cloudyOrganic: false },
    tags: ["amide-coupling"],
    causes: ["fine-solids", "surfactant-soap"],
  };

  it("survives the trip through a URL unchanged", () => {
    const href = caseStartHref(full);
    expect(href.startsWith("/cases/new?system=")).toBe(true);
    const param = new URL(`http://x${href}`).searchParams.get("system");
    expect(decodeCasePrefill(param)).toEqual(full);
  });

  it("reads a still-encoded value and the first of repeated parameters", () => {
    const encoded = encodeURIComponent(encodeCasePrefill({ temperatureC: 5 }));
    expect(decodeCasePrefill(encoded)).toEqual({ temperatureC: 5 });
    expect(decodeCasePrefill([encodeCasePrefill({ temperatureC: 30 }), "{}"])).toEqual({ temperatureC: 30 });
  });

  it("drops the parts that do not parse and keeps the rest", () => {
    const raw = JSON.stringify({
      organic: [{ solvent: "ethyl acetate", volumeMl: 80 }, { solvent: "", volumeMl: 10 }, { solvent: "hexane", volumeMl: -3 }],
      aqueous: { solute: "water" },
      temperatureC: "warm",
      seen: { emulsionFractionPct: 250, thirdLayer: true },
      tags: ["ok", 3, " ok ", ""],
      causes: ["fine-solids", "Not A Code", "fine-solids"],
    });
    expect(decodeCasePrefill(raw)).toEqual({
      organic: [{ solvent: "ethyl acetate", volumeMl: 80 }],
      seen: { thirdLayer: true },
      tags: ["ok"],
      causes: ["fine-solids"],
    });
  });

  it.each([[undefined], [""], ["not json"], ["[1,2]"], ["null"], ['{"organic": "DCM"}']])("gives null for %p", (raw) => {
    expect(decodeCasePrefill(raw)).toBeNull();
  });

  it("leaves empty parts out of the link", () => {
    expect(encodeCasePrefill({ organic: [], seen: {}, tags: [] })).toBe("{}");
  });
});
