import { requireSolvent, SHIPPED_REFERENCE } from "../reference";
import { KnowledgeInputError, type AntoineConstants, type KnowledgeWarning, type ReferenceData, type Solvent } from "../types";

/** 1 mmHg (torr) = 101 325 / 760 Pa = 1.333 224 mbar. */
export const MBAR_PER_MMHG = 101325 / 760 / 100;
const MBAR_PER_UNIT: Record<AntoineConstants["pressureUnit"], number> = { mmHg: MBAR_PER_MMHG, bar: 1000, kPa: 10 };

/** Solvents boiling below this at 1 atm need a gentle vacuum and a cool bath (DCM, diethyl ether, pentane). */
export const LOW_BOILER_C = 45;
/** The "20-degree" rule (common practice): bath = vapour + 20 °C, condenser ≤ vapour − 20 °C. */
export const RULE_STEP_C = 20;

function antoineOf(solvent: Solvent, field: string): AntoineConstants {
  const a = solvent.antoine?.value;
  if (!a) throw new KnowledgeInputError(field, `No Antoine constants for ${solvent.name} in the solvent table.`);
  return a;
}

const toAntoineT = (a: AntoineConstants, c: number) => (a.temperatureUnit === "K" ? c + 273.15 : c);
const fromAntoineT = (a: AntoineConstants, t: number) => (a.temperatureUnit === "K" ? t - 273.15 : t);

/** Vapour pressure (mbar) at a temperature, log10(P) = A − B/(C + T), inside the constants' range. */
export function vapourPressureMbar(solvent: Solvent, temperatureC: number, field = "vaporTemperatureC"): number {
  const a = antoineOf(solvent, field);
  if (!Number.isFinite(temperatureC)) throw new KnowledgeInputError(field, "The temperature must be a number in °C.");
  if (temperatureC < a.minC - 1e-9 || temperatureC > a.maxC + 1e-9) {
    throw new KnowledgeInputError(
      field,
      `The Antoine constants for ${solvent.name} hold from ${a.minC} to ${a.maxC} °C; ${temperatureC} °C is outside.`,
    );
  }
  return 10 ** (a.a - a.b / (a.c + toAntoineT(a, temperatureC))) * MBAR_PER_UNIT[a.pressureUnit];
}

/** Boiling point (°C) at a pressure (mbar), the Antoine equation solved for T, inside the constants' range. */
export function boilingPointAtPressureC(solvent: Solvent, pressureMbar: number, field = "pressureMbar"): number {
  const a = antoineOf(solvent, field);
  if (!(pressureMbar > 0) || !Number.isFinite(pressureMbar)) throw new KnowledgeInputError(field, "The pressure must be above 0 mbar.");
  const logP = Math.log10(pressureMbar / MBAR_PER_UNIT[a.pressureUnit]);
  const t = fromAntoineT(a, a.b / (a.a - logP) - a.c);
  const lo = vapourPressureMbar(solvent, a.minC, field);
  const hi = vapourPressureMbar(solvent, a.maxC, field);
  if (a.a - logP <= 0 || t < a.minC - 1e-6 || t > a.maxC + 1e-6) {
    throw new KnowledgeInputError(
      field,
      `The Antoine constants for ${solvent.name} cover ${round(lo, 1)}–${round(hi, 0)} mbar (${a.minC}–${a.maxC} °C); ${pressureMbar} mbar is outside.`,
    );
  }
  return t;
}

export type EvaporationInput = { solvent: string; vaporTemperatureC: number } | { solvent: string; pressureMbar: number };

export interface EvaporationSettings {
  solventKey: string;
  solventName: string;
  pressureMbar: number;
  pressureMmHg: number;
  boilingPointC: number;
  /** bath = vapour + 20 °C (common practice) */
  bathC: number;
  /** coolant at or below vapour − 20 °C (common practice) */
  condenserMaxC: number;
  normalBoilingPointC: number;
  cautions: KnowledgeWarning[];
  sources: string[];
}

/**
 * Rotary-evaporator settings for one solvent: from a chosen vapour temperature the pressure
 * at which it boils, or from a chosen pressure its boiling point; then the 20-degree rule.
 */
export function evaporationSettings(input: EvaporationInput, ref: ReferenceData = SHIPPED_REFERENCE): EvaporationSettings {
  const solvent = requireSolvent(input.solvent, "solvent", ref);
  let pressureMbar: number;
  let boilingPointC: number;
  if ("vaporTemperatureC" in input && input.vaporTemperatureC !== undefined) {
    boilingPointC = input.vaporTemperatureC;
    pressureMbar = vapourPressureMbar(solvent, boilingPointC, "vaporTemperatureC");
  } else if ("pressureMbar" in input && input.pressureMbar !== undefined) {
    pressureMbar = input.pressureMbar;
    boilingPointC = boilingPointAtPressureC(solvent, pressureMbar, "pressureMbar");
  } else {
    throw new KnowledgeInputError("vaporTemperatureC", "Give a vapour temperature (°C) or a pressure (mbar).");
  }
  return {
    solventKey: solvent.key,
    solventName: solvent.name,
    pressureMbar,
    pressureMmHg: pressureMbar / MBAR_PER_MMHG,
    boilingPointC,
    bathC: boilingPointC + RULE_STEP_C,
    condenserMaxC: boilingPointC - RULE_STEP_C,
    normalBoilingPointC: solvent.boilingPointC.value,
    cautions: evaporationCautions(solvent),
    sources: [solvent.antoine?.source ?? "from-memory", "common-practice"],
  };
}

/** One line each: peroxides before concentrating, low boilers, halogenated waste, flammability. */
export function evaporationCautions(solvent: Solvent): KnowledgeWarning[] {
  const out: KnowledgeWarning[] = [];
  if (solvent.peroxideClass.value !== null) {
    out.push({
      code: "peroxide-before-concentrating",
      message: `${solvent.name} forms peroxides (class ${solvent.peroxideClass.value}): test the extract before concentrating and never take it to dryness if the test is positive; follow the SDS and local rules.`,
    });
  }
  if (solvent.boilingPointC.value < LOW_BOILER_C) {
    out.push({
      code: "low-boiler-gentle-vacuum",
      message: `${solvent.name} boils at ${solvent.boilingPointC.value} °C: lower the vacuum gently and keep the bath cool, or it bumps and carries over.`,
    });
  }
  if (solvent.halogenated) {
    out.push({
      code: "halogenated-waste",
      message: `${solvent.name} is halogenated: collect the condensate as halogenated waste; work in a fume hood.`,
    });
  }
  return out;
}

function round(x: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(x * f) / f;
}
