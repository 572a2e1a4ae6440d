import * as z from "./zod";
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
  z.string({ error: `Name the ${what}.` }).check(z.trim(), z.minLength(1, { error: `Name the ${what}.` }), z.maxLength(120, { error: "That name is too long." }));

const number = (what: string) => z.number({ error: `${what} must be a number.` });

const volumeMl = number("The volume").check(
  z.positive({ error: "The volume must be more than 0 mL." }),
  z.maximum(MAX_PHASE_VOLUME_ML, { error: `The volume must be at most ${MAX_PHASE_VOLUME_ML} mL.` }),
);

const temperatureC = number("The temperature").check(
  z.minimum(MIN_TEMPERATURE_C, { error: `Plans cover ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C.` }),
  z.maximum(MAX_TEMPERATURE_C, { error: `Plans cover ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C.` }),
);

/** pKa values in water lie within about −10 to 50; anything outside is a typing slip. */
const pKa = number("The pKa").check(
  z.minimum(-10, { error: "A pKa below −10 is not plausible in water." }),
  z.maximum(50, { error: "A pKa above 50 is not plausible." }),
);

export const planComponentSchema = z.object({
  name: name("component"),
  kind: z.enum(["acid", "base", "neutral"], { error: 'The kind is "acid", "base" or "neutral".' }),
  /** for a base, the pKa of its conjugate acid */
  pKa: z.optional(pKa),
  partitionCoefficient: z.optional(
    number("K").check(z.nonnegative({ error: "K cannot be negative." }), z.maximum(1e12, { error: "K above 10¹² is not plausible." })),
  ),
  logP: z.optional(
    number("log P").check(z.minimum(-10, { error: "log P must lie between −10 and 15." }), z.maximum(15, { error: "log P must lie between −10 and 15." })),
  ),
  amountMmol: z.optional(number("The amount").check(z.nonnegative({ error: "The amount cannot be negative." }), z.maximum(1e7))),
  amountG: z.optional(number("The mass").check(z.nonnegative({ error: "The mass cannot be negative." }), z.maximum(1e5))),
  molarMassGPerMol: z.optional(number("The molar mass").check(z.positive({ error: "The molar mass must be above 0 g/mol." }), z.maximum(1e5))),
});

export const planWashSchema = z.object({
  aqueous: z.object(
    { solute: name('wash ("HCl", "NaHCO3", "brine" …)'), concentration: z.optional(concentrationSchema) },
    { error: "Name the wash's aqueous solution." },
  ),
  volumeMl,
  repeats: z.optional(
    z
      .number({ error: "Repeats must be a whole number." })
      .check(
        z.int({ error: "Repeats must be a whole number." }),
        z.minimum(1, { error: `Repeats are a whole number from 1 to ${MAX_REPEATS}.` }),
        z.maximum(MAX_REPEATS, { error: `Repeats are a whole number from 1 to ${MAX_REPEATS}.` }),
      ),
  ),
});

/** Recovering a component from the combined extracts of one wash (the bench card's last step). */
export const recoverySettingsSchema = z.object({
  /** name of an acid or base component of the plan */
  component: name("component to recover"),
  /** index of the wash whose extracts are combined; the wash that took most of it when absent */
  wash: z.optional(z.number().check(z.int(), z.minimum(0))),
  reagent: z.object({ solute: name("reagent"), concentration: concentrationSchema }, { error: "Name the reagent stock and its concentration." }),
  /** default two units past the pKa on the neutral side */
  targetPh: z.optional(number("The target pH").check(z.minimum(-2), z.maximum(16))),
});

export const evaporationPanelSchema = z
  .object({
    vaporTemperatureC: z.optional(number("The vapour temperature")),
    pressureMbar: z.optional(number("The pressure").check(z.positive({ error: "The pressure must be above 0 mbar." }))),
  })
  .check(
    z.refine((e) => (e.vaporTemperatureC === undefined) !== (e.pressureMbar === undefined), {
      error: "Give a vapour temperature or a pressure (one of them).",
    }),
  );

/** POST /api/plans/compute, and the `input` of a saved plan. */
export const planComputeRequestSchema = z.object({
  organic: z.object({ solvent: name("organic solvent"), volumeMl }, { error: "Give the organic solvent and its volume." }),
  components: z
    .array(planComponentSchema, { error: "Components are a list." })
    .check(z.maxLength(MAX_PLAN_COMPONENTS, { error: `At most ${MAX_PLAN_COMPONENTS} components.` })),
  washes: z
    .array(planWashSchema, { error: "Washes are a list." })
    .check(z.minLength(1, { error: "Add at least one wash." }), z.maxLength(MAX_PLAN_WASHES, { error: `At most ${MAX_PLAN_WASHES} washes.` })),
  temperatureC: z._default(temperatureC, 20),
  recovery: z.optional(recoverySettingsSchema),
  evaporation: z.optional(evaporationPanelSchema),
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
    vaporTemperatureC: z.optional(number("The vapour temperature")),
    pressureMbar: z.optional(number("The pressure").check(z.positive({ error: "The pressure must be above 0 mbar." }))),
  })
  .check(
    z.refine((e) => (e.vaporTemperatureC === undefined) !== (e.pressureMbar === undefined), {
      error: "Give either a vapour temperature (°C) or a pressure (mbar), not both.",
      path: ["vaporTemperatureC"],
    }),
  );
export type EvaporationRequest = z.input<typeof evaporationRequestSchema>;
export interface EvaporationResponse extends EvaporationSettings {
  sourceTitles: SourceRef[];
}

export const solventRankRequestSchema = z.object({
  immiscibleWithWater: z.optional(z.boolean()),
  organicLayer: z.optional(z.enum(["top", "bottom"], { error: 'The organic layer is "top" or "bottom".' })),
  aqueous: z.optional(z.object({ solute: name("aqueous phase"), concentration: z.optional(concentrationSchema) })),
  temperatureC: z.optional(temperatureC),
  bpMinC: z.optional(number("The lowest boiling point").check(z.minimum(-50), z.maximum(300))),
  bpMaxC: z.optional(number("The highest boiling point").check(z.minimum(-50), z.maximum(300))),
  noHalogen: z.optional(z.boolean()),
  noPeroxideFormer: z.optional(z.boolean()),
  minGuideCategory: z.optional(z.enum(GUIDE_ORDER as [string, ...string[]], { error: `The guide category is one of ${GUIDE_ORDER.join(", ")}.` })),
  candidates: z.optional(z.array(name("solvent")).check(z.maxLength(60))),
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
  .check(
    z.trim(),
    z.minLength(1, { error: "Give the plan a title." }),
    z.maxLength(PLAN_TITLE_MAX, { error: `Keep the title under ${PLAN_TITLE_MAX} characters.` }),
  );
const notes = z.string({ error: "Notes are text." }).check(z.maxLength(PLAN_NOTES_MAX, { error: `Keep the notes under ${PLAN_NOTES_MAX} characters.` }));

export const createPlanSchema = z.object({ title, notes: z.optional(notes), input: planComputeRequestSchema });
export const patchPlanSchema = z
  .object({ title: z.optional(title), notes: z.optional(notes), input: z.optional(planComputeRequestSchema) })
  .check(
    z.refine((p) => p.title !== undefined || p.notes !== undefined || p.input !== undefined, { error: "Change at least one of title, notes or input." }),
  );
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
