import type { AqueousSolute, ReferenceData, Solvent, SourceKey } from "./types";
import { KnowledgeInputError } from "./types";

/*
 * A lab group's corrections to the shipped tables (an SDS flash point, a density measured in
 * the lab, a solvent the tables lack). Applying them builds a new ReferenceData and never
 * touches the shipped arrays, so every group sees its own corrections and nobody else's.
 */

export type SolventValueField =
  | "densityGPerMl20C"
  | "boilingPointC"
  | "flashPointC"
  | "densityTempCoeffGPerMlPerK"
  | "waterInSolventWtPct"
  | "solubilityInWaterWtPct";

export type ReferenceOverride =
  | { kind: "solvent-value"; solventKey: string; field: SolventValueField; value: number; source: SourceKey }
  | { kind: "aqueous-point"; soluteKey: string; massFractionPct: number; densityGPerMl: number; source: SourceKey }
  | { kind: "solvent-new"; solvent: Solvent };

const FIELD_LIMITS: Record<SolventValueField, { min: number; max: number; label: string }> = {
  densityGPerMl20C: { min: 0.5, max: 3, label: "density at 20 °C (g/mL)" },
  boilingPointC: { min: -50, max: 350, label: "boiling point (°C)" },
  flashPointC: { min: -60, max: 300, label: "flash point (°C)" },
  densityTempCoeffGPerMlPerK: { min: -0.005, max: 0, label: "density temperature coefficient (g/mL per K)" },
  waterInSolventWtPct: { min: 0, max: 100, label: "water in solvent (wt%)" },
  solubilityInWaterWtPct: { min: 0, max: 100, label: "solubility in water (wt%)" },
};

function checkSource(source: unknown, field: string): void {
  if (typeof source !== "string" || source.trim() === "") {
    throw new KnowledgeInputError(field, "Every correction needs a source (an SDS, a measurement, a handbook).");
  }
}

function applySolventValue(solvents: Solvent[], o: Extract<ReferenceOverride, { kind: "solvent-value" }>, i: number): Solvent[] {
  const at = `overrides[${i}]`;
  const index = solvents.findIndex((s) => s.key === o.solventKey);
  if (index < 0) throw new KnowledgeInputError(`${at}.solventKey`, `No solvent with key "${o.solventKey}".`);
  const limits = FIELD_LIMITS[o.field];
  if (!limits) throw new KnowledgeInputError(`${at}.field`, `"${String(o.field)}" cannot be corrected.`);
  if (typeof o.value !== "number" || !Number.isFinite(o.value) || o.value < limits.min || o.value > limits.max) {
    throw new KnowledgeInputError(`${at}.value`, `A ${limits.label} must lie between ${limits.min} and ${limits.max}.`);
  }
  checkSource(o.source, `${at}.source`);
  const current = solvents[index]!;
  const updated: Solvent = { ...current, [o.field]: { value: o.value, source: o.source } };
  if ((o.field === "waterInSolventWtPct" || o.field === "solubilityInWaterWtPct") && current.miscibility.value === "miscible") {
    throw new KnowledgeInputError(`${at}.field`, `${current.name} is miscible with water; a mutual solubility does not apply.`);
  }
  return solvents.map((s, k) => (k === index ? updated : s));
}

function applyAqueousPoint(solutes: AqueousSolute[], o: Extract<ReferenceOverride, { kind: "aqueous-point" }>, i: number): AqueousSolute[] {
  const at = `overrides[${i}]`;
  const index = solutes.findIndex((s) => s.key === o.soluteKey);
  if (index < 0) throw new KnowledgeInputError(`${at}.soluteKey`, `No aqueous solute with key "${o.soluteKey}".`);
  if (typeof o.massFractionPct !== "number" || !(o.massFractionPct > 0) || o.massFractionPct > 100) {
    throw new KnowledgeInputError(`${at}.massFractionPct`, "A table point needs a mass fraction above 0 and at most 100 % w/w.");
  }
  if (typeof o.densityGPerMl !== "number" || !(o.densityGPerMl > 0.5) || o.densityGPerMl > 3) {
    throw new KnowledgeInputError(`${at}.densityGPerMl`, "A solution density must lie between 0.5 and 3 g/mL.");
  }
  checkSource(o.source, `${at}.source`);
  const current = solutes[index]!;
  const points = [
    ...current.points.value.filter((p) => p.massFractionPct !== o.massFractionPct),
    { massFractionPct: o.massFractionPct, densityGPerMl: o.densityGPerMl },
  ].sort((a, b) => a.massFractionPct - b.massFractionPct);
  const added = `the ${o.massFractionPct} % w/w point is a group correction (source: ${o.source})`;
  const updated: AqueousSolute = {
    ...current,
    points: { value: points, source: current.points.source, note: current.points.note ? `${current.points.note}; ${added}` : added },
  };
  return solutes.map((s, k) => (k === index ? updated : s));
}

function applyNewSolvent(solvents: Solvent[], o: Extract<ReferenceOverride, { kind: "solvent-new" }>, i: number): Solvent[] {
  const at = `overrides[${i}].solvent`;
  const s = o.solvent;
  if (!s || typeof s.key !== "string" || s.key.trim() === "") throw new KnowledgeInputError(`${at}.key`, "A new solvent needs a key.");
  if (solvents.some((x) => x.key === s.key)) throw new KnowledgeInputError(`${at}.key`, `A solvent with key "${s.key}" already exists.`);
  if (s.cas && solvents.some((x) => x.cas === s.cas)) {
    throw new KnowledgeInputError(`${at}.cas`, `CAS ${s.cas} is already in the tables.`);
  }
  const rho = s.densityGPerMl20C?.value;
  if (typeof rho !== "number" || !(rho > 0.5) || rho > 3) throw new KnowledgeInputError(`${at}.densityGPerMl20C`, "A density between 0.5 and 3 g/mL is needed.");
  checkSource(s.densityGPerMl20C.source, `${at}.densityGPerMl20C.source`);
  return [...solvents, s];
}

/** The shipped (or any) reference data with a group's corrections applied, as a new object. */
export function applyOverrides(base: ReferenceData, overrides: ReferenceOverride[]): ReferenceData {
  let solvents = base.solvents;
  let solutes = base.solutes;
  overrides.forEach((o, i) => {
    switch (o.kind) {
      case "solvent-value":
        solvents = applySolventValue(solvents, o, i);
        break;
      case "aqueous-point":
        solutes = applyAqueousPoint(solutes, o, i);
        break;
      case "solvent-new":
        solvents = applyNewSolvent(solvents, o, i);
        break;
      default:
        throw new KnowledgeInputError(`overrides[${i}].kind`, `Unknown correction kind "${String((o as { kind: unknown }).kind)}".`);
    }
  });
  return { solvents, solutes };
}
