import { findSolvent } from "../../knowledge/reference";
import {
  MBAR_PER_MMHG,
  boilingPointAtPressureC,
  evaporationSettings,
  vapourPressureMbar,
} from "../../knowledge/plan/evaporation";
import { KnowledgeInputError } from "../../knowledge/types";

const solvent = (q: string) => findSolvent(q)!;

describe("Antoine equation against published boiling points", () => {
  it.each([
    // saturation temperature of water, IAPWS-IF97 steam tables (recalled): 99.97 °C at 101.325 kPa, 45.81 °C at 10 kPa, 81.32 °C at 50 kPa
    ["water", 1013.25, 99.97, 0.2],
    ["water", 100, 45.81, 0.3],
    ["water", 500, 81.32, 0.3],
    // normal boiling points, CRC Handbook (from memory): toluene 110.6, ethanol 78.29, ethyl acetate 77.1, acetone 56.05
    ["toluene", 1013.25, 110.6, 0.4],
    ["ethanol", 1013.25, 78.29, 0.4],
    ["ethyl acetate", 1013.25, 77.1, 0.4],
    ["acetone", 1013.25, 56.05, 0.4],
  ])("%s boils at %d mbar near %d °C", (name, mbar, expectedC, tol) => {
    expect(Math.abs(boilingPointAtPressureC(solvent(name), mbar) - expectedC)).toBeLessThanOrEqual(tol);
  });

  it.each([
    // vapour pressure of water, IAPWS-IF97 steam tables (recalled): 2.339 kPa at 20 °C, 7.385 kPa at 40 °C
    ["water", 20, 23.39, 0.02],
    ["water", 40, 73.85, 0.02],
    // CRC Handbook vapour pressures (from memory): toluene 3.79 kPa at 25 °C, ethanol 5.95 kPa at 20 °C
    ["toluene", 25, 37.9, 0.03],
    ["ethanol", 20, 59.5, 0.03],
  ])("%s at %d °C has a vapour pressure near %d mbar", (name, t, mbar, relTol) => {
    expect(Math.abs(vapourPressureMbar(solvent(name), t) / mbar - 1)).toBeLessThanOrEqual(relTol);
  });

  it("inverts: the boiling point at the pressure it gives is the temperature again", () => {
    const s = solvent("toluene");
    expect(boilingPointAtPressureC(s, vapourPressureMbar(s, 55))).toBeCloseTo(55, 6);
  });

  it("refuses temperatures and pressures outside the constants' range", () => {
    const water = solvent("water");
    expect(() => vapourPressureMbar(water, 150)).toThrow(KnowledgeInputError);
    expect(() => boilingPointAtPressureC(water, 2000)).toThrow(KnowledgeInputError);
    expect(() => evaporationSettings({ solvent: "MTBE", vaporTemperatureC: 30 })).toThrow(KnowledgeInputError);
  });
});

describe("rotary-evaporator settings", () => {
  it("gives mbar and mmHg (1 mmHg = 1.333 22 mbar) and the 20-degree rule (common practice)", () => {
    const r = evaporationSettings({ solvent: "ethyl acetate", vaporTemperatureC: 40 });
    expect(r.pressureMmHg * MBAR_PER_MMHG).toBeCloseTo(r.pressureMbar, 9);
    expect(MBAR_PER_MMHG).toBeCloseTo(1.33322, 5);
    expect(r.bathC).toBe(60);
    expect(r.condenserMaxC).toBe(20);
    // manufacturer tables put ethyl acetate at ~240 mbar for a 40 °C vapour (domain brief §5.6)
    expect(r.pressureMbar).toBeGreaterThan(220);
    expect(r.pressureMbar).toBeLessThan(270);
  });

  it("takes a pressure and answers the boiling point", () => {
    const r = evaporationSettings({ solvent: "water", pressureMbar: 100 });
    expect(r.boilingPointC).toBeCloseTo(45.8, 0);
    expect(r.bathC).toBeCloseTo(r.boilingPointC + 20, 9);
  });

  it.each([
    ["dichloromethane", ["low-boiler-gentle-vacuum", "halogenated-waste"]],
    ["tetrahydrofuran", ["peroxide-before-concentrating"]],
    ["ethyl acetate", []],
  ])("cautions for %s", (name, codes) => {
    const r = evaporationSettings({ solvent: name, vaporTemperatureC: 30 });
    expect(r.cautions.map((c) => c.code).sort()).toEqual([...codes].sort());
  });
});
