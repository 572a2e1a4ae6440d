import { KnowledgeInputError } from "../types";

/**
 * Repeated extraction with fresh portions (Nichols, Organic Chemistry Laboratory Techniques,
 * ch. 4): with D = concentration in the portion ÷ concentration in the layer being extracted,
 * the fraction left in that layer after n portions of volume V_p is (V_s / (V_s + D·V_p))ⁿ.
 * Washing an organic layer with water uses the same formula with D = 1 / D(org/aq).
 * Assumes equilibrium at each pass, constant volumes and a D that does not change with loading.
 */
export interface RepeatedExtraction {
  /** concentration in the fresh portion ÷ concentration in the layer being extracted */
  distributionRatio: number;
  /** volume of the layer being extracted */
  sourceVolumeMl: number;
  /** volume of each fresh portion */
  portionVolumeMl: number;
}

function check(input: RepeatedExtraction): void {
  if (!(input.distributionRatio >= 0) || !Number.isFinite(input.distributionRatio)) {
    throw new KnowledgeInputError("distributionRatio", "The distribution ratio must be a number ≥ 0.");
  }
  if (!(input.sourceVolumeMl > 0)) throw new KnowledgeInputError("sourceVolumeMl", "The layer's volume must be above 0 mL.");
  if (!(input.portionVolumeMl > 0)) throw new KnowledgeInputError("portionVolumeMl", "Each portion's volume must be above 0 mL.");
}

/** Fraction left in the layer after one portion. */
export function fractionLeftPerPass(input: RepeatedExtraction): number {
  check(input);
  return input.sourceVolumeMl / (input.sourceVolumeMl + input.distributionRatio * input.portionVolumeMl);
}

/** Fraction left in the layer after `passes` portions. */
export function fractionLeftAfterPasses(input: RepeatedExtraction, passes: number): number {
  if (!Number.isInteger(passes) || passes < 0) throw new KnowledgeInputError("passes", "The number of passes must be a whole number ≥ 0.");
  return fractionLeftPerPass(input) ** passes;
}

export interface PassesForRecovery {
  /** passes needed; null when the target cannot be reached (D = 0) */
  passes: number | null;
  /** recovery actually reached with that many passes */
  recovery: number | null;
  fractionLeftPerPass: number;
  /** total volume of the portions */
  totalPortionVolumeMl: number | null;
}

/** Fewest passes of the given portion to move at least `targetRecovery` (0–1) out of the layer. */
export function passesForRecovery(input: RepeatedExtraction, targetRecovery: number, maxPasses = 50): PassesForRecovery {
  if (!(targetRecovery > 0 && targetRecovery < 1)) {
    throw new KnowledgeInputError("targetRecovery", "The target recovery must lie between 0 and 1 (e.g. 0.99 for 99 %).");
  }
  const left = fractionLeftPerPass(input);
  if (left >= 1) return { passes: null, recovery: null, fractionLeftPerPass: left, totalPortionVolumeMl: null };
  // a tiny tolerance keeps 1 − 0.1³ = 0.999 from asking for a fourth pass through rounding
  const n = Math.max(1, Math.ceil(Math.log(1 - targetRecovery) / Math.log(left) - 1e-9));
  if (n > maxPasses) return { passes: null, recovery: null, fractionLeftPerPass: left, totalPortionVolumeMl: null };
  return { passes: n, recovery: 1 - left ** n, fractionLeftPerPass: left, totalPortionVolumeMl: n * input.portionVolumeMl };
}

export interface PortionComparison {
  /** recovery (fraction moved out of the layer) with the whole volume in one portion */
  singleRecovery: number;
  /** recovery with the same total volume split into `portions` equal portions */
  splitRecovery: number;
  portions: number;
  portionVolumeMl: number;
  /** percentage points gained by splitting */
  gainPercentPoints: number;
}

/** One portion of the total volume against `portions` equal portions of it. */
export function compareOneVersusSplit(
  distributionRatio: number,
  sourceVolumeMl: number,
  totalPortionVolumeMl: number,
  portions: number,
): PortionComparison {
  if (!Number.isInteger(portions) || portions < 1) throw new KnowledgeInputError("portions", "Portions must be a whole number ≥ 1.");
  const single = 1 - fractionLeftAfterPasses({ distributionRatio, sourceVolumeMl, portionVolumeMl: totalPortionVolumeMl }, 1);
  const portionVolumeMl = totalPortionVolumeMl / portions;
  const split = 1 - fractionLeftAfterPasses({ distributionRatio, sourceVolumeMl, portionVolumeMl }, portions);
  return { singleRecovery: single, splitRecovery: split, portions, portionVolumeMl, gainPercentPoints: (split - single) * 100 };
}

/** Fraction left after 0, 1, … maxPasses portions, for the remaining-against-passes curve. */
export function fractionLeftCurve(input: RepeatedExtraction, maxPasses: number): { pass: number; fractionLeft: number }[] {
  const left = fractionLeftPerPass(input);
  return Array.from({ length: maxPasses + 1 }, (_, pass) => ({ pass, fractionLeft: left ** pass }));
}
