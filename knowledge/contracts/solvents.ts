import { gramsPerLitreFromMassFraction, maxMassFractionPct, molarityFromMassFraction } from "../concentration";
import { SOURCES } from "../sources";
import type { AqueousSolute, GuideCategory, Miscibility, PeroxideClass, Solvent, Sourced } from "../types";

/*
 * Shapes of GET /api/solvents, /api/solvents/:key and /api/aqueous-solutions, and the pure
 * functions that build them from the reference tables. Shared by the server routes and the
 * Solvents screens.
 */

/** A curated value with its source resolved to a title. */
export interface ResolvedValue<T> {
  value: T;
  source: string;
  sourceTitle: string;
  sourceKind: string;
  note?: string;
}

/** A source key the shipped list does not know (a group's correction) shows as itself. */
export function sourceTitle(key: string): { title: string; kind: string } {
  const entry = Object.prototype.hasOwnProperty.call(SOURCES, key) ? SOURCES[key] : undefined;
  return entry ? { title: entry.title, kind: entry.kind } : { title: key, kind: "group" };
}

export function resolve<T>(v: Sourced<T>): ResolvedValue<T> {
  const s = sourceTitle(v.source);
  const out: ResolvedValue<T> = { value: v.value, source: v.source, sourceTitle: s.title, sourceKind: s.kind };
  if (v.note !== undefined) out.note = v.note;
  return out;
}

/** A record with every Sourced field resolved; other fields unchanged. */
export type Resolved<T> = {
  [K in keyof T]: T[K] extends Sourced<infer V> ? ResolvedValue<V> : T[K] extends Sourced<infer V> | null ? ResolvedValue<V> | null : T[K];
};

function isSourced(v: unknown): v is Sourced<unknown> {
  return typeof v === "object" && v !== null && "value" in v && "source" in v && typeof (v as { source: unknown }).source === "string";
}

function resolveAll<T extends object>(record: T): Resolved<T> {
  const out: Record<string, unknown> = {};
  for (const [field, v] of Object.entries(record)) out[field] = isSourced(v) ? resolve(v) : v;
  return out as Resolved<T>;
}

export type SolventListItem = Pick<Solvent, "key" | "name" | "synonyms" | "cas" | "formula" | "family" | "halogenated"> & {
  densityGPerMl20C: number;
  boilingPointC: number;
  flashPointC: number | null;
  miscibility: Miscibility;
  guideCategory: GuideCategory;
  peroxideClass: PeroxideClass;
};

export function solventListItem(s: Solvent): SolventListItem {
  return {
    key: s.key,
    name: s.name,
    synonyms: s.synonyms,
    cas: s.cas,
    formula: s.formula,
    family: s.family,
    densityGPerMl20C: s.densityGPerMl20C.value,
    boilingPointC: s.boilingPointC.value,
    flashPointC: s.flashPointC.value,
    miscibility: s.miscibility.value,
    guideCategory: s.guide.value.category,
    halogenated: s.halogenated,
    peroxideClass: s.peroxideClass.value,
  };
}

/** One solvent with every value and its source title. */
export type SolventDetail = Resolved<Solvent>;

export function solventDetail(s: Solvent): SolventDetail {
  return resolveAll(s);
}

/** One aqueous solute: density at 20 °C against mass % w/w, saturation, and the limits the tables answer for. */
export type AqueousSolutionEntry = Resolved<AqueousSolute> & {
  /** the highest concentration the tables answer for, in each accepted unit */
  limits: {
    maxMassFractionPct: number;
    maxMolPerL: number;
    maxGPerL: number;
    limitedBy: "saturation" | "table";
  };
};

export function aqueousSolutionEntry(s: AqueousSolute): AqueousSolutionEntry {
  const wMax = maxMassFractionPct(s);
  const sat = s.saturationWtPct?.value;
  return {
    ...resolveAll(s),
    limits: {
      maxMassFractionPct: wMax,
      maxMolPerL: molarityFromMassFraction(s, wMax),
      maxGPerL: gramsPerLitreFromMassFraction(s, wMax),
      limitedBy: sat !== undefined && sat <= wMax ? "saturation" : "table",
    },
  };
}
