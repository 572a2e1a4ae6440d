import * as z from "./zod";
import type { LayerInput, LayerPrediction } from "../layers";
import { MAX_TEMPERATURE_C, MIN_TEMPERATURE_C } from "../reference";
import type { ConcentrationUnit, KnowledgeWarning } from "../types";

/*
 * The layer check's request and response, shared by POST /api/layers/predict and the Layers
 * screen (which validates its own inputs with the same schema before computing in the browser).
 * Pure zod/mini and TypeScript; field names are the API, change them only additively.
 */

/** Units a request may use; "M" and "%" are read as mol/L and % w/w. */
export const CONCENTRATION_INPUT_UNITS = ["mol/L", "M", "%w/w", "%", "g/L"] as const;
export type ConcentrationInputUnit = (typeof CONCENTRATION_INPUT_UNITS)[number];

const CANONICAL_UNIT: Record<ConcentrationInputUnit, ConcentrationUnit> = {
  "mol/L": "mol/L",
  M: "mol/L",
  "%w/w": "%w/w",
  "%": "%w/w",
  "g/L": "g/L",
};

/** Largest volume accepted for one phase: 100 L, well beyond any separatory funnel. */
export const MAX_PHASE_VOLUME_ML = 100_000;
/** Most organic solvents in one mixture. */
export const MAX_ORGANIC_PARTS = 6;

const volumeMl = z.number({ error: "The volume must be a number of mL." }).check(
  z.positive({ error: "The volume must be more than 0 mL." }),
  z.maximum(MAX_PHASE_VOLUME_ML, { error: `The volume must be at most ${MAX_PHASE_VOLUME_ML} mL.` }),
);

const name = (what: string) =>
  z.string({ error: `Name the ${what}.` }).check(z.trim(), z.minLength(1, { error: `Name the ${what}.` }), z.maxLength(120, { error: "That name is too long." }));

export const concentrationSchema = z.pipe(
  z.union(
    [
      z.literal("saturated"),
      z.object({
        value: z.number({ error: "The concentration must be a number." }).check(z.nonnegative({ error: "A concentration cannot be negative." })),
        unit: z.enum(CONCENTRATION_INPUT_UNITS, { error: 'The unit must be "mol/L", "M", "%w/w", "%" or "g/L".' }),
      }),
    ],
    { error: 'A concentration is { "value", "unit" } (mol/L, M, %w/w, % or g/L) or "saturated".' },
  ),
  z.transform((c) => (c === "saturated" ? c : { value: c.value, unit: CANONICAL_UNIT[c.unit] })),
);

export const layerPredictRequestSchema = z.object({
  organic: z
    .array(z.object({ solvent: name("organic solvent"), volumeMl }), { error: "Give the organic solvents as a list." })
    .check(
      z.minLength(1, { error: "Give at least one organic solvent with its volume." }),
      z.maxLength(MAX_ORGANIC_PARTS, { error: `At most ${MAX_ORGANIC_PARTS} organic solvents.` }),
    ),
  aqueous: z.object(
    {
      solute: name("aqueous phase (\"water\", \"NaCl\", \"NaOH\" …)"),
      concentration: z.optional(concentrationSchema),
      volumeMl,
    },
    { error: "Describe the aqueous phase." },
  ),
  temperatureC: z
    .number({ error: "The temperature must be a number in °C." })
    .check(
      z.minimum(MIN_TEMPERATURE_C, { error: `The layer check covers ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C.` }),
      z.maximum(MAX_TEMPERATURE_C, { error: `The layer check covers ${MIN_TEMPERATURE_C}–${MAX_TEMPERATURE_C} °C.` }),
    ),
  dissolvedSolidsG: z.optional(
    z
      .number({ error: "Dissolved material must be a number of grams." })
      .check(z.nonnegative({ error: "Dissolved material cannot be negative." }), z.maximum(10_000, { error: "Dissolved material must be at most 10 kg." })),
  ),
  dissolvedSolidsDensityGPerMl: z.optional(
    z
      .number({ error: "The density must be a number of g/mL." })
      .check(
        z.minimum(0.5, { error: "The density of the dissolved material must lie between 0.5 and 3 g/mL." }),
        z.maximum(3, { error: "The density of the dissolved material must lie between 0.5 and 3 g/mL." }),
      ),
  ),
});

export type LayerPredictRequest = z.input<typeof layerPredictRequestSchema>;

/** What the schema hands on: exactly predictLayers' input. */
export type ParsedLayerPredictRequest = z.output<typeof layerPredictRequestSchema>;
// A compile-time check that the parsed request is a LayerInput.
const _isLayerInput = (r: ParsedLayerPredictRequest): LayerInput => r;
void _isLayerInput;

/** "organic[0].volumeMl": the same field names the knowledge module's errors use. */
export function fieldPath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((out, part) => {
    if (typeof part === "number") return `${out}[${part}]`;
    const key = String(part);
    return out === "" ? key : `${out}.${key}`;
  }, "");
}

/** One message per field (the first), keyed by fieldPath. */
export function fieldErrors(error: z.core.$ZodError): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = fieldPath(issue.path) || "body";
    out[key] ??= issue.message;
  }
  return out;
}

export interface SourceRef {
  key: string;
  title: string;
  kind: string;
}

/** The answer of POST /api/layers/predict: predictLayers' result, densities to 3 decimals. */
export interface LayerPredictResponse extends Omit<LayerPrediction, "warnings"> {
  warnings: KnowledgeWarning[];
  /** the sources behind `sources`, with their titles */
  sourceTitles: SourceRef[];
}

/** Round to 3 decimals (densities in g/mL, UX rule). */
export function round3(x: number): number {
  return Math.round(x * 1000) / 1000;
}
