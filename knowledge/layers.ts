import { maxMassFractionPct, toMassFractionPct } from "./concentration";
import {
  SHIPPED_REFERENCE,
  aqueousDensityGPerMl,
  checkTemperature,
  requireSolute,
  requireSolvent,
  solventDensityGPerMl,
  waterDensityGPerMl,
} from "./reference";
import type { Concentration, KnowledgeWarning, ReferenceData, Solvent, SourceKey } from "./types";
import { KnowledgeInputError } from "./types";

/*
 * Which layer is on top. Both phase densities come from the tables, the organic phase by
 * ideal volume-additive mixing; the confidence says how much the order can be trusted.
 */

export interface OrganicPart {
  solvent: string;
  volumeMl: number;
}
export interface AqueousInput {
  solute: string;
  concentration?: Concentration;
  volumeMl: number;
}
export interface LayerInput {
  organic: OrganicPart[];
  aqueous: AqueousInput;
  temperatureC: number;
  /** grams of product or other material dissolved in the organic phase */
  dissolvedSolidsG?: number;
  /** density assumed for that material; DEFAULT_DISSOLVED_DENSITY_G_PER_ML when absent */
  dissolvedSolidsDensityGPerMl?: number;
}

export type LayerConfidence = "clear" | "close" | "too-close" | "one-phase";
export type Phase = "organic" | "aqueous";

export interface LayerPrediction {
  phases: 1 | 2;
  top: Phase | null;
  bottom: Phase | null;
  organicDensityGPerMl: number;
  aqueousDensityGPerMl: number;
  /** |organic − aqueous| */
  densityDifferenceGPerMl: number;
  /** organic − aqueous: positive when the organic is the denser (bottom) phase */
  signedDensityDifferenceGPerMl: number;
  confidence: LayerConfidence;
  organicVolumeMl: number;
  aqueousVolumeMl: number;
  totalVolumeMl: number;
  warnings: KnowledgeWarning[];
  assumptions: string[];
  /** keys of SOURCES behind the numbers used */
  sources: SourceKey[];
  /** how to confirm the order when the confidence is not "clear" */
  confirm?: string;
  organicParts: { key: string; name: string; volumeMl: number; densityGPerMl: number }[];
  aqueous: { key: string; name: string; massFractionPct: number; densityGPerMl: number };
}

/**
 * |Δρ| at or above which the order is called "clear". Practitioners warn below about 0.05 g/mL
 * (common practice). The thresholds here come from an uncertainty budget: tabulated densities
 * ±0.003, a ±5 °C temperature guess ±0.01 for chlorinated solvents, non-ideal mixing up to
 * ±0.02, a "saturated" wash that is really 90 % saturated −0.02, and a few grams of dissolved
 * product +0.01–0.03. Under 0.03 the order is within the combined error ("too-close"); from
 * 0.03 to 0.07 it is probably right but a plausible error or product load could flip it and
 * the layers settle slowly ("close").
 */
export const CLEAR_DENSITY_DIFFERENCE_G_PER_ML = 0.07;
/** |Δρ| below which the order cannot be predicted from densities ("too-close"). */
export const TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML = 0.03;
/** Water-miscible solvents at or above this volume fraction of the organic make one phase (common practice). */
export const MISCIBLE_DOMINANT_FRACTION = 0.5;
/** Aqueous phases at least this dense can lift a chlorinated or near-water organic (common practice). */
export const DENSE_AQUEOUS_G_PER_ML = 1.1;
/** A dense aqueous phase within this margin of a sinking organic gets an inversion-risk warning. */
export const INVERSION_RISK_MARGIN_G_PER_ML = 0.15;
/** Density assumed for material dissolved in the organic phase: typical organic solids are 1.1–1.4 g/mL (common practice). */
export const DEFAULT_DISSOLVED_DENSITY_G_PER_ML = 1.2;
/** Warn of pressure when the funnel is within this many kelvin of a component's boiling point. */
export const NEAR_BOILING_MARGIN_K = 10;
/** Flash points at or below this are "very low" (GHS category 1 region, −18 °C). */
export const VERY_LOW_FLASH_POINT_C = -18;

export const CONFIRM_BY_DROP_TEST =
  "Confirm before draining: add a few drops of water and watch which layer they join (that is the aqueous layer). Keep both layers until the product is found.";

/** With one phase there is no layer to test; say what to do if a second layer appears anyway. */
export const CONFIRM_ONE_PHASE =
  "Expect no split. If a second layer does form (salting out, cold), treat it as unknown: drop-test it and keep everything until the product is found.";

const SALTS_THAT_SALT_OUT = new Set(["sodium-chloride", "potassium-carbonate", "sodium-carbonate", "ammonium-chloride", "calcium-chloride", "lithium-chloride"]);
const GAS_FORMING_BASES = new Set(["sodium-bicarbonate", "sodium-carbonate", "potassium-carbonate"]);
const STRONG_ACIDS_AND_BASES = new Set(["sodium-hydroxide", "potassium-hydroxide", "hydrochloric-acid", "sulfuric-acid"]);

function isPositiveNumber(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/**
 * Plain structural validation (no zod): returns the input typed, or throws KnowledgeInputError
 * naming the field. Name look-ups and concentration limits are checked by predictLayers.
 */
export function validateLayerInput(input: unknown): LayerInput {
  if (typeof input !== "object" || input === null) throw new KnowledgeInputError("", "Expected an object.");
  const o = input as Record<string, unknown>;
  if (!Array.isArray(o.organic) || o.organic.length === 0) {
    throw new KnowledgeInputError("organic", "Give at least one organic solvent with its volume.");
  }
  o.organic.forEach((p: unknown, i: number) => {
    const part = (typeof p === "object" && p !== null ? p : {}) as Record<string, unknown>;
    if (typeof part.solvent !== "string" || part.solvent.trim() === "") {
      throw new KnowledgeInputError(`organic[${i}].solvent`, "Name the solvent.");
    }
    if (!isPositiveNumber(part.volumeMl)) {
      throw new KnowledgeInputError(`organic[${i}].volumeMl`, "The volume must be a positive number of mL.");
    }
  });
  const aq = (typeof o.aqueous === "object" && o.aqueous !== null ? o.aqueous : undefined) as Record<string, unknown> | undefined;
  if (!aq) throw new KnowledgeInputError("aqueous", "Describe the aqueous phase.");
  if (typeof aq.solute !== "string" || aq.solute.trim() === "") {
    throw new KnowledgeInputError("aqueous.solute", 'Name the aqueous phase ("water", "NaCl", "1 M HCl" needs solute "HCl").');
  }
  if (!isPositiveNumber(aq.volumeMl)) {
    throw new KnowledgeInputError("aqueous.volumeMl", "The volume must be a positive number of mL.");
  }
  const c = aq.concentration;
  if (c !== undefined && c !== "saturated") {
    const cc = (typeof c === "object" && c !== null ? c : {}) as Record<string, unknown>;
    if (typeof cc.value !== "number" || !Number.isFinite(cc.value) || cc.value < 0) {
      throw new KnowledgeInputError("aqueous.concentration.value", "The concentration must be zero or a positive number.");
    }
    if (cc.unit !== "mol/L" && cc.unit !== "%w/w" && cc.unit !== "g/L") {
      throw new KnowledgeInputError("aqueous.concentration.unit", 'The unit must be "mol/L", "%w/w" or "g/L".');
    }
  }
  if (typeof o.temperatureC !== "number" || !Number.isFinite(o.temperatureC)) {
    throw new KnowledgeInputError("temperatureC", "The temperature must be a number in °C.");
  }
  checkTemperature(o.temperatureC);
  if (o.dissolvedSolidsG !== undefined) {
    if (typeof o.dissolvedSolidsG !== "number" || !Number.isFinite(o.dissolvedSolidsG) || o.dissolvedSolidsG < 0) {
      throw new KnowledgeInputError("dissolvedSolidsG", "Dissolved material must be zero or a positive number of grams.");
    }
  }
  if (o.dissolvedSolidsDensityGPerMl !== undefined && !isPositiveNumber(o.dissolvedSolidsDensityGPerMl)) {
    throw new KnowledgeInputError("dissolvedSolidsDensityGPerMl", "The density of the dissolved material must be a positive number of g/mL.");
  }
  return input as LayerInput;
}

/**
 * Organic phase by ideal volume-additive mixing: ρ = (Σ Vᵢρᵢ + m) / (Σ Vᵢ + m/ρₘ), where m grams
 * of dissolved material occupy m/ρₘ mL. Densities must already be at the working temperature.
 */
export function mixOrganic(
  parts: { volumeMl: number; densityGPerMl: number }[],
  dissolvedG = 0,
  dissolvedDensityGPerMl = DEFAULT_DISSOLVED_DENSITY_G_PER_ML,
): { volumeMl: number; densityGPerMl: number } {
  const volume = parts.reduce((sum, p) => sum + p.volumeMl, 0) + dissolvedG / dissolvedDensityGPerMl;
  const mass = parts.reduce((sum, p) => sum + p.volumeMl * p.densityGPerMl, 0) + dissolvedG;
  return { volumeMl: volume, densityGPerMl: mass / volume };
}

function classify(absDifference: number): Exclude<LayerConfidence, "one-phase"> {
  if (absDifference >= CLEAR_DENSITY_DIFFERENCE_G_PER_ML) return "clear";
  if (absDifference >= TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML) return "close";
  return "too-close";
}

const r3 = (x: number) => Math.round(x * 1000) / 1000;
const r1 = (x: number) => Math.round(x * 10) / 10;

function partialMiscibilityMessage(s: Solvent): string {
  const inWater = s.solubilityInWaterWtPct.value;
  const waterIn = s.waterInSolventWtPct.value;
  const amounts = [
    inWater !== null ? `about ${inWater} wt% of it dissolves in water` : undefined,
    waterIn !== null ? `it takes up about ${waterIn} wt% water` : undefined,
  ]
    .filter(Boolean)
    .join(" and ");
  return `${s.name} is partly miscible with water (${amounts}): layer volumes shift on shaking and the organic layer carries water, so dry it.`;
}

/** Predict the layer order of an organic phase (one or more solvents) over or under an aqueous phase. */
export function predictLayers(input: LayerInput, ref: ReferenceData = SHIPPED_REFERENCE): LayerPrediction {
  validateLayerInput(input);
  const T = input.temperatureC;
  const sources = new Set<SourceKey>(["layer-thresholds"]);
  const warnings: KnowledgeWarning[] = [];
  const assumptions: string[] = [];
  const warn = (code: string, message: string) => {
    if (!warnings.some((w) => w.code === code && w.message === message)) warnings.push({ code, message });
  };

  const solvents = input.organic.map((part, i) => {
    const s = requireSolvent(part.solvent, `organic[${i}].solvent`, ref);
    if (s.family === "water") {
      throw new KnowledgeInputError(`organic[${i}].solvent`, "Water belongs in the aqueous phase, not the organic.", []);
    }
    return s;
  });
  const solute = requireSolute(input.aqueous.solute, "aqueous.solute", ref);

  const organicParts = input.organic.map((part, i) => {
    const s = solvents[i]!;
    const densityGPerMl = solventDensityGPerMl(s, T, "temperatureC");
    sources.add(s.densityGPerMl20C.source);
    if (T !== 20) sources.add(s.densityTempCoeffGPerMlPerK.source);
    sources.add(s.miscibility.source);
    return { key: s.key, name: s.name, volumeMl: part.volumeMl, densityGPerMl };
  });

  const massFractionPct = toMassFractionPct(solute, input.aqueous.concentration, "aqueous.concentration");
  const aqueousDensity = aqueousDensityGPerMl(solute, input.aqueous.concentration, T, "aqueous.concentration");
  sources.add(solute.points.source);
  if (input.aqueous.concentration === "saturated" && solute.saturationWtPct) sources.add(solute.saturationWtPct.source);
  if (T !== 20) sources.add("kell-1975-from-memory");

  const solidsG = input.dissolvedSolidsG ?? 0;
  const solidsDensity = input.dissolvedSolidsDensityGPerMl ?? DEFAULT_DISSOLVED_DENSITY_G_PER_ML;
  const solventVolume = organicParts.reduce((sum, p) => sum + p.volumeMl, 0);
  const mix = mixOrganic(organicParts, solidsG, solidsDensity);
  const organicVolumeMl = mix.volumeMl;
  const organicDensity = mix.densityGPerMl;
  sources.add("ideal-mixing");
  if (organicParts.length > 1) {
    assumptions.push("The organic solvents mix ideally: volumes add and the density is the volume-weighted mean (real mixtures deviate by about 1–2 %).");
  }
  if (solidsG > 0) {
    assumptions.push(
      `The ${r1(solidsG)} g of dissolved material stays in the organic phase and takes up its mass divided by ${solidsDensity} g/mL${
        input.dissolvedSolidsDensityGPerMl === undefined ? " (a typical organic solid; heavy halogenated products are denser)" : ""
      }.`,
    );
    sources.add("common-practice");
  }
  if (T !== 20) {
    assumptions.push(
      `Solvent densities are corrected to ${T} °C linearly from 20 °C; the aqueous density is the 20 °C table value scaled by the ratio of pure-water densities (an approximation).`,
    );
  }
  assumptions.push("The aqueous phase is the tabulated solution; salts or acids from the reaction raise its density.");
  assumptions.push("Mutual solubility of the two phases is ignored in the densities.");

  const signed = organicDensity - aqueousDensity;
  const abs = Math.abs(signed);

  // Water-miscible solvents in the organic phase.
  const miscibleVolume = organicParts.reduce((sum, p, i) => (solvents[i]!.miscibility.value === "miscible" ? sum + p.volumeMl : sum), 0);
  const miscibleFraction = miscibleVolume / solventVolume;
  const miscibleNames = solvents.filter((s) => s.miscibility.value === "miscible").map((s) => s.name);
  const onePhase = miscibleFraction >= MISCIBLE_DOMINANT_FRACTION;
  const saltingOut = SALTS_THAT_SALT_OUT.has(solute.key) && massFractionPct >= 0.8 * maxMassFractionPct(solute);

  if (onePhase) {
    sources.add("common-practice");
    warn(
      "one-phase",
      `${miscibleNames.join(" and ")} ${miscibleNames.length > 1 ? "mix" : "mixes"} with water: expect a single phase${
        miscibleFraction < 1 ? ` (water-miscible solvents are ${Math.round(miscibleFraction * 100)} % of the organic volume)` : ""
      }. Remove the water-miscible solvent (evaporate it) or dilute with a water-immiscible solvent before extracting.`,
    );
    if (saltingOut) {
      warn(
        "salting-out-possible",
        `A near-saturated ${solute.name} solution can salt out a ${miscibleNames.join("/")}-rich layer; if two layers form, identify them with the drop test.`,
      );
    }
  } else if (miscibleFraction > 0) {
    warn(
      "miscible-cosolvent",
      `${miscibleNames.join(" and ")} (${Math.round(miscibleFraction * 100)} % of the organic volume) ${miscibleNames.length > 1 ? "mix" : "mixes"} with water: ${
        miscibleNames.length > 1 ? "they" : "it"
      } will move largely into the aqueous layer, changing both densities and volumes and carrying polar product with ${miscibleNames.length > 1 ? "them" : "it"}.`,
    );
  }

  solvents.forEach((s) => {
    if (s.miscibility.value === "partial") {
      warn("partial-miscibility", partialMiscibilityMessage(s));
      sources.add(s.solubilityInWaterWtPct.source);
    }
  });

  let confidence: LayerConfidence;
  let top: Phase | null = null;
  let bottom: Phase | null = null;
  if (onePhase) {
    confidence = "one-phase";
  } else {
    confidence = classify(abs);
    bottom = signed > 0 ? "organic" : "aqueous";
    top = bottom === "organic" ? "aqueous" : "organic";
    if (confidence !== "clear") {
      warn(
        "near-density",
        `The phase densities differ by only ${r3(abs)} g/mL (organic ${r3(organicDensity)}, aqueous ${r3(aqueousDensity)}): ${
          confidence === "too-close" ? "the order cannot be predicted reliably" : "the order could flip"
        } and the layers will separate slowly.`,
      );
    }
    const waterT = waterDensityGPerMl(T);
    const organicSinksInWater = organicDensity > waterT;
    const solventsAloneSink = mixOrganic(organicParts).densityGPerMl > waterT;
    if (solidsG > 0 && solventsAloneSink !== organicSinksInWater) {
      warn(
        "load-changes-order",
        `The ${r1(solidsG)} g of dissolved material ${organicSinksInWater ? "makes the organic layer denser than water" : "makes the organic layer lighter than water"}: the solvent alone would ${solventsAloneSink ? "sink" : "float"}. Its density is assumed, so confirm with the drop test.`,
      );
    }
    if (organicSinksInWater !== (bottom === "organic")) {
      warn(
        "inverted-order",
        `Unlike over plain water, the organic layer is predicted on the ${top === "organic" ? "top" : "bottom"} here: the aqueous phase is ${r3(aqueousDensity)} g/mL.`,
      );
    } else if (organicSinksInWater && aqueousDensity >= DENSE_AQUEOUS_G_PER_ML && abs < INVERSION_RISK_MARGIN_G_PER_ML) {
      warn(
        "inversion-risk",
        `The aqueous phase is dense (${r3(aqueousDensity)} g/mL): the organic is still predicted below it, but only by ${r3(abs)} g/mL; more salt or base in the aqueous, or a lighter co-solvent, would put the organic on top.`,
      );
    }
  }

  if (solvents.some((s) => s.halogenated)) {
    warn("halogenated", "Halogenated solvent: work in a fume hood, vent the funnel often and collect it as halogenated waste; follow the SDS and local rules.");
  }
  solvents.forEach((s) => {
    const cls = s.peroxideClass.value;
    if (cls) {
      warn("peroxide-former", `${s.name} forms peroxides (class ${cls}): test an old bottle before use and before concentrating; follow the SDS and local rules.`);
      sources.add(s.peroxideClass.source);
    }
    const fp = s.flashPointC.value;
    if (fp !== null && fp <= VERY_LOW_FLASH_POINT_C) {
      warn("very-low-flash-point", `${s.name} has a very low flash point (${fp} °C): no ignition sources nearby; follow the SDS.`);
      sources.add(s.flashPointC.source);
    }
    if (T >= s.boilingPointC.value - NEAR_BOILING_MARGIN_K) {
      warn("near-boiling", `${T} °C is close to the boiling point of ${s.name} (${s.boilingPointC.value} °C): pressure builds in a stoppered funnel; vent often and keep the tip pointed away from people.`);
    }
  });
  if (GAS_FORMING_BASES.has(solute.key)) {
    warn("gas-evolution", `${solute.name} releases CO2 with any acid present: swirl before stoppering and vent after every inversion.`);
  }
  if (STRONG_ACIDS_AND_BASES.has(solute.key) && massFractionPct >= 10) {
    warn("corrosive-aqueous", `${r1(massFractionPct)} % w/w ${solute.name.toLowerCase()} is corrosive and can warm on mixing: wear eye protection and gloves; follow the SDS.`);
  }

  const aqueousVolumeMl = input.aqueous.volumeMl;
  return {
    phases: onePhase ? 1 : 2,
    top,
    bottom,
    organicDensityGPerMl: organicDensity,
    aqueousDensityGPerMl: aqueousDensity,
    densityDifferenceGPerMl: abs,
    signedDensityDifferenceGPerMl: signed,
    confidence,
    organicVolumeMl,
    aqueousVolumeMl,
    totalVolumeMl: organicVolumeMl + aqueousVolumeMl,
    warnings,
    assumptions,
    sources: [...sources],
    ...(confidence === "clear" ? {} : { confirm: confidence === "one-phase" ? CONFIRM_ONE_PHASE : CONFIRM_BY_DROP_TEST }),
    organicParts,
    aqueous: { key: solute.key, name: solute.name, massFractionPct, densityGPerMl: aqueousDensity },
  };
}
