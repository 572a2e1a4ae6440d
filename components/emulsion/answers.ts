import { fieldErrors } from "../../knowledge/contracts/layers";
import {
  bodyFieldOf,
  troubleshootRequestSchema,
  troubleshootResponse,
  type TroubleshootRequest,
  type TroubleshootResponse,
} from "../../knowledge/contracts/emulsion";
import { troubleshoot, type ReagentTag } from "../../knowledge/emulsion";
import { SHIPPED_REFERENCE } from "../../knowledge/reference";
import { KnowledgeInputError, type Concentration, type ReferenceData } from "../../knowledge/types";
import { readQuantity } from "../ui/quantity";

/*
 * The Emulsion screen's answers as the chemist gives them (text as typed, chips as tapped),
 * kept as a local draft, and turned into a troubleshoot request. Everything but the system may
 * stay unanswered: an unanswered question is left out of the request, never guessed.
 */

export const SEEN_FLAGS = ["solids", "thirdLayer", "cloudyOrganic", "foamOrBubbles", "afterSeparation", "viscous"] as const;
export type SeenFlag = (typeof SEEN_FLAGS)[number];

export const SEEN_LABELS: Record<SeenFlag, string> = {
  solids: "Solids at the interface",
  thirdLayer: "A third layer",
  cloudyOrganic: "Cloudy organic layer",
  foamOrBubbles: "Bubbles or foam",
  afterSeparation: "Layers already apart",
  viscous: "Syrupy organic layer",
};

export const EMULSIFIED_PCT = [10, 25, 33, 50, 100] as const;
export const MINUTES_WAITED = [0, 5, 10, 30, 60] as const;
export const FUNNEL_ML = [125, 250, 500, 1000, 2000] as const;
export const SHAKING = ["gentle", "normal", "vigorous"] as const;
export type Shaking = (typeof SHAKING)[number];

/** Co-solvents offered as chips; the names resolve in the solvent table. */
export const CO_SOLVENTS = ["THF", "methanol", "ethanol", "isopropanol", "acetonitrile", "acetone", "1,4-dioxane", "DMF", "DMSO", "NMP"] as const;

/** Reagent tags worth a chip, with the words a chemist would use. */
export const REAGENT_LABELS: Partial<Record<ReagentTag, string>> = {
  "fatty-acid": "Fatty acid",
  "greasy-amine": "Long-chain amine",
  surfactant: "Surfactant",
  "phase-transfer-catalyst": "Phase-transfer catalyst",
  protein: "Protein or biomass",
  polymer: "Polymer",
  aluminium: "Aluminium reagent",
  titanium: "Titanium reagent",
  tin: "Tin",
  copper: "Copper",
  zinc: "Zinc",
  iron: "Iron",
  magnesium: "Magnesium",
  palladium: "Palladium",
  "metal-salts": "Other metal salts",
  "urea-byproduct": "Urea by-product",
  carbonate: "Carbonate or bicarbonate",
};

export type ProductKind = "acid" | "base" | "neutral";

export interface EmulsionAnswers {
  organic: { solvent: string | null; volumeText: string }[];
  aqueous: { solute: string | null; concentrationText: string; volumeText: string };
  temperatureText: string;
  funnelMl: number | null;
  emulsifiedPct: number | null;
  seen: SeenFlag[];
  phText: string;
  coSolvents: string[];
  reagents: string[];
  shaking: Shaking | null;
  minutesWaited: number | null;
  product: { name: string; kind: ProductKind | null; pKaText: string; logPText: string };
}

export const BLANK_ANSWERS: EmulsionAnswers = {
  organic: [{ solvent: null, volumeText: "" }],
  aqueous: { solute: null, concentrationText: "", volumeText: "" },
  temperatureText: "20 °C",
  funnelMl: null,
  emulsifiedPct: null,
  seen: [],
  phText: "",
  coSolvents: [],
  reagents: [],
  shaking: null,
  minutesWaited: null,
  product: { name: "", kind: null, pKaText: "", logPText: "" },
};

/** A system to start from: a recent one, or the current layer check. */
export interface StartingSystem {
  organic: { solvent: string; volumeMl: number }[];
  aqueous: { solute: string; concentration?: Concentration; volumeMl: number };
  temperatureC?: number;
}

export type Built = { ok: true; request: TroubleshootRequest; system: StartingSystem } | { ok: false; errors: Record<string, string> };

/** Unit conversion leaves float noise (0.05 L → 50.00000000000001 mL): keep 0.001 mL. */
const ml = (x: number) => Math.round(x * 1000) / 1000;

const number = (text: string): number | null => {
  const t = text.trim().replace(",", ".").replace("−", "-");
  if (t === "") return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
};

/** The request for these answers, or the fields that stop it (keyed as the server keys them). */
export function buildRequest(a: EmulsionAnswers): Built {
  const errors: Record<string, string> = {};
  const organic = a.organic.flatMap((o, i) => {
    if (!o.solvent) {
      errors[`system.organic[${i}].solvent`] = "Pick the organic solvent.";
      return [];
    }
    const v = readQuantity("volume", o.volumeText);
    if (!v.ok) {
      errors[`system.organic[${i}].volumeMl`] = v.empty ? "Give the volume." : v.message;
      return [];
    }
    return [{ solvent: o.solvent, volumeMl: ml(v.value) }];
  });
  const aq = a.aqueous;
  if (!aq.solute) errors["system.aqueous.solute"] = "Pick the aqueous phase.";
  const aqVolume = readQuantity("volume", aq.volumeText);
  if (!aqVolume.ok) errors["system.aqueous.volumeMl"] = aqVolume.empty ? "Give the volume." : aqVolume.message;
  let concentration: Concentration | undefined;
  if (aq.solute && aq.solute !== "water") {
    const c = readQuantity("concentration", aq.concentrationText);
    if (c.ok) concentration = c.concentration;
    else errors["system.aqueous.concentration"] = c.empty ? "Give the concentration (e.g. 1 M, 10 %, sat.)." : c.message;
  }
  const t = readQuantity("temperature", a.temperatureText);
  if (!t.ok && !t.empty) errors["system.temperatureC"] = t.message;

  const ph = number(a.phText);
  if (ph !== null && Number.isNaN(ph)) errors["known.ph"] = "The pH must be a number.";
  const pKa = number(a.product.pKaText);
  if (pKa !== null && Number.isNaN(pKa)) errors["components[0].pKa"] = "The pKa must be a number.";
  const logP = number(a.product.logPText);
  if (logP !== null && Number.isNaN(logP)) errors["components[0].logP"] = "log P must be a number.";
  if (Object.keys(errors).length) return { ok: false, errors };

  const flag = (f: SeenFlag) => (a.seen.includes(f) ? { [f]: true } : {});
  const system: StartingSystem = {
    organic,
    aqueous: { solute: aq.solute!, volumeMl: aqVolume.ok ? ml(aqVolume.value) : 0, ...(concentration !== undefined ? { concentration } : {}) },
    ...(t.ok ? { temperatureC: t.value } : {}),
  };
  const request: TroubleshootRequest = {
    system,
    seen: {
      ...(a.emulsifiedPct !== null ? { emulsionFractionPct: a.emulsifiedPct } : {}),
      ...flag("solids"),
      ...flag("thirdLayer"),
      ...flag("cloudyOrganic"),
      ...flag("foamOrBubbles"),
      ...flag("afterSeparation"),
    },
    known: {
      ...(ph !== null ? { ph } : {}),
      ...(a.coSolvents.length ? { coSolvents: a.coSolvents } : {}),
      ...(a.reagents.length ? { reagents: a.reagents } : {}),
      ...(a.shaking ? { shaking: a.shaking } : {}),
      ...(a.minutesWaited !== null ? { minutesWaited: a.minutesWaited } : {}),
      ...(a.seen.includes("viscous") ? { viscous: true } : {}),
      ...(a.funnelMl !== null ? { funnelMl: a.funnelMl } : {}),
    },
  };
  if (a.product.kind) {
    request.components = [
      {
        name: a.product.name.trim() || "product",
        kind: a.product.kind,
        ...(pKa !== null ? { pKa } : {}),
        ...(logP !== null ? { logP } : {}),
      },
    ];
  }
  const checked = troubleshootRequestSchema.safeParse(request);
  return checked.success ? { ok: true, request, system } : { ok: false, errors: fieldErrors(checked.error) };
}

export type Computed = { ok: true; answer: TroubleshootResponse } | { ok: false; errors: Record<string, string>; suggestions: string[] };

/** The ranking computed here, from the shipped tables: works with no connection. */
export function computeLocally(request: TroubleshootRequest, ref: ReferenceData = SHIPPED_REFERENCE): Computed {
  const parsed = troubleshootRequestSchema.safeParse(request);
  if (!parsed.success) return { ok: false, errors: fieldErrors(parsed.error), suggestions: [] };
  try {
    return { ok: true, answer: troubleshootResponse(troubleshoot(parsed.data, { ref }), false) };
  } catch (e) {
    if (!(e instanceof KnowledgeInputError)) throw e;
    return { ok: false, errors: { [bodyFieldOf(e.field)]: e.message }, suggestions: e.suggestions };
  }
}

/** Answers for a system to start from, keeping what was already seen and known. */
export function withSystem(a: EmulsionAnswers, s: StartingSystem): EmulsionAnswers {
  const c = s.aqueous.concentration;
  return {
    ...a,
    organic: s.organic.map((o) => ({ solvent: o.solvent, volumeText: `${o.volumeMl} mL` })),
    aqueous: {
      solute: s.aqueous.solute,
      volumeText: `${s.aqueous.volumeMl} mL`,
      concentrationText: c === undefined ? "" : c === "saturated" ? "saturated" : `${c.value} ${c.unit === "%w/w" ? "%" : c.unit}`,
    },
    temperatureText: s.temperatureC !== undefined ? `${s.temperatureC} °C` : a.temperatureText,
  };
}

export const RECENT_MAX = 5;

/** Most recent first, without repeats. */
export function rememberSystem(recent: StartingSystem[], s: StartingSystem): StartingSystem[] {
  const key = (x: StartingSystem) => JSON.stringify([x.organic, x.aqueous, x.temperatureC ?? 20]);
  return [s, ...recent.filter((r) => key(r) !== key(s))].slice(0, RECENT_MAX);
}
