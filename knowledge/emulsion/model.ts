import type { Concentration, SourceKey } from "../types";

/** Cause codes: readable slugs, stable across releases because logged cases refer to them. */
export const CAUSE_CODES = [
  "surfactant-soap",
  "fine-solids",
  "close-densities",
  "viscous-crude",
  "miscible-cosolvent",
  "chlorinated-base",
  "entrained-gas",
  "hazy-organic",
] as const;
export type CauseCode = (typeof CAUSE_CODES)[number];

export const REMEDY_IDS = [
  "let-stand",
  "swirl-interface",
  "saturated-brine",
  "solid-salt",
  "more-organic",
  "dilute-aqueous",
  "little-alcohol",
  "filter-pad",
  "centrifuge",
  "adjust-ph",
  "warm-bath",
  "chill-freeze-thaw",
  "ultrasound",
  "strip-cosolvent",
  "dry-organic",
  "phase-separator-paper",
  "tartrate-chelation",
  "copper-ammonia-wash",
  "gentle-vacuum-degas",
  "drain-band",
  "swap-solvent",
] as const;
export type RemedyId = (typeof REMEDY_IDS)[number];

export type EvidenceLevel = "literature" | "common-practice" | "anecdotal";

export interface MinutesRange {
  min: number;
  max: number;
}

export interface EmulsionCause {
  code: CauseCode;
  title: string;
  /** what is going on, in one or two sentences */
  mechanism: string;
  /** what the chemist sees or knows that points to this cause */
  signs: string[];
  sources: SourceKey[];
}

/** Amounts scaled to one system; every remedy's steps are written from these. */
export interface RemedyAmounts {
  aqueousMl: number;
  organicMl: number;
  totalMl: number;
  funnelMl: number | null;
  mainSolventName: string;
  /** null when the layer check cannot tell */
  organicIsBottom: boolean | null;
  brineMl: AmountRange;
  brineUseMl: number;
  saltG: number;
  saltSaturationG: number;
  extraOrganicMl: number;
  extraOrganicSolventName: string;
  waterMl: number;
  alcoholMl: AmountRange;
  rinseMl: number;
  tubes50Ml: number;
  bathC: number;
  dissolvedWaterG: number | null;
  dryingAgentG: number;
  chelatorMl: number;
  washMl: number;
  /** acid or base needed to reach the target pH, mmol, when the wash's chemistry is known */
  neutraliseMmol: number | null;
  /** pH to aim for when adjusting, and with what; null when no adjustment is indicated */
  phTarget: number | null;
  phReagent: string | null;
  phReagentMl: number | null;
}

/** A low–high pair of amounts (mL, g). */
export interface AmountRange {
  min: number;
  max: number;
}

export interface Remedy {
  id: RemedyId;
  title: string;
  mechanism: string;
  fits: {
    /** how well the remedy answers each cause, 0–1 (curated) */
    causes: Partial<Record<CauseCode, number>>;
    /** system conditions that make it fit or not, in words */
    conditions: string[];
  };
  steps: (a: RemedyAmounts) => string[];
  minutes: MinutesRange;
  risks: string[];
  scale: string;
  /** above this total volume the remedy is impractical */
  maxTotalMl?: number;
  evidence: EvidenceLevel;
  sources: SourceKey[];
  cautions: string[];
  /** 1 = cheap and safe … 5 = drastic; orders the escalation ladder */
  tier: 1 | 2 | 3 | 4 | 5;
}

// ——— troubleshoot input and output ———

export interface EmulsionSystem {
  organic: { solvent: string; volumeMl: number }[];
  aqueous: { solute: string; concentration?: Concentration; volumeMl: number };
  temperatureC: number;
}

export interface Seen {
  /** share of the total liquid volume that is emulsified, % */
  emulsionFractionPct?: number;
  solids?: boolean;
  colour?: string;
  thirdLayer?: boolean;
  cloudyOrganic?: boolean;
  foamOrBubbles?: boolean;
  afterSeparation?: boolean;
}

export const REAGENT_TAGS = [
  "metal-salts",
  "aluminium",
  "titanium",
  "tin",
  "copper",
  "zinc",
  "iron",
  "magnesium",
  "palladium",
  "phase-transfer-catalyst",
  "fatty-acid",
  "greasy-amine",
  "surfactant",
  "protein",
  "polymer",
  "urea-byproduct",
  "carbonate",
] as const;
export type ReagentTag = (typeof REAGENT_TAGS)[number];

export interface Known {
  ph?: number;
  coSolvents?: string[];
  /** tags from REAGENT_TAGS; unknown tags are ignored */
  reagents?: string[];
  shaking?: "gentle" | "normal" | "vigorous";
  minutesWaited?: number;
  viscous?: boolean;
  funnelMl?: number;
}

export interface Component {
  name: string;
  kind: "acid" | "base" | "neutral";
  /** for a base, the pKa of its conjugate acid */
  pKa?: number;
  partitionCoefficient?: number;
  logP?: number;
}

export interface TroubleshootInput {
  system: EmulsionSystem;
  seen: Seen;
  known: Known;
  components?: Component[];
}
