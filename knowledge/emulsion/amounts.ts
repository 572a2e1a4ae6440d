import { inSentence } from "../text";
import type { SystemFacts } from "./facts";
import type { RemedyAmounts } from "./model";
import { benchAmount } from "./remedies";
import { DEFAULT_BATH_C, neutralisationEffect, saltToSaturationG } from "./side-effects";

/*
 * Amounts scaled to the funnel. The fractions are rules of thumb (common practice) unless a
 * source is named: brine 20–30 % of the aqueous volume; solid salt half of what would saturate;
 * washes 0.3–1 × the organic volume (we take 0.5).
 */
export const BRINE_FRACTION = { min: 0.2, use: 0.25, max: 0.3 } as const;
export const SALT_FRACTION_OF_SATURATION = 0.5;
export const EXTRA_ORGANIC_FRACTION = 0.5;
export const EXTRA_WATER_FRACTION = 0.5;
export const WASH_FRACTION = 0.5;
/** Alcohol as a share of the total liquid: "a few drops to a few mL" for a 100 mL funnel load. */
export const ALCOHOL_FRACTION = { min: 0.01, max: 0.03 } as const;
/** mL of liquid per centrifuge tube (a 50 mL tube filled to 40 mL). */
export const TUBE_FILL_ML = 40;
/** Starting portion of drying agent, g per mL of organic (about 1 g per 25 mL, then add until free-flowing). */
export const DRYING_AGENT_G_PER_ML = 1 / 25;

export interface PhPlan {
  targetPh: number;
  /** "2 M HCl" or "2 M NaOH" */
  reagent: string;
}

/** Which solvent to add for "more organic": the one already present that widens the density gap. */
export function extraOrganicSolvent(facts: SystemFacts): { key: string; name: string } {
  const parts = facts.layers.organicParts.filter((p) => facts.solvents.some((s) => s.solvent.key === p.key && s.solvent.miscibility.value !== "miscible"));
  if (parts.length === 0) return { key: facts.main.key, name: facts.main.name };
  const pick = parts.reduce((best, p) =>
    facts.organicIsBottom ? (p.densityGPerMl > best.densityGPerMl ? p : best) : p.densityGPerMl < best.densityGPerMl ? p : best,
  );
  return { key: pick.key, name: pick.name };
}

function dissolvedWaterG(facts: SystemFacts): number | null {
  let total = 0;
  let known = false;
  for (const part of facts.layers.organicParts) {
    const s = facts.solvents.find((x) => x.solvent.key === part.key)?.solvent;
    const w = s?.waterInSolventWtPct.value;
    if (w === null || w === undefined) continue;
    known = true;
    total += (part.volumeMl * part.densityGPerMl * w) / 100;
  }
  return known ? total : null;
}

export function remedyAmounts(facts: SystemFacts, funnelMl: number | undefined, ph: PhPlan | null): RemedyAmounts {
  const aqueousMl = facts.system.aqueous.volumeMl;
  const organicMl = facts.layers.organicVolumeMl;
  const totalMl = aqueousMl + organicMl;
  const saturation = saltToSaturationG(facts);
  const extra = extraOrganicSolvent(facts);
  const effect = ph ? neutralisationEffect(facts, ph.targetPh) : null;
  return {
    aqueousMl,
    organicMl,
    totalMl,
    funnelMl: funnelMl ?? null,
    mainSolventName: inSentence(facts.main.name),
    organicIsBottom: facts.organicIsBottom,
    brineMl: { min: benchAmount(aqueousMl * BRINE_FRACTION.min), max: benchAmount(aqueousMl * BRINE_FRACTION.max) },
    brineUseMl: benchAmount(aqueousMl * BRINE_FRACTION.use),
    saltG: benchAmount(saturation * SALT_FRACTION_OF_SATURATION),
    saltSaturationG: saturation,
    extraOrganicMl: benchAmount(organicMl * EXTRA_ORGANIC_FRACTION),
    extraOrganicSolventName: extra.name,
    waterMl: benchAmount(aqueousMl * EXTRA_WATER_FRACTION),
    alcoholMl: { min: benchAmount(Math.max(0.5, totalMl * ALCOHOL_FRACTION.min)), max: benchAmount(Math.max(1, totalMl * ALCOHOL_FRACTION.max)) },
    rinseMl: benchAmount(Math.max(5, organicMl * 0.2)),
    tubes50Ml: Math.max(1, Math.ceil(totalMl / TUBE_FILL_ML)),
    bathC: DEFAULT_BATH_C,
    dissolvedWaterG: dissolvedWaterG(facts),
    dryingAgentG: benchAmount(Math.max(1, organicMl * DRYING_AGENT_G_PER_ML)),
    chelatorMl: benchAmount(organicMl),
    washMl: benchAmount(organicMl * WASH_FRACTION),
    neutraliseMmol: effect ? effect.result.reagentMmol : null,
    phTarget: ph?.targetPh ?? null,
    phReagent: ph?.reagent ?? null,
    phReagentMl: effect && effect.result.reagentVolumeMl > 0 ? effect.result.reagentVolumeMl : null,
  };
}
