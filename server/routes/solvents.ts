import { Router } from "express";
import { z } from "zod";
import { aqueousSolutionEntry, solventDetail, solventListItem } from "../../knowledge/contracts/solvents";
import { normaliseName, suggestSolvents } from "../../knowledge/reference";
import type { ReferenceData, Solvent } from "../../knowledge/types";
import type { AppDeps } from "../deps";
import { HttpError } from "../middleware/errors";
import { parse } from "../middleware/validate";
import { referenceFor } from "../reference-data";

const listQuery = z.object({
  q: z.string().trim().max(120, { error: "Keep the search under 120 characters." }).optional(),
});
const keyParam = z.string().trim().min(1).max(120);

/** The best fuzzy matches always show; beyond them only entries that contain what was typed. */
const FUZZY_SHOWN = 8;

/** A search of the list: fuse.js ranks; the long tail of weak fuzzy hits is cut off. */
export function searchSolvents(q: string, ref: ReferenceData): Solvent[] {
  const wanted = normaliseName(q);
  return suggestSolvents(q, ref, ref.solvents.length).filter(
    (s, i) => i < FUZZY_SHOWN || [s.key, s.name, s.cas, s.formula, ...s.synonyms].some((n) => normaliseName(n).includes(wanted)),
  );
}

/** Public reference tables: solvents and aqueous work-up solutions, each value with its source. */
export function solventsRouter(deps: AppDeps): Router {
  const router = Router();

  router.get("/solvents", async (req, res) => {
    const { q } = parse(listQuery, req.query);
    const ref = await referenceFor(req, deps);
    const found = q ? searchSolvents(q, ref) : ref.solvents;
    res.json({ solvents: found.map(solventListItem) });
  });

  router.get("/solvents/:key", async (req, res) => {
    const key = parse(keyParam, req.params.key);
    const ref = await referenceFor(req, deps);
    // Exact slug or CAS number only: a fuzzy match here would answer for another compound.
    const wanted = normaliseName(key);
    const solvent = ref.solvents.find((s) => normaliseName(s.key) === wanted || normaliseName(s.cas) === wanted);
    if (!solvent) {
      throw new HttpError(404, "not_found", `No solvent with the key or CAS number "${key}".`, undefined, {
        suggestions: suggestSolvents(key, ref).map((s) => s.key),
      });
    }
    res.json(solventDetail(solvent));
  });

  router.get("/aqueous-solutions", async (req, res) => {
    const ref = await referenceFor(req, deps);
    res.json({ solutes: ref.solutes.map(aqueousSolutionEntry) });
  });

  return router;
}
