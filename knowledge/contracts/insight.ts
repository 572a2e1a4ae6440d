import * as z from "./zod";

/*
 * The group's insight: how remedies do by system family, how long clearing takes, which cases
 * are stuck, which solvents the group uses, and cases per month. Shared by
 * server/routes/insight.ts and the desk's Insight section.
 */

const day = z
  .string()
  .check(
    z.regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2025-03-14."),
    z.refine((v) => !Number.isNaN(Date.parse(`${v}T00:00:00Z`)), "That is not a date."),
  );

/** Both ends inclusive, whole days in UTC; by default the last 12 calendar months up to today. */
export const insightQuery = z
  .object({ from: z.optional(day), to: z.optional(day) })
  .check(z.refine((q) => !q.from || !q.to || q.from <= q.to, { message: "The start date is after the end date.", path: ["from"] }));
export type InsightQuery = z.input<typeof insightQuery>;

/** A case is stubborn when it is still open after this many attempts, none of which cleared it. */
export const STUBBORN_MIN_ATTEMPTS = 2;

export interface RemedyRate {
  remedyId: string;
  remedyTitle: string;
  tried: number;
  cleared: number;
  partly: number;
  /** cleared ÷ tried, 0–1, to 3 decimals */
  rate: number;
}

export interface FamilyRemedies {
  /** the extraction solvent's family, or "unknown" when the solvent did not resolve */
  solventFamily: string;
  tried: number;
  remedies: RemedyRate[];
}

export interface StubbornCase {
  id: string;
  title: string;
  authorName: string;
  solvents: string[];
  attempts: number;
  /** whole days since the work-up */
  openDays: number;
  occurredAt: string;
}

export interface InsightResponse {
  period: { from: string; to: string };
  totals: { cases: number; open: number; resolved: number; abandoned: number; attempts: number };
  byFamily: FamilyRemedies[];
  timeToClear: {
    /** minutes spent on attempts up to and including the first that cleared, median over cases */
    medianMinutes: number | null;
    /** cases that cleared with every attempt up to it timed */
    cases: number;
    /** cases that cleared but have an untimed attempt on the way, left out of the median */
    untimed: number;
    byRemedy: { remedyId: string; remedyTitle: string; medianMinutes: number; cases: number }[];
  };
  stubborn: StubbornCase[];
  solvents: { key: string | null; name: string; cases: number }[];
  perMonth: { month: string; cases: number; resolved: number }[];
}

/** Median of a list (mean of the middle two for an even count); null when empty. */
export function median(values: number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}
