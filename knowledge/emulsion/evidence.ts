import type { CauseCode, RemedyId } from "./model";

export type EvidenceOutcome = "cleared" | "partly" | "no-change" | "worse";

/** One remedy attempt from a group's logged cases, reduced to what the ranking needs. */
export interface EvidenceRecord {
  groupId: string;
  remedyId: RemedyId | string;
  outcome: EvidenceOutcome;
  solventFamily: string;
  phBand: string;
  causeCode?: CauseCode | string;
}

export const PH_BANDS = ["<2", "2-6", "6-9", "9-12", ">12"] as const;
export type PhBand = (typeof PH_BANDS)[number];

/**
 * Aqueous pH band of the case-log signature: <2, 2–6, 6–9, 9–12, >12. A pH on a boundary
 * belongs to the band below it (6 → "2-6", 9 → "6-9", 12 → "9-12"); 2 itself is "2-6".
 */
export function phBand(ph: number): PhBand {
  if (!Number.isFinite(ph)) throw new RangeError(`pH must be a number (got ${ph})`);
  if (ph < 2) return "<2";
  if (ph <= 6) return "2-6";
  if (ph <= 9) return "6-9";
  if (ph <= 12) return "9-12";
  return ">12";
}

/**
 * Prior strength of the curated fit, in pseudo-cases. With k = 4, the curated score p₀ acts as
 * a Beta(k·p₀, k·(1 − p₀)) prior, and the posterior mean after s successes in n tries is
 * (s + k·p₀) / (n + k): one lucky case moves a remedy by at most 1/5 of the way to 1.
 */
export const PRIOR_STRENGTH = 4;

/** Success credit per outcome: "partly" counts half, as a half-cleared band is half a success. */
export const OUTCOME_CREDIT: Record<EvidenceOutcome, number> = {
  cleared: 1,
  partly: 0.5,
  "no-change": 0,
  worse: 0,
};

/** Posterior mean of a Beta(k·p₀, k·(1 − p₀)) prior after `successes` in `tries`. */
export function smoothedRate(priorMean: number, successes: number, tries: number, strength = PRIOR_STRENGTH): number {
  const p0 = Math.min(1, Math.max(0, priorMean));
  const a = strength * p0;
  const b = strength * (1 - p0);
  return (successes + a) / (tries + a + b);
}

/**
 * The records that may be used for this caller. With a group id, only that group's records;
 * without one, the records only if they all come from one group — evidence from two groups is
 * never blended.
 */
export function ownGroupRecords(records: EvidenceRecord[], groupId?: string): EvidenceRecord[] {
  if (groupId !== undefined) return records.filter((r) => r.groupId === groupId);
  const groups = new Set(records.map((r) => r.groupId));
  return groups.size <= 1 ? records : [];
}

export interface CaseSignature {
  solventFamily: string;
  phBand: PhBand;
  /** the most likely cause of the current case */
  causeCode?: string;
}

/**
 * Similar cases: same solvent family, same pH band, and the same cause when both the record
 * and the current case name one (a record logged without a cause matches on the first two).
 */
export function isSimilar(record: EvidenceRecord, sig: CaseSignature): boolean {
  if (record.solventFamily !== sig.solventFamily || record.phBand !== sig.phBand) return false;
  if (record.causeCode === undefined || sig.causeCode === undefined) return true;
  return record.causeCode === sig.causeCode;
}

export interface RemedyEvidence {
  cleared: number;
  tried: number;
  smoothedRate: number;
}

/** How one remedy did in similar cases, blended with its curated prior. Null when never tried. */
export function remedyEvidence(
  remedyId: string,
  priorMean: number,
  records: EvidenceRecord[],
  sig: CaseSignature,
): RemedyEvidence | null {
  const own = records.filter((r) => r.remedyId === remedyId && isSimilar(r, sig));
  if (own.length === 0) return null;
  const successes = own.reduce((s, r) => s + OUTCOME_CREDIT[r.outcome], 0);
  return {
    cleared: own.filter((r) => r.outcome === "cleared").length,
    tried: own.length,
    smoothedRate: smoothedRate(priorMean, successes, own.length),
  };
}
