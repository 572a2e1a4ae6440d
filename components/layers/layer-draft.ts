import { fieldErrors, layerPredictRequestSchema } from "../../knowledge/contracts/layers";
import { predictLayers, type LayerInput, type LayerPrediction } from "../../knowledge/layers";
import { SHIPPED_REFERENCE } from "../../knowledge/reference";
import type { Concentration, ReferenceData } from "../../knowledge/types";
import { KnowledgeInputError } from "../../knowledge/types";
import { formatPercent, trimNumber } from "../ui/format";
import { readQuantity } from "../ui/quantity";
import { solventAbbreviation } from "../ui/solvent-picker";

/*
 * The layer check as the form holds it (text as typed, so nothing is lost or reformatted while
 * someone types), how it becomes a prediction in the browser, and how it travels in a link.
 */

export interface OrganicDraft {
  /** solvent key, or null until picked */
  solvent: string | null;
  volume: string;
}

export interface LayerDraft {
  organic: OrganicDraft[];
  /** grams of product dissolved in the organic phase, as typed; "" for none */
  dissolved: string;
  aqueous: { solute: string | null; concentration: string; volume: string };
  temperature: string;
}

export const NEW_DRAFT: LayerDraft = {
  organic: [{ solvent: null, volume: "50 mL" }],
  dissolved: "",
  aqueous: { solute: null, concentration: "", volume: "50 mL" },
  temperature: "20 °C",
};

export type FieldErrors = Record<string, string>;

export type LayerEvaluation =
  | { status: "incomplete"; missing: string[]; errors: FieldErrors }
  | { status: "invalid"; errors: FieldErrors }
  | { status: "ok"; input: LayerInput; prediction: LayerPrediction; errors: FieldErrors };

const needsConcentration = (solute: string | null) => solute !== null && solute !== "water";

/**
 * Turn the form into a prediction: read every typed quantity, check the request with the same
 * zod schema the server uses, then run predictLayers. Errors are keyed like the API's fields
 * ("organic[0].volumeMl", "aqueous.concentration").
 */
export function evaluateDraft(d: LayerDraft, ref: ReferenceData = SHIPPED_REFERENCE): LayerEvaluation {
  const errors: FieldErrors = {};
  const missing: string[] = [];
  const read = (field: string, kind: Parameters<typeof readQuantity>[0], text: string, what: string) => {
    const r = readQuantity(kind, text);
    if (r.ok) return r;
    if (r.empty) missing.push(what);
    else errors[field] = r.message;
    return undefined;
  };

  const organic = d.organic.map((p, i) => {
    if (!p.solvent) missing.push(d.organic.length > 1 ? `solvent ${i + 1}` : "the organic solvent");
    const v = read(`organic[${i}].volumeMl`, "volume", p.volume, "an organic volume");
    return { solvent: p.solvent ?? "", volumeMl: v?.value ?? Number.NaN };
  });
  if (!d.aqueous.solute) missing.push("the aqueous phase");
  let concentration: Concentration | undefined;
  if (needsConcentration(d.aqueous.solute)) {
    concentration = read("aqueous.concentration", "concentration", d.aqueous.concentration, "its concentration")?.concentration;
  }
  const aqueousVolume = read("aqueous.volumeMl", "volume", d.aqueous.volume, "the aqueous volume")?.value;
  const temperature = read("temperatureC", "temperature", d.temperature, "the temperature")?.value;
  const dissolved = d.dissolved.trim() === "" ? 0 : read("dissolvedSolidsG", "mass", d.dissolved, "")?.value;

  if (missing.length) return { status: "incomplete", missing, errors };
  if (Object.keys(errors).length) return { status: "invalid", errors };

  const parsed = layerPredictRequestSchema.safeParse({
    organic,
    aqueous: { solute: d.aqueous.solute, concentration, volumeMl: aqueousVolume },
    temperatureC: temperature,
    dissolvedSolidsG: dissolved,
  });
  if (!parsed.success) return { status: "invalid", errors: fieldErrors(parsed.error) };
  try {
    return { status: "ok", input: parsed.data, prediction: predictLayers(parsed.data, ref), errors };
  } catch (e) {
    if (e instanceof KnowledgeInputError) return { status: "invalid", errors: { [e.field || "body"]: e.message } };
    throw e;
  }
}

// ── links ────────────────────────────────────────────────────────────────────

/** Query parameters of a shared check: o=dichloromethane:40,hexane:10 aq=sodium-hydroxide c=50% av=20 t=20 g=2 */
export type CheckParams = Partial<Record<"o" | "aq" | "c" | "av" | "t" | "g", string>>;

function compactConcentration(c: Concentration): string {
  if (c === "saturated") return "sat";
  return c.unit === "mol/L" ? `${c.value}M` : c.unit === "%w/w" ? `${c.value}%` : `${c.value}g/L`;
}

/** The check as query parameters, in canonical units; fields that do not read are left out. */
export function draftToParams(d: LayerDraft): CheckParams {
  const out: CheckParams = {};
  const parts = d.organic.flatMap((p) => {
    const v = readQuantity("volume", p.volume);
    return p.solvent && v.ok ? [`${p.solvent}:${trimNumber(v.value, 2)}`] : [];
  });
  if (parts.length) out.o = parts.join(",");
  if (d.aqueous.solute) out.aq = d.aqueous.solute;
  const c = readQuantity("concentration", d.aqueous.concentration);
  if (needsConcentration(d.aqueous.solute) && c.ok && c.concentration) out.c = compactConcentration(c.concentration);
  const av = readQuantity("volume", d.aqueous.volume);
  if (av.ok) out.av = trimNumber(av.value, 2);
  const t = readQuantity("temperature", d.temperature);
  if (t.ok) out.t = trimNumber(t.value, 1);
  const g = readQuantity("mass", d.dissolved);
  if (g.ok && g.value > 0) out.g = trimNumber(g.value, 2);
  return out;
}

export function paramsToQuery(p: CheckParams): string {
  const q = new URLSearchParams();
  for (const k of ["o", "aq", "c", "av", "t", "g"] as const) {
    const v = p[k];
    if (v) q.set(k, v);
  }
  return q.toString();
}

const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const KEY = /^[a-z0-9-]{1,60}$/;
const NUMBER = /^\d+(\.\d+)?$/;

/** A draft from a link's parameters, or null when the link holds no check. Unknown parts are dropped. */
export function paramsToDraft(params: Record<string, string | string[] | undefined>): LayerDraft | null {
  const o = first(params.o);
  const aq = first(params.aq);
  if (!o && !aq) return null;
  const organic = (o ?? "")
    .split(",")
    .map((part) => part.split(":"))
    .filter(([key, ml]) => key && KEY.test(key) && ml && NUMBER.test(ml))
    .slice(0, 6)
    .map(([key, ml]) => ({ solvent: key!, volume: `${ml} mL` }));
  const c = first(params.c) ?? "";
  const m = /^(\d+(?:\.\d+)?)(M|%|g\/L)$/.exec(c);
  const concentration = c === "sat" ? "saturated" : m ? `${m[1]} ${m[2]}` : "";
  const num = (k: string, unit: string, fallback: string) => {
    const v = first(params[k]);
    return v && /^-?\d+(\.\d+)?$/.test(v) ? `${v} ${unit}` : fallback;
  };
  return {
    organic: organic.length ? organic : NEW_DRAFT.organic,
    dissolved: num("g", "g", ""),
    aqueous: { solute: aq && KEY.test(aq) ? aq : null, concentration, volume: num("av", "mL", NEW_DRAFT.aqueous.volume) },
    temperature: num("t", "°C", NEW_DRAFT.temperature),
  };
}

/** A short name for a recent check: "DCM 40 mL · 50 % NaOH 20 mL". */
export function describeCheck(input: LayerInput, ref: ReferenceData = SHIPPED_REFERENCE): string {
  const organic = input.organic
    .map((p) => {
      const s = ref.solvents.find((x) => x.key === p.solvent);
      return `${s ? (solventAbbreviation(s) ?? s.name) : p.solvent} ${trimNumber(p.volumeMl, 1)} mL`;
    })
    .join(" + ");
  const solute = ref.solutes.find((x) => x.key === input.aqueous.solute);
  const c = input.aqueous.concentration;
  const conc = !c ? "" : c === "saturated" ? "sat. " : c.unit === "%w/w" ? `${formatPercent(c.value)} ` : c.unit === "mol/L" ? `${trimNumber(c.value, 2)} M ` : `${trimNumber(c.value, 1)} g/L `;
  const aqueous = solute?.key === "water" ? "water" : `${conc}${solute?.formula ?? input.aqueous.solute}`;
  return `${organic} · ${aqueous} ${trimNumber(input.aqueous.volumeMl, 1)} mL`;
}
