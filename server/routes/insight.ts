import { Router } from "express";
import { insightQuery } from "../../knowledge/contracts/insight";
import type { AppDeps } from "../deps";
import { groupInsight, insightPeriod } from "../insight";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";

/** GET /api/insight?from=&to= — any member of the group. */
export function insightRouter({ db }: AppDeps): Router {
  const router = Router();
  router.get("/insight", requireGroup(db), async (req, res) => {
    const q = parse(insightQuery, req.query);
    res.json(await groupInsight(db, req.group!.id, insightPeriod(q)));
  });
  return router;
}
