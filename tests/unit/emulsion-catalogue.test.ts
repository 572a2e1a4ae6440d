import {
  CAUSES,
  CAUSE_CODES,
  EMULSION_SOURCES,
  PREVENTION_TIPS,
  REMEDIES,
  REMEDY_IDS,
  catalogueEntry,
  isEmulsionSourceKey,
  preventionFor,
  remedyAmounts,
  remedyCatalogue,
  systemFacts,
} from "../../knowledge/emulsion";

describe("cause catalogue", () => {
  it("covers the eight causes, each with signs and a known source", () => {
    expect(CAUSES.map((c) => c.code).sort()).toEqual([...CAUSE_CODES].sort());
    expect(CAUSES.length).toBeGreaterThanOrEqual(8);
    for (const c of CAUSES) {
      expect(c.signs.length).toBeGreaterThanOrEqual(2);
      expect(c.sources.length).toBeGreaterThan(0);
      for (const s of c.sources) expect(isEmulsionSourceKey(s)).toBe(true);
    }
  });
});

describe("remedy catalogue", () => {
  it("holds at least 17 remedies with unique ids, all with sources that resolve", () => {
    expect(REMEDIES.length).toBeGreaterThanOrEqual(17);
    expect(new Set(REMEDIES.map((r) => r.id)).size).toBe(REMEDIES.length);
    expect(REMEDIES.map((r) => r.id).sort()).toEqual([...REMEDY_IDS].sort());
    const withSources = REMEDIES.filter((r) => r.sources.length > 0 && r.sources.every(isEmulsionSourceKey));
    expect(withSources.length).toBe(REMEDIES.length);
  });

  it.each(REMEDIES.map((r) => [r.id, r] as const))("%s is complete", (_id, r) => {
    expect(r.mechanism.length).toBeGreaterThan(20);
    expect(Object.keys(r.fits.causes).length).toBeGreaterThan(0);
    for (const [code, w] of Object.entries(r.fits.causes)) {
      expect(CAUSE_CODES).toContain(code);
      expect(w).toBeGreaterThan(0);
      expect(w).toBeLessThanOrEqual(1);
    }
    expect(r.fits.conditions.length).toBeGreaterThan(0);
    expect(r.minutes.min).toBeGreaterThan(0);
    expect(r.minutes.min).toBeLessThanOrEqual(r.minutes.max);
    expect(r.risks.length).toBeGreaterThan(0);
    expect(["literature", "common-practice", "anecdotal"]).toContain(r.evidence);
    expect(r.scale.length).toBeGreaterThan(0);
  });

  it.each([
    ["warm-bath", /boiling point/],
    ["centrifuge", /Flammable solvents/],
    ["adjust-ph", /never a stoppered funnel/],
    ["strip-cosolvent", /[Pp]eroxides/],
    ["gentle-vacuum-degas", /vacuum/],
  ])("%s carries its safety caution, deferring to the SDS and local rules", (id, pattern) => {
    const r = REMEDIES.find((x) => x.id === id)!;
    expect(r.cautions.join(" ")).toMatch(pattern);
    expect(r.cautions.join(" ")).toMatch(/SDS and local rules/);
  });

  it("every source entry has a title and a kind", () => {
    for (const s of EMULSION_SOURCES) {
      expect(s.title.length).toBeGreaterThan(20);
      expect(s.kind).toBeTruthy();
    }
  });
});

describe("amounts scale with the funnel", () => {
  it.each([
    // brine 20–30 % of the aqueous volume; NaCl: half of 35.9 g per 100 g water (CRC solubility), ρ(water, 20 °C) = 0.9982
    [100, 20, 30, 18],
    [200, 40, 60, 36],
    [40, 8, 12, 7],
  ])("%p mL water: %p–%p mL brine, %p g salt", (aqueousMl, bMin, bMax, salt) => {
    const facts = systemFacts(
      { organic: [{ solvent: "ethyl acetate", volumeMl: aqueousMl }], aqueous: { solute: "water", volumeMl: aqueousMl }, temperatureC: 20 },
      undefined,
    );
    const a = remedyAmounts(facts, undefined, null);
    expect(a.brineMl).toEqual({ min: bMin, max: bMax });
    expect(a.saltSaturationG).toBeCloseTo(aqueousMl * 0.9982 * (26.4 / 73.6), 1);
    expect(a.saltG).toBe(salt);
    const steps = REMEDIES.find((r) => r.id === "saturated-brine")!.steps(a).join(" ");
    expect(steps).toContain(`${bMin}–${bMax} mL saturated aqueous NaCl`);
  });

  it("estimates the water a water-saturated ethyl acetate layer holds (3.3 wt %, Stephenson 1992)", () => {
    const facts = systemFacts(
      { organic: [{ solvent: "ethyl acetate", volumeMl: 100 }], aqueous: { solute: "water", volumeMl: 100 }, temperatureC: 20 },
      undefined,
    );
    const a = remedyAmounts(facts, undefined, null);
    const rho = facts.layers.organicParts[0]!.densityGPerMl;
    const pct = facts.main.waterInSolventWtPct.value!;
    expect(pct).toBeGreaterThan(2.5);
    expect(pct).toBeLessThan(3.5);
    expect(a.dissolvedWaterG).toBeCloseTo((100 * rho * pct) / 100, 6);
  });
});

describe("catalogue view and prevention", () => {
  it("serves every remedy as plain data with example steps and source titles", () => {
    const cat = remedyCatalogue();
    expect(cat).toHaveLength(REMEDIES.length);
    const json = JSON.parse(JSON.stringify(cat)) as typeof cat;
    expect(json[0]!.steps.length).toBeGreaterThan(0);
    for (const e of json) for (const s of e.sources) expect(s.title).not.toBe(s.key);
    expect(catalogueEntry("saturated-brine")?.steps[0]).toMatch(/20–30 mL/);
    expect(catalogueEntry("no-such-remedy")).toBeUndefined();
  });

  it("chooses tips by cause, most likely first, then the general ones", () => {
    const tips = preventionFor(["fine-solids"]);
    expect(tips[0]).toMatch(/Filter solids off/);
    expect(tips.join(" ")).toMatch(/slow inversions/);
    expect(tips.join(" ")).not.toMatch(/bicarbonate/);
    for (const t of PREVENTION_TIPS) expect(isEmulsionSourceKey(t.source)).toBe(true);
  });
});
