import { Router } from "express";
import { z } from "zod";
import { fieldErrors } from "../../knowledge/contracts/layers";
import { planSourceRefs, solventRankRequestSchema, type SolventRankResponse, type SubstitutesResponse } from "../../knowledge/contracts/plans";
import { greenerSubstitutes, rankSolvents, type SolventConstraints } from "../../knowledge/plan";
import { normaliseName, suggestSolvents } from "../../knowledge/reference";
import type { ReferenceData, Solvent } from "../../knowledge/types";
import type { AppDeps } from "../deps";
import { badRequest, HttpError } from "../middleware/errors";
import { parse } from "../middleware/validate";
import { referenceFor } from "../reference-data";

const keyParam = z.string().trim().min(1).max(120);

/**
 * A solvent named in a URL: exact slug or CAS number only, since a fuzzy hit would answer for
 * another compound; 404 with the closest keys otherwise. (GET /api/solvents/:key uses the same rule.)
 */
export function solventByKeyOrCas(key: string, ref: ReferenceData): Solvent {
  const wanted = normaliseName(key);
  const solvent = ref.solvents.find((s) => normaliseName(s.key) === wanted || normaliseName(s.cas) === wanted);
  if (solvent) return solvent;
  throw new HttpError(404, "not_found", `No solvent with the key or CAS number "${key}".`, undefined, {
    suggestions: suggestSolvents(key, ref).map((s) => s.key),
  });
}

/** Public: extraction solvents ranked under constraints, and greener substitutes for one solvent. */
export function solventChoiceRouter(deps: AppDeps): Router {
  const router = Router();

  router.post("/solvents/rank", async (req, res) => {
    const parsed = solventRankRequestSchema.safeParse(req.body ?? {});
    if (!parsed.success) throw badRequest("Some fields need attention.", fieldErrors(parsed.error));
    const solvents = rankSolvents(parsed.data as SolventConstraints, await referenceFor(req, deps));
    const out: SolventRankResponse = { solvents, sourceTitles: planSourceRefs(solvents.flatMap((s) => s.sources)) };
    res.json(out);
  });

  router.get("/solvents/:key/substitutes", async (req, res) => {
    const ref = await referenceFor(req, deps);
    const solvent = solventByKeyOrCas(parse(keyParam, req.params.key), ref);
    const advice = greenerSubstitutes(solvent.key, ref);
    const out: SubstitutesResponse = { ...advice, sourceTitles: planSourceRefs(advice.sources) };
    res.json(out);
  });

  return router;
}
