import type { PlanDocument } from "../../knowledge/contracts/plans";
import { distributionCurve, partitionCoefficientOf, type PlanResult, type PlanStep } from "../../knowledge/plan";
import type { KnowledgeWarning } from "../../knowledge/types";
import { formatVolumeMl } from "../ui/format";
import { formatPh, formatShare, portionsLabel, washLabel, washShortLabel } from "./plan-format";

/*
 * What the plan's screens and its bench card show, worked out once from the document and the
 * computed result: where each component goes, one row per pass with what to drain, the marks
 * for the pH chart, and the cautions. Pure, so the component test and the print view agree.
 */

export interface ComponentFate {
  name: string;
  kind: "acid" | "base" | "neutral";
  /** share of the start still in the organic layer at the end */
  left: number;
  /** share of the start taken by each wash (all its passes) */
  perWash: number[];
  removedBy: number[];
}

export function componentFates(doc: PlanDocument, result: PlanResult): ComponentFate[] {
  return doc.components.map((c, ci) => ({
    name: c.name,
    kind: c.kind,
    left: result.final.components[ci]?.fractionInOrganic ?? 0,
    perWash: doc.washes.map((_w, wi) =>
      result.steps.filter((s) => s.wash === wi).reduce((sum, s) => sum + (s.components[ci]?.fractionInAqueousThisPass ?? 0), 0),
    ),
    removedBy: result.final.components[ci]?.removedBy ?? [],
  }));
}

/** One sentence per component, for the answer and for screen readers. */
export function fateSentence(f: ComponentFate, doc: PlanDocument): string {
  const takers = f.perWash
    .map((share, wi) => ({ share, wi }))
    .filter((x) => x.share >= 0.0005)
    .sort((a, b) => b.share - a.share)
    .map((x) => `wash ${x.wi + 1} (${washLabel(doc.washes[x.wi]!)}) takes ${formatShare(x.share)}`);
  return `${f.name}: ${formatShare(f.left)} stays in the organic layer${takers.length ? `; ${takers.join(", ")}` : ""}.`;
}

export interface StepRow {
  key: string;
  wash: number;
  pass: number;
  passes: number;
  solution: string;
  /** "1 M HCl" */
  short: string;
  volume: string;
  washPh: string;
  aqueousPh: string;
  /** "organic on top" */
  order: string;
  /** what to do at the stopcock */
  drain: string;
  confirm: boolean;
  co2Ml: number;
  capacityExceeded: boolean;
  components: { name: string; inOrganic: string; takenThisPass: string }[];
}

function drainLine(s: PlanStep, wi: number): string {
  if (s.top === null || s.bottom === null) return "One phase is expected here: do not separate, check the solvent and the wash.";
  if (s.bottom === "aqueous") return `Drain the lower aqueous layer into the wash ${wi + 1} extract flask; the organic stays in the funnel.`;
  return `Drain the lower organic layer into a clean flask, pour the upper aqueous out of the top into the wash ${wi + 1} extract flask, and return the organic to the funnel.`;
}

export function stepRows(doc: PlanDocument, result: PlanResult): StepRow[] {
  return result.steps.map((s) => {
    const w = doc.washes[s.wash]!;
    return {
      key: `${s.wash}.${s.pass}`,
      wash: s.wash,
      pass: s.pass,
      passes: w.repeats ?? 1,
      solution: washLabel(w),
      short: washShortLabel(w),
      volume: formatVolumeMl(w.volumeMl),
      washPh: formatPh(s.washPh),
      aqueousPh: formatPh(s.aqueousPh),
      order: s.top === null ? "one phase" : `${s.top} on top`,
      drain: drainLine(s, s.wash),
      confirm: s.confidence !== "clear",
      co2Ml: s.co2Ml,
      capacityExceeded: s.capacityExceeded,
      components: s.components.map((c) => ({ name: c.name, inOrganic: formatShare(c.fractionInOrganic), takenThisPass: formatShare(c.fractionInAqueousThisPass) })),
    };
  });
}

/** "Wash 1: 2 × 25 mL 1 M hydrochloric acid" */
export function washSummary(doc: PlanDocument, wi: number): string {
  const w = doc.washes[wi]!;
  return `Wash ${wi + 1}: ${portionsLabel(w)} ${washLabel(w)}`;
}

/** The fresh wash's pH for each wash (first pass), for the marks on the pH chart. */
export function phMarks(result: PlanResult): { label: string; pH: number }[] {
  const seen = new Set<number>();
  return result.steps.flatMap((s) => {
    if (seen.has(s.wash)) return [];
    seen.add(s.wash);
    return [{ label: String(s.wash + 1), pH: s.washPh }];
  });
}

/** One-pass share left in the organic layer against pH, with the first wash's volume. */
export function distributionCurves(doc: PlanDocument) {
  const vAq = doc.washes[0]?.volumeMl ?? doc.organic.volumeMl;
  return doc.components.map((c) => ({
    name: c.name,
    points: distributionCurve({ kind: c.kind, pKa: c.pKa, partitionCoefficient: partitionCoefficientOf(c).value }, doc.organic.volumeMl, vAq, 0, 14, 0.25),
  }));
}

/** Where the share left in one pass crosses one half, for a sentence under the pH chart. */
export function halfPointPh(points: { pH: number; fractionInOrganic: number }[]): number | null {
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1]!;
    const b = points[i]!;
    if ((a.fractionInOrganic - 0.5) * (b.fractionInOrganic - 0.5) <= 0 && a.fractionInOrganic !== b.fractionInOrganic) {
      return a.pH + ((0.5 - a.fractionInOrganic) * (b.pH - a.pH)) / (b.fractionInOrganic - a.fractionInOrganic);
    }
  }
  return null;
}

/** One line that closes every list of cautions. */
export const DEFER_LINE = "These are reminders, not a risk assessment: follow the SDS, your local rules and your supervisor.";

/** Cautions in the order they matter at the funnel, without repeats. */
export function cautionLines(...groups: (KnowledgeWarning[] | undefined)[]): KnowledgeWarning[] {
  const out: KnowledgeWarning[] = [];
  for (const g of groups) for (const w of g ?? []) if (!out.some((o) => o.message === w.message)) out.push(w);
  return out;
}
