import { Router } from "express";
import { buildDigest, sendDigest } from "../case-mail";
import type { AppDeps } from "../deps";
import { requireGroup } from "../middleware/session";

/** The weekly digest of the caller's group: a preview for the desk, and "send it now". */
export function digestRouter(deps: AppDeps): Router {
  const router = Router();
  const lead = requireGroup(deps.db, "lead");

  router.get("/digest", lead, async (req, res) => {
    res.json(await buildDigest(deps, req.group!.id));
  });

  router.post("/digest/send", lead, async (req, res) => {
    res.json(await sendDigest(deps, req.group!.id));
  });

  return router;
}
