import fc from "fast-check";
import { netCharge, PH_SEARCH_HIGH, PH_SEARCH_LOW, solvePh, speciesFractions, type AqueousMixture, type ProticSystem } from "../../knowledge/plan/acid-base";

/*
 * solvePh takes interpolation steps inside a bracket (Brent's method). These checks hold it to
 * plain bisection on the charge balance written out here from the species fractions, and to
 * textbook pH values.
 */

const PKW = 13.995;

/** The charge balance from first principles: H⁺ − OH⁻ + spectators + Σ total × Σ fraction × charge. */
function referenceCharge(m: AqueousMixture, pH: number): number {
  let q = 10 ** -pH - 10 ** (pH - PKW) + m.strongCationMolL - m.strongAnionMolL;
  for (const s of m.systems) {
    const f = speciesFractions(s.pKas, pH);
    let total = s.totalMolL;
    if (s.volatileNeutralMaxMolL !== undefined && f[0]! * total > s.volatileNeutralMaxMolL) total = s.volatileNeutralMaxMolL / f[0]!;
    q += total * f.reduce((acc, fj, j) => acc + fj * (s.chargeOfMostProtonated - j), 0);
  }
  return q;
}

function bisect(charge: (pH: number) => number): number {
  let lo = PH_SEARCH_LOW;
  let hi = PH_SEARCH_HIGH;
  if (charge(lo) <= 0) return lo;
  if (charge(hi) >= 0) return hi;
  while (hi - lo > 1e-9) {
    const mid = (lo + hi) / 2;
    if (charge(mid) > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

const system: fc.Arbitrary<ProticSystem> = fc.record({
  totalMolL: fc.double({ min: 1e-5, max: 3, noNaN: true }),
  pKas: fc.array(fc.double({ min: -2, max: 15, noNaN: true }), { minLength: 1, maxLength: 3 }).map((p) => [...p].sort((a, b) => a - b)),
  chargeOfMostProtonated: fc.integer({ min: 0, max: 1 }),
});

const mixture: fc.Arbitrary<AqueousMixture> = fc.record({
  strongCationMolL: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 5, noNaN: true })),
  strongAnionMolL: fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 5, noNaN: true })),
  systems: fc.array(system, { maxLength: 4 }),
});

describe("solvePh", () => {
  it("lands within 1e-6 pH of bisection on the charge balance, for any mixture", () => {
    fc.assert(
      fc.property(mixture, (m) => {
        const fast = solvePh((pH) => netCharge(m, pH));
        const slow = bisect((pH) => referenceCharge(m, pH));
        expect(Math.abs(fast - slow)).toBeLessThan(1e-6);
      }),
      { numRuns: 400 },
    );
  });

  it("needs far fewer charge evaluations than bisection's 27", () => {
    const counts: number[] = [];
    fc.assert(
      fc.property(mixture, (m) => {
        let n = 0;
        solvePh((pH) => {
          n++;
          return netCharge(m, pH);
        });
        counts.push(n);
      }),
      { numRuns: 200 },
    );
    const mean = counts.reduce((a, b) => a + b, 0) / counts.length;
    expect(mean).toBeLessThan(18);
    expect(Math.max(...counts)).toBeLessThan(60);
  });

  it("matches textbook values: 0.010 M acetic acid pH 3.39, 0.10 M NH3 pH 11.12, 0.010 M HCl pH 2.00", () => {
    // Acetic acid pKa 4.76, ammonium pKa 9.25 (CRC Handbook, dissociation constants of organic
    // acids and bases; pH values by the exact quadratic, as in any analytical chemistry text).
    const acetic = solvePh((pH) => netCharge({ strongCationMolL: 0, strongAnionMolL: 0, systems: [{ totalMolL: 0.01, pKas: [4.76], chargeOfMostProtonated: 0 }] }, pH));
    const ka = 10 ** -4.76;
    const h = (-ka + Math.sqrt(ka * ka + 4 * ka * 0.01)) / 2;
    expect(acetic).toBeCloseTo(-Math.log10(h), 4);
    expect(acetic).toBeCloseTo(3.39, 2);
    const ammonia = solvePh((pH) => netCharge({ strongCationMolL: 0, strongAnionMolL: 0, systems: [{ totalMolL: 0.1, pKas: [9.25], chargeOfMostProtonated: 1 }] }, pH));
    expect(ammonia).toBeCloseTo(11.12, 1);
    const hcl = solvePh((pH) => netCharge({ strongCationMolL: 0, strongAnionMolL: 0.01, systems: [] }, pH));
    expect(hcl).toBeCloseTo(2.0, 3);
  });
});
