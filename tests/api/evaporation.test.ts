import request from "supertest";
import { startTestApp, type TestApp } from "./harness";

/*
 * POST /api/evaporation against published values that the Antoine constants were not fitted to here:
 *  - Water: CRC Handbook of Chemistry and Physics, 73rd ed. (1992–93), "Vapor pressure of water"
 *    (read in a public copy): 25 °C 3.169 kPa, 30 °C 4.2455 kPa, 45 °C 9.5895 kPa, 46 °C 10.094 kPa,
 *    60 °C 19.932 kPa; 100 °C at 101.325 kPa (normal boiling point, ITS-90: 99.97 °C).
 *  - Normal boiling points (CRC, "Physical constants of organic compounds", from memory):
 *    toluene 110.6 °C, ethanol 78.3 °C, ethyl acetate 77.1 °C, diethyl ether 34.5 °C, n-hexane 68.7 °C.
 *  - Toluene vapour pressure at 25 °C ≈ 3.79 kPa (CRC, from memory).
 *  - 1 mmHg = 101 325 / 760 Pa (definition).
 * Antoine fits differ from the tables by a few tenths of a per cent; the tolerances say how much.
 */

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const evaporate = (body: unknown) => request(t.app).post("/api/evaporation").send(body as object);
const MBAR_PER_MMHG = 101325 / 760 / 100;

describe("POST /api/evaporation", () => {
  it.each([
    ["water", 100.0],
    ["toluene", 110.6],
    ["ethanol", 78.3],
    ["ethyl acetate", 77.1],
    ["diethyl ether", 34.5],
    ["hexane", 68.7],
  ])("puts the boiling point of %s at 1013.25 mbar at its published %s °C (±0.3)", async (solvent, published) => {
    const res = await evaporate({ solvent, pressureMbar: 1013.25 });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.boilingPointC - published)).toBeLessThanOrEqual(0.3);
    expect(res.body.pressureMbar).toBe(1013.25);
    expect(res.body.pressureMmHg).toBeCloseTo(760, 6);
  });

  it.each([
    [25, 31.69],
    [30, 42.455],
    [60, 199.32],
  ])("gives water's vapour pressure at %s °C as the CRC table's %s mbar (±1 %%), with the 20-degree rule", async (vaporTemperatureC, publishedMbar) => {
    const res = await evaporate({ solvent: "water", vaporTemperatureC });
    expect(res.status).toBe(200);
    const b = res.body;
    expect(Math.abs(b.pressureMbar - publishedMbar) / publishedMbar).toBeLessThan(0.01);
    expect(b.pressureMmHg).toBeCloseTo(b.pressureMbar / MBAR_PER_MMHG, 9);
    expect(b.boilingPointC).toBe(vaporTemperatureC);
    expect(b.bathC).toBe(vaporTemperatureC + 20);
    expect(b.condenserMaxC).toBe(vaporTemperatureC - 20);
    expect(b.solventKey).toBe("water");
    expect(b.sourceTitles.map((s: { key: string }) => s.key)).toEqual(b.sources);
  });

  it("boils water near 45.8 °C at 100 mbar (CRC: 9.5895 kPa at 45 °C, 10.094 kPa at 46 °C)", async () => {
    const res = await evaporate({ solvent: "H2O", pressureMbar: 100 });
    expect(res.status).toBe(200);
    const interpolated = 45 + (100 - 95.895) / (100.94 - 95.895);
    expect(Math.abs(res.body.boilingPointC - interpolated)).toBeLessThan(0.15);
  });

  it("gives toluene about 37.9 mbar at 25 °C", async () => {
    const res = await evaporate({ solvent: "toluene", vaporTemperatureC: 25 });
    expect(res.status).toBe(200);
    expect(Math.abs(res.body.pressureMbar - 37.9) / 37.9).toBeLessThan(0.02);
  });

  it("cautions before concentrating an ether and about halogenated condensate, each deferring or specific", async () => {
    const ether = await evaporate({ solvent: "Et2O", vaporTemperatureC: 20 });
    expect(ether.status).toBe(200);
    const etherCodes = ether.body.cautions.map((c: { code: string }) => c.code);
    expect(etherCodes).toEqual(expect.arrayContaining(["peroxide-before-concentrating", "low-boiler-gentle-vacuum"]));
    expect(ether.body.cautions.find((c: { code: string }) => c.code === "peroxide-before-concentrating").message).toMatch(/SDS/);
    const dcm = await evaporate({ solvent: "DCM", vaporTemperatureC: 20 });
    expect(dcm.body.cautions.map((c: { code: string }) => c.code)).toContain("halogenated-waste");
    const toluene = await evaporate({ solvent: "toluene", vaporTemperatureC: 40 });
    expect(toluene.body.cautions).toEqual([]);
  });

  it("refuses a pressure outside the constants' range with the range it covers", async () => {
    const res = await evaporate({ solvent: "water", pressureMbar: 1100 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("outside_antoine_range");
    expect(res.body.error.fields.pressureMbar).toMatch(/Antoine constants for Water hold from 1 to 100 °C/);
    expect(res.body.error.range.minC).toBe(1);
    expect(res.body.error.range.maxC).toBe(100);
    expect(res.body.error.range.maxMbar).toBeGreaterThan(1000);
  });

  it("refuses a vapour temperature outside the range", async () => {
    const res = await evaporate({ solvent: "water", vaporTemperatureC: 120 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("outside_antoine_range");
    expect(Object.keys(res.body.error.fields)).toEqual(["vaporTemperatureC"]);
  });

  it("says so plainly when the table has no Antoine constants (MTBE)", async () => {
    const res = await evaporate({ solvent: "MTBE", pressureMbar: 300 });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe("no_vapour_data");
    expect(res.body.error.message).toMatch(/no Antoine constants for Methyl tert-butyl ether/);
    expect(Object.keys(res.body.error.fields)).toEqual(["solvent"]);
  });

  it.each([
    ["both a temperature and a pressure", { solvent: "water", vaporTemperatureC: 30, pressureMbar: 40 }, "vaporTemperatureC"],
    ["neither", { solvent: "water" }, "vaporTemperatureC"],
    ["a negative pressure", { solvent: "water", pressureMbar: -3 }, "pressureMbar"],
    ["a temperature as text", { solvent: "water", vaporTemperatureC: "warm" }, "vaporTemperatureC"],
    ["no solvent", { pressureMbar: 100 }, "solvent"],
    ["an unknown solvent", { solvent: "unobtainium", pressureMbar: 100 }, "solvent"],
  ])("answers 400 for %s", async (_label, body, field) => {
    const res = await evaporate(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });
});
