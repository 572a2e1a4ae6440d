import { inSentence } from "../text";
import type { LayerPrediction } from "../layers";
import type { ReferenceData } from "../types";
import { KnowledgeInputError } from "../types";
import { extraOrganicSolvent, remedyAmounts, type PhPlan } from "./amounts";
import { CAUSES } from "./causes";
import { PRIOR_STRENGTH, ownGroupRecords, phBand, remedyEvidence, type EvidenceRecord, type RemedyEvidence } from "./evidence";
import { systemFacts, type SystemFacts } from "./facts";
import type { CauseCode, Component, Remedy, RemedyAmounts, RemedyId, TroubleshootInput } from "./model";
import { preventionFor } from "./prevention";
import { REMEDIES } from "./remedies";
import {
  PH_REAGENT_MOL_L,
  brineAfter,
  componentsAtPh,
  neutralisationEffect,
  organicAfter,
  saltingCanInvert,
  saturatedBrineDensityGPerMl,
  solidSaltAfter,
  waterAfter,
  warmedAfter,
  warmingCheck,
  type ComponentMove,
  type PhaseAfter,
} from "./side-effects";

// ── output shapes ────────────────────────────────────────────────────────────

export interface CauseResult {
  code: CauseCode;
  title: string;
  /** 0–1: how strongly the answers point to this cause */
  score: number;
  reasons: string[];
}

export interface GroupNote {
  remedyId: string;
  text: string;
  causeCode?: string;
  solventFamily?: string;
  /** aqueous pH band ("9-12"); such a note shows only when the system's band is known and the same */
  phBand?: string;
}

export interface RemedyResult {
  id: RemedyId;
  title: string;
  /** 0–1 ranking score: the curated fit, blended with group evidence when there is some */
  score: number;
  /** the curated fit before group evidence */
  priorScore: number;
  reasons: string[];
  risks: string[];
  cautions: string[];
  minutes: { min: number; max: number };
  steps: string[];
  evidenceLevel: Remedy["evidence"];
  sources: string[];
  after?: PhaseAfter;
  componentMoves?: ComponentMove[];
  evidence?: RemedyEvidence;
  groupNotes?: GroupNote[];
  /** ruled out for this system (brine that would swap the layers, pH that moves the product, a bath at the boiling point): never a first pick */
  blocked: boolean;
}

export interface TroubleshootResult {
  causes: CauseResult[];
  remedies: RemedyResult[];
  /** remedy ids from cheap and safe to drastic */
  escalation: RemedyId[];
  prevention: string[];
  layers: LayerPrediction;
  /** how the ranking was made, for the "why this order" line */
  method: string[];
}

export interface TroubleshootOptions {
  ref?: ReferenceData;
  /** the caller's group's logged remedy outcomes */
  evidence?: EvidenceRecord[];
  /** the caller's group: records of any other group are dropped */
  groupId?: string;
  groupNotes?: GroupNote[];
}

// ── causes ───────────────────────────────────────────────────────────────────

interface Context {
  input: TroubleshootInput;
  facts: SystemFacts;
  tags: Set<string>;
  funnelMl: number | undefined;
}

interface Signal {
  weight: number;
  reason: string;
}

/** 1 − Π(1 − wᵢ): independent signals each close part of the remaining doubt. */
function noisyOr(weights: number[]): number {
  return 1 - weights.reduce((p, w) => p * (1 - Math.min(1, Math.max(0, w))), 1);
}

const r2 = (x: number) => Math.round(x * 100) / 100;
const r3 = (x: number) => Math.round(x * 1000) / 1000;
const phText = (ctx: Context) => (ctx.facts.ph === null ? "" : `pH ${ctx.facts.ph.toFixed(1)}${ctx.facts.phMeasured ? "" : ", computed for the wash"}`);

const METAL_TAGS = ["metal-salts", "aluminium", "titanium", "tin", "copper", "zinc", "iron", "magnesium", "palladium"] as const;
const METAL_WORDS: Record<string, string> = {
  "metal-salts": "metal salts",
  aluminium: "an aluminium reagent",
  titanium: "a titanium reagent",
  tin: "tin salts",
  copper: "copper salts",
  zinc: "zinc salts",
  iron: "iron salts",
  magnesium: "magnesium salts",
  palladium: "palladium",
};
/** A neutral form this lipophilic (log K ≥ 3) makes a soap when ionised (common practice). */
const GREASY_LOG_K = 3;

function logK(c: Component): number | null {
  if (c.partitionCoefficient !== undefined && c.partitionCoefficient > 0) return Math.log10(c.partitionCoefficient);
  return c.logP ?? null;
}

/** Greasy components present mostly as ions at the current pH: acids above pKa + 1, bases below pKa − 1. */
function soapFormers(ctx: Context): { component: Component; kind: "acid" | "base" }[] {
  const ph = ctx.facts.ph;
  if (ph === null) return [];
  return (ctx.input.components ?? []).flatMap((c): { component: Component; kind: "acid" | "base" }[] => {
    const lk = logK(c);
    if (c.pKa === undefined || lk === null || lk < GREASY_LOG_K) return [];
    if (c.kind === "acid" && ph > c.pKa + 1) return [{ component: c, kind: "acid" }];
    if (c.kind === "base" && ph < c.pKa - 1) return [{ component: c, kind: "base" }];
    return [];
  });
}

function halogenatedFraction(ctx: Context): number {
  const total = ctx.facts.solvents.reduce((s, x) => s + x.volumeMl, 0);
  return ctx.facts.solvents.filter((x) => x.solvent.halogenated).reduce((s, x) => s + x.volumeMl, 0) / total;
}

const CAUSE_SIGNALS: Record<CauseCode, (ctx: Context) => Signal[]> = {
  "surfactant-soap": (ctx) => {
    const out: Signal[] = [];
    const ph = ctx.facts.ph;
    if (ctx.tags.has("fatty-acid")) {
      out.push(
        ph !== null && ph >= 8
          ? { weight: 0.6, reason: `a fatty acid in basic water (${phText(ctx)}) is a soap` }
          : { weight: 0.25, reason: "a fatty acid is present" },
      );
    }
    if (ctx.tags.has("greasy-amine")) {
      out.push(
        ph !== null && ph <= 6
          ? { weight: 0.6, reason: `a greasy amine in acidic water (${phText(ctx)}) acts as a surfactant` }
          : { weight: 0.25, reason: "a greasy amine is present" },
      );
    }
    if (ctx.tags.has("surfactant")) out.push({ weight: 0.55, reason: "a surfactant is in the mixture" });
    if (ctx.tags.has("phase-transfer-catalyst")) out.push({ weight: 0.5, reason: "a phase-transfer catalyst (quaternary salt) sits at the interface" });
    if (ctx.tags.has("protein")) out.push({ weight: 0.5, reason: "proteins or biological material stabilise droplets" });
    for (const s of soapFormers(ctx)) {
      out.push({
        weight: 0.5,
        reason: `${s.component.name} (pKa ${s.component.pKa}) is mostly ${s.kind === "acid" ? "deprotonated" : "protonated"} at ${phText(ctx)}: a greasy ion, i.e. a soap`,
      });
    }
    const carbonate = ctx.facts.wash?.carbonate || ctx.tags.has("carbonate");
    if (ctx.input.seen.foamOrBubbles && !carbonate) out.push({ weight: 0.15, reason: "lasting foam without a gas source" });
    if (/milk/i.test(ctx.input.seen.colour ?? "")) out.push({ weight: 0.1, reason: "a milky band" });
    return out;
  },
  "fine-solids": (ctx) => {
    const out: Signal[] = [];
    if (ctx.input.seen.solids) out.push({ weight: 0.6, reason: "solids seen at the interface" });
    const metals = METAL_TAGS.filter((t) => ctx.tags.has(t));
    if (metals.length) {
      out.push({ weight: 0.45, reason: `${metals.map((m) => METAL_WORDS[m]).join(", ")} used: hydroxides, salts or metal particles gather at the interface` });
    }
    if (ctx.tags.has("urea-byproduct")) out.push({ weight: 0.45, reason: "a urea by-product (carbodiimide coupling) is barely soluble in either layer" });
    if (ctx.input.seen.thirdLayer && ctx.input.seen.solids) out.push({ weight: 0.1, reason: "a solid-laden third layer (rag layer)" });
    return out;
  },
  "close-densities": (ctx) => {
    const l = ctx.facts.layers;
    if (l.phases === 1) return [];
    const gap = `the layer check gives a density gap of only ${r3(l.densityDifferenceGPerMl)} g/mL (organic ${r3(l.organicDensityGPerMl)}, aqueous ${r3(l.aqueousDensityGPerMl)})`;
    if (l.confidence === "too-close") return [{ weight: 0.8, reason: gap }];
    if (l.confidence === "close") return [{ weight: 0.5, reason: gap }];
    if (l.densityDifferenceGPerMl < 0.1) return [{ weight: 0.15, reason: `a modest density gap (${r3(l.densityDifferenceGPerMl)} g/mL) settles slowly` }];
    return [];
  },
  "viscous-crude": (ctx) => {
    const out: Signal[] = [];
    if (ctx.input.known.viscous) out.push({ weight: 0.65, reason: "the organic layer is viscous" });
    if (ctx.tags.has("polymer")) out.push({ weight: 0.4, reason: "polymeric material thickens the organic layer" });
    if (ctx.input.system.temperatureC < 10) out.push({ weight: 0.25, reason: `cold (${ctx.input.system.temperatureC} °C) raises viscosity` });
    if (/tar|dark|black|brown/i.test(ctx.input.seen.colour ?? "")) out.push({ weight: 0.15, reason: "a dark, tarry crude" });
    return out;
  },
  "miscible-cosolvent": (ctx) => {
    const out: Signal[] = [];
    const found = ctx.facts.miscibleCoSolvents;
    if (found.length) out.push({ weight: 0.75, reason: `${found.map((s) => s.name).join(", ")} mixes with water and is still present` });
    const unknown = (ctx.input.known.coSolvents ?? []).filter(
      (n) => !found.some((s) => s.name === n || s.key === n || s.synonyms.includes(n)) && n.trim() !== "",
    );
    if (unknown.length && !found.length) out.push({ weight: 0.4, reason: `co-solvent named: ${unknown.join(", ")}` });
    if (ctx.facts.layers.phases === 1) out.push({ weight: 0.5, reason: "the layer check predicts a single phase" });
    if (ctx.input.seen.thirdLayer && !ctx.input.seen.solids) out.push({ weight: 0.25, reason: "a third liquid layer" });
    return out;
  },
  "chlorinated-base": (ctx) => {
    const ph = ctx.facts.ph;
    const frac = halogenatedFraction(ctx);
    if (frac < 0.3 || ph === null || ph < 9) return [];
    const names = ctx.facts.solvents.filter((s) => s.solvent.halogenated).map((s) => s.solvent.name).join(", ");
    const out: Signal[] = [{ weight: 0.65, reason: `${names} over basic water (${phText(ctx)})` }];
    if (ph >= 12) out.push({ weight: 0.2, reason: "strongly basic water forms soaps and hydroxide precipitates" });
    return out;
  },
  "entrained-gas": (ctx) => {
    const out: Signal[] = [];
    const carbonate = ctx.facts.wash?.carbonate || ctx.tags.has("carbonate");
    if (ctx.input.seen.foamOrBubbles) out.push({ weight: 0.55, reason: "bubbles or foam in the band" });
    if (carbonate) {
      out.push(
        ctx.input.seen.foamOrBubbles
          ? { weight: 0.3, reason: "carbonate or bicarbonate gives CO2 with any acid" }
          : { weight: 0.15, reason: "carbonate or bicarbonate can release CO2" },
      );
    }
    if (ctx.input.seen.foamOrBubbles && ctx.input.known.shaking === "vigorous") out.push({ weight: 0.1, reason: "vigorous shaking beats air in" });
    return out;
  },
  "hazy-organic": (ctx) => {
    const out: Signal[] = [];
    const { cloudyOrganic, afterSeparation } = ctx.input.seen;
    if (cloudyOrganic) out.push({ weight: 0.55, reason: "the organic layer is cloudy" });
    if (afterSeparation) out.push({ weight: cloudyOrganic ? 0.5 : 0.3, reason: "the layers have already been separated" });
    const wet = ctx.facts.solvents.filter((s) => (s.solvent.waterInSolventWtPct.value ?? 0) >= 1);
    if (cloudyOrganic && wet.length) {
      out.push({
        weight: 0.15,
        reason: wet.map((s) => `${inSentence(s.solvent.name)} takes up about ${s.solvent.waterInSolventWtPct.value} wt% water`).join("; "),
      });
    }
    return out;
  },
};

/** When the layers are already apart, a band cause is less likely than haze. */
const AFTER_SEPARATION_DAMPING = 0.5;

function diagnoseCauses(ctx: Context): CauseResult[] {
  return CAUSES.map((c) => {
    const signals = CAUSE_SIGNALS[c.code](ctx);
    let score = noisyOr(signals.map((s) => s.weight));
    if (ctx.input.seen.afterSeparation && c.code !== "hazy-organic") score *= AFTER_SEPARATION_DAMPING;
    return { code: c.code, title: c.title, score: r3(score), reasons: signals.map((s) => s.reason) };
  })
    .filter((c) => c.score > 0)
    .sort((a, b) => b.score - a.score);
}

// ── remedies ─────────────────────────────────────────────────────────────────

/** Fit to a situation with no recognised cause: the general first moves (common practice). */
const GENERAL_FIT: Partial<Record<RemedyId, number>> = {
  "let-stand": 0.5,
  "swirl-interface": 0.45,
  "saturated-brine": 0.35,
  "solid-salt": 0.3,
  centrifuge: 0.2,
  "filter-pad": 0.15,
  "drain-band": 0.15,
};
const EVIDENCE_LEVEL_FACTOR: Record<Remedy["evidence"], number> = { literature: 1, "common-practice": 0.95, anecdotal: 0.85 };
/** Score taken off per tier above the first, so cheap and safe wins among similar fits. */
const TIER_STEP = 0.015;
/** Causes below this score do not name a remedy's reasons or prevention tips. */
const LIKELY = 0.2;
/** Remedies scoring below this are left out of the ranked list. */
const LISTED = 0.05;
/** The escalation ladder: remedies scoring at least this, at most this many. */
const LADDER_MIN_SCORE = 0.25;
const LADDER_MAX = 8;

interface Draft {
  factor: number;
  reasons: string[];
  risks: string[];
  cautions: string[];
  /** extra fit weight per cause when the chemistry makes the remedy specific */
  weightOverride: Partial<Record<CauseCode, number>>;
  after?: PhaseAfter;
  componentMoves?: ComponentMove[];
  /** replaces the catalogue steps when the system rules the remedy out */
  steps?: string[];
  /** a hard block: never first, not on the ladder */
  blocked: boolean;
}

interface RemedyContext extends Context {
  causes: Map<CauseCode, number>;
  amounts: RemedyAmounts;
  phPlan: PhPlan | null;
}

const cause = (ctx: RemedyContext, code: CauseCode) => ctx.causes.get(code) ?? 0;

function saltAdjust(ctx: RemedyContext, d: Draft, after: PhaseAfter, label: string): void {
  d.after = after;
  const l = ctx.facts.layers;
  if (saltingCanInvert(ctx.facts) || after.swapsLayers || after.isodense) {
    d.factor *= 0.15;
    d.blocked = true;
    d.reasons.push(
      `the organic (${r3(l.organicDensityGPerMl)} g/mL) sinks in water but is not clearly denser than saturated brine (${r3(saturatedBrineDensityGPerMl(ctx.facts))} g/mL): ${label} would stall or swap the layers`,
    );
  } else if (ctx.facts.organicIsBottom) {
    d.factor *= 0.75;
    d.reasons.push(`the organic is the lower layer: ${label} narrows the gap from ${r3(l.densityDifferenceGPerMl)} to ${r3(after.densityDifferenceGPerMl)} g/mL`);
  } else if (ctx.facts.organicIsBottom === false) {
    d.factor *= 1.1;
    d.reasons.push(`the organic floats: ${label} widens the gap from ${r3(l.densityDifferenceGPerMl)} to ${r3(after.densityDifferenceGPerMl)} g/mL`);
  }
  if (after.overfilled) {
    d.factor *= 0.7;
    d.reasons.push("the funnel would be over three-quarters full");
  }
}

function overfill(d: Draft, after: PhaseAfter): void {
  if (after.overfilled) {
    d.factor *= 0.6;
    d.reasons.push("the funnel would be over three-quarters full: split first");
  }
}

const DIPOLAR_APROTIC = new Set(["dmf", "dmso", "nmp"]);

const ADJUST: Partial<Record<RemedyId, (ctx: RemedyContext, d: Draft) => void>> = {
  "let-stand": (ctx, d) => {
    const waited = ctx.input.known.minutesWaited;
    if (waited !== undefined && waited >= 60) {
      d.factor *= 0.3;
      d.reasons.push(`already waited ${waited} minutes`);
    } else if (waited !== undefined && waited >= 30) {
      d.factor *= 0.5;
      d.reasons.push(`already waited ${waited} minutes`);
    } else if (waited === undefined || waited < 10) {
      d.factor *= 1.15;
      d.reasons.push("costs nothing and often works within 10–30 minutes");
    }
    const f = ctx.input.seen.emulsionFractionPct;
    if (f !== undefined && f <= 10) d.factor *= 1.1;
  },
  "saturated-brine": (ctx, d) => {
    if (ctx.facts.solute.key === "sodium-chloride" && ctx.input.system.aqueous.concentration === "saturated") {
      d.factor *= 0.1;
      d.reasons.push("the aqueous layer is already saturated brine");
      return;
    }
    saltAdjust(ctx, d, brineAfter(ctx.facts, ctx.amounts.brineUseMl, ctx.funnelMl), "brine");
  },
  "solid-salt": (ctx, d) => {
    if (ctx.amounts.saltG <= 0) {
      d.factor = 0;
      d.reasons.push("the aqueous layer is already saturated with salt");
      return;
    }
    saltAdjust(ctx, d, solidSaltAfter(ctx.facts, ctx.amounts.saltG, ctx.funnelMl), "salt");
  },
  "more-organic": (ctx, d) => {
    const solvent = extraOrganicSolvent(ctx.facts);
    const after = organicAfter(ctx.facts, solvent.key, ctx.amounts.extraOrganicMl, ctx.funnelMl);
    d.after = after;
    if (after.swapsLayers || after.isodense) {
      d.factor *= 0.4;
      d.reasons.push("the added solvent would swap or stall the layers");
    } else if (cause(ctx, "close-densities") >= LIKELY && after.densityDifferenceGPerMl > ctx.facts.layers.densityDifferenceGPerMl + 0.01) {
      d.factor *= 1.1;
      d.reasons.push(`more ${inSentence(solvent.name)} widens the gap to ${r3(after.densityDifferenceGPerMl)} g/mL`);
    }
    overfill(d, after);
  },
  "dilute-aqueous": (ctx, d) => {
    const after = waterAfter(ctx.facts, ctx.amounts.waterMl, ctx.funnelMl);
    d.after = after;
    const before = ctx.facts.layers.densityDifferenceGPerMl;
    if (cause(ctx, "close-densities") >= LIKELY) {
      if (after.densityDifferenceGPerMl > before + 0.005) {
        d.factor *= 1.2;
        d.reasons.push(`water lowers the aqueous density: gap ${r3(before)} → ${r3(after.densityDifferenceGPerMl)} g/mL`);
      } else {
        d.factor *= 0.6;
        d.reasons.push(`water does not widen the gap here (${r3(before)} → ${r3(after.densityDifferenceGPerMl)} g/mL)`);
      }
    }
    if (ctx.facts.miscibleCoSolvents.some((s) => DIPOLAR_APROTIC.has(s.key))) {
      d.factor *= 1.3;
      d.reasons.push("plenty of water pulls DMF, DMSO or NMP out of the organic layer");
    }
    overfill(d, after);
  },
  "little-alcohol": (ctx, d) => {
    if (cause(ctx, "miscible-cosolvent") >= 0.4) {
      d.factor *= 0.4;
      d.reasons.push("a co-solvent is already the problem: alcohol adds to it");
    }
  },
  "filter-pad": (ctx, d) => {
    if (ctx.input.seen.solids) {
      d.factor *= 1.1;
      d.reasons.push("solids are visible: take them out and the band loses its armour");
    }
    if (!ctx.tags.has("palladium")) d.cautions = [];
    if (ctx.facts.solvents.some((s) => s.solvent.boilingPointC.value < 50)) {
      d.reasons.push("low-boiling solvent: filter by gravity through glass wool rather than under vacuum");
    }
  },
  centrifuge: (ctx, d) => {
    // The flammable-vapour caution only where a solvent has a flash point (not for DCM or chloroform).
    if (!ctx.facts.solvents.some((s) => s.solvent.flashPointC.value !== null)) {
      d.cautions = d.cautions.map((c) => (c.startsWith("Flammable solvents") ? "Use capped, balanced, solvent-resistant tubes (not polycarbonate for chlorinated solvents); follow the SDS and local rules." : c));
    }
    const total = ctx.amounts.totalMl;
    const max = REMEDY_MAX_ML.centrifuge;
    if (max !== undefined && total > max) {
      d.factor *= 0.15;
      d.reasons.push(`${Math.round(total)} mL is beyond tube scale`);
    } else if (total > 200) {
      d.factor *= 0.6;
      d.reasons.push(`${Math.round(total)} mL needs ${ctx.amounts.tubes50Ml} tubes`);
    } else {
      d.reasons.push(`${Math.round(total)} mL fits ${ctx.amounts.tubes50Ml} tube${ctx.amounts.tubes50Ml > 1 ? "s" : ""}`);
    }
  },
  "adjust-ph": (ctx, d) => {
    const plan = ctx.phPlan;
    const ph = ctx.facts.ph;
    if (ph === null) {
      d.factor *= 0.5;
      d.reasons.push("the aqueous pH is not known: measure it first");
      return;
    }
    if (!plan) {
      d.factor *= 0.5;
      d.reasons.push("nothing points to an ionised emulsifier, so no pH to aim for");
      return;
    }
    const components = ctx.input.components ?? [];
    if (components.length === 0) {
      d.factor *= 0.55;
      d.reasons.push(`check first where the product goes at pH ${plan.targetPh}: add its pKa and log P (ranked after that check)`);
    } else {
      const check = componentsAtPh(ctx.facts, components, ph, plan.targetPh);
      d.componentMoves = check.moves;
      const lost = check.moves.filter((m) => m.from === "organic" && m.to === "aqueous");
      const recovered = check.moves.filter((m) => m.from === "aqueous" && m.to === "organic");
      if (lost.length) {
        d.factor *= 0.25;
        d.blocked = true;
        d.reasons.push(
          `${lost.map((m) => `${m.name} (D ${sci(m.distributionRatioBefore)} → ${sci(m.distributionRatioAfter)})`).join(", ")} would move into the aqueous layer at pH ${plan.targetPh}`,
        );
      } else {
        d.factor *= 1.1;
        d.reasons.push(`component check at pH ${plan.targetPh}: nothing leaves the organic layer`);
      }
      if (recovered.length) {
        d.reasons.push(`${recovered.map((m) => m.name).join(", ")} goes to the organic layer as the neutral form, taking the soap out of the interface`);
      }
      if (check.unchecked.length) {
        d.factor *= 0.8;
        d.reasons.push(`not checked: ${check.unchecked.map((u) => `${u.name} (${u.reason})`).join("; ")}`);
      }
    }
    const effect = neutralisationEffect(ctx.facts, plan.targetPh);
    if (effect) d.cautions.push(...effect.cautions);
  },
  "warm-bath": (ctx, d) => {
    const check = warmingCheck(ctx.facts, ctx.amounts.bathC);
    d.cautions.push(...check.cautions);
    if (check.verdict === "refuse") {
      const boiling = check.solvents.filter((s) => s.verdict === "refuse").map((s) => `${inSentence(s.name)} (bp ${s.boilingPointC} °C)`).join(", ");
      d.factor *= 0.03;
      d.blocked = true;
      d.reasons.push(`a ${check.bathC} °C bath is at or near the boiling point of ${boiling}`);
      d.steps = [`Do not warm this mixture: ${boiling} would boil or pressurise. Wait, add solvent or centrifuge instead.`];
      return;
    }
    if (check.verdict === "caution") {
      d.factor *= 0.6;
      d.reasons.push("the solvent boils not far above the bath: open flask only");
    }
    const after = warmedAfter(ctx.facts, check.bathC, ctx.funnelMl);
    if (after) d.after = after;
  },
  "chill-freeze-thaw": (ctx, d) => {
    if (cause(ctx, "viscous-crude") >= LIKELY) {
      d.factor *= 0.6;
      d.reasons.push("cold thickens a viscous crude further");
    }
  },
  ultrasound: (ctx, d) => {
    const max = REMEDY_MAX_ML.ultrasound;
    if (max !== undefined && ctx.amounts.totalMl > max) {
      d.factor *= 0.3;
      d.reasons.push(`only a portion of the ${Math.round(ctx.amounts.totalMl)} mL fits a bath vial`);
    }
  },
  "phase-separator-paper": (ctx, d) => {
    if (ctx.facts.organicIsBottom === false) {
      d.factor *= 0.5;
      d.reasons.push("the organic is the upper layer: drain the aqueous first");
    }
    const max = REMEDY_MAX_ML["phase-separator-paper"];
    if (max !== undefined && ctx.amounts.totalMl > max) d.factor *= 0.3;
    if (cause(ctx, "surfactant-soap") >= 0.5) {
      d.factor *= 0.7;
      d.reasons.push("surfactants can wet the paper and let water through");
    }
  },
  "tartrate-chelation": (ctx, d) => {
    if (ctx.tags.has("aluminium") || ctx.tags.has("titanium")) {
      d.weightOverride["fine-solids"] = 0.9;
      d.reasons.push(`${ctx.tags.has("aluminium") ? "aluminium" : "titanium"} reagent: tartrate keeps the metal in solution`);
    } else {
      d.factor *= 0.15;
    }
  },
  "copper-ammonia-wash": (ctx, d) => {
    if (ctx.tags.has("copper")) {
      d.weightOverride["fine-solids"] = 0.85;
      d.reasons.push("copper salts: ammonia or EDTA carries them into the water");
    } else {
      d.factor *= 0.15;
    }
  },
  "strip-cosolvent": (ctx, d) => {
    const found = ctx.facts.miscibleCoSolvents;
    if (found.length === 0 && (ctx.input.known.coSolvents ?? []).length === 0) {
      d.factor *= 0.1;
      return;
    }
    if (found.some((s) => DIPOLAR_APROTIC.has(s.key))) d.reasons.push("DMF, DMSO or NMP: wash out with water or 5 % LiCl rather than evaporate");
    const volatile = found.filter((s) => !DIPOLAR_APROTIC.has(s.key));
    if (volatile.length) d.reasons.push(`${volatile.map((s) => `${inSentence(s.name)} (bp ${s.boilingPointC.value} °C)`).join(", ")} can be evaporated`);
  },
  "dry-organic": (ctx, d) => {
    if (!ctx.input.seen.afterSeparation && !ctx.input.seen.cloudyOrganic) d.factor *= 0.3;
  },
  "drain-band": (ctx, d) => {
    const f = ctx.input.seen.emulsionFractionPct;
    if (f !== undefined && f <= 15) {
      d.factor *= 1.3;
      d.reasons.push(`a thin band (${f} % of the volume) can be drained off and treated alone`);
    } else if (f !== undefined && f > 33) {
      d.factor *= 0.6;
    }
  },
};

const REMEDY_MAX_ML: Partial<Record<RemedyId, number>> = Object.fromEntries(
  REMEDIES.filter((r) => r.maxTotalMl !== undefined).map((r) => [r.id, r.maxTotalMl]),
);

function sci(x: number): string {
  if (x === 0) return "0";
  return x >= 0.01 && x < 1000 ? String(r2(x)) : x.toExponential(1);
}

/** The pH to aim for: acidify greasy acids and chlorinated/base bands, basify greasy amines. */
function choosePhPlan(ctx: Context, causes: Map<CauseCode, number>): PhPlan | null {
  const ph = ctx.facts.ph;
  if (ph === null) return null;
  const formers = soapFormers(ctx);
  const acidSoap = ctx.tags.has("fatty-acid") || formers.some((f) => f.kind === "acid");
  const baseSoap = ctx.tags.has("greasy-amine") || formers.some((f) => f.kind === "base");
  const acid = `${PH_REAGENT_MOL_L} M HCl`;
  const base = `${PH_REAGENT_MOL_L} M NaOH`;
  // EPA oil-and-grease methods take the sample below pH 2; greasy amines need the mirror image.
  if (ph > 7 && (acidSoap || (causes.get("chlorinated-base") ?? 0) >= LIKELY || (causes.get("surfactant-soap") ?? 0) >= LIKELY)) {
    return { targetPh: 2, reagent: acid };
  }
  if (ph < 7 && (baseSoap || (causes.get("surfactant-soap") ?? 0) >= LIKELY)) return { targetPh: 12, reagent: base };
  return null;
}

function contributionReasons(remedy: Remedy, causes: CauseResult[], weights: Partial<Record<CauseCode, number>>): string[] {
  return causes
    .filter((c) => c.score >= LIKELY && (weights[c.code] ?? 0) * c.score >= 0.15)
    .map((c) => `fits ${c.title.toLowerCase()} (${Math.round(c.score * 100)} % likely)`);
}

interface Ranked extends RemedyResult {
  /** fit to the causes before the system checks */
  fit: number;
}

function rankRemedy(ctx: RemedyContext, remedy: Remedy, causes: CauseResult[]): Ranked {
  const d: Draft = { factor: 1, reasons: [], risks: [], cautions: [...remedy.cautions], weightOverride: {}, blocked: false };
  ADJUST[remedy.id]?.(ctx, d);
  const weights = { ...remedy.fits.causes, ...d.weightOverride };
  const maxCause = causes.reduce((m, c) => Math.max(m, c.score), 0);
  const general = (GENERAL_FIT[remedy.id] ?? 0) * (1 - maxCause);
  const fit = noisyOr([general, ...causes.map((c) => c.score * (weights[c.code] ?? 0))]);
  const raw = fit * EVIDENCE_LEVEL_FACTOR[remedy.evidence] * d.factor - TIER_STEP * (remedy.tier - 1);
  const priorScore = r3(Math.min(1, Math.max(0, raw)));
  const reasons = [...contributionReasons(remedy, causes, weights), ...d.reasons];
  if (reasons.length === 0) {
    const best = causes.filter((c) => (weights[c.code] ?? 0) > 0).sort((a, b) => b.score * (weights[b.code] ?? 0) - a.score * (weights[a.code] ?? 0))[0];
    if (best && best.score * (weights[best.code] ?? 0) >= general) reasons.push(`a weaker fit for ${best.title.toLowerCase()}`);
    else if (general > 0) reasons.push("a general first move when no cause stands out");
  }
  return {
    id: remedy.id,
    title: remedy.title,
    score: priorScore,
    priorScore,
    reasons,
    risks: [...remedy.risks, ...d.risks],
    cautions: d.cautions,
    minutes: { ...remedy.minutes },
    steps: d.steps ?? remedy.steps(ctx.amounts),
    evidenceLevel: remedy.evidence,
    sources: [...remedy.sources],
    ...(d.after ? { after: d.after } : {}),
    ...(d.componentMoves ? { componentMoves: d.componentMoves } : {}),
    blocked: d.blocked,
    fit,
  };
}

function checkInput(input: TroubleshootInput): void {
  const { seen, known } = input;
  if (!input.system || !seen || !known) throw new KnowledgeInputError("", "Give the system, what is seen and what is known.");
  const f = seen.emulsionFractionPct;
  if (f !== undefined && !(f >= 0 && f <= 100)) throw new KnowledgeInputError("seen.emulsionFractionPct", "The emulsified share must be 0–100 %.");
  const w = known.minutesWaited;
  if (w !== undefined && !(w >= 0)) throw new KnowledgeInputError("known.minutesWaited", "Minutes waited must be zero or more.");
  const fm = known.funnelMl;
  if (fm !== undefined && !(fm > 0)) throw new KnowledgeInputError("known.funnelMl", "The funnel size must be a positive number of mL.");
}

/**
 * Diagnose an emulsion and rank the remedies. Pure: the same input gives the same answer.
 * Scores are 0–1; a remedy's score is its curated fit (causes × fit weights, system checks,
 * evidence level, a small step per escalation tier) blended with the group's similar cases
 * through a Beta prior of 4 pseudo-cases (see evidence.ts).
 */
export function troubleshoot(input: TroubleshootInput, options: TroubleshootOptions = {}): TroubleshootResult {
  checkInput(input);
  const facts = systemFacts(input.system, input.known.ph, input.known.coSolvents ?? [], options.ref);
  const ctx: Context = {
    input,
    facts,
    tags: new Set((input.known.reagents ?? []).map((t) => t.trim().toLowerCase())),
    funnelMl: input.known.funnelMl,
  };
  const causes = diagnoseCauses(ctx);
  const causeMap = new Map(causes.map((c) => [c.code, c.score]));
  const phPlan = choosePhPlan(ctx, causeMap);
  const rctx: RemedyContext = { ...ctx, causes: causeMap, amounts: remedyAmounts(facts, ctx.funnelMl, phPlan), phPlan };

  const records = ownGroupRecords(options.evidence ?? [], options.groupId);
  const top = causes[0];
  const signature =
    facts.ph === null
      ? null
      : { solventFamily: facts.main.family, phBand: phBand(facts.ph), ...(top && top.score >= LIKELY ? { causeCode: top.code } : {}) };
  const likelyCodes = new Set(causes.filter((c) => c.score >= LIKELY).map((c) => c.code as string));

  const ranked = REMEDIES.map((remedy) => {
    const r = rankRemedy(rctx, remedy, causes);
    const ev = signature ? remedyEvidence(remedy.id, r.priorScore, records, signature) : null;
    if (ev) {
      r.evidence = ev;
      r.score = r3(ev.smoothedRate);
      r.reasons.push(`group cases on similar systems: cleared ${ev.cleared} of ${ev.tried}`);
    }
    const notes = (options.groupNotes ?? []).filter(
      (n) =>
        n.remedyId === remedy.id &&
        (n.causeCode === undefined || likelyCodes.has(n.causeCode)) &&
        (n.solventFamily === undefined || n.solventFamily === facts.main.family) &&
        (n.phBand === undefined || (signature !== null && n.phBand === signature.phBand)),
    );
    if (notes.length) r.groupNotes = notes;
    return r;
  })
    // blocked remedies stay listed so their warning is seen
    .filter((r) => r.score >= LISTED || (r.blocked && r.fit >= LISTED))
    .sort((a, b) => b.score - a.score || remedyTier(a.id) - remedyTier(b.id));

  // A blocked remedy (brine that would swap the layers, pH that moves the product, a bath at the
  // boiling point) never leads, whatever the group's record says.
  const firstOpen = ranked.findIndex((r) => !r.blocked);
  if (firstOpen > 0) ranked.unshift(...ranked.splice(firstOpen, 1));

  const escalation = ranked
    .filter((r) => !r.blocked && r.score >= LADDER_MIN_SCORE)
    .slice(0, LADDER_MAX)
    .sort((a, b) => remedyTier(a.id) - remedyTier(b.id) || b.score - a.score)
    .map((r) => r.id);

  return {
    causes,
    remedies: ranked.map(({ fit: _fit, ...r }) => r),
    escalation,
    prevention: preventionFor(causes.filter((c) => c.score >= LIKELY).map((c) => c.code)),
    layers: facts.layers,
    method: [
      "Cause scores combine independent signs as 1 − Π(1 − wᵢ).",
      "A remedy's fit combines its curated weight for each cause, times the cause score, the same way; system checks (density after salt, boiling point, scale, component check) scale it; each escalation tier takes 0.015 off.",
      `Group evidence, when there is some on similar systems (same solvent family, pH band and main cause), blends in as a Beta prior of ${PRIOR_STRENGTH} pseudo-cases: (successes + ${PRIOR_STRENGTH}·fit) / (tries + ${PRIOR_STRENGTH}), a partly cleared case counting half.`,
    ],
  };
}

function remedyTier(id: RemedyId): number {
  return REMEDIES.find((r) => r.id === id)?.tier ?? 5;
}
