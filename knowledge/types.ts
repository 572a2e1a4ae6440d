/**
 * Shared shapes of the curated knowledge. Every curated value is `Sourced`: its `source`
 * is a key of SOURCES in ./sources.ts ("common-practice" and "from-memory" are keys too).
 */
export type SourceKey = string;

export interface Sourced<T> {
  value: T;
  source: SourceKey;
  note?: string;
}

export type Miscibility = "miscible" | "partial" | "immiscible";
/** Peroxide-former classes A–D (hazard on storage / on concentration / polymerisation / other). */
export type PeroxideClass = "A" | "B" | "C" | "D" | null;
export type GuideCategory = "recommended" | "problematic" | "hazardous" | "highly-hazardous";
export type SolventFamily =
  | "halogenated"
  | "ether"
  | "ester"
  | "hydrocarbon"
  | "aromatic"
  | "alcohol"
  | "ketone"
  | "nitrile"
  | "amide"
  | "sulfoxide"
  | "water"
  | "other";

/** log10(P) = a − b / (c + T). Units as stated; valid between minC and maxC. */
export interface AntoineConstants {
  a: number;
  b: number;
  c: number;
  pressureUnit: "mmHg" | "bar" | "kPa";
  temperatureUnit: "C" | "K";
  minC: number;
  maxC: number;
}

export interface Solvent {
  /** slug, e.g. "dichloromethane" */
  key: string;
  name: string;
  /** abbreviations, other names, formula spellings: "DCM", "methylene chloride", "CH2Cl2" */
  synonyms: string[];
  cas: string;
  formula: string;
  family: SolventFamily;
  halogenated: boolean;
  molarMassGPerMol: Sourced<number>;
  densityGPerMl20C: Sourced<number>;
  /** dρ/dT in g/mL per K (negative) */
  densityTempCoeffGPerMlPerK: Sourced<number>;
  boilingPointC: Sourced<number>;
  meltingPointC: Sourced<number>;
  /** wt% of solvent dissolved in water at ~20–25 °C; null when miscible */
  solubilityInWaterWtPct: Sourced<number | null>;
  /** wt% of water dissolved in the solvent; null when miscible */
  waterInSolventWtPct: Sourced<number | null>;
  miscibility: Sourced<Miscibility>;
  /** closed cup; null when it has none */
  flashPointC: Sourced<number | null>;
  peroxideClass: Sourced<PeroxideClass>;
  guide: Sourced<{ category: GuideCategory; reason: string }>;
  antoine: Sourced<AntoineConstants> | null;
}

/** One tabulated density of an aqueous solution at 20 °C. */
export interface DensityPoint {
  massFractionPct: number;
  densityGPerMl: number;
}

export interface AqueousSolute {
  /** slug, e.g. "sodium-chloride"; the pure-water entry is "water" */
  key: string;
  name: string;
  formula: string;
  synonyms: string[];
  cas: string;
  molarMassGPerMol: number;
  /** ascending in massFractionPct, starting at 0 (pure water) */
  points: Sourced<DensityPoint[]>;
  /** saturation at ~20 °C in % w/w; null when the table's end is the only limit */
  saturationWtPct: Sourced<number> | null;
}

export type ConcentrationUnit = "mol/L" | "%w/w" | "g/L";
export type Concentration = { value: number; unit: ConcentrationUnit } | "saturated";

export interface ReferenceData {
  solvents: Solvent[];
  solutes: AqueousSolute[];
}

export interface KnowledgeWarning {
  code: string;
  message: string;
}

/** Thrown by computations on input they cannot answer; the server maps it to 400. */
export class KnowledgeInputError extends Error {
  constructor(
    public readonly field: string,
    message: string,
    public readonly suggestions: string[] = [],
  ) {
    super(message);
    this.name = "KnowledgeInputError";
  }
}
