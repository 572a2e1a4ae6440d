import type { ReferenceData } from "../types";
import { remedyAmounts } from "./amounts";
import { systemFacts } from "./facts";
import type { EmulsionSystem, Remedy, RemedyId } from "./model";
import { REMEDIES } from "./remedies";
import { emulsionSource } from "./sources";

/** The system the catalogue's example amounts are scaled to. */
export const CATALOGUE_SYSTEM: EmulsionSystem = {
  organic: [{ solvent: "ethyl-acetate", volumeMl: 100 }],
  aqueous: { solute: "water", volumeMl: 100 },
  temperatureC: 20,
};
export const CATALOGUE_SCALE_NOTE = "Amounts shown for 100 mL ethyl acetate over 100 mL water; troubleshooting scales them to your funnel.";

export interface CatalogueEntry extends Omit<Remedy, "steps" | "sources"> {
  steps: string[];
  sources: { key: string; title: string }[];
}

/** The remedies as plain data (for GET /api/remedies), with example steps and source titles. */
export function remedyCatalogue(ref?: ReferenceData): CatalogueEntry[] {
  const amounts = remedyAmounts(systemFacts(CATALOGUE_SYSTEM, undefined, [], ref), undefined, null);
  return REMEDIES.map(({ steps, sources, ...rest }) => ({
    ...rest,
    steps: steps(amounts),
    sources: sources.map((key) => ({ key, title: emulsionSource(key)?.title ?? key })),
  }));
}

export function catalogueEntry(id: string, ref?: ReferenceData): CatalogueEntry | undefined {
  return remedyCatalogue(ref).find((r) => r.id === (id as RemedyId));
}
