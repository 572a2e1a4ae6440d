import { densityAtMassFractionGPerMl, interpolateDensity, toMassFractionPct } from "../concentration";
import { KnowledgeInputError, type AqueousSolute, type Concentration, type ReferenceData, type Sourced } from "../types";
import { findSolute, normaliseName, SHIPPED_REFERENCE } from "../reference";
import { mixturePh, type AqueousMixture } from "./acid-base";

/**
 * Acid–base behaviour of the wash solutes, matched to the aqueous table by solute key or
 * formula. Per formula unit: spectator charges (Na⁺, K⁺, Cl⁻…) and the protic systems it
 * brings (carbonic acid, hydrogen sulfate, ammonium, citric acid), each pKa at 25 °C.
 */
export type WashRole = "strong-acid" | "weak-acid" | "strong-base" | "weak-base" | "neutral";

export interface WashSystem {
  /** ascending */
  pKas: Sourced<number>[];
  chargeOfMostProtonated: number;
  name: string;
}

export interface WashChemistry {
  /** solute key in the aqueous table */
  soluteKey: string;
  formula: string;
  name: string;
  molarMassGPerMol: number;
  role: WashRole;
  cationsPerUnit: number;
  anionsPerUnit: number;
  systems: WashSystem[];
  /** protons one formula unit can give to a base (acid capacity) */
  acidEquivalents: number;
  /** protons one formula unit can take up from an acid (base capacity) */
  baseEquivalents: number;
  /** carbonate or bicarbonate: CO2 forms when acid is taken up */
  carbonate: boolean;
}

const CRC = "crc-inorganic-dissociation";
const E1 = "libretexts-e1-acid-constants";

const CARBONIC: WashSystem = {
  name: "carbonic acid",
  pKas: [
    { value: 6.35, source: CRC },
    { value: 10.33, source: CRC },
  ],
  chargeOfMostProtonated: 0,
};
/** pKa1, pKa2 of carbonic acid, for CO2 bookkeeping. */
export const CARBONIC_PKAS = CARBONIC.pKas.map((p) => p.value);
const HYDROGEN_SULFATE: WashSystem = {
  name: "hydrogen sulfate",
  pKas: [{ value: 1.99, source: E1, note: "second dissociation of sulfuric acid; the first is complete" }],
  chargeOfMostProtonated: -1,
};
const AMMONIUM: WashSystem = { name: "ammonium", pKas: [{ value: 9.25, source: CRC }], chargeOfMostProtonated: 1 };
const CITRIC: WashSystem = {
  name: "citric acid",
  pKas: [
    { value: 3.13, source: E1 },
    { value: 4.76, source: E1 },
    { value: 6.4, source: E1 },
  ],
  chargeOfMostProtonated: 0,
};

type Spec = Omit<WashChemistry, "carbonate" | "systems"> & { systems?: WashSystem[]; carbonate?: boolean };

const SPECS: Spec[] = [
  { soluteKey: "water", formula: "H2O", name: "water", molarMassGPerMol: 18.015, role: "neutral", cationsPerUnit: 0, anionsPerUnit: 0, acidEquivalents: 0, baseEquivalents: 0 },
  { soluteKey: "sodium-chloride", formula: "NaCl", name: "sodium chloride (brine)", molarMassGPerMol: 58.44, role: "neutral", cationsPerUnit: 1, anionsPerUnit: 1, acidEquivalents: 0, baseEquivalents: 0 },
  { soluteKey: "lithium-chloride", formula: "LiCl", name: "lithium chloride", molarMassGPerMol: 42.39, role: "neutral", cationsPerUnit: 1, anionsPerUnit: 1, acidEquivalents: 0, baseEquivalents: 0 },
  { soluteKey: "calcium-chloride", formula: "CaCl2", name: "calcium chloride", molarMassGPerMol: 110.98, role: "neutral", cationsPerUnit: 2, anionsPerUnit: 2, acidEquivalents: 0, baseEquivalents: 0 },
  { soluteKey: "hydrochloric-acid", formula: "HCl", name: "hydrochloric acid", molarMassGPerMol: 36.46, role: "strong-acid", cationsPerUnit: 0, anionsPerUnit: 1, acidEquivalents: 1, baseEquivalents: 0 },
  { soluteKey: "sulfuric-acid", formula: "H2SO4", name: "sulfuric acid", molarMassGPerMol: 98.08, role: "strong-acid", cationsPerUnit: 0, anionsPerUnit: 0, systems: [HYDROGEN_SULFATE], acidEquivalents: 2, baseEquivalents: 0 },
  { soluteKey: "potassium-bisulfate", formula: "KHSO4", name: "potassium hydrogen sulfate", molarMassGPerMol: 136.17, role: "weak-acid", cationsPerUnit: 1, anionsPerUnit: 0, systems: [HYDROGEN_SULFATE], acidEquivalents: 1, baseEquivalents: 0 },
  { soluteKey: "sodium-sulfate", formula: "Na2SO4", name: "sodium sulfate", molarMassGPerMol: 142.04, role: "neutral", cationsPerUnit: 2, anionsPerUnit: 0, systems: [HYDROGEN_SULFATE], acidEquivalents: 0, baseEquivalents: 0 },
  { soluteKey: "sodium-hydroxide", formula: "NaOH", name: "sodium hydroxide", molarMassGPerMol: 40.0, role: "strong-base", cationsPerUnit: 1, anionsPerUnit: 0, acidEquivalents: 0, baseEquivalents: 1 },
  { soluteKey: "potassium-hydroxide", formula: "KOH", name: "potassium hydroxide", molarMassGPerMol: 56.11, role: "strong-base", cationsPerUnit: 1, anionsPerUnit: 0, acidEquivalents: 0, baseEquivalents: 1 },
  { soluteKey: "sodium-bicarbonate", formula: "NaHCO3", name: "sodium bicarbonate", molarMassGPerMol: 84.01, role: "weak-base", cationsPerUnit: 1, anionsPerUnit: 0, systems: [CARBONIC], carbonate: true, acidEquivalents: 0, baseEquivalents: 1 },
  { soluteKey: "sodium-carbonate", formula: "Na2CO3", name: "sodium carbonate", molarMassGPerMol: 105.99, role: "weak-base", cationsPerUnit: 2, anionsPerUnit: 0, systems: [CARBONIC], carbonate: true, acidEquivalents: 0, baseEquivalents: 2 },
  { soluteKey: "potassium-carbonate", formula: "K2CO3", name: "potassium carbonate", molarMassGPerMol: 138.21, role: "weak-base", cationsPerUnit: 2, anionsPerUnit: 0, systems: [CARBONIC], carbonate: true, acidEquivalents: 0, baseEquivalents: 2 },
  { soluteKey: "ammonium-chloride", formula: "NH4Cl", name: "ammonium chloride", molarMassGPerMol: 53.49, role: "weak-acid", cationsPerUnit: 0, anionsPerUnit: 1, systems: [AMMONIUM], acidEquivalents: 1, baseEquivalents: 0 },
  { soluteKey: "ammonia", formula: "NH3", name: "aqueous ammonia", molarMassGPerMol: 17.03, role: "weak-base", cationsPerUnit: 0, anionsPerUnit: 0, systems: [AMMONIUM], acidEquivalents: 0, baseEquivalents: 1 },
  { soluteKey: "citric-acid", formula: "C6H8O7", name: "citric acid", molarMassGPerMol: 192.12, role: "weak-acid", cationsPerUnit: 0, anionsPerUnit: 0, systems: [CITRIC], acidEquivalents: 3, baseEquivalents: 0 },
];

export const WASH_CHEMISTRY: WashChemistry[] = SPECS.map((s) => ({ ...s, systems: s.systems ?? [], carbonate: s.carbonate ?? false }));

export const ACTIVITY_NOTE =
  "pH from concentrations by exact charge balance; activity effects are ignored, so concentrated salt washes (≥ 1 M) can read up to about half a unit off on a pH meter; pKa values at 25 °C.";

const norm = normaliseName;

/** The acid–base entry for a solute of the aqueous table (by key, then formula). */
export function washChemistryFor(solute: AqueousSolute | string): WashChemistry | undefined {
  const key = typeof solute === "string" ? solute : solute.key;
  const formula = typeof solute === "string" ? solute : solute.formula;
  return (
    WASH_CHEMISTRY.find((w) => w.soluteKey === key) ??
    WASH_CHEMISTRY.find((w) => norm(w.formula) === norm(formula) || norm(w.name) === norm(key))
  );
}

export interface WashMolarity {
  molL: number;
  /** null for a solute outside the aqueous table given in mol/L or g/L */
  massFractionPct: number | null;
  densityGPerMl: number | null;
  notes: string[];
}

/**
 * Molarity of the wash. "Saturated" takes the table's saturation; where the density table
 * stops short of it, the last tabulated density stands in (a few mg/mL off).
 */
export function washMolarity(solute: AqueousSolute | undefined, chem: WashChemistry, c: Concentration | undefined, field = "aqueous.concentration"): WashMolarity {
  if (chem.soluteKey === "water") {
    return { molL: 0, massFractionPct: 0, densityGPerMl: solute ? densityAtMassFractionGPerMl(solute, 0) : null, notes: [] };
  }
  if (!solute) {
    if (c === undefined || c === "saturated" || c.unit === "%w/w") {
      throw new KnowledgeInputError(field, `${chem.name} has no density table here: give its concentration in mol/L or g/L.`);
    }
    if (!(c.value >= 0)) throw new KnowledgeInputError(field, "A concentration must be zero or positive.");
    return { molL: c.unit === "mol/L" ? c.value : c.value / chem.molarMassGPerMol, massFractionPct: null, densityGPerMl: null, notes: [] };
  }
  const sat = solute.saturationWtPct;
  const tableEnd = solute.points.value[solute.points.value.length - 1]?.massFractionPct ?? 0;
  if (c === "saturated" && sat && sat.value > tableEnd) {
    const rho = interpolateDensity(solute.points.value, sat.value);
    return {
      molL: (sat.value * rho * 10) / solute.molarMassGPerMol,
      massFractionPct: sat.value,
      densityGPerMl: rho,
      notes: [`${solute.name}: saturation (${sat.value} % w/w) lies beyond the density table (${tableEnd} %); its last density is used.`],
    };
  }
  const pct = toMassFractionPct(solute, c, field);
  const rho = densityAtMassFractionGPerMl(solute, pct, field);
  const molL = c !== undefined && c !== "saturated" && c.unit === "mol/L" ? c.value : (pct * rho * 10) / solute.molarMassGPerMol;
  return { molL, massFractionPct: pct, densityGPerMl: rho, notes: [] };
}

/**
 * CO2 dissolved in water under 1 atm of CO2 (Henry's law, Sander 2015, recalled): 0.034 mol/L
 * at 25 °C, more when colder. Above it the gas comes out in the funnel and is vented.
 */
export function co2SaturationMolL(temperatureC: number): number {
  return 0.034 * Math.exp(2400 * (1 / (temperatureC + 273.15) - 1 / 298.15));
}

/** The aqueous mixture a wash of this molarity makes, for the charge balance. */
export function washMixture(chem: WashChemistry, molL: number, temperatureC = 25): AqueousMixture {
  return {
    strongCationMolL: chem.cationsPerUnit * molL,
    strongAnionMolL: chem.anionsPerUnit * molL,
    systems: chem.systems.map((s) => ({
      totalMolL: molL,
      pKas: s.pKas.map((p) => p.value),
      chargeOfMostProtonated: s.chargeOfMostProtonated,
      ...(s === CARBONIC ? { volatileNeutralMaxMolL: co2SaturationMolL(temperatureC) } : {}),
    })),
  };
}

export interface WashPh {
  pH: number;
  soluteKey: string;
  name: string;
  role: WashRole;
  molarityMolL: number;
  /** equivalents of acid or base in one mL of the wash (mmol/mL = mol/L × equivalents) */
  acidCapacityMmolPerMl: number;
  baseCapacityMmolPerMl: number;
  carbonate: boolean;
  method: string;
  assumptions: string[];
  sources: string[];
  mixture: AqueousMixture;
  densityGPerMl: number | null;
}

/** Look up the solute and its acid–base entry, or say which solutes are known. */
export function resolveWash(
  solute: string | AqueousSolute,
  ref: ReferenceData = SHIPPED_REFERENCE,
  field = "aqueous.solute",
): { solute: AqueousSolute | undefined; chem: WashChemistry } {
  let found = typeof solute === "string" ? findSolute(solute, ref) : solute;
  let chem = found ? washChemistryFor(found) : undefined;
  // an exact entry here beats a fuzzy reference hit ("KHSO4" is not in the density tables)
  const direct = typeof solute === "string" ? washChemistryFor(solute) : undefined;
  if (direct && direct !== chem) {
    chem = direct;
    found = ref.solutes.find((s) => s.key === direct.soluteKey);
  }
  if (!chem) {
    const label = found?.name ?? String(solute);
    throw new KnowledgeInputError(
      field,
      `No acid–base data for "${label}".`,
      WASH_CHEMISTRY.map((w) => w.soluteKey),
    );
  }
  return { solute: found, chem };
}

/**
 * pH of a fresh wash. Strong acids and bases come out of the same charge balance as
 * −log c and 14 + log c; weak acids, weak bases and amphoteric salts (NaHCO3) from their pKa values.
 */
export function washPh(
  solute: string | AqueousSolute,
  concentration: Concentration | undefined,
  ref: ReferenceData = SHIPPED_REFERENCE,
): WashPh {
  const { solute: found, chem } = resolveWash(solute, ref);
  const m = washMolarity(found, chem, concentration);
  const mixture = washMixture(chem, m.molL);
  const sources = [...new Set(chem.systems.flatMap((s) => s.pKas.map((p) => p.source)).concat(CRC))];
  const method =
    chem.role === "strong-acid" || chem.role === "strong-base"
      ? chem.systems.length
        ? "strong acid from its concentration, with the second dissociation from its pKa (charge balance)"
        : `strong ${chem.role === "strong-acid" ? "acid" : "base"} from its concentration (charge balance)`
      : chem.systems.length
        ? `charge balance with the pKa values of ${chem.systems.map((s) => s.name).join(", ")}`
        : "neutral salt: the pH of pure water";
  return {
    pH: mixturePh(mixture),
    soluteKey: chem.soluteKey,
    name: chem.name,
    role: chem.role,
    molarityMolL: m.molL,
    acidCapacityMmolPerMl: m.molL * chem.acidEquivalents,
    baseCapacityMmolPerMl: m.molL * chem.baseEquivalents,
    carbonate: chem.carbonate,
    method,
    assumptions: [
      ACTIVITY_NOTE,
      ...(chem.carbonate ? ["CO2 formed stays dissolved up to its solubility under 1 atm (Henry's law); the rest leaves as gas."] : []),
      ...m.notes,
    ],
    sources,
    mixture,
    densityGPerMl: m.densityGPerMl,
  };
}
