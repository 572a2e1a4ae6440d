import { predictLayers, type LayerPrediction } from "../layers";
import { washPh, type WashPh } from "../plan/wash-chemistry";
import { SHIPPED_REFERENCE, findSolvent, requireSolute, requireSolvent } from "../reference";
import type { AqueousSolute, ReferenceData, Solvent } from "../types";
import { KnowledgeInputError } from "../types";
import type { EmulsionSystem } from "./model";

/** What the remedies need to know about one funnel, worked out once from the layer check. */
export interface SystemFacts {
  system: EmulsionSystem;
  ref: ReferenceData;
  layers: LayerPrediction;
  solvents: { solvent: Solvent; volumeMl: number }[];
  /** the water-immiscible solvent with the largest volume (the extraction solvent) */
  main: Solvent;
  solute: AqueousSolute;
  /** mass of the aqueous phase, g */
  aqueousMassG: number;
  /** mass of dissolved solute in it, g */
  aqueousSoluteG: number;
  /** null when the layers cannot be ordered (one phase) */
  organicIsBottom: boolean | null;
  /** pH of the wash from its acid–base data; null when the solute has none */
  wash: WashPh | null;
  /** the measured pH if given, else the wash's computed pH */
  ph: number | null;
  phMeasured: boolean;
  /** co-solvents named by the user that the tables know, with those inside the organic list */
  miscibleCoSolvents: Solvent[];
}

function safeWashPh(system: EmulsionSystem, ref: ReferenceData): WashPh | null {
  try {
    return washPh(system.aqueous.solute, system.aqueous.concentration, ref);
  } catch (e) {
    // No acid–base entry for this solute: the pH then has to come from the user.
    if (e instanceof KnowledgeInputError) return null;
    throw e;
  }
}

export function systemFacts(
  system: EmulsionSystem,
  measuredPh: number | undefined,
  coSolventNames: string[] = [],
  ref: ReferenceData = SHIPPED_REFERENCE,
): SystemFacts {
  const layers = predictLayers(system, ref);
  const solvents = system.organic.map((p, i) => ({
    solvent: requireSolvent(p.solvent, `system.organic[${i}].solvent`, ref),
    volumeMl: p.volumeMl,
  }));
  const byVolume = [...solvents].sort((a, b) => b.volumeMl - a.volumeMl);
  const main = (byVolume.find((s) => s.solvent.miscibility.value !== "miscible") ?? byVolume[0]!).solvent;
  const solute = requireSolute(system.aqueous.solute, "system.aqueous.solute", ref);
  const aqueousMassG = system.aqueous.volumeMl * layers.aqueousDensityGPerMl;
  const wash = safeWashPh(system, ref);
  if (measuredPh !== undefined && (!Number.isFinite(measuredPh) || measuredPh < -2 || measuredPh > 16)) {
    throw new KnowledgeInputError("known.ph", "The pH must be a number between −2 and 16.");
  }
  const named = coSolventNames
    .map((n) => findSolvent(n, ref))
    .filter((s): s is Solvent => s !== undefined && s.miscibility.value === "miscible");
  const inside = solvents.map((s) => s.solvent).filter((s) => s.miscibility.value === "miscible");
  const miscibleCoSolvents = [...new Set([...named, ...inside])];
  return {
    system,
    ref,
    layers,
    solvents,
    main,
    solute,
    aqueousMassG,
    aqueousSoluteG: (aqueousMassG * layers.aqueous.massFractionPct) / 100,
    organicIsBottom: layers.bottom === null ? null : layers.bottom === "organic",
    wash,
    ph: measuredPh ?? wash?.pH ?? null,
    phMeasured: measuredPh !== undefined,
    miscibleCoSolvents,
  };
}
