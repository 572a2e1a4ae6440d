import * as z from "./zod";
import { CAUSE_CODES } from "../emulsion/model";
import { PH_BANDS, type CasePhBand } from "./cases";
import type { PersonRef } from "./curation";

/*
 * Group advice: a lead promotes a verified fix into the group's note on a remedy for a kind of
 * system ("for halogenated solvents over basic water, filter first"). Shared by
 * server/routes/advice.ts, the emulsion help (through the group-notes seam) and the desk.
 */

export const SOLVENT_FAMILIES = [
  "halogenated",
  "ether",
  "ester",
  "hydrocarbon",
  "aromatic",
  "alcohol",
  "ketone",
  "nitrile",
  "amide",
  "sulfoxide",
  "other",
] as const;

/** Words for the signature parts, for the note's scope line. */
export const FAMILY_WORDS: Record<string, string> = {
  halogenated: "halogenated solvents",
  ether: "ethers",
  ester: "esters",
  hydrocarbon: "hydrocarbons",
  aromatic: "aromatic solvents",
  alcohol: "alcohols",
  ketone: "ketones",
  nitrile: "nitriles",
  amide: "amide solvents",
  sulfoxide: "sulfoxides",
  other: "other solvents",
};

export const PH_BAND_WORDS: Record<CasePhBand, string> = {
  "<2": "strongly acidic water (pH below 2)",
  "2-6": "acidic water (pH 2–6)",
  "6-9": "near-neutral water (pH 6–9)",
  "9-12": "basic water (pH 9–12)",
  ">12": "strongly basic water (pH above 12)",
};

/** "halogenated solvents over basic water (pH 9–12)"; "any system" when nothing narrows it. */
export function adviceScope(n: { solventFamily: string | null; phBand: string | null }): string {
  const family = n.solventFamily ? (FAMILY_WORDS[n.solventFamily] ?? n.solventFamily) : null;
  const band = n.phBand ? (PH_BAND_WORDS[n.phBand as CasePhBand] ?? `pH ${n.phBand}`) : null;
  if (family && band) return `${family} over ${band}`;
  if (family) return family;
  if (band) return `any solvent over ${band}`;
  return "any system";
}

const noteText = z
  .string({ message: "Write the note." })
  .check(
    z.trim(),
    z.minLength(10, "Write the note in a sentence (at least 10 characters)."),
    z.maxLength(600, "Keep the note under 600 characters."),
  );
const id = z.string().check(z.trim(), z.minLength(1), z.maxLength(100));
/** undefined: take it from the case; null: any */
const family = z.optional(z.nullable(z.enum(SOLVENT_FAMILIES, { message: "Pick a solvent family." })));
const band = z.optional(z.nullable(z.enum(PH_BANDS, { message: "Pick a pH band." })));
const cause = z.optional(z.nullable(z.enum(CAUSE_CODES, { message: "Pick a cause from the catalogue." })));

export const adviceCreateBody = z.object({
  /** the verified case the fix comes from */
  caseId: id,
  /** the attempt to promote; by default the case's verified working fix */
  attemptId: z.optional(id),
  text: noteText,
  solventFamily: family,
  phBand: band,
  causeCode: cause,
  /** other cases that back the note */
  alsoCaseIds: z._default(z.array(id).check(z.maxLength(50)), []),
});
export type AdviceCreateBody = z.input<typeof adviceCreateBody>;

export const advicePatchBody = z
  .object({
    text: z.optional(noteText),
    solventFamily: family,
    phBand: band,
    causeCode: cause,
    sourceCaseIds: z.optional(z.array(id).check(z.minLength(1, "A note cites at least one case."), z.maxLength(50))),
    /** true retires the note (give a reason); false brings it back */
    retired: z.optional(z.boolean()),
    reason: z.optional(z.string().check(z.trim(), z.minLength(3, "Say why (at least 3 characters)."), z.maxLength(500))),
  })
  .check(
    z.refine((p) => Object.keys(p).some((k) => k !== "reason"), { message: "Change at least one field.", path: ["body"] }),
    z.refine((p) => p.retired !== true || p.reason !== undefined, { message: "Say why the note is retired.", path: ["reason"] }),
  );
export type AdvicePatchBody = z.input<typeof advicePatchBody>;

export const adviceListQuery = z.object({
  includeRetired: z._default(
    z.pipe(
      z.enum(["true", "false"]),
      z.transform((v) => v === "true"),
    ),
    false,
  ),
  remedy: z.optional(z.string().check(z.trim(), z.maxLength(60))),
});

export interface AdviceSource {
  id: string;
  title: string;
  verified: boolean;
  /** retired or merged away since the note was written */
  retired: boolean;
  whatWorked: string | null;
}

export interface AdviceNote {
  id: string;
  remedyId: string;
  remedyTitle: string;
  solventFamily: string | null;
  phBand: CasePhBand | null;
  causeCode: string | null;
  /** "halogenated solvents over basic water (pH 9–12)" */
  scope: string;
  text: string;
  sources: AdviceSource[];
  /** the remedy in the group's live cases that match the note's scope: "cleared n of m" */
  evidence: { cleared: number; tried: number };
  createdBy: PersonRef;
  createdAt: string;
  updatedAt: string;
  version: number;
  retired: boolean;
  retiredAt: string | null;
  retiredReason: string | null;
}

export interface AdviceListResponse {
  notes: AdviceNote[];
}

/** "cleared 3 of 4" */
export function clearedText(e: { cleared: number; tried: number }): string {
  return e.tried === 0 ? "not yet tried on a matching case" : `cleared ${e.cleared} of ${e.tried}`;
}
