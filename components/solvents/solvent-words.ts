import type { GuideCategory, Miscibility, PeroxideClass } from "../../knowledge/types";
import type { Tone } from "../../hooks/theme";

/* Words and tones for solvent properties, shared by the table and the detail view. */

export const GUIDE_LABEL: Record<GuideCategory, string> = {
  recommended: "Recommended",
  problematic: "Problematic",
  hazardous: "Hazardous",
  "highly-hazardous": "Highly hazardous",
};

export const GUIDE_TONE: Record<GuideCategory, Tone> = {
  recommended: "good",
  problematic: "caution",
  hazardous: "danger",
  "highly-hazardous": "danger",
};

/** Order for sorting: the preferred choices first. */
export const GUIDE_RANK: Record<GuideCategory, number> = { recommended: 0, problematic: 1, hazardous: 2, "highly-hazardous": 3 };

export const MISCIBILITY_LABEL: Record<Miscibility, string> = {
  immiscible: "Not miscible",
  partial: "Partly miscible",
  miscible: "Mixes with water",
};

export function peroxideLabel(c: PeroxideClass): string {
  return c ? `Class ${c}` : "Not a peroxide former";
}
