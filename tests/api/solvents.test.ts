import request from "supertest";
import { startTestApp, type TestApp } from "./harness";

/*
 * GET /api/solvents, /api/solvents/:key and /api/aqueous-solutions. Published values:
 *  - CRC Handbook, "Physical constants of organic compounds": dichloromethane ρ(20 °C) 1.3266 g/mL,
 *    bp 39.6 °C, CAS 75-09-2, M 84.93 g/mol; ethyl acetate ρ(20 °C) 0.9003 g/mL, CAS 141-78-6.
 *  - Prat et al., CHEM21 selection guide, Green Chem. 2016, 18, 288: dichloromethane "hazardous",
 *    ethyl acetate "recommended", chloroform "highly hazardous".
 *  - CRC Handbook, "Concentrative properties of aqueous solutions": NaCl 10 % w/w 1.0707 g/mL at 20 °C;
 *    NaCl solubility 35.9 g per 100 g water at 20 °C (26.4 % w/w).
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

interface Item {
  key: string;
  name: string;
  cas: string;
  densityGPerMl20C: number;
  boilingPointC: number;
  guideCategory: string;
  halogenated: boolean;
}

describe("GET /api/solvents", () => {
  it("lists at least 30 solvents, compact, without signing in", async () => {
    const res = await request(t.app).get("/api/solvents");
    expect(res.status).toBe(200);
    expect(res.body.solvents.length).toBeGreaterThanOrEqual(30);
    const dcm = res.body.solvents.find((s: Item) => s.key === "dichloromethane");
    expect(dcm).toMatchObject({
      name: "Dichloromethane",
      cas: "75-09-2",
      formula: "CH2Cl2",
      miscibility: "immiscible",
      guideCategory: "hazardous",
      halogenated: true,
      peroxideClass: null,
    });
    expect(Math.abs(dcm.densityGPerMl20C - 1.3266)).toBeLessThan(0.001);
    expect(dcm.boilingPointC).toBeCloseTo(39.6, 1);
    expect(dcm.synonyms).toContain("DCM");
    // compact: no sources or Antoine constants in the list
    expect(dcm.antoine).toBeUndefined();
    expect(typeof dcm.densityGPerMl20C).toBe("number");
  });

  it.each([
    ["DCM", "dichloromethane"],
    ["methylene chloride", "dichloromethane"],
    ["75-09-2", "dichloromethane"],
    ["CH2Cl2", "dichloromethane"],
    ["EtOAc", "ethyl-acetate"],
    ["141-78-6", "ethyl-acetate"],
    ["dichloromethan", "dichloromethane"],
    ["Et2O", "diethyl-ether"],
  ])("finds %s first", async (q, key) => {
    const res = await request(t.app).get("/api/solvents").query({ q });
    expect(res.status).toBe(200);
    expect(res.body.solvents[0].key).toBe(key);
  });

  it("cuts the weak fuzzy tail: a search for ether lists the ethers, not every solvent", async () => {
    const res = await request(t.app).get("/api/solvents").query({ q: "ether" });
    const keys = res.body.solvents.map((s: Item) => s.key);
    expect(keys[0]).toBe("diethyl-ether");
    expect(keys).toEqual(expect.arrayContaining(["mtbe", "cpme"]));
    expect(keys.length).toBeLessThanOrEqual(16);
    expect(keys).not.toContain("dmso");
    expect(keys).not.toContain("dichloromethane");
  });

  it("answers an empty list for nothing like a solvent", async () => {
    const res = await request(t.app).get("/api/solvents").query({ q: "qqqqzzzz" });
    expect(res.status).toBe(200);
    expect(res.body.solvents).toEqual([]);
  });

  it("refuses an overlong search with 400 naming q", async () => {
    const res = await request(t.app).get("/api/solvents").query({ q: "x".repeat(121) });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(["q"]);
  });
});

describe("GET /api/solvents/:key", () => {
  it("gives every value of dichloromethane with its source title, by slug or CAS", async () => {
    const bySlug = await request(t.app).get("/api/solvents/dichloromethane");
    const byCas = await request(t.app).get("/api/solvents/75-09-2");
    expect(bySlug.status).toBe(200);
    expect(byCas.body).toEqual(bySlug.body);
    const d = bySlug.body;
    expect(Math.abs(d.densityGPerMl20C.value - 1.3266)).toBeLessThan(0.001);
    expect(d.molarMassGPerMol.value).toBeCloseTo(84.93, 1);
    expect(d.guide.value.category).toBe("hazardous");
    expect(d.guide.value.reason.length).toBeGreaterThan(10);
    expect(d.guide.sourceTitle).toMatch(/CHEM21/);
    expect(d.densityGPerMl20C.sourceTitle).toMatch(/CRC Handbook/);
    expect(d.antoine.value).toMatchObject({ pressureUnit: "mmHg", temperatureUnit: "C" });
    // Antoine reproduces the normal boiling point: log10(760) = A − B / (C + 39.6).
    const { a, b, c } = d.antoine.value;
    expect(a - b / (c + 39.6)).toBeCloseTo(Math.log10(760), 1);
    const sourced = Object.entries(d).filter(([, v]) => typeof v === "object" && v !== null && !Array.isArray(v));
    expect(sourced.length).toBeGreaterThanOrEqual(12);
    for (const [field, v] of sourced) {
      const value = v as { source?: string; sourceTitle?: string };
      expect([field, typeof value.source]).toEqual([field, "string"]);
      expect([field, (value.sourceTitle ?? "").length > 10]).toEqual([field, true]);
    }
  });

  it("ranks chloroform highly hazardous and ethyl acetate recommended (CHEM21)", async () => {
    expect((await request(t.app).get("/api/solvents/chloroform")).body.guide.value.category).toBe("highly-hazardous");
    expect((await request(t.app).get("/api/solvents/141-78-6")).body.guide.value.category).toBe("recommended");
  });

  it("answers 404 for an abbreviation or an unknown key, with suggestions", async () => {
    const res = await request(t.app).get("/api/solvents/DCM");
    expect(res.status).toBe(404);
    expect(res.body.error.suggestions).toContain("dichloromethane");
    expect((await request(t.app).get("/api/solvents/no-such-solvent")).status).toBe(404);
  });
});

describe("GET /api/aqueous-solutions", () => {
  it("lists at least 12 solutes with their table points, limits and sources", async () => {
    const res = await request(t.app).get("/api/aqueous-solutions");
    expect(res.status).toBe(200);
    const solutes = res.body.solutes as {
      key: string;
      points: { value: { massFractionPct: number; densityGPerMl: number }[]; sourceTitle: string };
      saturationWtPct: { value: number; sourceTitle: string } | null;
      limits: { maxMassFractionPct: number; maxMolPerL: number; maxGPerL: number; limitedBy: string };
    }[];
    expect(solutes.length).toBeGreaterThanOrEqual(12);
    for (const key of ["water", "sodium-chloride", "hydrochloric-acid", "sodium-hydroxide", "potassium-hydroxide", "sodium-bicarbonate", "sodium-carbonate", "potassium-carbonate", "ammonium-chloride", "sulfuric-acid", "lithium-chloride", "calcium-chloride"]) {
      expect(solutes.map((s) => s.key)).toContain(key);
    }
    const nacl = solutes.find((s) => s.key === "sodium-chloride")!;
    const p10 = nacl.points.value.find((p) => p.massFractionPct === 10)!;
    expect(p10.densityGPerMl).toBeCloseTo(1.0707, 4); // CRC concentrative properties
    expect(nacl.points.sourceTitle).toMatch(/CRC Handbook/);
    expect(nacl.saturationWtPct!.value).toBeCloseTo((100 * 35.9) / 135.9, 1);
    expect(nacl.limits.limitedBy).toBe("saturation");
    // Saturated brine by hand: c = w·ρ·10 / M = 26.4 × 1.2006 × 10 / 58.443 ≈ 5.42 mol/L.
    expect(nacl.limits.maxMolPerL).toBeCloseTo((26.4 * 1.2006 * 10) / 58.443, 1);
    expect(nacl.limits.maxGPerL).toBeCloseTo(26.4 * 1.2006 * 10, -1);
    const water = solutes.find((s) => s.key === "water")!;
    expect(water.saturationWtPct).toBeNull();
    expect(water.limits.maxMassFractionPct).toBe(0);
    for (const s of solutes) {
      const ws = s.points.value.map((p) => p.massFractionPct);
      expect(ws).toEqual([...ws].sort((a, b) => a - b));
    }
  });
});
