import { fieldErrors } from "../../knowledge/contracts/layers";
import {
  evaporationFor,
  planComputeRequestSchema,
  planInputOf,
  recoveryFor,
  type PlanComputeRequest,
  type PlanDocument,
  type RecoveryOutcome,
} from "../../knowledge/contracts/plans";
import { computePlan, resolveWash, type EvaporationSettings, type PlanResult } from "../../knowledge/plan";
import { findSolvent, SHIPPED_REFERENCE } from "../../knowledge/reference";
import type { Concentration, ReferenceData } from "../../knowledge/types";
import { KnowledgeInputError } from "../../knowledge/types";
import { formatConcentration, trimNumber } from "../ui/format";
import { readQuantity } from "../ui/quantity";

/*
 * The plan as the builder holds it: text as typed (so nothing is reformatted under the
 * chemist's fingers), turned into the API's plan document and computed in the browser with
 * the knowledge module. Errors are keyed like the API's fields ("washes[1].volumeMl").
 */

export type ComponentKind = "acid" | "base" | "neutral";

export interface ComponentDraft {
  /** stable id for the list, never sent */
  id: string;
  name: string;
  kind: ComponentKind;
  pKa: string;
  /** pKa table entry the value came from, shown as its source */
  pKaFrom?: string;
  partitionMode: "K" | "logP";
  partition: string;
  amount: string;
  amountUnit: "mmol" | "g";
  molarMass: string;
}

export interface WashDraft {
  id: string;
  /** solute key of the aqueous table, or null until picked */
  solute: string | null;
  concentration: string;
  volume: string;
  repeats: string;
}

export interface RecoveryDraft {
  /** id of the component to recover, or "" for none */
  component: string;
  /** index of the wash whose extracts are combined, or "auto" (the one that took most) */
  wash: number | "auto";
  reagent: string | null;
  reagentConcentration: string;
  /** "" means two units past the pKa */
  targetPh: string;
}

export interface EvaporationDraft {
  mode: "vapour" | "pressure";
  vapour: string;
  pressure: string;
}

export interface PlanDraft {
  title: string;
  notes: string;
  solvent: string | null;
  volume: string;
  temperature: string;
  components: ComponentDraft[];
  washes: WashDraft[];
  recovery: RecoveryDraft;
  evaporation: EvaporationDraft;
}

let counter = 0;
/** Ids for list rows: unique within a session, no randomness needed. */
export function rowId(prefix: string): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}`;
}

export const newComponent = (kind: ComponentKind = "neutral"): ComponentDraft => ({
  id: rowId("c"),
  name: "",
  kind,
  pKa: "",
  partitionMode: "K",
  partition: "",
  amount: "",
  amountUnit: "mmol",
  molarMass: "",
});

export const newWash = (): WashDraft => ({ id: rowId("w"), solute: null, concentration: "", volume: "20 mL", repeats: "1" });

export const NEW_RECOVERY: RecoveryDraft = { component: "", wash: "auto", reagent: null, reagentConcentration: "", targetPh: "" };
export const NEW_EVAPORATION: EvaporationDraft = { mode: "vapour", vapour: "30 °C", pressure: "100" };

export const NEW_PLAN: PlanDraft = {
  title: "",
  notes: "",
  solvent: null,
  volume: "50 mL",
  temperature: "20 °C",
  components: [],
  washes: [],
  recovery: NEW_RECOVERY,
  evaporation: NEW_EVAPORATION,
};

/**
 * The demo work-up of our fictional group: a crude amide coupling in ethyl acetate with the
 * leftover amine, the leftover carboxylic acid and the neutral amide product (values invented
 * for the demo; pKa values from the pKa table's typical entries).
 */
export function examplePlan(): PlanDraft {
  const amine: ComponentDraft = { ...newComponent("base"), name: "benzylamine (excess)", pKa: "9.34", pKaFrom: "benzylamine", partition: "12", amount: "3" };
  const acid: ComponentDraft = { ...newComponent("acid"), name: "aryl acid (unreacted)", pKa: "4.2", pKaFrom: "aryl-carboxylic-acid", partition: "60", amount: "1.5" };
  const amide: ComponentDraft = { ...newComponent("neutral"), name: "amide product", partitionMode: "logP", partition: "2.1", amount: "10" };
  return {
    ...NEW_PLAN,
    title: "Amide coupling work-up, 10 mmol",
    solvent: "ethyl-acetate",
    volume: "80 mL",
    components: [amine, acid, amide],
    washes: [
      { id: rowId("w"), solute: "hydrochloric-acid", concentration: "1 M", volume: "25 mL", repeats: "2" },
      { id: rowId("w"), solute: "sodium-bicarbonate", concentration: "saturated", volume: "25 mL", repeats: "2" },
      { id: rowId("w"), solute: "sodium-chloride", concentration: "saturated", volume: "25 mL", repeats: "1" },
    ],
    recovery: { ...NEW_RECOVERY, component: acid.id, reagent: "hydrochloric-acid", reagentConcentration: "6 M" },
  };
}

export type FieldErrors = Record<string, string>;

export type PlanEvaluation =
  | { status: "incomplete"; missing: string[]; errors: FieldErrors }
  | { status: "invalid"; errors: FieldErrors }
  | { status: "ok"; doc: PlanDocument; result: PlanResult; errors: FieldErrors };

/** Plain number ("9.5", "−1,2"): decimal commas and typographic minus signs accepted. */
export function readNumber(text: string): number | undefined {
  const t = text.trim().replace(/[−–]/g, "-").replace(/(\d),(\d)/g, "$1.$2");
  if (t === "" || !/^[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?$/.test(t)) return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : undefined;
}

const needsConcentration = (solute: string | null) => solute !== null && solute !== "water";

/** The API's plan document from the builder, without checking it. */
function toRequest(d: PlanDraft, errors: FieldErrors, missing: string[]): PlanComputeRequest {
  const quantity = (field: string, kind: "volume" | "temperature" | "mass", text: string, what: string) => {
    const r = readQuantity(kind, text);
    if (r.ok) return r.value;
    if (r.empty) missing.push(what);
    else errors[field] = r.message;
    return Number.NaN;
  };
  const number = (field: string, text: string, what: string, required: boolean) => {
    if (text.trim() === "") {
      if (required) missing.push(what);
      return undefined;
    }
    const n = readNumber(text);
    if (n === undefined) errors[field] = `"${text}" is not a number.`;
    return n;
  };

  if (!d.solvent) missing.push("the organic solvent");
  const volumeMl = quantity("organic.volumeMl", "volume", d.volume, "the organic volume");
  const temperatureC = quantity("temperatureC", "temperature", d.temperature, "the temperature");

  const components = d.components.map((c, i) => {
    const f = `components[${i}]`;
    const label = c.name.trim() || `component ${i + 1}`;
    if (!c.name.trim()) missing.push(`a name for component ${i + 1}`);
    const pKa = c.kind === "neutral" ? undefined : number(`${f}.pKa`, c.pKa, `the pKa of ${label}`, true);
    const partition = number(`${f}.partitionCoefficient`, c.partition, c.partitionMode === "K" ? `K for ${label}` : `log P for ${label}`, true);
    let amountMmol: number | undefined;
    let amountG: number | undefined;
    let molarMassGPerMol: number | undefined;
    const amountText = c.amount.trim().replace(/\s*(mmol|g)$/i, "");
    const amount = number(`${f}.${c.amountUnit === "mmol" ? "amountMmol" : "amountG"}`, amountText, `the amount of ${label}`, true);
    if (c.amountUnit === "mmol") amountMmol = amount;
    else {
      amountG = amount;
      molarMassGPerMol = number(`${f}.molarMassGPerMol`, c.molarMass.replace(/\s*g\/mol$/i, ""), `the molar mass of ${label}`, true);
    }
    return {
      name: c.name.trim(),
      kind: c.kind,
      ...(pKa !== undefined ? { pKa } : {}),
      ...(partition !== undefined ? (c.partitionMode === "K" ? { partitionCoefficient: partition } : { logP: partition }) : {}),
      ...(amountMmol !== undefined ? { amountMmol } : {}),
      ...(amountG !== undefined ? { amountG } : {}),
      ...(molarMassGPerMol !== undefined ? { molarMassGPerMol } : {}),
    };
  });

  if (d.washes.length === 0) missing.push("at least one wash");
  const washes = d.washes.map((w, i) => {
    const f = `washes[${i}]`;
    if (!w.solute) missing.push(`the solution of wash ${i + 1}`);
    let concentration: Concentration | undefined;
    if (needsConcentration(w.solute)) {
      const r = readQuantity("concentration", w.concentration);
      if (r.ok) concentration = r.concentration;
      else if (r.empty) missing.push(`the concentration of wash ${i + 1}`);
      else errors[`${f}.aqueous.concentration`] = r.message;
    }
    const repeats = number(`${f}.repeats`, w.repeats, "", false);
    return {
      aqueous: { solute: w.solute ?? "", ...(concentration !== undefined ? { concentration } : {}) },
      volumeMl: quantity(`${f}.volumeMl`, "volume", w.volume, `the volume of wash ${i + 1}`),
      ...(repeats !== undefined ? { repeats } : {}),
    };
  });

  return { organic: { solvent: d.solvent ?? "", volumeMl }, components, washes, temperatureC };
}

/** A knowledge error as a field message; other errors are bugs and are rethrown. */
function knowledgeField(e: unknown, errors: FieldErrors): void {
  if (!(e instanceof KnowledgeInputError)) throw e;
  const hint = e.suggestions.length ? ` Did you mean ${e.suggestions.slice(0, 3).join(", ")}?` : "";
  errors[e.field || "plan"] = `${e.message}${hint}`;
}

/**
 * Read the builder, check it with the server's schema, and compute the wash sequence. The
 * panels (recovery, evaporation) are evaluated apart, so a slip there never hides the plan.
 */
export function evaluatePlan(d: PlanDraft, ref: ReferenceData = SHIPPED_REFERENCE): PlanEvaluation {
  const errors: FieldErrors = {};
  const missing: string[] = [];
  const request = toRequest(d, errors, missing);
  if (missing.length) return { status: "incomplete", missing, errors };
  if (Object.keys(errors).length) return { status: "invalid", errors };
  const parsed = planComputeRequestSchema.safeParse(request);
  if (!parsed.success) return { status: "invalid", errors: fieldErrors(parsed.error) };
  try {
    const result = computePlan(planInputOf(parsed.data), ref);
    return { status: "ok", doc: parsed.data, result, errors };
  } catch (e) {
    knowledgeField(e, errors);
    return { status: "invalid", errors };
  }
}

export type PanelOutcome<T> = { status: "off" } | { status: "incomplete"; message: string } | { status: "error"; field: string; message: string } | { status: "ok"; value: T };

/** Recovery settings as the saved document holds them, or a reason there are none yet. */
export function recoverySettingsOf(d: PlanDraft): { settings?: PlanDocument["recovery"]; problem?: { field: string; message: string } } {
  const r = d.recovery;
  const component = d.components.find((c) => c.id === r.component);
  if (!component) return {};
  if (!r.reagent) return { problem: { field: "recovery.reagent.solute", message: "Pick the acid or base stock." } };
  const c = readQuantity("concentration", r.reagentConcentration);
  if (!c.ok || !c.concentration) return { problem: { field: "recovery.reagent.concentration", message: c.ok ? "Give the stock's concentration." : c.message } };
  const targetPh = r.targetPh.trim() === "" ? undefined : readNumber(r.targetPh);
  if (r.targetPh.trim() !== "" && targetPh === undefined) return { problem: { field: "recovery.targetPh", message: `"${r.targetPh}" is not a pH.` } };
  return {
    settings: {
      component: component.name.trim(),
      ...(r.wash !== "auto" ? { wash: r.wash } : {}),
      reagent: { solute: r.reagent, concentration: c.concentration },
      ...(targetPh !== undefined ? { targetPh } : {}),
    },
  };
}

export function evaluateRecovery(d: PlanDraft, evaluation: PlanEvaluation, ref: ReferenceData = SHIPPED_REFERENCE): PanelOutcome<RecoveryOutcome> {
  if (evaluation.status !== "ok") return { status: "off" };
  const { settings, problem } = recoverySettingsOf(d);
  if (problem) return { status: "incomplete", message: problem.message };
  if (!settings) return { status: "off" };
  try {
    return { status: "ok", value: recoveryFor(evaluation.doc, evaluation.result, settings, ref) };
  } catch (e) {
    if (!(e instanceof KnowledgeInputError)) throw e;
    return { status: "error", field: e.field, message: e.message };
  }
}

/** Evaporation settings as the saved document holds them, or a problem with what was typed. */
export function evaporationSettingsOf(d: PlanDraft): { settings?: PlanDocument["evaporation"]; problem?: { field: string; message: string } } {
  const e = d.evaporation;
  if (e.mode === "vapour") {
    const r = readQuantity("temperature", e.vapour);
    if (!r.ok) return { problem: { field: "evaporation.vaporTemperatureC", message: r.message } };
    return { settings: { vaporTemperatureC: r.value } };
  }
  const p = readNumber(e.pressure.replace(/\s*mbar$/i, ""));
  if (p === undefined || !(p > 0)) return { problem: { field: "evaporation.pressureMbar", message: "Give the pressure in mbar." } };
  return { settings: { pressureMbar: p } };
}

export function evaluateEvaporation(d: PlanDraft, evaluation: PlanEvaluation, ref: ReferenceData = SHIPPED_REFERENCE): PanelOutcome<EvaporationSettings> {
  if (evaluation.status !== "ok") return { status: "off" };
  const { settings, problem } = evaporationSettingsOf(d);
  if (problem) return { status: "incomplete", message: problem.message };
  if (!settings) return { status: "off" };
  try {
    return { status: "ok", value: evaporationFor(evaluation.doc, settings, ref) };
  } catch (e) {
    if (!(e instanceof KnowledgeInputError)) throw e;
    return { status: "error", field: e.field, message: e.message };
  }
}

/** The document to save: the plan and the panels that are filled in. */
export function documentToSave(d: PlanDraft, evaluation: PlanEvaluation): PlanDocument | null {
  if (evaluation.status !== "ok") return null;
  const recovery = recoverySettingsOf(d).settings;
  const evaporation = evaporationSettingsOf(d).settings;
  return { ...evaluation.doc, ...(recovery ? { recovery } : {}), ...(evaporation ? { evaporation } : {}) };
}

const concentrationText = (c: Concentration | undefined) => {
  if (c === undefined) return "";
  if (c === "saturated") return "saturated";
  return c.unit === "mol/L" ? `${trimNumber(c.value, 3)} M` : formatConcentration(c).replace(" w/w", "");
};

const soluteKey = (name: string, ref: ReferenceData) => {
  try {
    return resolveWash(name, ref).chem.soluteKey;
  } catch {
    return name;
  }
};

/** A saved plan back into the builder. */
export function draftFromDocument(doc: PlanDocument, title = "", notes = "", ref: ReferenceData = SHIPPED_REFERENCE): PlanDraft {
  const components: ComponentDraft[] = doc.components.map((c) => ({
    id: rowId("c"),
    name: c.name,
    kind: c.kind,
    pKa: c.pKa !== undefined ? String(c.pKa) : "",
    partitionMode: c.partitionCoefficient === undefined && c.logP !== undefined ? "logP" : "K",
    partition: c.partitionCoefficient !== undefined ? String(c.partitionCoefficient) : c.logP !== undefined ? String(c.logP) : "",
    amount: c.amountMmol !== undefined ? String(c.amountMmol) : c.amountG !== undefined ? String(c.amountG) : "",
    amountUnit: c.amountMmol === undefined && c.amountG !== undefined ? "g" : "mmol",
    molarMass: c.molarMassGPerMol !== undefined ? String(c.molarMassGPerMol) : "",
  }));
  const recovered = doc.recovery ? components.find((c) => c.name.trim().toLowerCase() === doc.recovery!.component.trim().toLowerCase()) : undefined;
  return {
    title,
    notes,
    // the pickers hold table keys; a document written by hand may say "EtOAc" or "HCl"
    solvent: findSolvent(doc.organic.solvent, ref)?.key ?? doc.organic.solvent,
    volume: `${trimNumber(doc.organic.volumeMl, 2)} mL`,
    temperature: `${trimNumber(doc.temperatureC, 1)} °C`,
    components,
    washes: doc.washes.map((w) => ({
      id: rowId("w"),
      solute: soluteKey(w.aqueous.solute, ref),
      concentration: concentrationText(w.aqueous.concentration),
      volume: `${trimNumber(w.volumeMl, 2)} mL`,
      repeats: String(w.repeats ?? 1),
    })),
    recovery:
      doc.recovery && recovered
        ? {
            component: recovered.id,
            wash: doc.recovery.wash ?? "auto",
            reagent: soluteKey(doc.recovery.reagent.solute, ref),
            reagentConcentration: concentrationText(doc.recovery.reagent.concentration),
            targetPh: doc.recovery.targetPh !== undefined ? String(doc.recovery.targetPh) : "",
          }
        : NEW_RECOVERY,
    evaporation: doc.evaporation
      ? doc.evaporation.vaporTemperatureC !== undefined
        ? { ...NEW_EVAPORATION, mode: "vapour", vapour: `${trimNumber(doc.evaporation.vaporTemperatureC, 1)} °C` }
        : { ...NEW_EVAPORATION, mode: "pressure", pressure: trimNumber(doc.evaporation.pressureMbar ?? 100, 1) }
      : NEW_EVAPORATION,
  };
}
