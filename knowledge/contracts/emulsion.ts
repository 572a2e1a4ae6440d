import * as z from "./zod";
import type { CatalogueEntry } from "../emulsion/catalogue";
import type { CauseResult, GroupNote, RemedyResult, TroubleshootResult } from "../emulsion/diagnose";
import type { RemedyId, TroubleshootInput } from "../emulsion/model";
import type { PhaseAfter } from "../emulsion/side-effects";
import { emulsionSource } from "../emulsion/sources";
import type { LayerPrediction } from "../layers";
import { layerPredictRequestSchema } from "./layers";

/*
 * Emulsion help's request and response, shared by POST /api/troubleshoot, the remedy catalogue
 * routes and the Emulsion screen (which checks its answers with the same schema before
 * computing in the browser). Pure zod/mini and TypeScript; field names are the API.
 */

/** Same limits as the layer check; the temperature defaults to a room-temperature funnel. */
export const emulsionSystemSchema = z.object({
  organic: layerPredictRequestSchema.shape.organic,
  aqueous: layerPredictRequestSchema.shape.aqueous,
  temperatureC: z._default(layerPredictRequestSchema.shape.temperatureC, 20),
});

export const SHAKING = ["gentle", "normal", "vigorous"] as const;

const flag = z.optional(z.boolean({ error: "Use true or false." }));

export const seenSchema = z.object({
  emulsionFractionPct: z.optional(
    z
      .number({ error: "The emulsified share must be a number of %." })
      .check(z.minimum(0, { error: "The emulsified share must be 0–100 %." }), z.maximum(100, { error: "The emulsified share must be 0–100 %." })),
  ),
  solids: flag,
  colour: z.optional(z.string().check(z.trim(), z.maxLength(60, { error: "Keep the colour under 60 characters." }))),
  thirdLayer: flag,
  cloudyOrganic: flag,
  foamOrBubbles: flag,
  afterSeparation: flag,
});

const shortName = z.string().check(z.trim(), z.minLength(1, { error: "Leave no empty names." }), z.maxLength(80, { error: "That name is too long." }));

export const knownSchema = z.object({
  ph: z.optional(
    z
      .number({ error: "The pH must be a number." })
      .check(z.minimum(-2, { error: "The pH must lie between −2 and 16." }), z.maximum(16, { error: "The pH must lie between −2 and 16." })),
  ),
  coSolvents: z.optional(z.array(shortName).check(z.maxLength(8, { error: "At most 8 co-solvents." }))),
  /** reagent tags (REAGENT_TAGS); unknown tags are ignored by the ranking */
  reagents: z.optional(z.array(shortName).check(z.maxLength(20, { error: "At most 20 reagent tags." }))),
  shaking: z.optional(z.enum(SHAKING, { error: "Shaking is gentle, normal or vigorous." })),
  minutesWaited: z.optional(
    z
      .number({ error: "Minutes waited must be a number." })
      .check(z.minimum(0, { error: "Minutes waited must be zero or more." }), z.maximum(100_000, { error: "Minutes waited must be at most 100 000." })),
  ),
  viscous: flag,
  funnelMl: z.optional(
    z
      .number({ error: "The funnel size must be a number of mL." })
      .check(z.positive({ error: "The funnel size must be more than 0 mL." }), z.maximum(100_000, { error: "The funnel size must be at most 100 000 mL." })),
  ),
});

export const componentSchema = z.object({
  name: shortName,
  kind: z.enum(["acid", "base", "neutral"], { error: "A component is an acid, a base or neutral." }),
  /** for a base, the pKa of its conjugate acid */
  pKa: z.optional(z.number({ error: "The pKa must be a number." }).check(z.minimum(-15), z.maximum(60))),
  partitionCoefficient: z.optional(z.number({ error: "The partition coefficient must be a number." }).check(z.positive())),
  logP: z.optional(z.number({ error: "log P must be a number." }).check(z.minimum(-10), z.maximum(20))),
});

export const troubleshootRequestSchema = z.object({
  system: emulsionSystemSchema,
  seen: z._default(seenSchema, {}),
  known: z._default(knownSchema, {}),
  components: z.optional(z.array(componentSchema).check(z.maxLength(20, { error: "At most 20 components." }))),
});

export type TroubleshootRequest = z.input<typeof troubleshootRequestSchema>;
export type ParsedTroubleshootRequest = z.output<typeof troubleshootRequestSchema>;
// A compile-time check that the parsed request is the knowledge module's input.
const _isTroubleshootInput = (r: ParsedTroubleshootRequest): TroubleshootInput => r;
void _isTroubleshootInput;

/**
 * Knowledge errors name fields of the layer input ("organic[0].solvent"); in this body they sit
 * under "system.". Fields already named from the body's root stay as they are.
 */
export function bodyFieldOf(knowledgeField: string): string {
  if (knowledgeField === "") return "body";
  return /^(system|seen|known|components)([.[]|$)/.test(knowledgeField) ? knowledgeField : `system.${knowledgeField}`;
}

// ── responses ────────────────────────────────────────────────────────────────

export interface SourceTitle {
  key: string;
  title: string;
}

/** Cause likelihoods as the knowledge module gives them (score 0–1). */
export type CauseAnswer = CauseResult;

/** What the layers do after the remedy: the knowledge module's numbers, densities to 3 decimals. */
export type AfterAnswer = PhaseAfter;

/**
 * A ranked remedy: the knowledge module's result with its sources titled and its numbers rounded
 * for the wire; `evidence` is the group's similar cases ("cleared n of m").
 */
export interface RemedyAnswer extends Omit<RemedyResult, "sources" | "groupNotes"> {
  sources: SourceTitle[];
  /** the group's advice on this remedy for this kind of system, with its record when known */
  groupNotes?: (GroupNote & { id?: string; evidence?: { cleared: number; tried: number } })[];
}

export interface TroubleshootResponse {
  causes: CauseAnswer[];
  remedies: RemedyAnswer[];
  /** remedy ids from cheap and safe to drastic */
  escalation: RemedyId[];
  prevention: string[];
  /** the layer check for the system as it is now */
  layers: LayerPrediction;
  method: string[];
  /** true when the group's logged cases took part in the ranking */
  groupEvidence: boolean;
}

export type RemedyCatalogueEntry = CatalogueEntry;

export interface RemedyCatalogueResponse {
  remedies: RemedyCatalogueEntry[];
  /** what the example amounts are scaled to */
  scaleNote: string;
}

// ── the answer, computed once for the server and the offline screen ─────────

const round = (x: number, places: number) => Math.round(x * 10 ** places) / 10 ** places;

/** Densities to 3 decimals (UX rule), volumes to 0.1 mL, fractions to 0.001. */
function afterAnswer(a: PhaseAfter): AfterAnswer {
  return {
    ...a,
    densityDifferenceGPerMl: round(a.densityDifferenceGPerMl, 3),
    organicDensityGPerMl: round(a.organicDensityGPerMl, 3),
    aqueousDensityGPerMl: round(a.aqueousDensityGPerMl, 3),
    organicVolumeMl: round(a.organicVolumeMl, 1),
    aqueousVolumeMl: round(a.aqueousVolumeMl, 1),
    totalVolumeMl: round(a.totalVolumeMl, 1),
    funnelFillFraction: a.funnelFillFraction === null ? null : round(a.funnelFillFraction, 3),
  };
}

export function sourceTitleOf(key: string): SourceTitle {
  return { key, title: emulsionSource(key)?.title ?? key };
}

/** The troubleshoot result as it goes on the wire (and as the screen shows it offline). */
export function troubleshootResponse(r: TroubleshootResult, groupEvidence: boolean): TroubleshootResponse {
  return {
    causes: r.causes.map((c) => ({ code: c.code, title: c.title, score: round(c.score, 3), reasons: c.reasons })),
    remedies: r.remedies.map(({ after, sources, evidence, ...m }) => ({
      ...m,
      sources: sources.map(sourceTitleOf),
      ...(after ? { after: afterAnswer(after) } : {}),
      ...(evidence ? { evidence: { ...evidence, smoothedRate: round(evidence.smoothedRate, 3) } } : {}),
    })),
    escalation: r.escalation,
    prevention: r.prevention,
    layers: r.layers,
    method: r.method,
    groupEvidence,
  };
}
