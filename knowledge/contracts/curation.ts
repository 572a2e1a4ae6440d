import * as z from "./zod";
import type { AttemptOutcome, CasePhBand, CaseStatus, EmulsionKind } from "./cases";

/*
 * The lead's curation of the case log: the review queue, verify, requests to the author,
 * merging duplicates, retiring and restoring. Shared by server/routes/curation.ts and the desk.
 */

// ── retiring ─────────────────────────────────────────────────────────────────

/** Why a case leaves the record (domain brief §6.2 "Retire / deprecate", in our words). */
export const RETIRE_CODES = [
  "superseded",
  "unsafe",
  "not-reproducible",
  "not-allowed",
  "equipment-gone",
  "procedure-changed",
  "duplicate",
  "other",
] as const;
export type RetireCode = (typeof RETIRE_CODES)[number];

export const RETIRE_LABELS: Record<RetireCode, string> = {
  superseded: "Superseded by a better fix",
  unsafe: "Found unsafe",
  "not-reproducible": "Not reproducible",
  "not-allowed": "Solvent or reagent no longer allowed here",
  "equipment-gone": "Equipment no longer available",
  "procedure-changed": "The procedure changed",
  duplicate: "Duplicate of another case",
  other: "Other",
};

const text = (min: number, max: number, what: string) =>
  z
    .string({ message: `Write ${what}.` })
    .check(z.trim(), z.minLength(min, `Write ${what} (at least ${min} characters).`), z.maxLength(max, `Keep ${what} under ${max} characters.`));

const caseId = z.string().check(z.trim(), z.minLength(1, "Name the case."), z.maxLength(100));
const optionalNote = z.optional(z.string().check(z.trim(), z.maxLength(500)));

export const retireBody = z.object({
  code: z.enum(RETIRE_CODES, { message: "Pick why the case is retired." }),
  reason: text(3, 500, "the reason"),
});
export type RetireBody = z.input<typeof retireBody>;

export const restoreBody = z._default(z.object({ reason: optionalNote }), {});

// ── verify ───────────────────────────────────────────────────────────────────

export const verifyBody = z._default(
  z.object({
    /** the attempt that worked; by default the last attempt that cleared */
    attemptId: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(100))),
    note: optionalNote,
  }),
  {},
);
export type VerifyBody = z.input<typeof verifyBody>;

export const bulkVerifyBody = z.object({
  ids: z
    .array(caseId)
    .check(
      z.minLength(1, "Select at least one case."),
      z.maxLength(100, "Verify at most 100 cases at once."),
      z.refine((ids) => new Set(ids).size === ids.length, "A case is selected twice."),
    ),
});
export type BulkVerifyBody = z.input<typeof bulkVerifyBody>;

// ── merge ────────────────────────────────────────────────────────────────────

export const mergeBody = z.object({
  /** the case that remains */
  into: caseId,
  reason: optionalNote,
});
export type MergeBody = z.input<typeof mergeBody>;

// ── requests to the author ───────────────────────────────────────────────────

export const REQUEST_STATUSES = ["open", "answered"] as const;
export type RequestStatus = (typeof REQUEST_STATUSES)[number];

export const requestBody = z.object({ text: text(3, 2000, "what you need") });
export type RequestBody = z.input<typeof requestBody>;

export const requestPatchBody = z
  .object({
    status: z.optional(z.enum(REQUEST_STATUSES, { message: "Status is open or answered." })),
    reply: z.optional(z.string().check(z.trim(), z.maxLength(2000, "Keep the reply under 2000 characters."))),
  })
  .check(z.refine((p) => p.status !== undefined || p.reply !== undefined, { message: "Change the status or write a reply.", path: ["body"] }));
export type RequestPatchBody = z.input<typeof requestPatchBody>;

export const myRequestsQuery = z.object({
  status: z._default(z.enum([...REQUEST_STATUSES, "all"]), "open"),
});

export interface PersonRef {
  id: string;
  name: string;
}

export interface CaseRequest {
  id: string;
  caseId: string;
  caseTitle: string;
  text: string;
  status: RequestStatus;
  reply: string | null;
  askedBy: PersonRef;
  askedOf: PersonRef;
  answeredBy: PersonRef | null;
  createdAt: string;
  answeredAt: string | null;
}

export interface CaseRequestList {
  requests: CaseRequest[];
}

// ── curation state (what a restore brings back) ─────────────────────────────

/** A case's curation, as the audit log records it before and after each action. */
export interface CurationState {
  id: string;
  verified: boolean;
  verifiedBy: string | null;
  verifiedAt: string | null;
  verifiedAttemptId: string | null;
  retired: boolean;
  retiredAt: string | null;
  retiredBy: string | null;
  retiredReason: string | null;
  /** the case this one was merged into */
  mergedInto: string | null;
  /** cases merged into this one (still merged) */
  absorbed: string[];
  attemptCount: number;
  photoCount: number;
}

export interface MergeResponse {
  kept: CurationState;
  merged: CurationState;
  moved: { attempts: number; photos: number; followers: number };
}

export interface BulkVerifyResponse {
  verified: CurationState[];
}

// ── review queue ─────────────────────────────────────────────────────────────

export const REVIEW_KINDS = ["all", "new", "resolved", "asked"] as const;
export type ReviewKind = (typeof REVIEW_KINDS)[number];

export const reviewQuery = z.object({
  /** new = still open; resolved = resolved or abandoned, not yet verified; asked = has an open request */
  kind: z._default(z.enum(REVIEW_KINDS), "all"),
  limit: z._default(z.coerce.number().check(z.int(), z.minimum(1), z.maximum(200)), 100),
  offset: z._default(z.coerce.number().check(z.int(), z.minimum(0)), 0),
});
export type ReviewQuery = z.input<typeof reviewQuery>;

export const REVIEW_CHECKS = ["no-ph", "no-attempts", "no-fix", "no-photo", "layer-surprise", "no-outcome", "safety"] as const;
export type ReviewCheckCode = (typeof REVIEW_CHECKS)[number];

/** What the lead should look at before verifying (domain brief §6.2 "Verify"). */
export interface ReviewCheck {
  code: ReviewCheckCode;
  message: string;
  tone: "info" | "caution" | "danger";
}

export interface ReviewItem {
  id: string;
  title: string;
  status: CaseStatus;
  queue: "new" | "resolved";
  authorId: string;
  authorName: string;
  occurredAt: string;
  createdAt: string;
  updatedAt: string;
  solvents: string[];
  aqueousLabel: string;
  solventFamily: string | null;
  phBand: CasePhBand | null;
  kind: EmulsionKind | null;
  attemptCount: number;
  photoCount: number;
  whatWorked: string | null;
  bestOutcome: AttemptOutcome | null;
  /** the attempt a verify would mark as the working fix, when one cleared */
  fixAttemptId: string | null;
  openRequests: number;
  checks: ReviewCheck[];
}

export interface ReviewResponse {
  items: ReviewItem[];
  total: number;
  counts: Record<ReviewKind, number>;
}
