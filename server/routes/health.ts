import { Router } from "express";
import { sql } from "drizzle-orm";
import type { AppDeps } from "../deps";

export function healthRouter({ db, dbKind }: AppDeps): Router {
  const router = Router();
  router.get("/health", async (_req, res) => {
    await db.execute(sql`select 1`);
    res.json({ status: "ok", database: dbKind });
  });
  return router;
}
