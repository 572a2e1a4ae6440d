import type { LayerInput } from "../../knowledge/layers";
import { readDraft } from "../../hooks/use-draft";
import { readRecentChecks } from "../../hooks/use-recent-checks";
import { describeCheck, evaluateDraft, paramsToDraft, type LayerDraft } from "../layers/layer-draft";
import type { StartingSystem } from "./answers";

/*
 * Systems to start from, one tap each: the layer check open on this device, the layer checks run
 * lately, and the systems troubleshot here before. All read from local storage, so they work offline.
 */

export interface Start {
  id: string;
  label: string;
  system: StartingSystem;
}

/** The Layers screen keeps its open check under this draft key (components/layers/layer-check-screen.tsx). */
const layerCheckKey = (owner: string) => `layers.check.${owner}`;
export const emulsionRecentKey = (owner: string) => `emulsion.recent.${owner}`;
const MAX_STARTS = 6;

function fromLayerInput(input: LayerInput): StartingSystem {
  return {
    organic: input.organic.map((o) => ({ solvent: o.solvent, volumeMl: o.volumeMl })),
    aqueous: {
      solute: input.aqueous.solute,
      volumeMl: input.aqueous.volumeMl,
      ...(input.aqueous.concentration !== undefined ? { concentration: input.aqueous.concentration } : {}),
    },
    temperatureC: input.temperatureC,
  };
}

function fromLayerDraft(d: LayerDraft | null): LayerInput | null {
  if (!d) return null;
  const e = evaluateDraft(d);
  return e.status === "ok" ? e.input : null;
}

export function labelOf(s: StartingSystem): string {
  return describeCheck({ ...s, temperatureC: s.temperatureC ?? 20 });
}

export function startingSystems(owner: string, ownRecent: StartingSystem[]): Start[] {
  const out: Start[] = [];
  const add = (id: string, label: string, system: StartingSystem) => {
    if (!out.some((s) => s.label.endsWith(label))) out.push({ id, label, system });
  };
  const current = fromLayerDraft(readDraft<LayerDraft>(layerCheckKey(owner))?.data ?? null);
  if (current) add("layer-check", `Layer check: ${describeCheck(current)}`, fromLayerInput(current));
  for (const s of ownRecent) add(`recent-${out.length}`, labelOf(s), s);
  for (const c of readRecentChecks(owner)) {
    const input = fromLayerDraft(paramsToDraft(Object.fromEntries(new URLSearchParams(c.query))));
    if (input) add(`check-${out.length}`, describeCheck(input), fromLayerInput(input));
  }
  return out.slice(0, MAX_STARTS);
}
