import * as z from "../knowledge/contracts/zod";

/*
 * The "Start a case" hand-off: the Layers and Emulsion screens put the system they are showing
 * into `/cases/new?system=<json>` and the new-case form starts from it. The decoder is forgiving
 * (a link typed by hand or cut short must still open the form): parts that do not parse are
 * dropped one by one instead of rejecting the whole link.
 */

const concentration = z.union([
  z.literal("saturated"),
  z.object({ value: z.number().check(z.nonnegative()), unit: z.enum(["mol/L", "%w/w", "g/L"]) }),
]);

const name = z.string().check(z.trim(), z.minLength(1), z.maxLength(120));
const volumeMl = z.number().check(z.positive(), z.maximum(100_000));
const organicPart = z.object({ solvent: name, volumeMl });
const aqueous = z.object({
  solute: name,
  concentration: z.optional(concentration),
  volumeMl,
});

/** What the emulsion screen has seen; the same names as knowledge/emulsion's `Seen`. */
const seen = z.object({
  emulsionFractionPct: z.optional(z.number().check(z.minimum(0), z.maximum(100))),
  solids: z.optional(z.boolean()),
  colour: z.optional(z.string().check(z.trim(), z.maxLength(80))),
  thirdLayer: z.optional(z.boolean()),
  cloudyOrganic: z.optional(z.boolean()),
  foamOrBubbles: z.optional(z.boolean()),
});

export type PrefillConcentration = z.infer<typeof concentration>;
export type PrefillOrganic = z.infer<typeof organicPart>;
export type PrefillAqueous = z.infer<typeof aqueous>;
export type PrefillSeen = z.infer<typeof seen>;

export interface CasePrefill {
  organic?: PrefillOrganic[];
  aqueous?: PrefillAqueous;
  temperatureC?: number;
  seen?: PrefillSeen;
  /** reaction or work-up context tags, e.g. "metal-salts", "phase-transfer-catalyst" */
  tags?: string[];
  /** suspected cause codes from the emulsion catalogue, most likely first ("fine-solids") */
  causes?: string[];
  /** free text to start the title with */
  title?: string;
}

export const PREFILL_PARAM = "system";
const MAX_ORGANIC_PARTS = 6;
const MAX_TAGS = 12;
/** the create-case contract takes at most 8 causes */
const MAX_CAUSES = 8;

/** JSON for the `system` query parameter (not yet URL-encoded). Empty parts are left out. */
export function encodeCasePrefill(prefill: CasePrefill): string {
  const out: CasePrefill = {};
  if (prefill.organic?.length) out.organic = prefill.organic.map((p) => ({ solvent: p.solvent, volumeMl: p.volumeMl }));
  if (prefill.aqueous) out.aqueous = prefill.aqueous;
  if (prefill.temperatureC !== undefined) out.temperatureC = prefill.temperatureC;
  if (prefill.seen && Object.values(prefill.seen).some((v) => v !== undefined)) out.seen = prefill.seen;
  if (prefill.tags?.length) out.tags = prefill.tags;
  if (prefill.causes?.length) out.causes = prefill.causes;
  if (prefill.title) out.title = prefill.title;
  return JSON.stringify(out);
}

/** The route to open the new-case form prefilled: `/cases/new?system=…`. */
export function caseStartHref(prefill: CasePrefill): string {
  return `/cases/new?${PREFILL_PARAM}=${encodeURIComponent(encodeCasePrefill(prefill))}`;
}

function pick<T>(schema: z.ZodMiniType<T>, value: unknown): T | undefined {
  const r = schema.safeParse(value);
  return r.success ? r.data : undefined;
}

/**
 * Read a `system` parameter back. Accepts the raw JSON or a still-encoded string (and the
 * array Expo Router gives for a repeated parameter: the first wins). Returns null when nothing
 * usable is in it.
 */
export function decodeCasePrefill(raw: string | string[] | undefined | null): CasePrefill | null {
  const text = Array.isArray(raw) ? raw[0] : raw;
  if (!text) return null;
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    try {
      data = JSON.parse(decodeURIComponent(text));
    } catch {
      return null;
    }
  }
  if (typeof data !== "object" || data === null || Array.isArray(data)) return null;
  const o = data as Record<string, unknown>;
  const out: CasePrefill = {};
  if (Array.isArray(o.organic)) {
    const parts = o.organic.map((p) => pick(organicPart, p)).filter((p): p is PrefillOrganic => !!p);
    if (parts.length) out.organic = parts.slice(0, MAX_ORGANIC_PARTS);
  }
  const aq = pick(aqueous, o.aqueous);
  if (aq) out.aqueous = aq;
  const t = pick(z.number().check(z.minimum(-80), z.maximum(200)), o.temperatureC);
  if (t !== undefined) out.temperatureC = t;
  if (typeof o.seen === "object" && o.seen !== null) {
    // Field by field, so one bad observation does not drop the others.
    const s: PrefillSeen = {};
    const shape = seen.shape;
    const src = o.seen as Record<string, unknown>;
    for (const key of Object.keys(shape) as (keyof PrefillSeen)[]) {
      const v = pick(shape[key] as z.ZodMiniType<unknown>, src[key]);
      if (v !== undefined) (s as Record<string, unknown>)[key] = v;
    }
    if (Object.keys(s).length) out.seen = s;
  }
  if (Array.isArray(o.tags)) {
    const tags = o.tags.filter((x): x is string => typeof x === "string" && x.trim() !== "").map((x) => x.trim().slice(0, 60));
    if (tags.length) out.tags = [...new Set(tags)].slice(0, MAX_TAGS);
  }
  if (Array.isArray(o.causes)) {
    const causes = o.causes.filter((x): x is string => typeof x === "string" && /^[a-z0-9][a-z0-9-]{0,59}$/.test(x));
    if (causes.length) out.causes = [...new Set(causes)].slice(0, MAX_CAUSES);
  }
  const title = pick(z.string().check(z.trim(), z.minLength(1), z.maxLength(160)), o.title);
  if (title) out.title = title;
  return Object.keys(out).length ? out : null;
}
