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

/**
 * The two things the charge balance needs of one system at one pH, in one pass without
 * allocating (the pH solver calls this a few dozen times per wash): the share in the fully
 * protonated form and the mean charge. Same log-space arithmetic as speciesFractions.
 */
function fractionsSummary(system: ProticSystem, pH: number): { neutralShare: number; meanCharge: number } {
  const pKas = system.pKas;
  let acc = 0;
  let max = 0;
  for (let j = 0; j < pKas.length; j++) {
    acc += pH - pKas[j]!;
    if (acc > max) max = acc;
  }
  let sum = 10 ** -max;
  let weighted = 0; // Σ term_j × j (protons lost)
  const first = sum;
  acc = 0;
  for (let j = 0; j < pKas.length; j++) {
    acc += pH - pKas[j]!;
    const t = 10 ** (acc - max);
    sum += t;
    weighted += t * (j + 1);
  }
  return { neutralShare: first / sum, meanCharge: system.chargeOfMostProtonated - weighted / sum };
}

/** Mean charge of one formula unit of the system at this pH. */
export function meanCharge(system: ProticSystem, pH: number): number {
  return fractionsSummary(system, pH).meanCharge;
}

function effectiveTotal(system: ProticSystem, neutralShare: number): number {
  const cap = system.volatileNeutralMaxMolL;
  if (cap === undefined) return system.totalMolL;
  return neutralShare * system.totalMolL <= cap ? system.totalMolL : cap / neutralShare;
}

/** Total of the system left in solution at this pH once any excess volatile neutral form has left. */
export function effectiveTotalMolL(system: ProticSystem, pH: number): number {
  if (system.volatileNeutralMaxMolL === undefined) return system.totalMolL;
  return effectiveTotal(system, fractionsSummary(system, pH).neutralShare);
}

/** Net positive charge (mol/L) of the mixture, H⁺ and OH⁻ included, at this pH. Decreases as pH rises. */
export function netCharge(mixture: AqueousMixture, pH: number): number {
  const h = 10 ** -pH;
  const oh = 10 ** (pH - PKW_25C);
  let q = h - oh + mixture.strongCationMolL - mixture.strongAnionMolL;
  for (const s of mixture.systems) {
    const f = fractionsSummary(s, pH);
    q += effectiveTotal(s, f.neutralShare) * f.meanCharge;
  }
  return q;
}

export const PH_SEARCH_LOW = -3;
export const PH_SEARCH_HIGH = 17;

/** How closely solvePh pins the root, in pH units: far below the model's accuracy. */
export const PH_TOLERANCE = 1e-6;

/**
 * The pH where `charge(pH)` = 0, for a charge that falls as pH rises (every acid–base
 * term does). Brent's method (Brent, Algorithms for Minimization without Derivatives, 1973,
 * ch. 4): it keeps a bracket like bisection, so it cannot diverge, but takes secant and
 * inverse-quadratic steps where the charge is smooth, so it needs about a third of the
 * evaluations bisection does for PH_TOLERANCE.
 */
export function solvePh(charge: (pH: number) => number): number {
  let a = PH_SEARCH_LOW;
  let b = PH_SEARCH_HIGH;
  let fa = charge(a);
  if (fa <= 0) return a;
  let fb = charge(b);
  if (fb >= 0) return b;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let i = 0; i < 200; i++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + PH_TOLERANCE / 2;
    const m = (c - b) / 2;
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // interpolation: secant when only two points differ, else inverse quadratic
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const r = fb / fc;
        const t = fa / fc;
        p = s * (2 * m * t * (t - r) - (b - a) * (r - 1));
        q = (t - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = charge(b);
  }
  return b;
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
