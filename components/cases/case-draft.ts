import type { CasePrefill } from "../../hooks/case-prefill";
import { parseConcentration, parseTemperatureC, parseVolumeMl } from "../../knowledge/concentration";
import {
  attemptBody,
  createCaseBody,
  type AttemptBody,
  type AttemptOutcome,
  type CasePhase,
  type CreateCaseBody,
  type EmulsionKind,
  type ShakingLevel,
} from "../../knowledge/contracts/cases";
import { findSolute, findSolvent } from "../../knowledge/reference";
import { KnowledgeInputError } from "../../knowledge/types";
import { formatConcentration, inSentence } from "./format";

/*
 * The forms hold what the chemist typed (strings, so "0.5 L" and "sat." survive a reload) and
 * turn it into the contract's bodies on save. Field errors are keyed by the body path the
 * server uses ("system.organic.0.volumeMl"), so client and server errors land on the same field.
 */

export type SeenFlag = "solids" | "thirdLayer" | "cloudyOrganic" | "foamOrBubbles";

export interface CaseDraftValue {
  title: string;
  /** `solvent` holds a table key once picked, or the name as typed when `freeText` */
  organic: { solvent: string; volume: string; freeText?: boolean }[];
  aqueous: { solute: string; concentration: string; volume: string; ph: string; freeText?: boolean };
  temperature: string;
  observedBottom: CasePhase | null;
  kind: EmulsionKind | null;
  emulsionPct: string;
  flags: SeenFlag[];
  colour: string;
  shaking: ShakingLevel | null;
  minutesWaited: string;
  causes: string[];
  tags: string[];
  otherTags: string;
  notes: string;
  funnel: string;
  productG: string;
}

export type FieldErrors = Record<string, string>;

export const DEFAULT_TEMPERATURE_C = 20;

export function emptyCaseDraft(): CaseDraftValue {
  return {
    title: "",
    organic: [{ solvent: "", volume: "" }],
    aqueous: { solute: "", concentration: "", volume: "", ph: "" },
    temperature: `${DEFAULT_TEMPERATURE_C} °C`,
    observedBottom: null,
    kind: null,
    emulsionPct: "",
    flags: [],
    colour: "",
    shaking: null,
    minutesWaited: "",
    causes: [],
    tags: [],
    otherTags: "",
    notes: "",
    funnel: "",
    productG: "",
  };
}


const FLAG_KEYS: SeenFlag[] = ["solids", "thirdLayer", "cloudyOrganic", "foamOrBubbles"];

/** A draft started from a "Start a case" link. */
export function draftFromPrefill(p: CasePrefill): CaseDraftValue {
  const d = emptyCaseDraft();
  if (p.title) d.title = p.title;
  // A linked name the tables do not know stays as typed (free text) rather than being dropped.
  if (p.organic?.length) d.organic = p.organic.map((o) => ({ solvent: o.solvent, volume: `${o.volumeMl} mL`, freeText: !findSolvent(o.solvent) }));
  if (p.aqueous) {
    d.aqueous = {
      solute: p.aqueous.solute,
      concentration: formatConcentration(p.aqueous.concentration),
      volume: `${p.aqueous.volumeMl} mL`,
      ph: "",
      freeText: !findSolute(p.aqueous.solute),
    };
  }
  if (p.temperatureC !== undefined) d.temperature = `${p.temperatureC} °C`;
  if (p.seen) {
    if (p.seen.emulsionFractionPct !== undefined) d.emulsionPct = String(p.seen.emulsionFractionPct);
    if (p.seen.colour) d.colour = p.seen.colour;
    d.flags = FLAG_KEYS.filter((k) => p.seen?.[k] === true);
  }
  if (p.tags?.length) d.tags = p.tags;
  if (p.causes?.length) d.causes = p.causes;
  return d;
}

function num(text: string, field: string, errors: FieldErrors, message: string): number | undefined {
  const t = text.trim().replace(",", ".");
  if (t === "") return undefined;
  const n = Number(t.replace(/\s*%$/, ""));
  if (!Number.isFinite(n)) {
    errors[field] = message;
    return undefined;
  }
  return n;
}

/** Unit conversion leaves float dust (0.5 L → 500.00000000000006 mL): keep 12 significant digits. */
function tidy<T>(v: T): T {
  return (typeof v === "number" ? Number(v.toPrecision(12)) : v) as T;
}

function parsed<T>(fn: () => T, field: string, errors: FieldErrors): T | undefined {
  try {
    return tidy(fn());
  } catch (e) {
    errors[field] = e instanceof KnowledgeInputError || e instanceof Error ? e.message : "Check this value.";
    return undefined;
  }
}

/** A title when the chemist gives none: "Emulsion: ethyl acetate over saturated sodium bicarbonate". */
export function suggestedTitle(d: CaseDraftValue): string {
  const name = (text: string, find: (t: string) => { name: string } | undefined) => {
    const t = text.trim();
    return t ? inSentence(find(t)?.name ?? t) : "";
  };
  const solvents = d.organic.map((o) => name(o.solvent, findSolvent)).filter(Boolean);
  const aq = [d.aqueous.concentration.trim(), name(d.aqueous.solute, findSolute)].filter(Boolean).join(" ");
  if (!solvents.length && !aq) return "";
  const head = solvents.join(" + ") || "organic";
  const text = `${head}${aq ? ` over ${aq}` : ""}`;
  const full = d.kind && d.kind !== "none" ? `Emulsion: ${text}` : text.charAt(0).toUpperCase() + text.slice(1);
  return full.slice(0, 140);
}

function tagList(d: CaseDraftValue): string[] {
  const extra = d.otherTags
    .split(/[,;]/)
    .map((t) => t.trim())
    .filter(Boolean);
  return [...new Set([...d.tags, ...extra])];
}

/** Turn the draft into POST /api/cases' body, or the errors that stop it. */
export function caseBodyFromDraft(d: CaseDraftValue): { body: CreateCaseBody | null; errors: FieldErrors } {
  const errors: FieldErrors = {};
  // Every row is sent as it stands, so the server's error indices match the rows on screen.
  const organic = d.organic.map((o, i) => {
    const base = `system.organic.${i}`;
    if (o.solvent.trim() === "") errors[`${base}.solvent`] = "Name the solvent.";
    let volumeMl: number | undefined;
    if (o.volume.trim() === "") errors[`${base}.volumeMl`] = "Give the volume (e.g. 50 mL).";
    else volumeMl = parsed(() => parseVolumeMl(o.volume, `${base}.volumeMl`), `${base}.volumeMl`, errors);
    return { solvent: o.solvent.trim(), volumeMl: volumeMl ?? 0 };
  });

  const a = d.aqueous;
  if (a.solute.trim() === "") errors["system.aqueous.solute"] = "Name the aqueous phase (water, brine, 1 M HCl…).";
  let aqueousMl: number | undefined;
  if (a.volume.trim() === "") errors["system.aqueous.volumeMl"] = "Give the volume (e.g. 50 mL).";
  else aqueousMl = parsed(() => parseVolumeMl(a.volume), "system.aqueous.volumeMl", errors);
  const concentration = a.concentration.trim()
    ? parsed(() => parseConcentration(a.concentration), "system.aqueous.concentration", errors)
    : undefined;
  const ph = num(a.ph, "system.aqueous.ph", errors, "Give the pH as a number.");

  const temperatureC = d.temperature.trim()
    ? parsed(() => parseTemperatureC(d.temperature), "system.temperatureC", errors)
    : DEFAULT_TEMPERATURE_C;
  const funnelMl = d.funnel.trim() ? parsed(() => parseVolumeMl(d.funnel), "system.scale.funnelMl", errors) : undefined;
  const productG = num(d.productG, "system.scale.productG", errors, "Give the mass in g.");
  const emulsionFractionPct = num(d.emulsionPct, "seen.emulsionFractionPct", errors, "Give a share between 0 and 100 %.");
  const minutesWaited = num(d.minutesWaited, "seen.minutesWaited", errors, "Give the minutes as a number.");

  const title = d.title.trim() || suggestedTitle(d);
  const candidate: CreateCaseBody = {
    title,
    system: {
      organic,
      aqueous: {
        solute: a.solute.trim(),
        volumeMl: aqueousMl ?? 0,
        ...(concentration !== undefined ? { concentration } : {}),
        ...(ph !== undefined ? { ph } : {}),
      },
      temperatureC: temperatureC ?? DEFAULT_TEMPERATURE_C,
      ...(funnelMl !== undefined || productG !== undefined
        ? { scale: { ...(funnelMl !== undefined ? { funnelMl } : {}), ...(productG !== undefined ? { productG } : {}) } }
        : {}),
    },
    tags: tagList(d),
    causes: d.causes,
    observedBottom: d.observedBottom,
    seen: {
      kind: d.kind,
      emulsionFractionPct: emulsionFractionPct ?? null,
      solids: d.flags.includes("solids") ? true : null,
      colour: d.colour.trim() || null,
      thirdLayer: d.flags.includes("thirdLayer") ? true : null,
      cloudyOrganic: d.flags.includes("cloudyOrganic") ? true : null,
      foamOrBubbles: d.flags.includes("foamOrBubbles") ? true : null,
      shaking: d.shaking,
      minutesWaited: minutesWaited ?? null,
    },
    notes: d.notes.trim(),
  };

  // The contract's own rules (ranges, lengths) after ours, without overwriting a clearer message.
  const check = createCaseBody.safeParse(candidate);
  if (!check.success) {
    for (const issue of check.error.issues) {
      const key = issue.path.map(String).join(".") || "body";
      errors[key] ??= issue.message;
    }
  }
  if (errors.title && !d.title.trim()) errors.title = "Give the case a title (or fill in the system and one is suggested).";
  return Object.keys(errors).length ? { body: null, errors } : { body: candidate, errors };
}

// ── attempts ────────────────────────────────────────────────────────────────

export interface AttemptDraftValue {
  remedyId: string | null;
  description: string;
  amount: string;
  minutes: string;
  outcome: AttemptOutcome | null;
  note: string;
}

export function emptyAttemptDraft(): AttemptDraftValue {
  return { remedyId: null, description: "", amount: "", minutes: "", outcome: null, note: "" };
}

export function attemptBodyFromDraft(d: AttemptDraftValue): { body: AttemptBody | null; errors: FieldErrors } {
  const errors: FieldErrors = {};
  if (!d.remedyId && !d.description.trim()) errors.remedyId = "Pick a remedy or describe what you tried.";
  if (!d.outcome) errors.outcome = "How did it go? Pick an outcome.";
  const minutes = num(d.minutes, "minutes", errors, "Give the minutes as a number.");
  if (minutes !== undefined && minutes < 0) errors.minutes = "Minutes cannot be negative.";
  const candidate: AttemptBody = {
    remedyId: d.remedyId,
    ...(d.description.trim() ? { description: d.description.trim() } : {}),
    ...(d.amount.trim() ? { amount: d.amount.trim() } : {}),
    ...(minutes !== undefined ? { minutes } : {}),
    outcome: d.outcome ?? "no-change",
    ...(d.note.trim() ? { note: d.note.trim() } : {}),
  };
  const check = attemptBody.safeParse(candidate);
  if (!check.success) {
    for (const issue of check.error.issues) errors[issue.path.map(String).join(".") || "body"] ??= issue.message;
  }
  return Object.keys(errors).length ? { body: null, errors } : { body: candidate, errors };
}
