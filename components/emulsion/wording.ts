import type { AfterAnswer, RemedyAnswer, TroubleshootResponse } from "../../knowledge/contracts/emulsion";
import type { LayerPrediction } from "../../knowledge/layers";
import { formatDensity, formatVolumeMl, trimNumber } from "../ui/format";

/* What the remedy cards say, worked out from the answer's numbers (UX number rules). */

export function minutesText(m: { min: number; max: number }): string {
  const f = (x: number) => (x >= 60 ? `${trimNumber(x / 60, 1)} h` : `${x} min`);
  if (m.min === m.max) return f(m.min);
  return m.max >= 60 && m.min < 60 ? `${m.min} min – ${f(m.max)}` : `${f(m.min).replace(/ (min|h)$/, "")}–${f(m.max)}`;
}

/** "0.6" → "60 %": cause likelihoods to the nearest whole percent. */
export function likelihoodText(score: number): string {
  return `${Math.round(score * 100)} %`;
}

function organicPlace(a: AfterAnswer): string {
  if (a.bottom === null) return "one phase";
  const where = a.bottom === "organic" ? "bottom" : "top";
  return a.swapsLayers ? `organic now on the ${where}` : `organic still on the ${where}`;
}

/**
 * One line for the card: "After 15 mL saturated brine: organic still on the bottom, Δρ 0.064 g/mL,
 * funnel 78 % full". The lead-in ("After 15 mL saturated brine") comes from the answer's note.
 */
export function afterLine(a: AfterAnswer): string {
  const lead = a.note.split(":")[0]?.trim() || "Afterwards";
  const parts = [organicPlace(a), `Δρ ${formatDensity(a.densityDifferenceGPerMl)}`];
  if (a.isodense) parts.push("too close to settle");
  if (a.funnelFillFraction !== null) parts.push(`funnel ${Math.round(a.funnelFillFraction * 100)} % full${a.overfilled ? " — split it first" : ""}`);
  return `${lead}: ${parts.join(", ")}`;
}

/** "Bottom: organic — Dichloromethane, 1.327 g/mL": the layer check the answer rests on. */
export function layersLine(l: LayerPrediction): string {
  if (l.phases === 1 || l.bottom === null) return "One phase: the solvents mix with the water";
  const organicName = l.organicParts.map((p) => p.name).join(" + ");
  const bottom = l.bottom === "organic" ? `organic — ${organicName}, ${formatDensity(l.organicDensityGPerMl)}` : `aqueous — ${l.aqueous.name}, ${formatDensity(l.aqueousDensityGPerMl)}`;
  return `Bottom layer: ${bottom}`;
}

export function layersDetail(l: LayerPrediction): string {
  return `Δρ ${formatDensity(l.densityDifferenceGPerMl)} · ${formatVolumeMl(l.totalVolumeMl)} in the funnel`;
}

/**
 * Why a remedy must not be used on this funnel, read off the answer's own numbers: salt or solvent
 * that swaps or stalls the layers, a pH that sends a component into the water, a bath at a
 * solvent's boiling point. Null when nothing rules it out.
 */
export function blockingWarning(r: RemedyAnswer): string | null {
  if (r.after && (r.after.swapsLayers || r.after.isodense) && (r.id === "saturated-brine" || r.id === "solid-salt")) {
    return r.after.swapsLayers ? "Would swap the layers: the organic would float." : "Would bring the layers too close to settle.";
  }
  const lost = (r.componentMoves ?? []).filter((m) => m.from === "organic" && m.to === "aqueous");
  if (r.id === "adjust-ph" && lost.length) return `Would move ${lost.map((m) => m.name).join(", ")} into the aqueous layer.`;
  const boil = r.cautions.find((c) => c.startsWith("Do not warm"));
  if (r.id === "warm-bath" && boil) return boil;
  return null;
}

export interface RankedCards {
  open: RemedyAnswer[];
  blocked: { remedy: RemedyAnswer; warning: string }[];
}

/** Remedies to try, in the answer's order, and those ruled out for this funnel with their warning. */
export function splitRemedies(answer: TroubleshootResponse): RankedCards {
  const out: RankedCards = { open: [], blocked: [] };
  for (const r of answer.remedies) {
    const warning = blockingWarning(r);
    if (warning) out.blocked.push({ remedy: r, warning });
    else out.open.push(r);
  }
  return out;
}

/** "Cleared 2 of 3 in this group" */
export function evidenceText(e: { cleared: number; tried: number }): string {
  return `Cleared ${e.cleared} of ${e.tried} in this group`;
}
