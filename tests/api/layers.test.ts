import request from "supertest";
import { signUp, startTestApp, type TestApp } from "./harness";

/*
 * POST /api/layers/predict, checked against published densities at 20 °C:
 *  - CRC Handbook of Chemistry and Physics, "Physical constants of organic compounds":
 *    dichloromethane 1.3266, ethyl acetate 0.9003, toluene 0.8669, n-hexane 0.6594 g/mL.
 *  - CRC Handbook, "Concentrative properties of aqueous solutions": NaCl 10 % w/w 1.0707,
 *    26 % w/w 1.1972 g/mL; HCl 3.6 % w/w ≈ 1 mol/L.
 *  - Perry's Chemical Engineers' Handbook, NaOH 50 % w/w 1.5253 g/mL.
 *  - Pure water 0.99820 g/mL (Kell 1975; CRC "Properties of water").
 * The response rounds densities to 3 decimals, so a value is right when it lies within
 * 0.0005 of the published one (plus the table's own tolerance where stated).
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const predict = (body: unknown) => request(t.app).post("/api/layers/predict").send(body as object);

const decimals = (x: number) => (String(x).split(".")[1] ?? "").length;

function near(actual: number, published: number, tolerance = 0.0005) {
  expect(Math.abs(actual - published)).toBeLessThanOrEqual(tolerance + 1e-12);
}

describe("POST /api/layers/predict", () => {
  it("answers the issue's example without signing in: DCM under 10 % brine", async () => {
    const res = await predict({
      organic: [{ solvent: "dichloromethane", volumeMl: 40 }],
      aqueous: { solute: "NaCl", concentration: { value: 10, unit: "%w/w" }, volumeMl: 20 },
      temperatureC: 20,
      dissolvedSolidsG: 0,
    });
    expect(res.status).toBe(200);
    const b = res.body;
    expect(b.phases).toBe(2);
    expect(b.top).toBe("aqueous");
    expect(b.bottom).toBe("organic");
    near(b.organicDensityGPerMl, 1.3266); // CRC, dichloromethane at 20 °C
    near(b.aqueousDensityGPerMl, 1.0707); // CRC, NaCl 10 % w/w at 20 °C
    near(b.densityDifferenceGPerMl, 1.3266 - 1.0707, 0.001);
    for (const x of [b.organicDensityGPerMl, b.aqueousDensityGPerMl, b.densityDifferenceGPerMl]) expect(decimals(x)).toBeLessThanOrEqual(3);
    expect(b.confidence).toBe("clear");
    expect(b.warnings.map((w: { code: string }) => w.code)).toContain("halogenated");
    expect(b.warnings.map((w: { code: string }) => w.code)).not.toContain("name-interpreted");
    for (const w of b.warnings) {
      expect(typeof w.code).toBe("string");
      expect(w.message.length).toBeGreaterThan(10);
    }
    expect(b.sources.length).toBeGreaterThan(0);
    expect(b.sourceTitles.map((s: { key: string }) => s.key)).toEqual(b.sources);
    expect(b.sourceTitles.find((s: { key: string }) => s.key === "crc-aqueous-2021").title).toMatch(/CRC Handbook/);
    expect(b.organicParts).toEqual([{ key: "dichloromethane", name: "Dichloromethane", volumeMl: 40, densityGPerMl: 1.327 }]);
    expect(b.totalVolumeMl).toBe(60);
  });

  it("puts DCM on top of 50 % NaOH and says the order is inverted", async () => {
    const res = await predict({
      organic: [{ solvent: "DCM", volumeMl: 50 }],
      aqueous: { solute: "sodium hydroxide", concentration: { value: 50, unit: "%" }, volumeMl: 25 },
      temperatureC: 20,
    });
    expect(res.status).toBe(200);
    near(res.body.aqueousDensityGPerMl, 1.5253); // Perry's, NaOH 50 % w/w at 20 °C
    expect(res.body.top).toBe("organic");
    expect(res.body.bottom).toBe("aqueous");
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toEqual(expect.arrayContaining(["inverted-order", "corrosive-aqueous"]));
  });

  it("reads saturated brine from the saturation limit", async () => {
    const res = await predict({
      organic: [{ solvent: "EtOAc", volumeMl: 100 }],
      aqueous: { solute: "brine", concentration: "saturated", volumeMl: 50 },
      temperatureC: 20,
    });
    expect(res.status).toBe(200);
    // CRC: 26 % w/w is 1.1972 g/mL; saturation (26.4 %, 35.9 g per 100 g water) lies just above.
    expect(res.body.aqueousDensityGPerMl).toBeGreaterThanOrEqual(1.197);
    expect(res.body.aqueousDensityGPerMl).toBeLessThanOrEqual(1.205);
    expect(res.body.aqueous.massFractionPct).toBeCloseTo(100 * 35.9 / 135.9, 1);
    near(res.body.organicDensityGPerMl, 0.9003); // CRC, ethyl acetate
    expect(res.body.top).toBe("organic");
  });

  it("takes plain water without a concentration", async () => {
    const res = await predict({ organic: [{ solvent: "toluene", volumeMl: 30 }], aqueous: { solute: "water", volumeMl: 30 }, temperatureC: 20 });
    expect(res.status).toBe(200);
    near(res.body.aqueousDensityGPerMl, 0.9982); // Kell 1975 / CRC, water at 20 °C
    near(res.body.organicDensityGPerMl, 0.8669); // CRC, toluene
    expect(res.body.top).toBe("organic");
    expect(res.body.confidence).toBe("clear");
  });

  it("answers one phase for THF and water, with no top or bottom", async () => {
    const res = await predict({ organic: [{ solvent: "THF", volumeMl: 20 }], aqueous: { solute: "water", volumeMl: 20 }, temperatureC: 20 });
    expect(res.status).toBe(200);
    expect(res.body.phases).toBe(1);
    expect(res.body.top).toBeNull();
    expect(res.body.bottom).toBeNull();
    expect(res.body.confidence).toBe("one-phase");
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toContain("one-phase");
  });

  it("mixes solvents by volume: 30 mL DCM + 10 mL hexane", async () => {
    const res = await predict({
      organic: [
        { solvent: "CH2Cl2", volumeMl: 30 },
        { solvent: "n-hexane", volumeMl: 10 },
      ],
      aqueous: { solute: "water", volumeMl: 40 },
      temperatureC: 20,
    });
    expect(res.status).toBe(200);
    // Ideal mixing by hand from the CRC densities: (30 × 1.3266 + 10 × 0.6594) / 40 = 1.1598.
    near(res.body.organicDensityGPerMl, (30 * 1.3266 + 10 * 0.6594) / 40);
    expect(res.body.bottom).toBe("organic");
    expect(res.body.assumptions.join(" ")).toMatch(/mix ideally/);
  });

  it("corrects DCM to 30 °C and reads a concentration in M", async () => {
    const res = await predict({
      organic: [{ solvent: "75-09-2", volumeMl: 20 }],
      aqueous: { solute: "HCl", concentration: { value: 1, unit: "M" }, volumeMl: 20 },
      temperatureC: 30,
    });
    expect(res.status).toBe(200);
    // Linear in T by hand: 1.3266 + (−0.001885 g/mL/K, Perry's DIPPR slope) × 10 K = 1.3078.
    near(res.body.organicDensityGPerMl, 1.3266 - 0.001885 * 10);
    // 1 mol/L HCl is about 3.6 % w/w (CRC); c = w·ρ·10 / M must give back 1 mol/L.
    const { massFractionPct, densityGPerMl } = res.body.aqueous;
    expect(massFractionPct).toBeGreaterThan(3.4);
    expect(massFractionPct).toBeLessThan(3.8);
    // The wire density is at 30 °C; the 20 °C molarity uses ρ(20 °C) ≈ ρ(30 °C) × 0.99820/0.99565 (water, CRC).
    expect((massFractionPct * densityGPerMl * (0.9982 / 0.99565) * 10) / 36.461).toBeCloseTo(1, 1);
  });

  it("is the same for a signed-in caller", async () => {
    const { agent } = await signUp(t.app, "layers");
    const body = { organic: [{ solvent: "toluene", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 10 }, temperatureC: 20 };
    const anonymous = await predict(body);
    const signedIn = await agent.post("/api/layers/predict").send(body);
    expect(signedIn.status).toBe(200);
    expect(signedIn.body).toEqual(anonymous.body);
  });

  it("accepts a close typo but refuses an unknown name with the closest matches", async () => {
    const typo = await predict({ organic: [{ solvent: "dichloromethan", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 10 }, temperatureC: 20 });
    expect(typo.status).toBe(200);
    expect(typo.body.organicParts[0].name).toBe("Dichloromethane");
    // …and says how it read the name, since a slip can land on another compound.
    expect(typo.body.warnings[0]).toEqual({ code: "name-interpreted", message: expect.stringContaining("“dichloromethan” as Dichloromethane (CAS 75-09-2)") });

    const res = await predict({ organic: [{ solvent: "dikloromethan", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 10 }, temperatureC: 20 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(["organic[0].solvent"]);
    expect(res.body.error.suggestions[0]).toBe("Dichloromethane");

    const solute = await predict({
      organic: [{ solvent: "toluene", volumeMl: 10 }],
      aqueous: { solute: "potassium permanganate", concentration: { value: 1, unit: "%w/w" }, volumeMl: 10 },
      temperatureC: 20,
    });
    expect(solute.status).toBe(400);
    expect(Object.keys(solute.body.error.fields)).toEqual(["aqueous.solute"]);
    expect(Array.isArray(solute.body.error.suggestions)).toBe(true);
  });

  it.each([
    ["a negative organic volume", { organic: [{ solvent: "toluene", volumeMl: -5 }] }, "organic[0].volumeMl"],
    ["a zero aqueous volume", { aqueous: { solute: "water", volumeMl: 0 } }, "aqueous.volumeMl"],
    ["no organic solvent", { organic: [] }, "organic"],
    ["a temperature above 60 °C", { temperatureC: 80 }, "temperatureC"],
    ["a temperature below 0 °C", { temperatureC: -10 }, "temperatureC"],
    ["a temperature above the solvent's boiling point (DCM boils at 39.6 °C, CRC)", { organic: [{ solvent: "DCM", volumeMl: 10 }], temperatureC: 45 }, "temperatureC"],
    ["NaCl above saturation (26.4 % w/w)", { aqueous: { solute: "NaCl", concentration: { value: 30, unit: "%w/w" }, volumeMl: 10 } }, "aqueous.concentration"],
    ["10 M NaCl (saturated brine is about 5.4 M)", { aqueous: { solute: "NaCl", concentration: { value: 10, unit: "mol/L" }, volumeMl: 10 } }, "aqueous.concentration"],
    ["a negative concentration", { aqueous: { solute: "NaCl", concentration: { value: -1, unit: "%" }, volumeMl: 10 } }, "aqueous.concentration.value"],
    ["an unknown unit", { aqueous: { solute: "NaCl", concentration: { value: 1, unit: "mmol" }, volumeMl: 10 } }, "aqueous.concentration"],
    ["a salt without a concentration", { aqueous: { solute: "NaCl", volumeMl: 10 } }, "aqueous.concentration"],
    ["water as the organic phase", { organic: [{ solvent: "water", volumeMl: 10 }] }, "organic[0].solvent"],
    ["a volume given as text", { organic: [{ solvent: "toluene", volumeMl: "10 mL" }] }, "organic[0].volumeMl"],
  ])("answers 400 for %s", async (_what, change, field) => {
    const base = { organic: [{ solvent: "toluene", volumeMl: 10 }], aqueous: { solute: "water", volumeMl: 10 }, temperatureC: 20 };
    const res = await predict({ ...base, ...change });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("bad_request");
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(res.body.error.fields[field].length).toBeGreaterThan(5);
  });

  it("answers 400 for a body that is not an object", async () => {
    const res = await request(t.app).post("/api/layers/predict").set("content-type", "application/json").send("[]");
    expect(res.status).toBe(400);
  });
});
