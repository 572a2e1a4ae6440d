import { Router } from "express";
import { fieldErrors, layerPredictRequestSchema, round3, type LayerPredictResponse } from "../../knowledge/contracts/layers";
import { sourceTitle } from "../../knowledge/contracts/solvents";
import { predictLayers, type LayerPrediction } from "../../knowledge/layers";
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

/** Public: which layer is on top, from the phase densities. */
export function layersRouter(deps: AppDeps): Router {
  const router = Router();
  router.post("/layers/predict", async (req, res) => {
    const parsed = layerPredictRequestSchema.safeParse(req.body);
    if (!parsed.success) throw badRequest("Some fields need attention.", fieldErrors(parsed.error));
    const ref = await referenceFor(req, deps);
    // Unknown names, impossible concentrations and temperatures outside a solvent's liquid
    // range throw KnowledgeInputError: the error handler answers 400 with the field and suggestions.
    res.json(layerPredictResponse(predictLayers(parsed.data, ref)));
  });
  return router;
}
