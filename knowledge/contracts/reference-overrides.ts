import * as z from "./zod";
import { applyOverrides, type ReferenceOverride, type SolventValueField } from "../overrides";
import { KnowledgeInputError, type ReferenceData } from "../types";
import type { ResolvedValue, SolventDetail } from "./solvents";

/*
 * A lab group's corrections to the shipped reference tables: request and response shapes shared
 * by GET/POST/DELETE /api/reference/overrides, GET /api/reference/solvents/:key and the desk.
 */

/** The solvent values a lead may correct, with the range a real value lies in (request-level plausibility). */
export const SOLVENT_VALUE_FIELDS: Record<SolventValueField, { label: string; unit: string; min: number; max: number; decimals: number }> = {
  // Liquids a separatory funnel sees run from pentane (0.626) to dibromomethane (2.50) at 20 °C (CRC Handbook, from memory): outside 0.5–2.5 is a typo.
  densityGPerMl20C: { label: "Density at 20 °C", unit: "g/mL", min: 0.5, max: 2.5, decimals: 3 },
  boilingPointC: { label: "Boiling point", unit: "°C", min: -50, max: 350, decimals: 1 },
  flashPointC: { label: "Flash point (closed cup)", unit: "°C", min: -60, max: 300, decimals: 1 },
  // Organic liquids expand by about 0.0007–0.0020 g/mL per K (the shipped DIPPR-based slopes): zero or positive is not a liquid's.
  densityTempCoeffGPerMlPerK: { label: "Density change with temperature", unit: "g/mL per K", min: -0.005, max: -0.0001, decimals: 5 },
  waterInSolventWtPct: { label: "Water dissolved in the solvent", unit: "wt%", min: 0, max: 100, decimals: 2 },
  solubilityInWaterWtPct: { label: "Solvent dissolved in water", unit: "wt%", min: 0, max: 100, decimals: 2 },
};
export const SOLVENT_VALUE_FIELD_KEYS = Object.keys(SOLVENT_VALUE_FIELDS) as [SolventValueField, ...SolventValueField[]];

/** Aqueous solution densities at 20 °C: 28 % ammonia is about 0.90, saturated salt solutions stay below 2.5 (CRC concentrative properties, from memory). */
export const AQUEOUS_DENSITY_RANGE = { min: 0.8, max: 2.5 } as const;

const provenance = {
  source: z
    .string({ message: "Name the source: an SDS, a handbook table, a measurement in the lab." })
    .check(
      z.trim(),
      z.minLength(3, "Name the source: an SDS, a handbook table, a measurement in the lab."),
      z.maxLength(300, "Keep the source under 300 characters."),
    ),
  reason: z
    .string({ message: "Say why the group needs this value." })
    .check(z.trim(), z.minLength(3, "Say why the group needs this value."), z.maxLength(1000, "Keep the reason under 1000 characters.")),
};

const solventValueBody = z
  .object({
    kind: z.literal("solvent-value"),
    solventKey: z.string().check(z.trim(), z.minLength(1, "Pick a solvent."), z.maxLength(120)),
    field: z.enum(SOLVENT_VALUE_FIELD_KEYS, { message: "Pick which value to correct." }),
    value: z.number({ message: "Give the value as a number." }),
    ...provenance,
  })
  .check(
    z.superRefine((b, ctx) => {
      const f = SOLVENT_VALUE_FIELDS[b.field];
      if (b.value < f.min || b.value > f.max) {
        ctx.addIssue({
          code: "custom",
          path: ["value"],
          message: `${f.label} must lie between ${f.min} and ${f.max} ${f.unit}; check the number and its unit.`,
        });
      }
    }),
  );

const aqueousDensityMessage = `An aqueous solution's density lies between ${AQUEOUS_DENSITY_RANGE.min} and ${AQUEOUS_DENSITY_RANGE.max} g/mL.`;
const aqueousPointBody = z.object({
  kind: z.literal("aqueous-point"),
  soluteKey: z.string().check(z.trim(), z.minLength(1, "Pick a solution."), z.maxLength(120)),
  massFractionPct: z
    .number({ message: "Give the concentration in % w/w." })
    .check(z.gt(0, "The concentration must be above 0 % w/w."), z.maximum(100, "The concentration cannot exceed 100 % w/w.")),
  densityGPerMl: z
    .number({ message: "Give the density in g/mL." })
    .check(z.minimum(AQUEOUS_DENSITY_RANGE.min, aqueousDensityMessage), z.maximum(AQUEOUS_DENSITY_RANGE.max, aqueousDensityMessage)),
  ...provenance,
});

export const createOverrideBody = z.discriminatedUnion("kind", [solventValueBody, aqueousPointBody], {
  message: "Say whether this corrects a solvent value or an aqueous density point.",
});
export type CreateOverrideBody = z.infer<typeof createOverrideBody>;

export const retireOverrideBody = z.object({
  reason: z
    .string({ message: "Say why this correction no longer applies." })
    .check(z.trim(), z.minLength(3, "Say why this correction no longer applies."), z.maxLength(1000)),
});

export const overrideListQuery = z.object({
  status: z._default(z.enum(["active", "retired", "all"]), "active"),
  target: z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(120))),
});

/** One side of the comparison: a value and where it comes from. */
export interface ComparedValue {
  value: number | null;
  source: string;
  sourceTitle: string;
  /** e.g. "interpolated between the 24 and 26 % w/w table points" */
  note?: string;
}

export interface OverrideView {
  id: string;
  kind: ReferenceOverride["kind"];
  subject: string;
  targetKey: string;
  targetName: string;
  /** "Density at 20 °C" or "Density at 12 % w/w" */
  label: string;
  unit: string;
  payload: ReferenceOverride;
  shipped: ComparedValue;
  group: ComparedValue;
  source: string;
  reason: string;
  createdBy: { id: string; name: string } | null;
  createdAt: string;
  retiredAt: string | null;
  retiredBy: { id: string; name: string } | null;
  retiredReason: string | null;
  /** false when the shipped tables changed so the correction no longer applies (e.g. the solvent was removed) */
  applies: boolean;
}

export interface OverrideListResponse {
  overrides: OverrideView[];
}

export interface SolventComparison {
  key: string;
  name: string;
  shipped: SolventDetail;
  /** the values this group computes with (shipped plus its active corrections) */
  group: SolventDetail;
  corrections: OverrideView[];
}

export interface SoluteComparison {
  key: string;
  name: string;
  shippedPoints: ResolvedValue<{ massFractionPct: number; densityGPerMl: number }[]>;
  groupPoints: ResolvedValue<{ massFractionPct: number; densityGPerMl: number }[]>;
  corrections: OverrideView[];
}

/** The one subject a correction replaces: one active correction per subject and group. */
export function overrideSubject(o: CreateOverrideBody | ReferenceOverride): string {
  switch (o.kind) {
    case "solvent-value":
      return `solvent-value:${o.solventKey}:${o.field}`;
    case "aqueous-point":
      return `aqueous-point:${o.soluteKey}:${o.massFractionPct}`;
    case "solvent-new":
      return `solvent-new:${o.solvent.key}`;
  }
}

/**
 * Applies a group's corrections one at a time, so one that no longer fits the tables (its
 * solvent was renamed, say) is reported and skipped instead of breaking every computation.
 * Used by the server for each request and by the client for computations it runs itself.
 */
export function applyCorrections(base: ReferenceData, rows: { id: string; payload: ReferenceOverride }[]) {
  let ref = base;
  const skipped: { id: string; message: string }[] = [];
  for (const row of rows) {
    try {
      ref = applyOverrides(ref, [row.payload]);
    } catch (err) {
      if (!(err instanceof KnowledgeInputError)) throw err;
      skipped.push({ id: row.id, message: err.message });
    }
  }
  return { ref, skipped };
}
