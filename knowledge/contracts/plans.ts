import { z } from "zod";
import type { NeutraliseResult } from "../plan/neutralise";
import { neutraliseExtract } from "../plan/neutralise";
import type { EvaporationSettings } from "../plan/evaporation";
import { evaporationSettings } from "../plan/evaporation";
import { MAX_REPEATS, type PlanInput, type PlanResult } from "../plan/plan";
import { GUIDE_ORDER, type RankedSolvent, type SubstituteAdvice } from "../plan/solvent-choice";
import { planSourceEntry } from "../plan/sources";
import { SHIPPED_REFERENCE, MAX_TEMPERATURE_C, MIN_TEMPERATURE_C } from "../reference";
import { KnowledgeInputError, type Concentration, type ReferenceData } from "../types";
import { concentrationSchema, MAX_PHASE_VOLUME_ML, type SourceRef } from "./layers";

/*
 * The extraction plan's requests and responses, shared by the server routes (compute, saved
 * plans, evaporation, solvent choice) and the Plan screens. Field names are the API: change
 * them only additively. The few functions here put knowledge results together for a bench
 * card; they are pure.
 */

export const MAX_PLAN_COMPONENTS = 12;
export const MAX_PLAN_WASHES = 12;
export const PLAN_TITLE_MAX = 120;
export const PLAN_NOTES_MAX = 4000;

const name = (what: string) =>
  z.string({ error: `Name the ${what}.` }).trim().min(1, { error: `Name the ${what}.` }).max(120, { error: "That name is too long." });

const number = (what: string) =>
  z.number({ error: `${what} must be a number.` }).finite({ error: `${what} must be a number.` });

const volumeMl = number("The volume")
  .positive({ error: "The volume must be more than 0 mL." })
  .max(MAX_PHASE_VOLUME_ML, { error: `The volume must be at most ${MAX_PHASE_VOLUME_ML} mL.` });

const temperatureC = number("The temperature")
  .min(MIN_TEMPERATURE_C, { error: `Plans cover ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C.` })
  .max(MAX_TEMPERATURE_C, { error: `Plans cover ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C.` });

/** pKa values in water lie within about −10 to 50; anything outside is a typing slip. */
const pKa = number("The pKa").min(-10, { error: "A pKa below −10 is not plausible in water." }).max(50, { error: "A pKa above 50 is not plausible." });

export const planComponentSchema = z.object({
  name: name("component"),
  kind: z.enum(["acid", "base", "neutral"], { error: 'The kind is "acid", "base" or "neutral".' }),
  /** for a base, the pKa of its conjugate acid */
  pKa: pKa.optional(),
  partitionCoefficient: number("K").nonnegative({ error: "K cannot be negative." }).max(1e12, { error: "K above 10¹² is not plausible." }).optional(),
  logP: number("log P").min(-10, { error: "log P must lie between −10 and 15." }).max(15, { error: "log P must lie between −10 and 15." }).optional(),
  amountMmol: number("The amount").nonnegative({ error: "The amount cannot be negative." }).max(1e7).optional(),
  amountG: number("The mass").nonnegative({ error: "The mass cannot be negative." }).max(1e5).optional(),
  molarMassGPerMol: number("The molar mass").positive({ error: "The molar mass must be above 0 g/mol." }).max(1e5).optional(),
});

export const planWashSchema = z.object({
  aqueous: z.object(
    { solute: name('wash ("HCl", "NaHCO3", "brine" …)'), concentration: concentrationSchema.optional() },
    { error: "Name the wash's aqueous solution." },
  ),
  volumeMl,
  repeats: z
    .number({ error: "Repeats must be a whole number." })
    .int({ error: "Repeats must be a whole number." })
    .min(1, { error: `Repeats are a whole number from 1 to ${MAX_REPEATS}.` })
    .max(MAX_REPEATS, { error: `Repeats are a whole number from 1 to ${MAX_REPEATS}.` })
    .optional(),
});

/** Recovering a component from the combined extracts of one wash (the bench card's last step). */
export const recoverySettingsSchema = z.object({
  /** name of an acid or base component of the plan */
  component: name("component to recover"),
  /** index of the wash whose extracts are combined; the wash that took most of it when absent */
  wash: z.number().int().min(0).optional(),
  reagent: z.object({ solute: name("reagent"), concentration: concentrationSchema }, { error: "Name the reagent stock and its concentration." }),
  /** default two units past the pKa on the neutral side */
  targetPh: number("The target pH").min(-2).max(16).optional(),
});

export const evaporationPanelSchema = z
  .object({
    vaporTemperatureC: number("The vapour temperature").optional(),
    pressureMbar: number("The pressure").positive({ error: "The pressure must be above 0 mbar." }).optional(),
  })
  .refine((e) => (e.vaporTemperatureC === undefined) !== (e.pressureMbar === undefined), {
    error: "Give a vapour temperature or a pressure (one of them).",
  });

/** POST /api/plans/compute, and the `input` of a saved plan. */
export const planComputeRequestSchema = z.object({
  organic: z.object({ solvent: name("organic solvent"), volumeMl }, { error: "Give the organic solvent and its volume." }),
  components: z
    .array(planComponentSchema, { error: "Components are a list." })
    .max(MAX_PLAN_COMPONENTS, { error: `At most ${MAX_PLAN_COMPONENTS} components.` }),
  washes: z
    .array(planWashSchema, { error: "Washes are a list." })
    .min(1, { error: "Add at least one wash." })
    .max(MAX_PLAN_WASHES, { error: `At most ${MAX_PLAN_WASHES} washes.` }),
  temperatureC: temperatureC.default(20),
  recovery: recoverySettingsSchema.optional(),
  evaporation: evaporationPanelSchema.optional(),
});

export type PlanComputeRequest = z.input<typeof planComputeRequestSchema>;
export type PlanDocument = z.output<typeof planComputeRequestSchema>;
export type RecoverySettings = z.output<typeof recoverySettingsSchema>;
export type EvaporationPanel = z.output<typeof evaporationPanelSchema>;

/** The plan computation's own input (the panels' settings left out). */
export function planInputOf(doc: PlanDocument): PlanInput {
  return { organic: doc.organic, components: doc.components, washes: doc.washes, temperatureC: doc.temperatureC };
}
// compile-time check: what the schema hands on is a PlanInput
const _isPlanInput = (d: PlanDocument): PlanInput => d;
void _isPlanInput;

// ── bench extras: recovery from an extract, rotary evaporation ───────────────

export interface RecoveryOutcome extends NeutraliseResult {
  component: string;
  /** the wash whose extracts are combined */
  wash: number;
  extractVolumeMl: number;
  /** components of the same kind carried in that extract, mmol */
  extractComponents: { name: string; mmol: number }[];
}

/**
 * Acid or base to add to the combined extracts of one wash to get a component back in its
 * neutral form. The extract is the wash as made up (all its passes) holding what the plan
 * says those passes took up; acids and bases are recovered from separate extracts, so only
 * components of the same kind count. Errors name fields under `recovery.`.
 */
export function recoveryFor(doc: PlanDocument, plan: PlanResult, settings: RecoverySettings, ref: ReferenceData = SHIPPED_REFERENCE): RecoveryOutcome {
  const index = doc.components.findIndex((c) => c.name.trim().toLowerCase() === settings.component.trim().toLowerCase());
  const target = doc.components[index];
  if (!target) throw new KnowledgeInputError("recovery.component", `No component named "${settings.component}" in this plan.`);
  if (target.kind === "neutral") {
    throw new KnowledgeInputError("recovery.component", `${target.name} is neutral: no acid or base brings it back from the water.`);
  }
  const kind: "acid" | "base" = target.kind;
  const start = (i: number) => {
    const c = doc.components[i]!;
    return c.amountMmol ?? (c.amountG !== undefined && c.molarMassGPerMol ? (c.amountG / c.molarMassGPerMol) * 1000 : 0);
  };
  const takenBy = (wi: number, ci: number) =>
    plan.steps.filter((s) => s.wash === wi).reduce((sum, s) => sum + (s.components[ci]?.fractionInAqueousThisPass ?? 0) * start(ci), 0);
  let wash = settings.wash;
  if (wash === undefined) {
    wash = doc.washes.reduce((best, _w, wi) => (takenBy(wi, index) > takenBy(best, index) ? wi : best), 0);
  }
  const w = doc.washes[wash];
  if (!w) throw new KnowledgeInputError("recovery.wash", `There is no wash ${wash + 1} in this plan.`);
  const extractVolumeMl = w.volumeMl * (w.repeats ?? 1);
  const extractComponents = doc.components.flatMap((c, ci) =>
    c.kind === kind && c.pKa !== undefined ? [{ name: c.name, kind, pKa: c.pKa, mmol: takenBy(wash, ci) }] : [],
  );
  try {
    const result = neutraliseExtract(
      {
        extract: { solute: w.aqueous.solute, ...(w.aqueous.concentration !== undefined ? { concentration: w.aqueous.concentration as Concentration } : {}), volumeMl: extractVolumeMl },
        components: extractComponents,
        reagent: { solute: settings.reagent.solute, concentration: settings.reagent.concentration as Concentration },
        ...(settings.targetPh !== undefined ? { targetPh: settings.targetPh } : {}),
        temperatureC: doc.temperatureC,
      },
      ref,
    );
    return {
      ...result,
      component: target.name,
      wash,
      extractVolumeMl,
      extractComponents: extractComponents.map(({ name: n, mmol }) => ({ name: n, mmol })),
    };
  } catch (e) {
    if (e instanceof KnowledgeInputError) throw new KnowledgeInputError(`recovery.${recoveryField(e.field)}`, e.message, e.suggestions);
    throw e;
  }
}

/** neutraliseExtract's field names, as the recovery settings spell them. */
function recoveryField(field: string): string {
  if (field.startsWith("reagent") || field === "targetPh") return field;
  if (field.startsWith("extract")) return "wash";
  return "component";
}

/** Rotary-evaporator settings for the plan's solvent; errors name fields under `evaporation.`. */
export function evaporationFor(doc: PlanDocument, panel: EvaporationPanel, ref: ReferenceData = SHIPPED_REFERENCE): EvaporationSettings {
  try {
    return evaporationSettings(
      panel.vaporTemperatureC !== undefined
        ? { solvent: doc.organic.solvent, vaporTemperatureC: panel.vaporTemperatureC }
        : { solvent: doc.organic.solvent, pressureMbar: panel.pressureMbar! },
      ref,
    );
  } catch (e) {
    if (e instanceof KnowledgeInputError) {
      throw new KnowledgeInputError(e.field === "solvent" ? "organic.solvent" : `evaporation.${e.field}`, e.message, e.suggestions);
    }
    throw e;
  }
}

/** A knowledge error raised while checking a nested document, its field put under `prefix`. */
export function prefixKnowledgeError(e: unknown, prefix: string): unknown {
  if (!(e instanceof KnowledgeInputError)) return e;
  return new KnowledgeInputError(e.field ? `${prefix}.${e.field}` : prefix, e.message, e.suggestions);
}

// ── responses ────────────────────────────────────────────────────────────────

/** Source keys of the plan and layer-check lists with their titles. */
export function planSourceRefs(keys: string[]): SourceRef[] {
  return [...new Set(keys)].map((key) => {
    const entry = planSourceEntry(key);
    return { key, title: entry?.title ?? key, kind: entry?.kind ?? "group" };
  });
}

export interface PlanComputeResponse extends PlanResult {
  recovery?: RecoveryOutcome;
  evaporation?: EvaporationSettings;
  sourceTitles: SourceRef[];
}

export const evaporationRequestSchema = z
  .object({
    solvent: name("solvent"),
    vaporTemperatureC: number("The vapour temperature").optional(),
    pressureMbar: number("The pressure").positive({ error: "The pressure must be above 0 mbar." }).optional(),
  })
  .refine((e) => (e.vaporTemperatureC === undefined) !== (e.pressureMbar === undefined), {
    error: "Give either a vapour temperature (°C) or a pressure (mbar), not both.",
    path: ["vaporTemperatureC"],
  });
export type EvaporationRequest = z.input<typeof evaporationRequestSchema>;
export interface EvaporationResponse extends EvaporationSettings {
  sourceTitles: SourceRef[];
}

export const solventRankRequestSchema = z.object({
  immiscibleWithWater: z.boolean().optional(),
  organicLayer: z.enum(["top", "bottom"], { error: 'The organic layer is "top" or "bottom".' }).optional(),
  aqueous: z.object({ solute: name("aqueous phase"), concentration: concentrationSchema.optional() }).optional(),
  temperatureC: temperatureC.optional(),
  bpMinC: number("The lowest boiling point").min(-50).max(300).optional(),
  bpMaxC: number("The highest boiling point").min(-50).max(300).optional(),
  noHalogen: z.boolean().optional(),
  noPeroxideFormer: z.boolean().optional(),
  minGuideCategory: z.enum(GUIDE_ORDER as [string, ...string[]], { error: `The guide category is one of ${GUIDE_ORDER.join(", ")}.` }).optional(),
  candidates: z.array(name("solvent")).max(60).optional(),
});
export type SolventRankRequest = z.input<typeof solventRankRequestSchema>;
export interface SolventRankResponse {
  solvents: RankedSolvent[];
  sourceTitles: SourceRef[];
}
export type SubstitutesResponse = SubstituteAdvice & { sourceTitles: SourceRef[] };

// ── saved plans ──────────────────────────────────────────────────────────────

const title = z
  .string({ error: "Give the plan a title." })
  .trim()
  .min(1, { error: "Give the plan a title." })
  .max(PLAN_TITLE_MAX, { error: `Keep the title under ${PLAN_TITLE_MAX} characters.` });
const notes = z.string({ error: "Notes are text." }).max(PLAN_NOTES_MAX, { error: `Keep the notes under ${PLAN_NOTES_MAX} characters.` });

export const createPlanSchema = z.object({ title, notes: notes.optional(), input: planComputeRequestSchema });
export const patchPlanSchema = z
  .object({ title: title.optional(), notes: notes.optional(), input: planComputeRequestSchema.optional() })
  .refine((p) => p.title !== undefined || p.notes !== undefined || p.input !== undefined, { error: "Change at least one of title, notes or input." });
export type CreatePlanBody = z.input<typeof createPlanSchema>;
export type PatchPlanBody = z.input<typeof patchPlanSchema>;

export interface PlanPerson {
  id: string;
  name: string;
}

export interface SavedPlanSummary {
  id: string;
  title: string;
  solvent: string;
  componentNames: string[];
  washCount: number;
  author: PlanPerson;
  updatedBy: PlanPerson | null;
  createdAt: string;
  updatedAt: string;
  /** the caller may change or delete it (author, lead or owner) */
  canEdit: boolean;
}

export interface SavedPlan extends SavedPlanSummary {
  notes: string;
  input: PlanDocument;
}

export interface SavedPlanList {
  plans: SavedPlanSummary[];
}
