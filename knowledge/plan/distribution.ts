import { KnowledgeInputError } from "../types";
import { netCharge, solvePh, type AqueousMixture } from "./acid-base";

export type ComponentKind = "acid" | "base" | "neutral";

/**
 * Share of the component in its neutral form at this pH (Henderson–Hasselbalch):
 * acid 1/(1 + 10^(pH − pKa)); base (pKa of the conjugate acid) 1/(1 + 10^(pKa − pH)); neutral 1.
 */
export function fractionNeutral(kind: ComponentKind, pKa: number | undefined, pH: number): number {
  if (kind === "neutral") return 1;
  if (pKa === undefined || !Number.isFinite(pKa)) throw new KnowledgeInputError("pKa", `An ${kind} needs a pKa.`);
  return kind === "acid" ? 1 / (1 + 10 ** (pH - pKa)) : 1 / (1 + 10 ** (pKa - pH));
}

/** D = K × fraction neutral: only the neutral form enters the organic layer (ion pairs ignored). */
export function distributionRatio(partitionCoefficient: number, kind: ComponentKind, pKa: number | undefined, pH: number): number {
  return partitionCoefficient * fractionNeutral(kind, pKa, pH);
}

/** Fraction of the component in the organic layer after one equilibration: D·V_org / (D·V_org + V_aq). */
export function fractionLeftInOrganic(distribution: number, organicVolumeMl: number, aqueousVolumeMl: number): number {
  const o = distribution * organicVolumeMl;
  return o / (o + aqueousVolumeMl);
}

export const LOGP_ESTIMATE_NOTE =
  "K estimated as the octanol–water P (K = 10^logP). Solvent–water K follows P only roughly: within about a log unit for esters, ethers and alcohols, further off for hydrocarbons and halogenated solvents (Collander relations, Leo, Hansch & Elkins 1971); use a measured K when there is one.";

/** Partition coefficient of the neutral form: the given K, or K = P = 10^logP. */
export function partitionCoefficientOf(c: { partitionCoefficient?: number; logP?: number; name?: string }): {
  value: number;
  estimated: boolean;
} {
  if (c.partitionCoefficient !== undefined) {
    if (!(c.partitionCoefficient >= 0) || !Number.isFinite(c.partitionCoefficient)) {
      throw new KnowledgeInputError("partitionCoefficient", "The partition coefficient must be a number ≥ 0.");
    }
    return { value: c.partitionCoefficient, estimated: false };
  }
  if (c.logP !== undefined && Number.isFinite(c.logP)) return { value: 10 ** c.logP, estimated: true };
  throw new KnowledgeInputError(
    "partitionCoefficient",
    `${c.name ?? "The component"} needs a partition coefficient or a log P.`,
  );
}

export interface EquilibriumComponent {
  kind: ComponentKind;
  pKa?: number;
  partitionCoefficient: number;
  /** amount in the funnel (organic layer before the pass) */
  mmol: number;
}

export interface EquilibriumResult {
  /** aqueous pH once the components have been taken up */
  pH: number;
  components: {
    fractionNeutral: number;
    distributionRatio: number;
    /** of the amount in the funnel */
    fractionInOrganic: number;
    mmolInOrganic: number;
    mmolInAqueous: number;
    /** amount held in the aqueous as the ion (salt form) */
    mmolIonisedInAqueous: number;
  }[];
}

function share(c: EquilibriumComponent, pH: number, organicVolumeMl: number, aqueousVolumeMl: number) {
  const fn = c.kind === "neutral" ? 1 : fractionNeutral(c.kind, c.pKa, pH);
  const d = c.partitionCoefficient * fn;
  const inOrg = fractionLeftInOrganic(d, organicVolumeMl, aqueousVolumeMl);
  return { fn, d, inOrg };
}

/**
 * One shake-and-settle: organic layer with its components against a fresh aqueous portion.
 * The aqueous pH and every component's split are solved together by charge balance, so a
 * wash without enough acid or base for the components shows it as a pH shift and a smaller
 * transfer — the stronger acid or base takes the available equivalents first.
 */
export function equilibratePass(
  organicVolumeMl: number,
  aqueousVolumeMl: number,
  aqueous: AqueousMixture,
  components: EquilibriumComponent[],
): EquilibriumResult {
  if (!(organicVolumeMl > 0)) throw new KnowledgeInputError("organic.volumeMl", "The organic volume must be above 0 mL.");
  if (!(aqueousVolumeMl > 0)) throw new KnowledgeInputError("washes.volumeMl", "The wash volume must be above 0 mL.");
  const charge = (pH: number) => {
    let q = netCharge(aqueous, pH);
    for (const c of components) {
      if (c.kind === "neutral" || c.mmol <= 0) continue;
      const { fn, inOrg } = share(c, pH, organicVolumeMl, aqueousVolumeMl);
      // mmol per mL is mol per L
      const ionMolL = (c.mmol * (1 - inOrg) * (1 - fn)) / aqueousVolumeMl;
      q += c.kind === "base" ? ionMolL : -ionMolL;
    }
    return q;
  };
  const pH = solvePh(charge);
  return {
    pH,
    components: components.map((c) => {
      const { fn, d, inOrg } = share(c, pH, organicVolumeMl, aqueousVolumeMl);
      const mmolInAqueous = c.mmol * (1 - inOrg);
      return {
        fractionNeutral: fn,
        distributionRatio: d,
        fractionInOrganic: inOrg,
        mmolInOrganic: c.mmol * inOrg,
        mmolInAqueous,
        mmolIonisedInAqueous: mmolInAqueous * (1 - fn),
      };
    }),
  };
}

/**
 * Equivalents of the ionisable components a wash would take up at its own pH, if it had
 * unlimited acid or base: the demand to set against the wash's capacity.
 */
export function ionisedDemandMmol(
  components: EquilibriumComponent[],
  washPh: number,
  organicVolumeMl: number,
  aqueousVolumeMl: number,
): { acidsMmol: number; basesMmol: number } {
  let acidsMmol = 0;
  let basesMmol = 0;
  for (const c of components) {
    if (c.kind === "neutral") continue;
    const { fn, inOrg } = share(c, washPh, organicVolumeMl, aqueousVolumeMl);
    const ion = c.mmol * (1 - inOrg) * (1 - fn);
    if (c.kind === "acid") acidsMmol += ion;
    else basesMmol += ion;
  }
  return { acidsMmol, basesMmol };
}

/** D and the one-pass fraction left in the organic layer across a pH range, for the distribution chart. */
export function distributionCurve(
  component: { kind: ComponentKind; pKa?: number; partitionCoefficient: number },
  organicVolumeMl: number,
  aqueousVolumeMl: number,
  fromPh = 0,
  toPh = 14,
  stepPh = 0.25,
): { pH: number; distributionRatio: number; fractionInOrganic: number }[] {
  if (!(stepPh > 0) || !(toPh >= fromPh)) throw new KnowledgeInputError("stepPh", "The pH range must run upwards in positive steps.");
  const n = Math.round((toPh - fromPh) / stepPh);
  return Array.from({ length: n + 1 }, (_, i) => {
    const pH = fromPh + i * stepPh;
    const d = distributionRatio(component.partitionCoefficient, component.kind, component.pKa, pH);
    return { pH, distributionRatio: d, fractionInOrganic: fractionLeftInOrganic(d, organicVolumeMl, aqueousVolumeMl) };
  });
}
