/**
 * Aqueous acid–base equilibrium by exact charge balance. Concentrations stand in for
 * activities (activity coefficients = 1), so concentrated salt solutions read lower or
 * higher on a pH meter than computed here; pKa values are for 25 °C.
 */

/** pKw at 25 °C from Kw = 1.01 × 10⁻¹⁴ (CRC inorganic dissociation table). */
export const PKW_25C = 13.995;

/** A conjugate series H_nA … A, each step with its pKa, fully protonated form of charge `chargeOfMostProtonated`. */
export interface ProticSystem {
  totalMolL: number;
  /** ascending */
  pKas: number[];
  chargeOfMostProtonated: number;
  /**
   * For a volatile neutral form (CO2 from carbonic acid): the most of it the solution holds;
   * above that it leaves as gas, so the system's total falls (vented funnel or open flask).
   */
  volatileNeutralMaxMolL?: number;
}

/** Everything in one aqueous phase except H⁺ and OH⁻. */
export interface AqueousMixture {
  /** charge concentration of spectator cations (Na⁺, K⁺, Li⁺), mol/L of charge */
  strongCationMolL: number;
  /** charge concentration of spectator anions (Cl⁻), mol/L of charge */
  strongAnionMolL: number;
  systems: ProticSystem[];
}

export const EMPTY_MIXTURE: AqueousMixture = { strongCationMolL: 0, strongAnionMolL: 0, systems: [] };

/** Fractions of H_nA, H_(n−1)A, …, A at this pH (index = protons lost). */
export function speciesFractions(pKas: number[], pH: number): number[] {
  // log-space terms keep very acidic or basic solutions from underflowing
  const logTerms: number[] = [0];
  let acc = 0;
  for (const pKa of pKas) {
    acc += pH - pKa;
    logTerms.push(acc);
  }
  const max = Math.max(...logTerms);
  const terms = logTerms.map((t) => 10 ** (t - max));
  const sum = terms.reduce((a, b) => a + b, 0);
  return terms.map((t) => t / sum);
}

/** Mean charge of one formula unit of the system at this pH. */
export function meanCharge(system: ProticSystem, pH: number): number {
  const f = speciesFractions(system.pKas, pH);
  return f.reduce((q, fj, j) => q + fj * (system.chargeOfMostProtonated - j), 0);
}

/** Total of the system left in solution at this pH once any excess volatile neutral form has left. */
export function effectiveTotalMolL(system: ProticSystem, pH: number): number {
  const cap = system.volatileNeutralMaxMolL;
  if (cap === undefined) return system.totalMolL;
  const neutralShare = speciesFractions(system.pKas, pH)[0] ?? 0;
  return neutralShare * system.totalMolL <= cap ? system.totalMolL : cap / neutralShare;
}

/** Net positive charge (mol/L) of the mixture, H⁺ and OH⁻ included, at this pH. Decreases as pH rises. */
export function netCharge(mixture: AqueousMixture, pH: number): number {
  const h = 10 ** -pH;
  const oh = 10 ** (pH - PKW_25C);
  let q = h - oh + mixture.strongCationMolL - mixture.strongAnionMolL;
  for (const s of mixture.systems) q += effectiveTotalMolL(s, pH) * meanCharge(s, pH);
  return q;
}

export const PH_SEARCH_LOW = -3;
export const PH_SEARCH_HIGH = 17;

/**
 * The pH where `charge(pH)` = 0, for a charge that falls as pH rises (every acid–base
 * term does). Bisection, so it cannot diverge; 0.000 01 pH units is far below the model's accuracy.
 */
export function solvePh(charge: (pH: number) => number): number {
  let lo = PH_SEARCH_LOW;
  let hi = PH_SEARCH_HIGH;
  if (charge(lo) <= 0) return lo;
  if (charge(hi) >= 0) return hi;
  while (hi - lo > 1e-6) {
    const mid = (lo + hi) / 2;
    if (charge(mid) > 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Equilibrium pH of a mixture on its own. */
export function mixturePh(mixture: AqueousMixture): number {
  return solvePh((pH) => netCharge(mixture, pH));
}

/** The same mixture diluted or concentrated by `factor` (new = old × factor). */
export function scaleMixture(mixture: AqueousMixture, factor: number): AqueousMixture {
  return {
    strongCationMolL: mixture.strongCationMolL * factor,
    strongAnionMolL: mixture.strongAnionMolL * factor,
    systems: mixture.systems.map((s) => ({ ...s, totalMolL: s.totalMolL * factor })),
  };
}

/** Two volumes of two mixtures combined (concentrations volume-weighted). */
export function combineMixtures(a: AqueousMixture, volumeAMl: number, b: AqueousMixture, volumeBMl: number): AqueousMixture {
  const v = volumeAMl + volumeBMl;
  const wa = volumeAMl / v;
  const wb = volumeBMl / v;
  return {
    strongCationMolL: a.strongCationMolL * wa + b.strongCationMolL * wb,
    strongAnionMolL: a.strongAnionMolL * wa + b.strongAnionMolL * wb,
    systems: [...scaleMixture(a, wa).systems, ...scaleMixture(b, wb).systems],
  };
}
