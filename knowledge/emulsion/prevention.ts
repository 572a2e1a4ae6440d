import type { SourceKey } from "../types";
import type { CauseCode } from "./model";

export interface PreventionTip {
  id: string;
  text: string;
  /** the causes this tip prevents; an empty list means it applies to every emulsion */
  causes: CauseCode[];
  source: SourceKey;
}

export const PREVENTION_TIPS: PreventionTip[] = [
  {
    id: "gentle-inversions",
    text: "Mix by slow inversions or swirling instead of shaking when the mixture is known to emulsify.",
    causes: [],
    source: "emulsion-teaching-module",
  },
  {
    id: "presalt-aqueous",
    text: "Saturate the aqueous phase with salt, or wash with brine instead of water, before the first shake.",
    causes: ["surfactant-soap", "miscible-cosolvent", "hazy-organic"],
    source: "epa-1664-white-paper",
  },
  {
    id: "set-ph-first",
    text: "Set the pH before the first contact so soaps never form: acidic for greasy acids, basic for greasy amines, after checking the product's pKa.",
    causes: ["surfactant-soap", "chlorinated-base"],
    source: "common-practice",
  },
  {
    id: "filter-before-funnel",
    text: "Filter solids off (diatomaceous earth) before the mixture goes into the funnel.",
    causes: ["fine-solids"],
    source: "common-practice",
  },
  {
    id: "chelating-quench",
    text: "Quench aluminium or titanium reagents with a tartrate solution, or the 1 : 1 : 3 water / 15 % NaOH / water sequence, and filter before extracting.",
    causes: ["fine-solids"],
    source: "lah-quench-teaching-page",
  },
  {
    id: "strip-cosolvent-first",
    text: "Evaporate water-miscible reaction solvents (THF, alcohols, acetonitrile, acetone) before the work-up; wash DMF or DMSO out with plenty of water.",
    causes: ["miscible-cosolvent"],
    source: "anderson-process-from-memory",
  },
  {
    id: "dilute-crude",
    text: "Dissolve the crude in more solvent (roughly 5–10 mL per g of crude) before washing.",
    causes: ["viscous-crude", "surfactant-soap"],
    source: "common-practice",
  },
  {
    id: "wider-density-gap",
    text: "Pick a solvent pair with a density gap of at least 0.1 g/mL (run the layer check first), or a solvent with less water uptake such as toluene, MTBE or CPME.",
    causes: ["close-densities", "chlorinated-base", "hazy-organic"],
    source: "common-practice",
  },
  {
    id: "degas-bicarbonate",
    text: "Neutralise acid with bicarbonate in an open, stirred flask until gas stops, then transfer to the funnel.",
    causes: ["entrained-gas"],
    source: "nichols-techniques-from-memory",
  },
  {
    id: "brine-before-drying",
    text: "Wash the organic layer once with brine before the drying agent.",
    causes: ["hazy-organic"],
    source: "common-practice",
  },
  {
    id: "aliquot-trial",
    text: "Try the work-up on a small aliquot in a test tube before committing the whole batch.",
    causes: [],
    source: "anderson-process-from-memory",
  },
];

/**
 * Tips for the diagnosed causes, most likely cause first, then the tips that always apply.
 * `causeCodes` is ordered by likelihood.
 */
export function preventionFor(causeCodes: CauseCode[]): string[] {
  const chosen: PreventionTip[] = [];
  for (const code of causeCodes) {
    for (const tip of PREVENTION_TIPS) {
      if (tip.causes.includes(code) && !chosen.includes(tip)) chosen.push(tip);
    }
  }
  for (const tip of PREVENTION_TIPS) {
    if (tip.causes.length === 0 && !chosen.includes(tip)) chosen.push(tip);
  }
  return chosen.map((t) => t.text);
}
