import { KnowledgeInputError, type KnowledgeWarning } from "../types";

/** Common separatory-funnel sizes, mL. */
export const FUNNEL_SIZES_ML = [60, 125, 250, 500, 1000, 2000] as const;

/** Fill a funnel to at most about three-quarters (common practice; some guides say two-thirds). */
export const MAX_FILL_FRACTION = 0.75;

export interface FunnelChoice {
  /** recommended funnel for one batch */
  funnelMl: number;
  /** number of batches the liquid has to be split into (1 when it fits) */
  batches: number;
  batchVolumeMl: number;
  /** batch volume ÷ funnel size */
  fillFraction: number;
  warnings: KnowledgeWarning[];
  source: string;
}

/**
 * Smallest standard funnel that holds the liquid at most three-quarters full; beyond the
 * largest, equal batches in the largest size.
 */
export function chooseFunnel(totalVolumeMl: number, sizesMl: readonly number[] = FUNNEL_SIZES_ML): FunnelChoice {
  if (!(totalVolumeMl > 0) || !Number.isFinite(totalVolumeMl)) {
    throw new KnowledgeInputError("totalVolumeMl", "The total liquid volume must be above 0 mL.");
  }
  const sizes = [...sizesMl].sort((a, b) => a - b);
  const largest = sizes[sizes.length - 1];
  if (largest === undefined) throw new KnowledgeInputError("sizesMl", "At least one funnel size is needed.");
  const warnings: KnowledgeWarning[] = [];
  const batches = Math.ceil(totalVolumeMl / (largest * MAX_FILL_FRACTION) - 1e-9);
  const batchVolumeMl = totalVolumeMl / batches;
  const funnelMl = sizes.find((s) => batchVolumeMl <= s * MAX_FILL_FRACTION + 1e-9) ?? largest;
  if (batches > 1) {
    warnings.push({
      code: "funnel-batches",
      message: `${round(totalVolumeMl)} mL is more than a ${largest} mL funnel holds three-quarters full: work in ${batches} batches of about ${round(batchVolumeMl)} mL.`,
    });
  }
  if (funnelMl > 1000) {
    warnings.push({
      code: "funnel-large-pressure",
      message:
        "In funnels over 1 L, vapour pressure of volatile solvents can force the stopper out: vent often or use smaller batches (Prudent Practices); follow local rules.",
    });
  }
  return { funnelMl, batches, batchVolumeMl, fillFraction: batchVolumeMl / funnelMl, warnings, source: "common-practice" };
}

function round(x: number): number {
  return Math.round(x);
}
