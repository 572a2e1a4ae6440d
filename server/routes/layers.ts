import { Router } from "express";
import { fieldErrors, layerPredictRequestSchema, round3, type LayerPredictResponse } from "../../knowledge/contracts/layers";
import { sourceTitle } from "../../knowledge/contracts/solvents";
import { predictLayers, type LayerInput, type LayerPrediction } from "../../knowledge/layers";
import { findSolute, findSolvent, normaliseName } from "../../knowledge/reference";
import type { KnowledgeWarning, ReferenceData } from "../../knowledge/types";
import type { AppDeps } from "../deps";
import { badRequest } from "../middleware/errors";
import { referenceFor } from "../reference-data";

const round2 = (x: number) => Math.round(x * 100) / 100;

/** predictLayers' answer for the wire: densities to 3 decimals, volumes and fractions to 2. */
export function layerPredictResponse(p: LayerPrediction): LayerPredictResponse {
  return {
    ...p,
    organicDensityGPerMl: round3(p.organicDensityGPerMl),
    aqueousDensityGPerMl: round3(p.aqueousDensityGPerMl),
    densityDifferenceGPerMl: round3(p.densityDifferenceGPerMl),
    signedDensityDifferenceGPerMl: round3(p.signedDensityDifferenceGPerMl),
    organicVolumeMl: round2(p.organicVolumeMl),
    aqueousVolumeMl: round2(p.aqueousVolumeMl),
    totalVolumeMl: round2(p.totalVolumeMl),
    organicParts: p.organicParts.map((o) => ({ ...o, densityGPerMl: round3(o.densityGPerMl) })),
    aqueous: { ...p.aqueous, massFractionPct: round2(p.aqueous.massFractionPct), densityGPerMl: round3(p.aqueous.densityGPerMl) },
    sourceTitles: p.sources.map((key) => ({ key, ...sourceTitle(key) })),
  };
}

interface Named {
  key: string;
  name: string;
  cas: string;
  formula: string;
  synonyms: string[];
}

const isOwnName = (item: Named, typed: string) =>
  [item.key, item.name, item.cas, item.formula, ...item.synonyms].some((n) => normaliseName(n) === normaliseName(typed));

/**
 * The look-ups forgive typing slips, and a slip can land on another compound: say so whenever
 * a name was read as something it does not literally name.
 */
export function interpretedNames(request: LayerInput, ref: ReferenceData): KnowledgeWarning[] {
  const read: { typed: string; as?: Named }[] = [
    ...request.organic.map((p) => ({ typed: p.solvent, as: findSolvent(p.solvent, ref) })),
    { typed: request.aqueous.solute, as: findSolute(request.aqueous.solute, ref) },
  ];
  return read
    .filter((r): r is { typed: string; as: Named } => !!r.as && !isOwnName(r.as, r.typed))
    .map((r) => ({
      code: "name-interpreted",
      message: `Read “${r.typed}” as ${r.as.name} (CAS ${r.as.cas}); if you meant another compound, it is not in the tables.`,
    }));
}

/** Public: which layer is on top, from the phase densities. */
export function layersRouter(deps: AppDeps): Router {
  const router = Router();
  router.post("/layers/predict", async (req, res) => {
    const parsed = layerPredictRequestSchema.safeParse(req.body);
    if (!parsed.success) throw badRequest("Some fields need attention.", fieldErrors(parsed.error));
    const ref = await referenceFor(req, deps);
    // Unknown names, impossible concentrations and temperatures outside a solvent's liquid
    // range throw KnowledgeInputError: the error handler answers 400 with the field and suggestions.
    const answer = layerPredictResponse(predictLayers(parsed.data, ref));
    res.json({ ...answer, warnings: [...interpretedNames(parsed.data, ref), ...answer.warnings] });
  });
  return router;
}
