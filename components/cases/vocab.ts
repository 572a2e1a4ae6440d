import type { Tone } from "../../hooks/theme";
import {
  SUGGESTED_CASE_TAGS,
  type AttemptOutcome,
  type CaseStatus,
  type EmulsionKind,
  type ShakingLevel,
} from "../../knowledge/contracts/cases";
import { CAUSES } from "../../knowledge/emulsion/causes";
import { REMEDIES } from "../../knowledge/emulsion/remedies";
import type { Choice } from "./choice-chips";
import type { SeenFlag } from "./case-draft";

/** Words for the case log's codes, in one place (lookup tables, not branches). */

export const OUTCOME: Record<AttemptOutcome, { label: string; tone: Tone; mark: string }> = {
  cleared: { label: "Cleared", tone: "good", mark: "✓" },
  partly: { label: "Partly", tone: "caution", mark: "◐" },
  "no-change": { label: "No change", tone: "neutral", mark: "–" },
  worse: { label: "Worse", tone: "danger", mark: "✕" },
};
export const OUTCOME_CHOICES: Choice<AttemptOutcome>[] = (Object.keys(OUTCOME) as AttemptOutcome[]).map((value) => ({
  value,
  label: OUTCOME[value].label,
}));

export const STATUS: Record<CaseStatus, { label: string; tone: Tone }> = {
  open: { label: "Open", tone: "info" },
  resolved: { label: "Resolved", tone: "good" },
  abandoned: { label: "Abandoned", tone: "neutral" },
};
export const STATUS_CHOICES: Choice<CaseStatus>[] = (Object.keys(STATUS) as CaseStatus[]).map((value) => ({ value, label: STATUS[value].label }));

export const KIND: Record<EmulsionKind, string> = {
  none: "Clean split",
  "milky-band": "Milky band",
  "rag-with-solids": "Rag with solids",
  foam: "Foam",
  "whole-volume-cloudy": "All cloudy",
  "three-layers": "Three layers",
  "hazy-organic": "Hazy organic",
};
export const KIND_CHOICES: Choice<EmulsionKind>[] = (Object.keys(KIND) as EmulsionKind[]).map((value) => ({ value, label: KIND[value] }));

export const SHAKING_CHOICES: Choice<ShakingLevel>[] = [
  { value: "gentle", label: "Gentle" },
  { value: "normal", label: "Normal" },
  { value: "vigorous", label: "Vigorous" },
];

export const FLAG_CHOICES: Choice<SeenFlag>[] = [
  { value: "solids", label: "Solids" },
  { value: "thirdLayer", label: "Third layer" },
  { value: "cloudyOrganic", label: "Cloudy organic" },
  { value: "foamOrBubbles", label: "Foam or bubbles" },
];

export const PHASE_CHOICES: Choice<"organic" | "aqueous">[] = [
  { value: "organic", label: "Organic" },
  { value: "aqueous", label: "Aqueous" },
];

/** Remedies from the emulsion catalogue, cheapest first (its escalation tiers). */
export const REMEDY_CHOICES: Choice<string>[] = [...REMEDIES]
  .sort((a, b) => a.tier - b.tier)
  .map((r) => ({ value: r.id, label: r.title }));
export function remedyLabel(id: string | null | undefined): string | undefined {
  return id ? REMEDIES.find((r) => r.id === id)?.title : undefined;
}

/** Causes with a short label for chips; the catalogue title in full for reading. */
const CAUSE_SHORT: Record<string, string> = {
  "surfactant-soap": "Soap / surfactant",
  "fine-solids": "Fine solids",
  "close-densities": "Close densities",
  "viscous-crude": "Viscous crude",
  "miscible-cosolvent": "Miscible co-solvent",
  "chlorinated-base": "Chlorinated over base",
  "entrained-gas": "Gas bubbles",
  "hazy-organic": "Hazy organic",
};
export const CAUSE_CHOICES: Choice<string>[] = CAUSES.map((c) => ({ value: c.code, label: CAUSE_SHORT[c.code] ?? c.title }));
export function causeLabel(code: string): string {
  return CAUSE_SHORT[code] ?? CAUSES.find((c) => c.code === code)?.title ?? code;
}

export function tagLabel(tag: string): string {
  const t = tag.replace(/-/g, " ");
  return t.charAt(0).toUpperCase() + t.slice(1);
}
export const TAG_CHOICES: Choice<string>[] = SUGGESTED_CASE_TAGS.map((t) => ({ value: t, label: tagLabel(t) }));
