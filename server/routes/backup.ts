import express, { Router } from "express";
import { eq } from "drizzle-orm";
import { BACKUP_MAX_BYTES, BACKUP_MEDIA_TYPE, backupDocument, type ImportResponse } from "../../knowledge/contracts/backup";
import { organization } from "../../db/schema";
import { backupCounts, importBackup, writeBackup } from "../backup";
import type { AppDeps } from "../deps";
import { badRequest } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";

/** Total records of a backup, sent ahead so a client can show progress by counting lines. */
export const BACKUP_RECORDS_HEADER = "X-Backup-Records";

export function backupRouter({ db, storage }: AppDeps): Router {
  const router = Router();
  const lead = requireGroup(db, "lead");
  // A large group's backup is far over the API's 1 MB JSON limit: it comes under its own media type.
  const backupBody = express.json({ type: BACKUP_MEDIA_TYPE, limit: BACKUP_MAX_BYTES });

  router.get("/backup", lead, async (req, res) => {
    const groupId = req.group!.id;
    const [group] = await db.select({ slug: organization.slug }).from(organization).where(eq(organization.id, groupId));
    const counts = await backupCounts(db, groupId);
    const total = Object.values(counts).reduce((s, n) => s + n, 0);
    const day = new Date().toISOString().slice(0, 10);
    res.status(200);
    res.setHeader("Content-Type", "application/json; charset=utf-8");
    res.setHeader("Content-Disposition", `attachment; filename="phasewise-${(group?.slug ?? "group").replace(/[^a-z0-9-]/gi, "")}-${day}.json"`);
    res.setHeader("Cache-Control", "no-store");
    res.setHeader(BACKUP_RECORDS_HEADER, String(total));
    const write = (chunk: string) =>
      new Promise<void>((resolve, reject) => {
        if (res.destroyed) return reject(new Error("The reader went away."));
        if (res.write(chunk)) return resolve();
        res.once("drain", resolve);
        res.once("close", () => reject(new Error("The reader went away.")));
      });
    try {
      await writeBackup(db, groupId, write);
      res.end();
    } catch (e) {
      // Half a backup must never look like a whole one: cut the connection instead of ending it.
      if (res.headersSent) res.destroy(e as Error);
      else throw e;
    }
  });

  router.post("/backup/import", lead, backupBody, async (req, res) => {
    if (!req.is("application/json") && !req.is(BACKUP_MEDIA_TYPE)) {
      throw badRequest(`Send the backup as ${BACKUP_MEDIA_TYPE}.`);
    }
    const doc = parse(backupDocument, req.body);
    const written: string[] = [];
    let result: ImportResponse;
    try {
      result = await db.transaction((tx) => importBackup(tx, storage, { groupId: req.group!.id, importerId: req.user!.id, doc }, written));
    } catch (e) {
      // Copied photo files belong to rows that were rolled back.
      await Promise.all(written.map((k) => storage.delete(k).catch(() => undefined)));
      throw e;
    }
    res.status(201).json(result);
  });

  return router;
}
