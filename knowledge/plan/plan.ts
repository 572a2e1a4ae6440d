import { volumeText } from "../text";
import { predictLayers, type LayerConfidence, type Phase } from "../layers";
import { requireSolvent, SHIPPED_REFERENCE } from "../reference";
import { KnowledgeInputError, type Concentration, type KnowledgeWarning, type ReferenceData } from "../types";
import { effectiveTotalMolL, mixturePh, speciesFractions } from "./acid-base";
import { equilibratePass, ionisedDemandMmol, LOGP_ESTIMATE_NOTE, partitionCoefficientOf, type ComponentKind, type EquilibriumComponent } from "./distribution";
import { chooseFunnel, type FunnelChoice } from "./funnel";
import { gasMlPerMmol, VENTING_CAUTION } from "./neutralise";
import { ACTIVITY_NOTE, CARBONIC_PKAS, resolveWash, washMixture, washMolarity, type WashChemistry } from "./wash-chemistry";

export interface PlanComponentInput {
  name: string;
  kind: ComponentKind;
  /** for a base, the pKa of its conjugate acid */
  pKa?: number;
  /** K of the neutral form, organic ÷ aqueous concentration */
  partitionCoefficient?: number;
  /** octanol–water log P, used when no K is given */
  logP?: number;
  amountMmol?: number;
  amountG?: number;
  molarMassGPerMol?: number;
}

export interface PlanWashInput {
  aqueous: { solute: string; concentration?: Concentration };
  volumeMl: number;
  /** fresh portions of this wash, one after the other; 1 when absent */
  repeats?: number;
}

export interface PlanInput {
  organic: { solvent: string; volumeMl: number };
  components: PlanComponentInput[];
  washes: PlanWashInput[];
  temperatureC: number;
}

export interface PlanStepComponent {
  name: string;
  /** share of the starting amount still in the organic layer after this pass */
  fractionInOrganic: number;
  /** share of the starting amount that went into this pass's aqueous portion */
  fractionInAqueousThisPass: number;
  mmolInOrganic: number;
  /** D at this pass's aqueous pH */
  distributionRatio: number;
  fractionNeutral: number;
}

export interface PlanStep {
  /** index into input.washes */
  wash: number;
  /** 1-based pass within the wash */
  pass: number;
  solute: string;
  soluteName: string;
  /** pH of the fresh wash */
  washPh: number;
  /** aqueous pH once the components have been taken up (differs when the wash is used up or buffers shift) */
  aqueousPh: number;
  /** the components needed more acid or base than this portion holds */
  capacityExceeded: boolean;
  top: Phase | null;
  bottom: Phase | null;
  densityDifferenceGPerMl: number;
  confidence: LayerConfidence;
  totalVolumeMl: number;
  /** CO2 formed in this pass (carbonate washes) and its volume at the plan's temperature, 1 atm */
  co2Mmol: number;
  co2Ml: number;
  components: PlanStepComponent[];
}

export interface PlanResult {
  steps: PlanStep[];
  final: { components: { name: string; fractionInOrganic: number; mmolInOrganic: number; removedBy: number[] }[] };
  funnelMl: number;
  funnel: FunnelChoice;
  warnings: KnowledgeWarning[];
  assumptions: string[];
  sources: string[];
}

/** A wash is listed in removedBy when it takes at least this share of the starting amount. */
export const REMOVED_BY_MIN_FRACTION = 0.05;
/** Greasy acids: K (or P) at or above this emulsify as soaps at high pH (common practice). */
export const GREASY_PARTITION_COEFFICIENT = 1000;
/** Gas per pass at or above this calls for neutralising in an open vessel first. */
export const LITRES_OF_GAS_ML = 1000;
export const MAX_REPEATS = 20;

interface PreparedComponent {
  name: string;
  kind: ComponentKind;
  pKa?: number;
  K: number;
  estimated: boolean;
  startMmol: number;
  molarMassGPerMol?: number;
}

function prepareComponent(c: PlanComponentInput, i: number): PreparedComponent {
  const field = `components[${i}]`;
  if (typeof c !== "object" || c === null) throw new KnowledgeInputError(field, "Each component is an object.");
  if (typeof c.name !== "string" || c.name.trim() === "") throw new KnowledgeInputError(`${field}.name`, "Give the component a name.");
  if (c.kind !== "acid" && c.kind !== "base" && c.kind !== "neutral") {
    throw new KnowledgeInputError(`${field}.kind`, 'The kind is "acid", "base" or "neutral".');
  }
  if (c.kind !== "neutral" && (typeof c.pKa !== "number" || !Number.isFinite(c.pKa))) {
    throw new KnowledgeInputError(`${field}.pKa`, `${c.name} is ${c.kind === "acid" ? "an acid" : "a base"}: give its pKa${c.kind === "base" ? " (of the conjugate acid)" : ""}.`);
  }
  let K: { value: number; estimated: boolean };
  try {
    K = partitionCoefficientOf(c);
  } catch (e) {
    if (e instanceof KnowledgeInputError) throw new KnowledgeInputError(`${field}.partitionCoefficient`, e.message);
    throw e;
  }
  let startMmol: number;
  if (c.amountMmol !== undefined) {
    if (!(c.amountMmol >= 0) || !Number.isFinite(c.amountMmol)) throw new KnowledgeInputError(`${field}.amountMmol`, "The amount must be ≥ 0 mmol.");
    startMmol = c.amountMmol;
  } else if (c.amountG !== undefined) {
    if (!(c.amountG >= 0) || !Number.isFinite(c.amountG)) throw new KnowledgeInputError(`${field}.amountG`, "The mass must be ≥ 0 g.");
    if (!(typeof c.molarMassGPerMol === "number" && c.molarMassGPerMol > 0)) {
      throw new KnowledgeInputError(`${field}.molarMassGPerMol`, `Give the molar mass of ${c.name} to turn grams into mmol.`);
    }
    startMmol = (c.amountG / c.molarMassGPerMol) * 1000;
  } else {
    throw new KnowledgeInputError(`${field}.amountMmol`, `Give the amount of ${c.name} (mmol, or g with the molar mass).`);
  }
  return {
    name: c.name,
    kind: c.kind,
    ...(c.kind !== "neutral" ? { pKa: c.pKa } : {}),
    K: K.value,
    estimated: K.estimated,
    startMmol,
    ...(typeof c.molarMassGPerMol === "number" && c.molarMassGPerMol > 0 ? { molarMassGPerMol: c.molarMassGPerMol } : {}),
  };
}

function checkInput(input: PlanInput): void {
  if (typeof input !== "object" || input === null) throw new KnowledgeInputError("", "Expected a plan object.");
  if (typeof input.organic !== "object" || input.organic === null || typeof input.organic.solvent !== "string") {
    throw new KnowledgeInputError("organic.solvent", "Give the organic solvent and its volume.");
  }
  if (!(input.organic.volumeMl > 0)) throw new KnowledgeInputError("organic.volumeMl", "The organic volume must be above 0 mL.");
  if (!Array.isArray(input.components)) throw new KnowledgeInputError("components", "Components are a list.");
  if (!Array.isArray(input.washes) || input.washes.length === 0) throw new KnowledgeInputError("washes", "Add at least one wash.");
  input.washes.forEach((w, i) => {
    if (typeof w !== "object" || w === null || typeof w.aqueous !== "object" || w.aqueous === null) {
      throw new KnowledgeInputError(`washes[${i}].aqueous`, "Each wash names its aqueous solution.");
    }
    if (!(w.volumeMl > 0)) throw new KnowledgeInputError(`washes[${i}].volumeMl`, "The wash volume must be above 0 mL.");
    const r = w.repeats ?? 1;
    if (!Number.isInteger(r) || r < 1 || r > MAX_REPEATS) {
      throw new KnowledgeInputError(`washes[${i}].repeats`, `Repeats are a whole number from 1 to ${MAX_REPEATS}.`);
    }
  });
}

const isAcidic = (c: WashChemistry) => c.role === "strong-acid" || c.role === "weak-acid";
const isBasic = (c: WashChemistry) => c.role === "strong-base" || c.role === "weak-base";

/** Layer warnings that belong to one wash get its label; the rest are about the solvent. */
const PER_WASH_LAYER_CODES = new Set(["near-density", "inverted-order", "inversion-risk", "one-phase", "corrosive-aqueous", "salting-out-possible"]);

/**
 * The whole wash sequence: each pass equilibrates the organic layer with a fresh portion
 * (pH and uptake solved together, so an under-sized wash shows up), the layer order comes from
 * the layer check with that pass's aqueous, and the cautions are collected once.
 */
export function computePlan(input: PlanInput, ref: ReferenceData = SHIPPED_REFERENCE): PlanResult {
  checkInput(input);
  const T = input.temperatureC;
  const solvent = requireSolvent(input.organic.solvent, "organic.solvent", ref);
  const Vorg = input.organic.volumeMl;
  const comps = input.components.map(prepareComponent);
  const mmol = comps.map((c) => c.startMmol);
  const warnings: KnowledgeWarning[] = [];
  const warn = (code: string, message: string) => {
    if (!warnings.some((w) => w.code === code && w.message === message)) warnings.push({ code, message });
  };
  const sources = new Set<string>(["crc-inorganic-dissociation", "libretexts-e1-acid-constants"]);
  const steps: PlanStep[] = [];
  const removedPerWash: number[][] = comps.map(() => input.washes.map(() => 0));
  let previousAcidicWash: number | null = null;

  input.washes.forEach((w, wi) => {
    const { solute, chem } = resolveWash(w.aqueous.solute, ref, `washes[${wi}].aqueous.solute`);
    const molarity = washMolarity(solute, chem, w.aqueous.concentration, `washes[${wi}].aqueous.concentration`);
    molarity.notes.forEach((n) => warn("wash-concentration-note", n));
    const mixture = washMixture(chem, molarity.molL, T);
    const Vaq = w.volumeMl;
    const label = `Wash ${wi + 1} (${chem.name})`;
    const freshPh = mixturePh(mixture);
    const repeats = w.repeats ?? 1;
    let washCo2Mmol = 0;
    let maxPassCo2Ml = 0;
    let capacityWarned = false;

    for (let pass = 1; pass <= repeats; pass++) {
      const loaded: EquilibriumComponent[] = comps.map((c, i) => ({
        kind: c.kind,
        ...(c.pKa !== undefined ? { pKa: c.pKa } : {}),
        partitionCoefficient: c.K,
        mmol: mmol[i]!,
      }));
      const dissolvedSolidsG = comps.reduce((g, c, i) => (c.molarMassGPerMol ? g + (mmol[i]! * c.molarMassGPerMol) / 1000 : g), 0);
      const layers = predictLayers(
        {
          organic: [{ solvent: input.organic.solvent, volumeMl: Vorg }],
          aqueous: {
            solute: solute?.key ?? w.aqueous.solute,
            ...(w.aqueous.concentration !== undefined ? { concentration: w.aqueous.concentration } : {}),
            volumeMl: Vaq,
          },
          temperatureC: T,
          ...(dissolvedSolidsG > 0 ? { dissolvedSolidsG } : {}),
        },
        ref,
      );
      layers.sources.forEach((s) => sources.add(s));
      for (const lw of layers.warnings) {
        if (lw.code === "gas-evolution") continue; // replaced by the CO2 estimate below
        warn(lw.code, PER_WASH_LAYER_CODES.has(lw.code) ? `${label}: ${lw.message}` : lw.message);
      }

      const eq = equilibratePass(Vorg, Vaq, mixture, loaded);

      // capacity: what the components would take at the fresh wash's pH, against what the portion holds
      const demand = ionisedDemandMmol(loaded, freshPh, Vorg, Vaq);
      const acidHeld = molarity.molL * Vaq * chem.acidEquivalents;
      const baseHeld = molarity.molL * Vaq * chem.baseEquivalents;
      const exceeded =
        (isAcidic(chem) && demand.basesMmol > acidHeld * 1.0001 && demand.basesMmol > 1e-6) ||
        (isBasic(chem) && demand.acidsMmol > baseHeld * 1.0001 && demand.acidsMmol > 1e-6);
      if (exceeded && !capacityWarned) {
        capacityWarned = true;
        const held = isAcidic(chem) ? acidHeld : baseHeld;
        const need = isAcidic(chem) ? demand.basesMmol : demand.acidsMmol;
        const taken = eq.components.reduce(
          (s, c, i) => (comps[i]!.kind === (isAcidic(chem) ? "base" : "acid") ? s + c.mmolIonisedInAqueous : s),
          0,
        );
        warn(
          "wash-capacity",
          `${label}, pass ${pass}: ${Vaq} mL holds ${held.toFixed(2)} mmol of ${isAcidic(chem) ? "acid" : "base"} but the ${
            isAcidic(chem) ? "bases" : "acids"
          } need ${need.toFixed(2)} mmol: only about ${taken.toFixed(2)} mmol is taken up and the aqueous ends near pH ${eq.pH.toFixed(1)} (fresh wash ${freshPh.toFixed(1)}). Use a larger or stronger portion, or more passes.`,
        );
      }

      // CO2: carbonate turned into carbonic acid by the acids taken up (closed count of what forms)
      let co2Mmol = 0;
      if (chem.carbonate) {
        const carb = mixture.systems[0]!;
        const co2Share = (pH: number) => speciesFractions(CARBONIC_PKAS, pH)[0] ?? 0;
        const dissolvedAfter = effectiveTotalMolL(carb, eq.pH) * co2Share(eq.pH);
        const lostAsGas = carb.totalMolL - effectiveTotalMolL(carb, eq.pH);
        co2Mmol = Math.max(0, (dissolvedAfter + lostAsGas - carb.totalMolL * co2Share(freshPh)) * Vaq);
        washCo2Mmol += co2Mmol;
      }
      const co2Ml = co2Mmol * gasMlPerMmol(T);
      maxPassCo2Ml = Math.max(maxPassCo2Ml, co2Ml);

      const stepComponents: PlanStepComponent[] = comps.map((c, i) => {
        const r = eq.components[i]!;
        const start = c.startMmol;
        removedPerWash[i]![wi]! += r.mmolInAqueous;
        mmol[i] = r.mmolInOrganic;
        return {
          name: c.name,
          fractionInOrganic: start > 0 ? r.mmolInOrganic / start : 0,
          fractionInAqueousThisPass: start > 0 ? r.mmolInAqueous / start : 0,
          mmolInOrganic: r.mmolInOrganic,
          distributionRatio: r.distributionRatio,
          fractionNeutral: r.fractionNeutral,
        };
      });

      // greasy acids turned into soaps
      comps.forEach((c, i) => {
        const r = eq.components[i]!;
        if (c.kind === "acid" && c.K >= GREASY_PARTITION_COEFFICIENT && r.mmolIonisedInAqueous > 0.05 * c.startMmol && eq.pH >= (c.pKa ?? 0) + 2) {
          warn(
            "emulsion-prone",
            `${label}: ${c.name} is greasy (K ≈ ${c.K.toPrecision(2)}) and goes into the water as its salt at pH ${eq.pH.toFixed(1)} — soaps stabilise emulsions: invert gently rather than shake, and keep brine at hand (common practice).`,
          );
          sources.add("common-practice");
        }
      });

      steps.push({
        wash: wi,
        pass,
        solute: chem.soluteKey,
        soluteName: chem.name,
        washPh: freshPh,
        aqueousPh: eq.pH,
        capacityExceeded: exceeded,
        top: layers.top,
        bottom: layers.bottom,
        densityDifferenceGPerMl: layers.densityDifferenceGPerMl,
        confidence: layers.confidence,
        totalVolumeMl: layers.totalVolumeMl,
        co2Mmol,
        co2Ml,
        components: stepComponents,
      });
    }

    if (chem.carbonate) {
      sources.add("si-2019-gas-constant");
      sources.add("sander-2015-from-memory");
      const carried = previousAcidicWash !== null ? ` Acid wash ${previousAcidicWash + 1} left in the funnel or the organic layer adds more.` : "";
      // The first pass meets most of the acid, so the largest pass is what the funnel must vent.
      const amount =
        repeats === 1
          ? `about ${volumeText(washCo2Mmol * gasMlPerMmol(T))} of CO2 (${washCo2Mmol.toFixed(1)} mmol at ${T} °C, 1 atm)`
          : `up to ${volumeText(maxPassCo2Ml)} of CO2 in one pass, most in the first (${washCo2Mmol.toFixed(1)} mmol over ${repeats} passes at ${T} °C, 1 atm)`;
      warn(
        "co2-gas",
        washCo2Mmol > 0.05
          ? `${label}: ${amount} as it neutralises the acids.${carried} Swirl unstoppered first, then vent after every inversion, tip pointed away from people.`
          : `${label}: little CO2 expected from the listed components.${carried} Swirl unstoppered first and vent after every inversion.`,
      );
      if (maxPassCo2Ml >= LITRES_OF_GAS_ML) {
        warn("co2-litres", `${label}: over a litre of gas per pass — do not do this in a stoppered funnel. ${VENTING_CAUTION}`);
      }
    }
    if (solvent.family === "ester" && chem.role === "strong-base") {
      warn(
        "ester-hydrolysis",
        `${label}: ${solvent.name} is an ester and hydrolyses in strong base (it is consumed and the product layer gains alcohol and carboxylate): keep the contact short and cold, or use carbonate or a non-ester solvent.`,
      );
    }
    if (isAcidic(chem)) previousAcidicWash = wi;
  });

  const funnel = chooseFunnel(Math.max(...steps.map((s) => s.totalVolumeMl)));
  funnel.warnings.forEach((w) => warn(w.code, w.message));
  sources.add("common-practice");

  const estimated = comps.filter((c) => c.estimated).map((c) => c.name);
  const assumptions = [
    "Each pass reaches equilibrium; every portion of a repeated wash is fresh.",
    "Only the neutral form of a component enters the organic layer (no ion pairs); K does not change with the salts in the wash.",
    "Volumes stay constant: the mutual solubility of the solvent and water is ignored.",
    ACTIVITY_NOTE,
    "The aqueous pH of a pass is solved together with what it takes up: it moves away from the fresh wash's pH when the components use up the wash's acid or base, or shift its buffer.",
    "CO2 from carbonate washes stays dissolved up to its solubility under 1 atm; the rest is vented. Gas volumes are ideal gas at the plan's temperature and 1 atm.",
    ...(estimated.length ? [`${estimated.join(", ")}: ${LOGP_ESTIMATE_NOTE}`] : []),
  ];
  if (estimated.length) sources.add("collander-leo-1971-from-memory");

  return {
    steps,
    final: {
      components: comps.map((c, i) => ({
        name: c.name,
        fractionInOrganic: c.startMmol > 0 ? mmol[i]! / c.startMmol : 0,
        mmolInOrganic: mmol[i]!,
        removedBy: removedPerWash[i]!.flatMap((m, wi) => (c.startMmol > 0 && m / c.startMmol >= REMOVED_BY_MIN_FRACTION ? [wi] : [])),
      })),
    },
    funnelMl: funnel.funnelMl,
    funnel,
    warnings,
    assumptions,
    sources: [...sources],
  };
}
