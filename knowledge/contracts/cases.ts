import * as z from "./zod";

/*
 * The case log's request and response shapes, shared by the server routes and the client
 * screens. Pure zod/mini and TypeScript: no I/O. Field names here are the API; change them only
 * additively.
 */

// ── vocabularies ─────────────────────────────────────────────────────────────

/** What the emulsion looked like (domain brief §6.1 H, in our own words). */
export const EMULSION_KINDS = [
  "none",
  "milky-band",
  "rag-with-solids",
  "foam",
  "whole-volume-cloudy",
  "three-layers",
  "hazy-organic",
] as const;
export type EmulsionKind = (typeof EMULSION_KINDS)[number];

export const ATTEMPT_OUTCOMES = ["cleared", "partly", "no-change", "worse"] as const;
export type AttemptOutcome = (typeof ATTEMPT_OUTCOMES)[number];

export const CASE_STATUSES = ["open", "resolved", "abandoned"] as const;
export type CaseStatus = (typeof CASE_STATUSES)[number];

export const PHASES = ["organic", "aqueous"] as const;
export type CasePhase = (typeof PHASES)[number];

export const SHAKING_LEVELS = ["gentle", "normal", "vigorous"] as const;
export type ShakingLevel = (typeof SHAKING_LEVELS)[number];

export const COMPONENT_ROLES = ["product", "starting-material", "reagent", "by-product", "impurity", "other"] as const;
export type ComponentRole = (typeof COMPONENT_ROLES)[number];

/** Aqueous pH bands of the case signature (domain brief §6.1): <2, 2–6, 6–9, 9–12, >12. */
export const PH_BANDS = ["<2", "2-6", "6-9", "9-12", ">12"] as const;
export type CasePhBand = (typeof PH_BANDS)[number];

/** Work-up contexts offered as tags; any other short tag is accepted too. */
export const SUGGESTED_CASE_TAGS = [
  "amide-coupling",
  "hydride-reduction",
  "grignard-quench",
  "ester-hydrolysis",
  "cross-coupling",
  "phase-transfer-catalyst",
  "metal-salts",
  "aluminium",
  "acid-base-wash",
  "natural-product",
  "scale-up",
] as const;

export const SORT_KEYS = ["relevance", "occurredAt", "updatedAt", "title", "status"] as const;
export type CaseSortKey = (typeof SORT_KEYS)[number];

// ── limits ───────────────────────────────────────────────────────────────────

export const MAX_PHOTOS_PER_CASE = 6;
export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
/** Accepted photo types, checked by the file's bytes, not its name. */
export const PHOTO_MIME_TYPES = ["image/jpeg", "image/png", "image/webp"] as const;
export const MAX_ATTEMPTS_PER_CASE = 40;
export const SLUG_MAX = 60;

// ── building blocks ──────────────────────────────────────────────────────────

const text = (max: number, message?: string) => z.string().check(z.trim(), z.maxLength(max, message ?? `Keep it under ${max} characters.`));
const optionalText = (max: number) =>
  z.pipe(
    z.optional(text(max)),
    z.transform((v) => (v === "" ? undefined : v)),
  );
const slug = z
  .string()
  .check(
    z.trim(),
    z.toLowerCase(),
    z.minLength(1, "Pick one."),
    z.maxLength(SLUG_MAX, `At most ${SLUG_MAX} characters.`),
    z.regex(/^[a-z0-9][a-z0-9-]*$/, "Use lower-case letters, digits and hyphens."),
  );
const positiveMl = z.number({ message: "Give the volume in mL." }).check(z.positive("The volume must be more than 0 mL."), z.maximum(1_000_000));

export const concentrationSchema = z.union([
  z.literal("saturated"),
  z.object({
    value: z.number().check(z.minimum(0, "The concentration cannot be negative.")),
    unit: z.enum(["mol/L", "%w/w", "g/L"], { message: 'The unit must be "mol/L", "%w/w" or "g/L".' }),
  }),
]);

export const organicPartSchema = z.object({
  /** as the chemist typed it; any synonym ("DCM") — the server resolves it */
  solvent: text(80).check(z.minLength(1, "Name the solvent.")),
  volumeMl: positiveMl,
});

export const aqueousPartSchema = z.object({
  /** as typed: "water", "brine", "NaHCO3", "Rochelle salt"… */
  solute: text(80).check(z.minLength(1, "Name the aqueous phase.")),
  concentration: z.optional(concentrationSchema),
  volumeMl: positiveMl,
  /** measured pH, when known */
  ph: z.optional(z.number().check(z.minimum(-2, "pH below −2 is not plausible."), z.maximum(16, "pH above 16 is not plausible."))),
});

export const scaleSchema = z.object({
  productG: z.optional(z.number().check(z.positive(), z.maximum(100_000))),
  mmol: z.optional(z.number().check(z.positive(), z.maximum(1_000_000))),
  funnelMl: z.optional(z.number().check(z.positive(), z.maximum(100_000))),
});

export const caseSystemSchema = z.object({
  organic: z.array(organicPartSchema).check(z.minLength(1, "Give at least one organic solvent."), z.maxLength(6, "At most 6 organic solvents.")),
  aqueous: aqueousPartSchema,
  temperatureC: z._default(
    z.number().check(z.minimum(-20, "Below −20 °C is outside a funnel work-up."), z.maximum(100, "Above 100 °C is outside a funnel work-up.")),
    20,
  ),
  scale: z.optional(scaleSchema),
});
export type CaseSystemInput = z.input<typeof caseSystemSchema>;

const seenFields = {
  kind: z.nullable(z.enum(EMULSION_KINDS)),
  /** share of the total liquid volume that is emulsified, % */
  emulsionFractionPct: z.nullable(z.number().check(z.minimum(0), z.maximum(100))),
  solids: z.nullable(z.boolean()),
  colour: z.nullable(text(60)),
  thirdLayer: z.nullable(z.boolean()),
  cloudyOrganic: z.nullable(z.boolean()),
  foamOrBubbles: z.nullable(z.boolean()),
  shaking: z.nullable(z.enum(SHAKING_LEVELS)),
  /** minutes already waited before the first attempt */
  minutesWaited: z.nullable(z.number().check(z.minimum(0), z.maximum(100_000))),
};
/** What was seen; every field may be null (not noted). */
export const seenSchema = z.object({
  kind: z._default(seenFields.kind, null),
  emulsionFractionPct: z._default(seenFields.emulsionFractionPct, null),
  solids: z._default(seenFields.solids, null),
  colour: z._default(seenFields.colour, null),
  thirdLayer: z._default(seenFields.thirdLayer, null),
  cloudyOrganic: z._default(seenFields.cloudyOrganic, null),
  foamOrBubbles: z._default(seenFields.foamOrBubbles, null),
  shaking: z._default(seenFields.shaking, null),
  minutesWaited: z._default(seenFields.minutesWaited, null),
});
/** A patch of what was seen: only the fields sent change. */
export const seenPatchSchema = z.partial(z.object(seenFields));
export const EMPTY_SEEN: z.output<typeof seenSchema> = {
  kind: null,
  emulsionFractionPct: null,
  solids: null,
  colour: null,
  thirdLayer: null,
  cloudyOrganic: null,
  foamOrBubbles: null,
  shaking: null,
  minutesWaited: null,
};
export type CaseSeen = z.output<typeof seenSchema>;

export const componentSchema = z.object({
  name: text(120).check(z.minLength(1, "Name the component.")),
  role: z.optional(z.enum(COMPONENT_ROLES)),
  kind: z.optional(z.enum(["acid", "base", "neutral"])),
  /** for a base, the pKa of its conjugate acid */
  pKa: z.optional(z.number().check(z.minimum(-15), z.maximum(60))),
});
export type CaseComponent = z.output<typeof componentSchema>;

const tagSchema = z.pipe(
  z.string().check(z.trim(), z.toLowerCase(), z.minLength(1), z.maxLength(40, "Keep each tag under 40 characters.")),
  z.transform((t) => t.replace(/\s+/g, "-")),
);

export const recoverySchema = z.object({
  massG: z.optional(z.number().check(z.minimum(0), z.maximum(100_000))),
  percent: z.optional(z.number().check(z.minimum(0), z.maximum(110, "Recovery above 110 % needs a second look."))),
});

// ── attempts ─────────────────────────────────────────────────────────────────

const attemptFields = {
  /** a remedy id from the emulsion catalogue ("saturated-brine"); null for a free description */
  remedyId: z._default(z.nullable(slug), null),
  description: optionalText(500),
  /** "20 mL saturated brine", "3 g NaCl" */
  amount: optionalText(120),
  minutes: z.optional(z.number().check(z.minimum(0), z.maximum(10_000))),
  outcome: z.enum(ATTEMPT_OUTCOMES, { message: "Outcome must be cleared, partly, no-change or worse." }),
  note: optionalText(2000),
};

export const attemptBody = z.object(attemptFields).check(
  z.refine((a) => a.remedyId !== null || (a.description ?? "") !== "", {
    message: "Pick a remedy or describe what you tried.",
    path: ["remedyId"],
  }),
);
export type AttemptBody = z.input<typeof attemptBody>;

export const attemptPatchBody = z
  .object({
    remedyId: z.optional(z.nullable(slug)),
    description: z.optional(z.nullable(text(500))),
    amount: z.optional(z.nullable(text(120))),
    minutes: z.optional(z.nullable(z.number().check(z.minimum(0), z.maximum(10_000)))),
    outcome: z.optional(z.enum(ATTEMPT_OUTCOMES)),
    note: z.optional(z.nullable(text(2000))),
  })
  .check(z.refine((p) => Object.keys(p).length > 0, { message: "Change at least one field.", path: ["body"] }));
export type AttemptPatchBody = z.input<typeof attemptPatchBody>;

// ── cases ────────────────────────────────────────────────────────────────────

const caseStatus = z.enum(CASE_STATUSES, { message: "Status must be open, resolved or abandoned." });
const occurredAt = z.iso.datetime({ offset: true, message: "Give an ISO date-time." });

const caseFields = {
  title: text(140).check(z.minLength(3, "Give the case a title of at least 3 characters.")),
  system: caseSystemSchema,
  tags: z._default(z.array(tagSchema).check(z.maxLength(20, "At most 20 tags.")), []),
  components: z._default(z.array(componentSchema).check(z.maxLength(20, "At most 20 components.")), []),
  /** suspected cause codes from the emulsion catalogue ("fine-solids") */
  causes: z._default(z.array(slug).check(z.maxLength(8, "At most 8 causes.")), []),
  /** the phase seen at the bottom; null when not checked */
  observedBottom: z._default(z.nullable(z.enum(PHASES)), null),
  seen: z._default(seenSchema, EMPTY_SEEN),
  notes: z._default(text(10_000), ""),
  status: z._default(caseStatus, "open"),
  /** "product recovered from both layers after filtration" */
  finalOutcome: z._default(z.nullable(text(1000)), null),
  recovery: z._default(z.nullable(recoverySchema), null),
  /** when the work-up happened (ISO 8601); defaults to now */
  occurredAt: z.optional(occurredAt),
};

export const createCaseBody = z.object({
  ...caseFields,
  /** attempts already made, in order; saved in the same transaction as the case */
  attempts: z._default(z.array(attemptBody).check(z.maxLength(MAX_ATTEMPTS_PER_CASE)), []),
});
export type CreateCaseBody = z.input<typeof createCaseBody>;
export type CreateCaseParsed = z.output<typeof createCaseBody>;

export const patchCaseBody = z
  .object({
    title: z.optional(caseFields.title),
    system: z.optional(caseSystemSchema),
    tags: z.optional(z.array(tagSchema).check(z.maxLength(20))),
    components: z.optional(z.array(componentSchema).check(z.maxLength(20))),
    causes: z.optional(z.array(slug).check(z.maxLength(8))),
    observedBottom: z.optional(z.nullable(z.enum(PHASES))),
    seen: z.optional(seenPatchSchema),
    notes: z.optional(text(10_000)),
    status: z.optional(caseStatus),
    finalOutcome: z.optional(z.nullable(text(1000))),
    recovery: z.optional(z.nullable(recoverySchema)),
    occurredAt: z.optional(occurredAt),
  })
  .check(z.refine((p) => Object.keys(p).length > 0, { message: "Change at least one field.", path: ["body"] }));
export type PatchCaseBody = z.input<typeof patchCaseBody>;

// ── list query ───────────────────────────────────────────────────────────────

const boolFlag = z.pipe(
  z.enum(["true", "false", "1", "0"], { message: "Use true or false." }),
  z.transform((v) => v === "true" || v === "1"),
);
const dateParam = z
  .string()
  .check(
    z.regex(/^\d{4}-\d{2}-\d{2}(T.*)?$/, "Use a date like 2025-03-14."),
    z.refine((v) => !Number.isNaN(Date.parse(v)), "That is not a date."),
  );

/** GET /api/cases and /api/cases/export.csv query string. All filters combine (AND). */
export const caseListQuery = z.object({
  /** one search box: titles, notes, solvents by any synonym, remedies, tags */
  q: z.optional(text(200)),
  /** solvent by any synonym ("DCM") */
  solvent: z.optional(text(80)),
  /** aqueous solute by any synonym ("bicarb") */
  aqueous: z.optional(text(80)),
  cause: z.optional(slug),
  /** a remedy that was tried; with `outcome`, the same attempt must have that outcome */
  remedy: z.optional(slug),
  outcome: z.optional(z.enum(ATTEMPT_OUTCOMES)),
  status: z.optional(z.enum(CASE_STATUSES)),
  /** a user id, or "me" */
  author: z.optional(text(100)),
  /** occurredAt on or after this date (inclusive) */
  from: z.optional(dateParam),
  /** occurredAt on or before this date (a bare date includes the whole day) */
  to: z.optional(dateParam),
  verified: z.optional(boolFlag),
  /** retired and merged cases are hidden unless asked for */
  includeRetired: z.optional(boolFlag),
  sort: z.optional(z.enum(SORT_KEYS)),
  order: z.optional(z.enum(["asc", "desc"])),
  limit: z._default(z.coerce.number().check(z.int(), z.minimum(1), z.maximum(200)), 50),
  offset: z._default(z.coerce.number().check(z.int(), z.minimum(0)), 0),
});
export type CaseListQuery = z.input<typeof caseListQuery>;
export type CaseListFilters = z.output<typeof caseListQuery>;

// ── responses ────────────────────────────────────────────────────────────────

export interface ResolvedOrganicPart {
  /** as entered */
  solvent: string;
  volumeMl: number;
  /** knowledge key when the name resolved ("dichloromethane"), else null */
  key: string | null;
  name: string;
  family: string | null;
}

export interface ResolvedAqueous {
  solute: string;
  concentration?: z.output<typeof concentrationSchema>;
  volumeMl: number;
  ph?: number;
  key: string | null;
  name: string;
}

export interface CaseSystem {
  organic: ResolvedOrganicPart[];
  aqueous: ResolvedAqueous;
  temperatureC: number;
  scale?: z.output<typeof scaleSchema>;
}

/** The layer check's answer for the case's system, computed on the server; null when a name did not resolve. */
export interface CasePredictedLayers {
  phases: 1 | 2;
  top: CasePhase | null;
  bottom: CasePhase | null;
  organicDensityGPerMl: number;
  aqueousDensityGPerMl: number;
  densityDifferenceGPerMl: number;
  confidence: "clear" | "close" | "too-close" | "one-phase";
}

export interface CaseAttempt {
  id: string;
  caseId: string;
  /** 1, 2, 3… in the order tried */
  position: number;
  remedyId: string | null;
  /** a short label for the remedy or the free description */
  label: string;
  description: string | null;
  amount: string | null;
  minutes: number | null;
  outcome: AttemptOutcome;
  note: string | null;
  authorId: string;
  authorName: string;
  createdAt: string;
  updatedAt: string;
}

export interface CasePhoto {
  id: string;
  caseId: string;
  /** authenticated URLs under /api */
  url: string;
  thumbnailUrl: string;
  mimeType: string;
  sizeBytes: number;
  width: number;
  height: number;
  uploadedBy: string;
  createdAt: string;
}

export interface CaseSummary {
  id: string;
  title: string;
  status: CaseStatus;
  authorId: string;
  authorName: string;
  occurredAt: string;
  createdAt: string;
  updatedAt: string;
  /** display names of the organic solvents, main one first */
  solvents: string[];
  /** "saturated sodium bicarbonate", "1 mol/L hydrochloric acid" */
  aqueousLabel: string;
  solventFamily: string | null;
  phBand: CasePhBand | null;
  kind: EmulsionKind | null;
  causes: string[];
  tags: string[];
  attemptCount: number;
  photoCount: number;
  /** first photo's thumbnail, for cards */
  thumbnailUrl: string | null;
  /** "cleared with saturated brine after 10 min"; null when nothing has worked yet */
  whatWorked: string | null;
  bestOutcome: AttemptOutcome | null;
  verified: boolean;
  retired: boolean;
  following: boolean;
}

export interface CaseListResponse {
  cases: CaseSummary[];
  /** matching cases; a search counts at most 1,000 (see totalIsLowerBound) */
  total: number;
  /** true when a search matched more than `total` cases and stopped counting */
  totalIsLowerBound: boolean;
  limit: number;
  offset: number;
}

export interface SimilarCase {
  id: string;
  title: string;
  status: CaseStatus;
  solventFamily: string | null;
  phBand: CasePhBand | null;
  kind: EmulsionKind | null;
  whatWorked: string | null;
  occurredAt: string;
  /** what matched: "solvent family", "pH band", "cause", "kind" */
  matched: string[];
}

export interface CaseDetail extends CaseSummary {
  system: CaseSystem;
  predicted: CasePredictedLayers | null;
  observedBottom: CasePhase | null;
  /** true when a prediction and an observation exist and disagree */
  layerSurprise: boolean;
  seen: CaseSeen;
  components: CaseComponent[];
  notes: string;
  finalOutcome: string | null;
  recovery: z.output<typeof recoverySchema> | null;
  attempts: CaseAttempt[];
  photos: CasePhoto[];
  similar: SimilarCase[];
  followerCount: number;
  /** the caller may edit (author, lead or owner) */
  canEdit: boolean;
  // Curation (lead's desk); nullable until a lead acts.
  verifiedBy: string | null;
  verifiedAt: string | null;
  verifiedAttemptId: string | null;
  retiredAt: string | null;
  retiredBy: string | null;
  retiredReason: string | null;
  mergedInto: string | null;
}

export interface FollowResponse {
  following: boolean;
  followerCount: number;
}
