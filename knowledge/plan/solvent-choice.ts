import { aqueousDensityGPerMl, findSolvent, requireSolute, requireSolvent, SHIPPED_REFERENCE, solventDensityGPerMl } from "../reference";
import { KnowledgeInputError, type Concentration, type GuideCategory, type ReferenceData, type Solvent } from "../types";
import { vapourPressureMbar } from "./evaporation";
import { TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML } from "../layers";

/** Best first, as the selection guide orders them. */
export const GUIDE_ORDER: GuideCategory[] = ["recommended", "problematic", "hazardous", "highly-hazardous"];
const guideRank = (c: GuideCategory) => GUIDE_ORDER.indexOf(c);

export interface SolventConstraints {
  /** drop solvents that mix with water (default true); partly miscible ones stay, with a note */
  immiscibleWithWater?: boolean;
  /** where the organic layer must sit against the aqueous phase */
  organicLayer?: "top" | "bottom";
  /** the aqueous phase to compare densities with; water when absent */
  aqueous?: { solute: string; concentration?: Concentration };
  /** 20 °C when absent */
  temperatureC?: number;
  bpMinC?: number;
  bpMaxC?: number;
  noHalogen?: boolean;
  noPeroxideFormer?: boolean;
  /** the selection-guide category must be this or better */
  minGuideCategory?: GuideCategory;
  /** solvent names or keys to rank; every non-water solvent of the table when absent */
  candidates?: string[];
}

export interface RankedSolvent {
  key: string;
  name: string;
  meetsConstraints: boolean;
  /** constraints it fails, one line each */
  failures: string[];
  /** facts behind the rank, one line each */
  reasons: string[];
  guideCategory: GuideCategory;
  boilingPointC: number;
  densityGPerMl: number | null;
  /** organic − aqueous; null when the density is not known at this temperature */
  densityDifferenceGPerMl: number | null;
  waterInSolventWtPct: number | null;
  peroxideClass: string | null;
  halogenated: boolean;
  sources: string[];
}

/**
 * 0 when solvent and water barely dissolve each other (< 2 wt% either way), 1 up to 10 wt%,
 * 2 beyond (MEK, 1-butanol: poor extraction solvents that carry water and salts).
 */
function mutualSolubilityClass(s: Solvent): number {
  if (s.miscibility.value === "miscible") return 3;
  const worst = Math.max(s.waterInSolventWtPct.value ?? 0, s.solubilityInWaterWtPct.value ?? 0);
  return worst < 2 ? 0 : worst <= 10 ? 1 : 2;
}

/** Splits slower below this |Δρ| (common practice: warn under about 0.05 g/mL). */
const SLOW_SPLIT_G_PER_ML = 0.05;

function rankOne(s: Solvent, c: SolventConstraints, aqueousDensity: number, T: number): RankedSolvent {
  const failures: string[] = [];
  const reasons: string[] = [];
  const guide = s.guide.value.category;
  let density: number | null = null;
  try {
    density = solventDensityGPerMl(s, T);
  } catch {
    failures.push(`not a liquid at ${T} °C (mp ${s.meltingPointC.value} °C, bp ${s.boilingPointC.value} °C)`);
  }
  const delta = density === null ? null : density - aqueousDensity;

  if ((c.immiscibleWithWater ?? true) && s.miscibility.value === "miscible") failures.push("mixes with water");
  if (s.miscibility.value === "partial") {
    reasons.push(
      `partly miscible: takes up ${s.waterInSolventWtPct.value ?? "?"} wt% water and ${s.solubilityInWaterWtPct.value ?? "?"} wt% of it dissolves in water`,
    );
  }
  if (c.organicLayer && delta !== null) {
    const isTop = delta < 0;
    if ((c.organicLayer === "top") !== isTop) failures.push(`the organic layer would be on the ${isTop ? "top" : "bottom"}`);
    // The layer check's own threshold: closer than this, which layer ends up on top is a guess.
    else if (Math.abs(delta) < TOO_CLOSE_DENSITY_DIFFERENCE_G_PER_ML)
      failures.push(`within ${Math.abs(delta).toFixed(3)} g/mL of the aqueous phase: no sure ${c.organicLayer} layer`);
  }
  if (delta !== null) {
    reasons.push(`${delta < 0 ? "lighter" : "denser"} than the aqueous phase by ${Math.abs(delta).toFixed(3)} g/mL${Math.abs(delta) < SLOW_SPLIT_G_PER_ML ? " (slow split, order uncertain)" : ""}`);
  }
  const bp = s.boilingPointC.value;
  if (c.bpMinC !== undefined && bp < c.bpMinC) failures.push(`boils at ${bp} °C, below ${c.bpMinC} °C`);
  if (c.bpMaxC !== undefined && bp > c.bpMaxC) failures.push(`boils at ${bp} °C, above ${c.bpMaxC} °C`);
  if (c.noHalogen && s.halogenated) failures.push("halogenated");
  if (c.noPeroxideFormer && s.peroxideClass.value !== null) failures.push(`peroxide former (class ${s.peroxideClass.value})`);
  if (c.minGuideCategory && guideRank(guide) > guideRank(c.minGuideCategory)) failures.push(`selection guide: ${guide}, worse than ${c.minGuideCategory}`);
  reasons.push(`selection guide: ${guide} (${s.guide.value.reason})`);
  reasons.push(`bp ${bp} °C`);
  if (s.waterInSolventWtPct.value !== null && s.miscibility.value !== "partial") reasons.push(`takes up ${s.waterInSolventWtPct.value} wt% water`);
  if (s.peroxideClass.value !== null && !c.noPeroxideFormer) reasons.push(`peroxide former (class ${s.peroxideClass.value})`);
  if (s.halogenated && !c.noHalogen) reasons.push("halogenated waste");
  return {
    key: s.key,
    name: s.name,
    meetsConstraints: failures.length === 0,
    failures,
    reasons,
    guideCategory: guide,
    boilingPointC: bp,
    densityGPerMl: density,
    densityDifferenceGPerMl: delta,
    waterInSolventWtPct: s.waterInSolventWtPct.value,
    peroxideClass: s.peroxideClass.value,
    halogenated: s.halogenated,
    sources: [s.guide.source, s.densityGPerMl20C.source, s.miscibility.source, s.peroxideClass.source, s.boilingPointC.source],
  };
}

/**
 * Candidate extraction solvents, those meeting every constraint first; then by selection-guide
 * category, lower mutual solubility with water, the cleaner split (larger |Δρ|, capped at
 * 0.15 g/mL where it stops mattering), and less water carried over.
 */
export function rankSolvents(constraints: SolventConstraints = {}, ref: ReferenceData = SHIPPED_REFERENCE): RankedSolvent[] {
  const T = constraints.temperatureC ?? 20;
  const aqueous = constraints.aqueous ?? { solute: "water" };
  const solute = requireSolute(aqueous.solute, "aqueous.solute", ref);
  const aqueousDensity = aqueousDensityGPerMl(solute, aqueous.concentration, T, "aqueous.concentration");
  const candidates = constraints.candidates
    ? constraints.candidates.map((q, i) => requireSolvent(q, `candidates[${i}]`, ref))
    : ref.solvents.filter((s) => s.family !== "water");
  const ranked = candidates.map((s) => rankOne(s, constraints, aqueousDensity, T));
  const split = (r: RankedSolvent) => Math.min(Math.abs(r.densityDifferenceGPerMl ?? 0), 0.15);
  const byKey = new Map(candidates.map((s) => [s.key, s]));
  const mutual = (r: RankedSolvent) => mutualSolubilityClass(byKey.get(r.key)!);
  return ranked.sort(
    (a, b) =>
      Number(b.meetsConstraints) - Number(a.meetsConstraints) ||
      guideRank(a.guideCategory) - guideRank(b.guideCategory) ||
      mutual(a) - mutual(b) ||
      split(b) - split(a) ||
      (a.waterInSolventWtPct ?? 100) - (b.waterInSolventWtPct ?? 100),
  );
}

// ── greener substitutes ──────────────────────────────────────────────────────

/** The replacement table of the Pfizer guide (Alfonsi et al. 2008), as reproduced in a university EHS page. */
const REPLACEMENTS: { replace: string[]; with: string[] }[] = [
  { replace: ["dichloromethane"], with: ["ethyl acetate", "MTBE", "toluene", "2-MeTHF", "CPME", "isopropyl acetate"] },
  { replace: ["hexane", "pentane"], with: ["heptane"] },
  { replace: ["diethyl ether", "diisopropyl ether"], with: ["MTBE", "2-MeTHF", "CPME"] },
  { replace: ["1,4-dioxane", "1,2-dimethoxyethane"], with: ["2-MeTHF", "MTBE"] },
  { replace: ["benzene"], with: ["toluene"] },
  { replace: ["chloroform", "carbon tetrachloride", "1,2-dichloroethane"], with: ["dichloromethane", "ethyl acetate", "2-MeTHF", "toluene"] },
  { replace: ["DMF", "N,N-dimethylacetamide", "NMP"], with: ["acetonitrile", "2-MeTHF"] },
  { replace: ["THF"], with: ["2-MeTHF"] },
];

/** Caveats beyond the computed ones, from the same replacement table's notes (mostly recalled practice). */
const KNOWN_CAVEATS: Record<string, string[]> = {
  "ethyl-acetate": ["carries polar impurities; hydrolyses or aminolyses under strong base, strong acid or amines"],
  mtbe: ["dissolves polar compounds poorly; cleaved by strong acids"],
  "2-methyltetrahydrofuran": ["costs more, but splits cleanly from water and is stable to base"],
  cpme: ["slow to strip; costly"],
  toluene: ["dissolves polar compounds poorly; reproductive toxicity (H361d)"],
  "isopropyl-acetate": ["takes up less water than ethyl acetate"],
  heptane: ["still very toxic to aquatic life (H410); petroleum fractions vary"],
  dichloromethane: ["a lesser evil only: still halogenated and a suspected carcinogen"],
  acetonitrile: ["mixes with water: separates only from brine or when cold"],
};

export const SUBSTITUTION_CHECKLIST = [
  "Does the product dissolve in, and partition into, the new solvent?",
  "Layer order with both phases as they will be (run the layer check).",
  "Water carried over and the drying load.",
  "Boiling point and the rotary-evaporator settings.",
  "Peroxide status.",
  "Compatibility: esters with strong base or amines, ethers with strong acids, ketones with amines.",
  "Local EHS restrictions, cost and supply.",
];

export interface Substitute {
  key: string;
  name: string;
  guideCategory: GuideCategory;
  /** from the replacement table, or computed from the solvent table when the solvent has no entry */
  basis: "replacement-table" | "solvent-table";
  caveats: string[];
  boilingPointC: number;
  densityGPerMl20C: number;
  waterInSolventWtPct: number | null;
  /** pressure (mbar) at which it boils at 40 °C, when the Antoine constants cover it */
  pressureFor40CMbar: number | null;
}

export interface SubstituteAdvice {
  solvent: { key: string; name: string; guideCategory: GuideCategory };
  substitutes: Substitute[];
  checklist: string[];
  sources: string[];
  note?: string;
}

const WATER_20C_G_PER_ML = 0.9982;

function pressureAt40(s: Solvent): number | null {
  try {
    return vapourPressureMbar(s, 40);
  } catch {
    return null;
  }
}

function caveatsFor(original: Solvent, sub: Solvent): string[] {
  const out: string[] = [];
  const origBottom = original.densityGPerMl20C.value > WATER_20C_G_PER_ML;
  const subBottom = sub.densityGPerMl20C.value > WATER_20C_G_PER_ML;
  if (original.miscibility.value !== "miscible" && sub.miscibility.value !== "miscible" && origBottom !== subBottom) {
    out.push(
      `layer order flips: over water the organic layer is now on the ${subBottom ? "bottom" : "top"} (${sub.densityGPerMl20C.value} vs ${original.densityGPerMl20C.value} g/mL) — change the draining steps and confirm with the drop test`,
    );
  }
  if (original.miscibility.value === "miscible" && sub.miscibility.value !== "miscible") {
    out.push(`forms two phases with water, unlike ${original.name}: the work-up changes (it can be extracted without stripping first)`);
  }
  if (Math.abs(sub.densityGPerMl20C.value - WATER_20C_G_PER_ML) < 0.12 && sub.miscibility.value !== "miscible") {
    out.push(`small density difference from water (${Math.abs(sub.densityGPerMl20C.value - WATER_20C_G_PER_ML).toFixed(2)} g/mL): slower splits, and brine or a heavy product can change the order`);
  }
  const wOrig = original.waterInSolventWtPct.value;
  const wSub = sub.waterInSolventWtPct.value;
  if (wSub !== null && (wOrig === null || wSub > wOrig * 1.5) && wSub >= 1) {
    out.push(`carries more water (${wSub} wt% vs ${wOrig ?? "miscible"}): wash with brine and expect a larger drying load`);
  }
  const dBp = sub.boilingPointC.value - original.boilingPointC.value;
  if (Math.abs(dBp) >= 15) {
    const p40 = pressureAt40(sub);
    out.push(
      `boils at ${sub.boilingPointC.value} °C vs ${original.boilingPointC.value} °C: ${dBp > 0 ? "slower to strip" : "strips faster, watch bumping"}${
        p40 !== null ? `; for a 40 °C vapour set about ${Math.round(p40)} mbar` : ""
      }`,
    );
  }
  if (sub.peroxideClass.value !== null && original.peroxideClass.value === null) {
    out.push(`peroxide former (class ${sub.peroxideClass.value}): date the bottle and test before concentrating`);
  }
  if (sub.flashPointC.value !== null && sub.flashPointC.value <= -18) out.push(`very low flash point (${sub.flashPointC.value} °C)`);
  if (guideRank(sub.guide.value.category) >= guideRank(original.guide.value.category)) {
    out.push(`no better in the selection guide (${sub.guide.value.category}); chosen for another reason in the replacement table`);
  }
  return [...out, ...(KNOWN_CAVEATS[sub.key] ?? [])];
}

function substituteOf(original: Solvent, sub: Solvent, basis: Substitute["basis"]): Substitute {
  return {
    key: sub.key,
    name: sub.name,
    guideCategory: sub.guide.value.category,
    basis,
    caveats: caveatsFor(original, sub),
    boilingPointC: sub.boilingPointC.value,
    densityGPerMl20C: sub.densityGPerMl20C.value,
    waterInSolventWtPct: sub.waterInSolventWtPct.value,
    pressureFor40CMbar: pressureAt40(sub),
  };
}

/**
 * Greener substitutes for an extraction solvent: the Pfizer replacement table first (those of
 * its entries the solvent table holds), each with computed caveats; for a solvent the table
 * does not list, the water-immiscible solvents the selection guide ranks better.
 */
export function greenerSubstitutes(solventQuery: string, ref: ReferenceData = SHIPPED_REFERENCE): SubstituteAdvice {
  const original = requireSolvent(solventQuery, "solvent", ref);
  if (original.family === "water") throw new KnowledgeInputError("solvent", "Water is the aqueous phase, not an extraction solvent.");
  const entry = REPLACEMENTS.find((r) => r.replace.some((q) => findSolvent(q, ref)?.key === original.key));
  const head = { key: original.key, name: original.name, guideCategory: original.guide.value.category };
  if (entry) {
    const subs = entry.with
      .map((q) => findSolvent(q, ref))
      .filter((s): s is Solvent => s !== undefined && s.key !== original.key)
      .map((s) => substituteOf(original, s, "replacement-table"));
    return { solvent: head, substitutes: subs, checklist: SUBSTITUTION_CHECKLIST, sources: ["alfonsi-2008-from-memory", "chem21-2016-from-memory"] };
  }
  const better = ref.solvents
    .filter(
      (s) =>
        s.family !== "water" &&
        s.key !== original.key &&
        s.miscibility.value !== "miscible" &&
        guideRank(s.guide.value.category) < guideRank(original.guide.value.category),
    )
    .sort((a, b) => guideRank(a.guide.value.category) - guideRank(b.guide.value.category))
    .map((s) => substituteOf(original, s, "solvent-table"));
  return {
    solvent: head,
    substitutes: better,
    checklist: SUBSTITUTION_CHECKLIST,
    sources: ["chem21-2016-from-memory"],
    note:
      better.length === 0
        ? `${original.name} is already among the best-ranked solvents in the selection guide.`
        : `${original.name} has no entry in the replacement table; these are the water-immiscible solvents the selection guide ranks better.`,
  };
}
