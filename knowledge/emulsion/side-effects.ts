import { inSentence } from "../text";
import {
  CLEAR_DENSITY_DIFFERENCE_G_PER_ML,
  NEAR_BOILING_MARGIN_K,
  TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML,
  predictLayers,
  type Phase,
} from "../layers";
import { distributionRatio, fractionLeftInOrganic, partitionCoefficientOf } from "../plan/distribution";
import { MAX_FILL_FRACTION } from "../plan/funnel";
import { neutraliseExtract, type NeutraliseResult } from "../plan/neutralise";
import { aqueousDensityGPerMl, requireSolute, waterDensityGPerMl } from "../reference";
import type { AntoineConstants, Solvent } from "../types";
import { KnowledgeInputError } from "../types";
import type { SystemFacts } from "./facts";
import type { Component } from "./model";

/*
 * What a remedy does to the phases, computed from the same tables as the layer check, so the
 * chemist sees the new order, density gap and fill before adding anything.
 */

export interface PhaseAfter {
  top: Phase | null;
  bottom: Phase | null;
  densityDifferenceGPerMl: number;
  organicDensityGPerMl: number;
  aqueousDensityGPerMl: number;
  organicVolumeMl: number;
  aqueousVolumeMl: number;
  totalVolumeMl: number;
  /** total ÷ funnel size; null when the funnel size is not known */
  funnelFillFraction: number | null;
  overfilled: boolean;
  swapsLayers: boolean;
  /** the density gap is below the layer check's "too close" limit */
  isodense: boolean;
  note: string;
}

const r3 = (x: number) => Math.round(x * 1000) / 1000;
const r1 = (x: number) => Math.round(x * 10) / 10;

function describe(after: Omit<PhaseAfter, "note">, before: SystemFacts, what: string): string {
  const d0 = before.layers.densityDifferenceGPerMl;
  const order =
    after.bottom === null
      ? "one phase"
      : after.swapsLayers
        ? `the layers swap: organic now on the ${after.top === "organic" ? "top" : "bottom"}`
        : `organic stays on the ${after.top === "organic" ? "top" : "bottom"}`;
  const gap = `density gap ${r3(d0)} → ${r3(after.densityDifferenceGPerMl)} g/mL`;
  const fill =
    after.funnelFillFraction === null
      ? ""
      : after.overfilled
        ? `; funnel ${Math.round(after.funnelFillFraction * 100)} % full — over three-quarters, split it`
        : `; funnel ${Math.round(after.funnelFillFraction * 100)} % full`;
  const iso = after.isodense ? " (too close to settle: the layers may hang or swap)" : "";
  return `${what}: aqueous ${r3(after.aqueousDensityGPerMl)} g/mL, organic ${r3(after.organicDensityGPerMl)} g/mL; ${order}; ${gap}${iso}${fill}.`;
}

/** Orders two phases of known density and volume against the state before the remedy. */
export function phaseAfter(
  facts: SystemFacts,
  organicDensityGPerMl: number,
  aqueousDensityGPerMl: number,
  organicVolumeMl: number,
  aqueousVolumeMl: number,
  funnelMl: number | undefined,
  what: string,
): PhaseAfter {
  const onePhase = facts.layers.phases === 1;
  const bottom: Phase | null = onePhase ? null : organicDensityGPerMl > aqueousDensityGPerMl ? "organic" : "aqueous";
  const top: Phase | null = bottom === null ? null : bottom === "organic" ? "aqueous" : "organic";
  const totalVolumeMl = organicVolumeMl + aqueousVolumeMl;
  const funnelFillFraction = funnelMl ? totalVolumeMl / funnelMl : null;
  const densityDifferenceGPerMl = Math.abs(organicDensityGPerMl - aqueousDensityGPerMl);
  const partial = {
    top,
    bottom,
    densityDifferenceGPerMl,
    organicDensityGPerMl,
    aqueousDensityGPerMl,
    organicVolumeMl,
    aqueousVolumeMl,
    totalVolumeMl,
    funnelFillFraction,
    overfilled: funnelFillFraction !== null && funnelFillFraction > MAX_FILL_FRACTION,
    swapsLayers: bottom !== null && facts.layers.bottom !== null && bottom !== facts.layers.bottom,
    isodense: bottom !== null && densityDifferenceGPerMl < TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML,
  };
  return { ...partial, note: describe(partial, facts, what) };
}

// ── salt ─────────────────────────────────────────────────────────────────────

const SODIUM_CHLORIDE = "sodium-chloride";

function sodiumChloride(facts: SystemFacts) {
  const nacl = requireSolute(SODIUM_CHLORIDE, "aqueous.solute", facts.ref);
  const satPct = nacl.saturationWtPct?.value ?? nacl.points.value[nacl.points.value.length - 1]!.massFractionPct;
  return { nacl, satPct };
}

/** Density (g/mL, at the system temperature) of NaCl solution of this mass %. */
function brineDensity(facts: SystemFacts, pct: number): number {
  const { nacl } = sodiumChloride(facts);
  return aqueousDensityGPerMl(nacl, { value: pct, unit: "%w/w" }, facts.system.temperatureC);
}

/** Saturated brine density at the system temperature (the CRC 26.4 % w/w point, scaled like the layer check). */
export function saturatedBrineDensityGPerMl(facts: SystemFacts): number {
  return brineDensity(facts, sodiumChloride(facts).satPct);
}

/** Water in the aqueous phase, g (the rest of its mass is solute). */
function waterMassG(facts: SystemFacts): number {
  return facts.aqueousMassG - facts.aqueousSoluteG;
}

/** Grams of NaCl the aqueous phase could still dissolve at 20 °C (35.9 g per 100 g water, less what is there). */
export function saltToSaturationG(facts: SystemFacts): number {
  const { satPct } = sodiumChloride(facts);
  const perGramWater = satPct / (100 - satPct);
  const already = facts.solute.key === SODIUM_CHLORIDE ? facts.aqueousSoluteG : 0;
  return Math.max(0, waterMassG(facts) * perGramWater - already);
}

/**
 * The aqueous phase after adding NaCl as brine or as solid. Water and NaCl solutions stay on
 * the NaCl table. Any other solute is an estimate: brine's volume adds to the aqueous volume;
 * solid salt adds its apparent volume in the phase's own water, read off the NaCl table.
 */
function aqueousWithSalt(facts: SystemFacts, naclG: number, addedWaterG: number, addedVolumeMl: number | null): { densityGPerMl: number; volumeMl: number } {
  const massG = facts.aqueousMassG + naclG + addedWaterG;
  if (facts.solute.key === "water" || facts.solute.key === SODIUM_CHLORIDE) {
    const pct = Math.min(sodiumChloride(facts).satPct, ((facts.aqueousSoluteG + naclG) / massG) * 100);
    const densityGPerMl = brineDensity(facts, pct);
    return { densityGPerMl, volumeMl: massG / densityGPerMl };
  }
  let volumeMl = facts.system.aqueous.volumeMl;
  if (addedVolumeMl !== null) {
    volumeMl += addedVolumeMl;
  } else if (naclG > 0) {
    const water = waterMassG(facts);
    const solutionMl = (water + naclG) / brineDensity(facts, (naclG / (water + naclG)) * 100);
    volumeMl += solutionMl - water / waterDensityGPerMl(facts.system.temperatureC);
  }
  return { densityGPerMl: massG / volumeMl, volumeMl };
}

function approxNote(facts: SystemFacts): string {
  return facts.solute.key === "water" || facts.solute.key === SODIUM_CHLORIDE
    ? ""
    : ` Mixed with ${inSentence(facts.solute.name)}, the density is estimated by adding volumes (about ±0.01 g/mL).`;
}

function saltedAfter(facts: SystemFacts, aq: { densityGPerMl: number; volumeMl: number }, funnelMl: number | undefined, what: string): PhaseAfter {
  const l = facts.layers;
  const after = phaseAfter(facts, l.organicDensityGPerMl, aq.densityGPerMl, l.organicVolumeMl, aq.volumeMl, funnelMl, what);
  return { ...after, note: after.note + approxNote(facts) + saturationNote(facts) };
}

/** Adding `brineMl` of saturated brine. */
export function brineAfter(facts: SystemFacts, brineMl: number, funnelMl?: number): PhaseAfter {
  if (!(brineMl >= 0)) throw new KnowledgeInputError("brineMl", "The brine volume must be zero or positive.");
  const { satPct } = sodiumChloride(facts);
  const brineG = brineMl * saturatedBrineDensityGPerMl(facts);
  const naclG = (brineG * satPct) / 100;
  return saltedAfter(facts, aqueousWithSalt(facts, naclG, brineG - naclG, brineMl), funnelMl, `After ${r1(brineMl)} mL saturated brine`);
}

/** Dissolving `saltG` of solid NaCl; refuses more than would dissolve. */
export function solidSaltAfter(facts: SystemFacts, saltG: number, funnelMl?: number): PhaseAfter {
  const room = saltToSaturationG(facts);
  if (!(saltG >= 0)) throw new KnowledgeInputError("saltG", "The salt mass must be zero or positive.");
  if (saltG > room + 1e-9) {
    throw new KnowledgeInputError("saltG", `Only about ${r1(room)} g NaCl dissolves in this aqueous phase at 20 °C.`);
  }
  return saltedAfter(facts, aqueousWithSalt(facts, saltG, 0, null), funnelMl, `After dissolving ${r1(saltG)} g NaCl`);
}

/**
 * True when salting the aqueous phase all the way would put a sinking organic on top or leave
 * the order unclear: the organic is below the aqueous now but not denser than saturated brine
 * by the layer check's "clear" margin (0.07 g/mL). Chlorobenzene (1.106) and 1,2-dichloroethane
 * (1.25) are caught; dichloromethane (1.33) is not.
 */
export function saltingCanInvert(facts: SystemFacts): boolean {
  if (facts.organicIsBottom !== true) return false;
  return facts.layers.organicDensityGPerMl < saturatedBrineDensityGPerMl(facts) + CLEAR_DENSITY_DIFFERENCE_G_PER_ML;
}

function saturationNote(facts: SystemFacts): string {
  if (!saltingCanInvert(facts)) return "";
  const sat = saturatedBrineDensityGPerMl(facts);
  return ` Saturated brine is ${r3(sat)} g/mL and the organic ${r3(facts.layers.organicDensityGPerMl)} g/mL: more salt would ${
    facts.layers.organicDensityGPerMl < sat ? "float the organic on top" : "leave the layers too close to settle well"
  }.`;
}

// ── dilution ─────────────────────────────────────────────────────────────────

/** Adding `waterMl` of water to the aqueous phase. */
export function waterAfter(facts: SystemFacts, waterMl: number, funnelMl?: number): PhaseAfter {
  if (!(waterMl >= 0)) throw new KnowledgeInputError("waterMl", "The water volume must be zero or positive.");
  const T = facts.system.temperatureC;
  const waterG = waterMl * waterDensityGPerMl(T);
  const massG = facts.aqueousMassG + waterG;
  const pct = (facts.aqueousSoluteG / massG) * 100;
  const densityGPerMl = facts.solute.key === "water" ? facts.layers.aqueousDensityGPerMl : aqueousDensityGPerMl(facts.solute, { value: pct, unit: "%w/w" }, T);
  return phaseAfter(
    facts,
    facts.layers.organicDensityGPerMl,
    densityGPerMl,
    facts.layers.organicVolumeMl,
    massG / densityGPerMl,
    funnelMl,
    `After ${r1(waterMl)} mL water`,
  );
}

/** Adding `volumeMl` of an organic solvent (by name), mixed ideally as in the layer check. */
export function organicAfter(facts: SystemFacts, solvent: string, volumeMl: number, funnelMl?: number): PhaseAfter {
  if (!(volumeMl > 0)) throw new KnowledgeInputError("volumeMl", "The added solvent volume must be positive.");
  const next = predictLayers({ ...facts.system, organic: [...facts.system.organic, { solvent, volumeMl }] }, facts.ref);
  return phaseAfter(
    facts,
    next.organicDensityGPerMl,
    next.aqueousDensityGPerMl,
    next.organicVolumeMl,
    next.aqueousVolumeMl,
    funnelMl,
    `After ${r1(volumeMl)} mL more ${inSentence(next.organicParts[next.organicParts.length - 1]!.name)}`,
  );
}

// ── pH ───────────────────────────────────────────────────────────────────────

export interface ComponentMove {
  name: string;
  from: Phase;
  to: Phase;
  /** fraction of the component in the organic layer after one equilibration at the new pH */
  fractionInOrganicAfter: number;
  distributionRatioBefore: number;
  distributionRatioAfter: number;
}

export interface ComponentCheck {
  moves: ComponentMove[];
  /** components that could not be checked (no pKa, no K or log P), with why */
  unchecked: { name: string; reason: string }[];
}

/**
 * Where each component sits before and after the pH change. A component counts as in the
 * layer its distribution ratio favours: organic when D = K·f(neutral) ≥ 1, aqueous below.
 */
export function componentsAtPh(facts: SystemFacts, components: Component[], fromPh: number, toPh: number): ComponentCheck {
  const moves: ComponentMove[] = [];
  const unchecked: { name: string; reason: string }[] = [];
  const side = (d: number): Phase => (d >= 1 ? "organic" : "aqueous");
  for (const c of components) {
    try {
      const k = partitionCoefficientOf(c).value;
      const before = distributionRatio(k, c.kind, c.pKa, fromPh);
      const after = distributionRatio(k, c.kind, c.pKa, toPh);
      moves.push({
        name: c.name,
        from: side(before),
        to: side(after),
        fractionInOrganicAfter: fractionLeftInOrganic(after, facts.layers.organicVolumeMl, facts.layers.aqueousVolumeMl),
        distributionRatioBefore: before,
        distributionRatioAfter: after,
      });
    } catch (e) {
      if (!(e instanceof KnowledgeInputError)) throw e;
      unchecked.push({ name: c.name, reason: e.message });
    }
  }
  return { moves, unchecked };
}

/** Acid or base for pH changes, mol/L. */
export const PH_REAGENT_MOL_L = 2;

export interface NeutralisationEffect {
  result: NeutraliseResult;
  /** the reagent's name, e.g. "2 M HCl" */
  reagent: string;
  cautions: string[];
}

/**
 * Acid or base needed, heat and CO2 from taking the aqueous phase to the target pH, by the
 * plan's charge balance (neutraliseExtract) with 2 M HCl or 2 M NaOH. Null when the aqueous
 * solute has no acid–base data or the pH is unknown.
 */
export function neutralisationEffect(facts: SystemFacts, targetPh: number): NeutralisationEffect | null {
  if (!facts.wash || facts.ph === null) return null;
  const acidify = targetPh < facts.ph;
  const { aqueous, temperatureC } = facts.system;
  let result: NeutraliseResult;
  try {
    result = neutraliseExtract(
      {
        extract: { solute: facts.solute.key, ...(aqueous.concentration !== undefined ? { concentration: aqueous.concentration } : {}), volumeMl: aqueous.volumeMl },
        // the emulsifier's amount is unknown: a zero-amount entry sets the direction and adds nothing
        components: [{ name: "emulsifier", kind: acidify ? "acid" : "base", pKa: acidify ? targetPh + 2 : targetPh - 2, mmol: 0 }],
        reagent: { solute: acidify ? "hydrochloric-acid" : "sodium-hydroxide", concentration: { value: PH_REAGENT_MOL_L, unit: "mol/L" } },
        targetPh,
        temperatureC,
      },
      facts.ref,
    );
  } catch (e) {
    if (e instanceof KnowledgeInputError) return null;
    throw e;
  }
  const cautions = result.warnings.map((w) => w.message);
  const peak = temperatureC + result.temperatureRiseK;
  const boiling = facts.solvents.filter((s) => peak >= s.solvent.boilingPointC.value - NEAR_BOILING_MARGIN_K);
  if (result.temperatureRiseK >= 1 && boiling.length) {
    cautions.push(
      `Up to ${Math.round(peak)} °C is near the boiling point of ${boiling.map((s) => `${inSentence(s.solvent.name)} (${s.solvent.boilingPointC.value} °C)`).join(", ")}: neutralise the aqueous layer alone, cold, before it meets the solvent again.`,
    );
  }
  return { result, reagent: `${PH_REAGENT_MOL_L} M ${acidify ? "HCl" : "NaOH"}`, cautions };
}

// ── warming ──────────────────────────────────────────────────────────────────

/** Vapour pressure from Antoine constants, kPa; null outside the constants' stated range. */
export function vapourPressureKPa(antoine: AntoineConstants, temperatureC: number): number | null {
  if (temperatureC < antoine.minC - 1e-9 || temperatureC > antoine.maxC + 1e-9) return null;
  const t = antoine.temperatureUnit === "K" ? temperatureC + 273.15 : temperatureC;
  const p = 10 ** (antoine.a - antoine.b / (antoine.c + t));
  switch (antoine.pressureUnit) {
    case "mmHg":
      return (p * 101.325) / 760;
    case "bar":
      return p * 100;
    case "kPa":
      return p;
  }
}

/** Refuse warming within this many kelvin of a solvent's boiling point (the layer check's near-boiling margin). */
export const WARMING_REFUSE_MARGIN_K = NEAR_BOILING_MARGIN_K;
/** Caution when the bath is within this many kelvin of the boiling point. */
export const WARMING_CAUTION_MARGIN_K = 25;
/** A warm-water bath for loosening an emulsion (common practice). */
export const DEFAULT_BATH_C = 40;
const ATMOSPHERE_KPA = 101.325;

export type WarmingVerdict = "ok" | "caution" | "refuse";

export interface WarmingCheck {
  bathC: number;
  verdict: WarmingVerdict;
  solvents: {
    name: string;
    boilingPointC: number;
    vapourPressureKPa: number | null;
    /** rise over the vapour pressure at the funnel's temperature, kPa */
    pressureRiseKPa: number | null;
    verdict: WarmingVerdict;
  }[];
  cautions: string[];
}

function solventVerdict(s: Solvent, bathC: number, pKPa: number | null): WarmingVerdict {
  const bp = s.boilingPointC.value;
  if (bathC >= bp - WARMING_REFUSE_MARGIN_K || (pKPa !== null && pKPa >= ATMOSPHERE_KPA)) return "refuse";
  if (bathC >= bp - WARMING_CAUTION_MARGIN_K) return "caution";
  return "ok";
}

/** Each organic solvent's boiling point and vapour pressure against a warm bath. */
export function warmingCheck(facts: SystemFacts, bathC: number = DEFAULT_BATH_C): WarmingCheck {
  const roomC = facts.system.temperatureC;
  const solvents = facts.solvents.map(({ solvent }) => {
    const p = solvent.antoine ? vapourPressureKPa(solvent.antoine.value, bathC) : null;
    const p0 = solvent.antoine ? vapourPressureKPa(solvent.antoine.value, roomC) : null;
    return {
      name: solvent.name,
      boilingPointC: solvent.boilingPointC.value,
      vapourPressureKPa: p,
      pressureRiseKPa: p !== null && p0 !== null ? p - p0 : null,
      verdict: solventVerdict(solvent, bathC, p),
    };
  });
  const rank: Record<WarmingVerdict, number> = { ok: 0, caution: 1, refuse: 2 };
  const verdict = solvents.reduce<WarmingVerdict>((v, s) => (rank[s.verdict] > rank[v] ? s.verdict : v), "ok");
  const cautions = solvents
    .filter((s) => s.verdict !== "ok")
    .map((s) => {
      const vp = s.vapourPressureKPa === null ? "" : ` (vapour pressure about ${Math.round(s.vapourPressureKPa)} kPa at ${bathC} °C)`;
      return s.verdict === "refuse"
        ? `Do not warm: ${inSentence(s.name)} boils at ${s.boilingPointC} °C${vp}, so a ${bathC} °C bath boils it or builds pressure; follow the SDS and local rules.`
        : `${s.name} boils at ${s.boilingPointC} °C${vp}: warm only in an open flask and vent; follow the SDS and local rules.`;
    });
  return { bathC, verdict, solvents, cautions };
}

/** Layer order at the bath temperature, or null when a solvent would boil there. */
export function warmedAfter(facts: SystemFacts, bathC: number, funnelMl?: number): PhaseAfter | null {
  if (warmingCheck(facts, bathC).verdict === "refuse") return null;
  try {
    const warm = predictLayers({ ...facts.system, temperatureC: bathC }, facts.ref);
    return phaseAfter(
      facts,
      warm.organicDensityGPerMl,
      warm.aqueousDensityGPerMl,
      warm.organicVolumeMl,
      warm.aqueousVolumeMl,
      funnelMl,
      `At ${bathC} °C`,
    );
  } catch (e) {
    // Outside the layer check's temperature range: no computed order, the cautions still stand.
    if (e instanceof KnowledgeInputError) return null;
    throw e;
  }
}
