import { volumeText } from "../text";
import { SHIPPED_REFERENCE } from "../reference";
import { KnowledgeInputError, type Concentration, type KnowledgeWarning, type ReferenceData } from "../types";
import { combineMixtures, effectiveTotalMolL, netCharge, PKW_25C, solvePh, speciesFractions, type AqueousMixture, type ProticSystem } from "./acid-base";
import { fractionNeutral } from "./distribution";
import { CARBONIC_PKAS, resolveWash, washMixture, washMolarity } from "./wash-chemistry";

/** Molar gas constant, exact since the 2019 SI (J mol⁻¹ K⁻¹). */
export const GAS_CONSTANT_J_PER_MOL_K = 8.314462618;
export const STANDARD_ATMOSPHERE_PA = 101325;
/** H⁺ + OH⁻ → H2O at 25 °C, kJ/mol (CODATA 1989 formation enthalpies: −285.830 − (−230.015)). */
export const NEUTRALISATION_ENTHALPY_KJ_PER_MOL = -55.8;
/** Specific heat capacity taken for the aqueous mixture (water, 20–25 °C), J g⁻¹ K⁻¹. */
export const MIXTURE_HEAT_CAPACITY_J_PER_G_K = 4.18;
/** Density taken for a reagent outside the aqueous tables, g/mL. */
const FALLBACK_DENSITY_G_PER_ML = 1.0;

/** Ideal-gas volume of one mmol, mL: V = nRT/P. About 24.5 mL at 25 °C and 1 atm. */
export function gasMlPerMmol(temperatureC: number, pressureAtm = 1): number {
  if (!(temperatureC > -273.15)) throw new KnowledgeInputError("temperatureC", "The temperature must be above absolute zero.");
  if (!(pressureAtm > 0)) throw new KnowledgeInputError("pressureAtm", "The pressure must be above 0 atm.");
  // J/Pa is m³; per mol → mL per mmol is the same number × 10⁶ / 10³
  return ((GAS_CONSTANT_J_PER_MOL_K * (temperatureC + 273.15)) / (pressureAtm * STANDARD_ATMOSPHERE_PA)) * 1000;
}

export const VENTING_CAUTION =
  "CO2 forms: add the acid in portions to an open, stirred flask until gas stops before any funnel work; vent a stoppered funnel after every inversion, tip pointed away from people; follow the SDS and your supervisor.";
export const EXOTHERM_CAUTION =
  "Strong acid meets strong base: cool in ice, add slowly with stirring in an open vessel, and watch the temperature near the solvent's boiling point; follow the SDS and your supervisor.";

export interface ExtractComponent {
  name?: string;
  kind: "acid" | "base";
  pKa: number;
  /** amount held in the extract */
  mmol: number;
}

export interface NeutraliseInput {
  /** the aqueous extract as it was made up (the wash), and its volume */
  extract: { solute: string; concentration?: Concentration; volumeMl: number };
  components: ExtractComponent[];
  /** the stock added, e.g. 6 M HCl or 2 M NaOH */
  reagent: { solute: string; concentration: Concentration };
  /** default: two units past the pKa on the neutral side (acid: pKa − 2, base: pKa + 2) */
  targetPh?: number;
  /** for the gas volume; 25 °C when absent */
  temperatureC?: number;
  pressureAtm?: number;
}

export interface NeutraliseResult {
  direction: "acidify" | "basify";
  startPh: number;
  targetPh: number;
  reagentMmol: number;
  reagentVolumeMl: number;
  finalVolumeMl: number;
  /** equivalents spent on the wash's leftover base (acidifying) or acid (basifying) */
  excessWashMmol: number;
  /** equivalents spent turning the components back to their neutral form */
  componentsMmol: number;
  /** the rest: free acid or base left at the target pH, buffer species */
  remainderMmol: number;
  co2Mmol: number;
  co2Ml: number;
  /** H⁺ + OH⁻ → water during the addition */
  waterFormedMmol: number;
  heatJ: number;
  mixtureMassG: number;
  temperatureRiseK: number;
  componentsNeutralFraction: { name: string; fractionNeutral: number }[];
  warnings: KnowledgeWarning[];
  assumptions: string[];
  sources: string[];
}

function componentSystem(c: ExtractComponent, volumeMl: number): ProticSystem {
  return { totalMolL: c.mmol / volumeMl, pKas: [c.pKa], chargeOfMostProtonated: c.kind === "base" ? 1 : 0 };
}

/**
 * Acid or base needed to bring an extract to the pH where its components are back in their
 * neutral form, by charge balance on extract + stock (so leftover wash base or acid is
 * neutralised first, and carbonate buffers count); CO2 from carbonate or bicarbonate; and
 * the temperature rise from the strong acid–strong base part.
 */
export function neutraliseExtract(input: NeutraliseInput, ref: ReferenceData = SHIPPED_REFERENCE): NeutraliseResult {
  const { extract, components, reagent } = input;
  if (!(extract.volumeMl > 0)) throw new KnowledgeInputError("extract.volumeMl", "The extract volume must be above 0 mL.");
  if (components.length === 0) throw new KnowledgeInputError("components", "Name at least one component to recover.");
  const kinds = new Set(components.map((c) => c.kind));
  if (kinds.size > 1) throw new KnowledgeInputError("components", "Recover acids and bases from separate extracts.");
  components.forEach((c, i) => {
    if (!(c.mmol >= 0)) throw new KnowledgeInputError(`components[${i}].mmol`, "The amount must be ≥ 0 mmol.");
    if (!Number.isFinite(c.pKa)) throw new KnowledgeInputError(`components[${i}].pKa`, "Give the pKa.");
  });
  const kind = components[0]!.kind;
  const direction = kind === "acid" ? "acidify" : "basify";
  const temperatureC = input.temperatureC ?? 25;

  const ext = resolveWash(extract.solute, ref, "extract.solute");
  const extMolarity = washMolarity(ext.solute, ext.chem, extract.concentration, "extract.concentration");
  const extMix = washMixture(ext.chem, extMolarity.molL, temperatureC);

  const rea = resolveWash(reagent.solute, ref, "reagent.solute");
  const wantAcid = direction === "acidify";
  if (wantAcid ? rea.chem.acidEquivalents === 0 : rea.chem.baseEquivalents === 0) {
    throw new KnowledgeInputError(
      "reagent.solute",
      `${direction === "acidify" ? "Recovering an acid needs an acid" : "Recovering a base needs a base"}; ${rea.chem.name} is not one.`,
    );
  }
  const reaMolarity = washMolarity(rea.solute, rea.chem, reagent.concentration, "reagent.concentration");
  if (!(reaMolarity.molL > 0)) throw new KnowledgeInputError("reagent.concentration", "The stock must have a concentration above 0.");
  const reaMix = washMixture(rea.chem, reaMolarity.molL, temperatureC);

  const targetPh =
    input.targetPh ??
    (kind === "acid" ? Math.min(...components.map((c) => c.pKa)) - 2 : Math.max(...components.map((c) => c.pKa)) + 2);
  if (!Number.isFinite(targetPh)) throw new KnowledgeInputError("targetPh", "The target pH must be a number.");

  const V0 = extract.volumeMl;
  const mixtureAfter = (reagentMl: number): AqueousMixture => {
    const mixed = combineMixtures(extMix, V0, reaMix, reagentMl);
    return { ...mixed, systems: [...mixed.systems, ...components.map((c) => componentSystem(c, V0 + reagentMl))] };
  };
  const phAfter = (reagentMl: number) => {
    const mixture = mixtureAfter(reagentMl);
    return solvePh((pH) => netCharge(mixture, pH));
  };
  const startPh = phAfter(0);
  const passed = (pH: number) => (wantAcid ? pH <= targetPh : pH >= targetPh);

  let reagentVolumeMl = 0;
  if (!passed(startPh)) {
    // the pH moves monotonically with the stock added; bracket, then bisect on the volume
    let hi = Math.max(V0 * 0.01, 0.01);
    let guard = 0;
    while (!passed(phAfter(hi))) {
      hi *= 2;
      if (++guard > 40) {
        throw new KnowledgeInputError("targetPh", `pH ${targetPh} cannot be reached with ${rea.chem.name} at this concentration.`);
      }
    }
    let lo = 0;
    for (let i = 0; i < 80 && hi - lo > 1e-9 * hi; i++) {
      const mid = (lo + hi) / 2;
      if (passed(phAfter(mid))) hi = mid;
      else lo = mid;
    }
    reagentVolumeMl = hi;
  }
  const reagentEq = wantAcid ? rea.chem.acidEquivalents : rea.chem.baseEquivalents;
  const reagentMmol = reaMolarity.molL * reagentVolumeMl;
  const reagentEqMmol = reagentMmol * reagentEq;
  const finalVolumeMl = V0 + reagentVolumeMl;

  const washEqMmol = extMolarity.molL * V0 * (wantAcid ? ext.chem.baseEquivalents : ext.chem.acidEquivalents);
  const componentsMmol = components.reduce((s, c) => s + c.mmol, 0);
  const excessWashMmol = Math.max(0, washEqMmol - componentsMmol);
  const remainderMmol = reagentEqMmol - excessWashMmol - componentsMmol;

  // CO2 formed by the stock: carbonate still in the extract (CO2 vented while it took up the
  // components is gone) turned into carbonic acid between the start and the target pH
  const carbSystem = mixtureAfter(0).systems.find((s) => s.volatileNeutralMaxMolL !== undefined);
  const carbMmol = carbSystem ? effectiveTotalMolL(carbSystem, startPh) * V0 : 0;
  const co2Share = (pH: number) => speciesFractions(CARBONIC_PKAS, pH)[0] ?? 0;
  const co2Mmol = carbMmol > 0 && wantAcid ? carbMmol * Math.max(0, co2Share(targetPh) - co2Share(startPh)) : 0;
  const co2Ml = co2Mmol * gasMlPerMmol(temperatureC, input.pressureAtm ?? 1);

  // heat: free OH⁻ (acidifying) or free H⁺ (basifying) of the extract consumed by the stock;
  // a weak-acid stock's ionisation enthalpy (a few kJ/mol) is left out
  const freeStartMolL = wantAcid ? 10 ** (startPh - PKW_25C) : 10 ** -startPh;
  const freeEndMolL = wantAcid ? 10 ** (targetPh - PKW_25C) : 10 ** -targetPh;
  const waterFormedMmol = Math.max(0, freeStartMolL * V0 - freeEndMolL * finalVolumeMl);
  const heatJ = (waterFormedMmol / 1000) * -NEUTRALISATION_ENTHALPY_KJ_PER_MOL * 1000;
  const extractMassG = V0 * (extMolarity.densityGPerMl ?? FALLBACK_DENSITY_G_PER_ML);
  const reagentMassG = reagentVolumeMl * (reaMolarity.densityGPerMl ?? FALLBACK_DENSITY_G_PER_ML);
  const mixtureMassG = extractMassG + reagentMassG;
  const temperatureRiseK = heatJ / (mixtureMassG * MIXTURE_HEAT_CAPACITY_J_PER_G_K);

  const warnings: KnowledgeWarning[] = [];
  if (co2Mmol > 0.01) {
    warnings.push({
      code: "co2-gas",
      message: `About ${volumeText(co2Ml)} of CO2 (${co2Mmol.toFixed(1)} mmol at ${temperatureC} °C, 1 atm) comes off. ${VENTING_CAUTION}`,
    });
  }
  if (temperatureRiseK >= 1) {
    warnings.push({
      code: "exotherm",
      message: `The mixture warms by about ${temperatureRiseK.toFixed(0)} °C if no heat is lost. ${EXOTHERM_CAUTION}`,
    });
  }
  if (rea.chem.soluteKey === "sulfuric-acid" && reaMolarity.molL > 2) {
    warnings.push({
      code: "dilution-heat",
      message: "Concentrated sulfuric acid also releases heat of dilution (not counted here): dilute it first, acid into water.",
    });
  }
  const assumptions = [
    "pH by charge balance with concentrations for activities; pKa values at 25 °C.",
    "The components stay dissolved while they are titrated (a neutral form that oils out or crystallises does not change the amount needed).",
    "CO2 formed leaves the open, stirred flask; it counts as an ideal gas, V = nRT/P.",
    `Heat: only H⁺ + OH⁻ → H2O (${NEUTRALISATION_ENTHALPY_KJ_PER_MOL} kJ/mol, CODATA 1989, recalled); protonating carboxylates, carbonate or amines adds little; no heat is lost; the mixture's heat capacity is ${MIXTURE_HEAT_CAPACITY_J_PER_G_K} J/g/K (water).`,
    ...extMolarity.notes,
    ...(extMolarity.densityGPerMl === null || reaMolarity.densityGPerMl === null
      ? [`A density of ${FALLBACK_DENSITY_G_PER_ML} g/mL is taken where the aqueous tables have none.`]
      : []),
  ];
  return {
    direction,
    startPh,
    targetPh,
    reagentMmol,
    reagentVolumeMl,
    finalVolumeMl,
    excessWashMmol,
    componentsMmol,
    remainderMmol,
    co2Mmol,
    co2Ml,
    waterFormedMmol,
    heatJ,
    mixtureMassG,
    temperatureRiseK,
    componentsNeutralFraction: components.map((c, i) => ({
      name: c.name ?? `component ${i + 1}`,
      fractionNeutral: fractionNeutral(c.kind, c.pKa, targetPh),
    })),
    warnings,
    assumptions,
    sources: [
      "crc-inorganic-dissociation",
      "si-2019-gas-constant",
      "codata-1989-from-memory",
      "water-heat-capacity-from-memory",
      ...(ext.chem.carbonate ? ["sander-2015-from-memory"] : []),
    ],
  };
}
