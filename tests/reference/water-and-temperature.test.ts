import { aqueousDensityGPerMl, findSolute, waterDensityGPerMl } from "../../knowledge/reference";
import type { AqueousSolute } from "../../knowledge/types";

const solute = (q: string): AqueousSolute => {
  const s = findSolute(q);
  if (!s) throw new Error(`no solute ${q}`);
  return s;
};

describe("pure water", () => {
  // Perry's Chemical Engineers' Handbook, 8th ed., Table 2-32, water:
  // ρ [mol/dm³] = C1 + C2·T + C3·T² + C4·T³, 273.16–353.15 K.
  const perryWater = (tC: number) => {
    const T = tC + 273.15;
    return ((-13.851 + 0.64038 * T - 0.0019124 * T ** 2 + 1.8211e-6 * T ** 3) * 18.01528) / 1000;
  };
  it.each([0, 5, 10, 20, 25, 30, 40, 50, 60])("Kell's equation matches Perry's correlation at %d °C within 0.0002 g/mL", (t) => {
    expect(Math.abs(waterDensityGPerMl(t) - perryWater(t))).toBeLessThan(0.0002);
  });
  it("is 0.9982 g/mL at 20 °C, as in the first row of the CRC concentrative table", () => {
    expect(waterDensityGPerMl(20)).toBeCloseTo(0.9982, 4);
  });
});

describe("temperature correction of aqueous densities (ratio of pure-water densities)", () => {
  it("10 % NaCl at 25 °C: 1.0707 × ρw(25)/ρw(20) = 1.0707 × 0.99705/0.99820 = 1.06947", () => {
    expect(aqueousDensityGPerMl(solute("NaCl"), { value: 10, unit: "%w/w" }, 25)).toBeCloseTo(1.06947, 4);
  });

  // NaCl: the Polish "Poradnik fizykochemiczny" (WNT, Warsaw 1974), as reproduced on a university
  // physics-lab table page, gives ρ(20 °C) and a coefficient A (kg/m³ per K) with
  // ρ(t) = ρ(20) + A·(20 − t): 1 % 1005.3/0.22, 10 % 1070.7/0.37, 20 % 1147.8/0.49, 26 % 1197.2/0.55.
  // The water-ratio correction is an approximation: brines expand faster than water, by up to
  // about 0.00035 g/mL per K for saturated brine.
  it.each([
    [1, 1.0053, 0.22],
    [10, 1.0707, 0.37],
    [20, 1.1478, 0.49],
    [26, 1.1972, 0.55],
  ])("NaCl %d %% at 10 and 30 °C stays within 0.0004 g/mL per K of the tabulated coefficient", (w, rho20, a) => {
    for (const t of [10, 30]) {
      const expected = rho20 + (a * (20 - t)) / 1000;
      const rho = aqueousDensityGPerMl(solute("NaCl"), { value: w, unit: "%w/w" }, t);
      expect(Math.abs(rho - expected)).toBeLessThan(0.0004 * Math.abs(20 - t));
    }
  });
});
