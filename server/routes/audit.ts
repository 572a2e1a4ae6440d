import { Router } from "express";
import { and, asc, count, desc, eq, gte, lte, type SQL } from "drizzle-orm";
import { z } from "zod";
import {
  auditListQuery,
  auditRestoreBody,
  type AuditEntry,
  type AuditListResponse,
  type AuditRestoreResponse,
} from "../../knowledge/contracts/audit";
import type { Database } from "../../db/client";
import { auditLog, user, type AuditRow } from "../../db/schema";
import { recordAudit, restorerFor, type DbOrTx } from "../audit";
import type { AppDeps } from "../deps";
import { badRequest, notFound } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";

const idParam = z.string().min(1).max(100);

type JoinedRow = AuditRow & { actorName: string | null; actorEmail: string | null };

function toEntry(row: JoinedRow): AuditEntry {
  return {
    id: row.id,
    action: row.action,
    entityType: row.entityType,
    entityId: row.entityId,
    actor: row.actorId ? { id: row.actorId, name: row.actorName ?? "", email: row.actorEmail ?? "" } : null,
    before: row.before ?? null,
    after: row.after ?? null,
    reason: row.reason,
    restoredFrom: row.restoredFrom,
    createdAt: row.createdAt.toISOString(),
    restorable: restorerFor(row.entityType) !== undefined,
  };
}

function joined(db: DbOrTx) {
  return db
    .select({
      id: auditLog.id,
      groupId: auditLog.groupId,
      actorId: auditLog.actorId,
      action: auditLog.action,
      entityType: auditLog.entityType,
      entityId: auditLog.entityId,
      before: auditLog.before,
      after: auditLog.after,
      reason: auditLog.reason,
      restoredFrom: auditLog.restoredFrom,
      createdAt: auditLog.createdAt,
      actorName: user.name,
      actorEmail: user.email,
    })
    .from(auditLog)
    .leftJoin(user, eq(auditLog.actorId, user.id));
}

/** One entry of the group's log, or 404 (another group's entry does not exist for the caller). */
export async function auditEntryOf(db: DbOrTx, groupId: string, id: string): Promise<AuditEntry> {
  const rows = await joined(db)
    .where(and(eq(auditLog.groupId, groupId), eq(auditLog.id, id)))
    .limit(1);
  if (!rows[0]) throw notFound("That audit entry");
  return toEntry(rows[0]);
}

async function facets(db: Database, groupId: string): Promise<AuditListResponse["facets"]> {
  const [actions, types, actors] = await Promise.all([
    db.selectDistinct({ v: auditLog.action }).from(auditLog).where(eq(auditLog.groupId, groupId)).orderBy(asc(auditLog.action)),
    db.selectDistinct({ v: auditLog.entityType }).from(auditLog).where(eq(auditLog.groupId, groupId)).orderBy(asc(auditLog.entityType)),
    db
      .selectDistinct({ id: user.id, name: user.name })
      .from(auditLog)
      .innerJoin(user, eq(auditLog.actorId, user.id))
      .where(eq(auditLog.groupId, groupId))
      .orderBy(asc(user.name)),
  ]);
  return { actions: actions.map((r) => r.v), entityTypes: types.map((r) => r.v), actors };
}

export function auditRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get("/audit", requireGroup(db, "lead"), async (req, res) => {
    const q = parse(auditListQuery, req.query);
    const groupId = req.group!.id;
    const where: SQL[] = [eq(auditLog.groupId, groupId)];
    if (q.entity) where.push(eq(auditLog.entityType, q.entity));
    if (q.entityId) where.push(eq(auditLog.entityId, q.entityId));
    if (q.actor) where.push(eq(auditLog.actorId, q.actor));
    if (q.action) where.push(eq(auditLog.action, q.action));
    if (q.from) where.push(gte(auditLog.createdAt, q.from));
    if (q.to) where.push(lte(auditLog.createdAt, q.to));
    if (q.from && q.to && q.from > q.to) throw badRequest("The start comes after the end.", { from: "The start comes after the end." });
    const order = q.sort === "oldest" ? [asc(auditLog.createdAt), asc(auditLog.id)] : [desc(auditLog.createdAt), desc(auditLog.id)];
    const [rows, totals, facetLists] = await Promise.all([
      joined(db)
        .where(and(...where))
        .orderBy(...order)
        .limit(q.limit)
        .offset(q.offset),
      db.select({ n: count() }).from(auditLog).where(and(...where)),
      facets(db, groupId),
    ]);
    const body: AuditListResponse = { entries: rows.map(toEntry), total: totals[0]?.n ?? 0, facets: facetLists };
    res.json(body);
  });

  router.post("/audit/:id/restore", requireGroup(db, "lead"), async (req, res) => {
    const id = parse(idParam, req.params.id);
    const body = parse(auditRestoreBody, req.body ?? {});
    const groupId = req.group!.id;
    const actorId = req.user!.id;
    const result = await db.transaction(async (tx) => {
      const entry = await auditEntryOf(tx, groupId, id);
      const registered = restorerFor(entry.entityType);
      if (!registered) throw badRequest(`Entries about "${entry.entityType}" cannot be restored from the log.`);
      const snapshot = (body.version === "before" ? entry.before : entry.after) ?? null;
      if (snapshot === null && !registered.restoresEmpty) {
        throw badRequest(
          body.version === "before"
            ? "This entry records a creation: there is no earlier version to bring back. Retire the record instead."
            : "This entry has no later version to bring back.",
        );
      }
      const changed = await registered.restore({ tx, groupId, actorId, entityId: entry.entityId, snapshot, version: body.version });
      const newId = await recordAudit(tx, {
        groupId,
        actorId,
        action: "restore",
        entityType: entry.entityType,
        entityId: entry.entityId,
        before: changed.before,
        after: changed.after,
        reason: body.reason ?? `Restored the version ${body.version === "before" ? "before" : "after"} the ${entry.action} of ${entry.createdAt}.`,
        restoredFrom: entry.id,
      });
      return { entry: await auditEntryOf(tx, groupId, newId), record: changed.after };
    });
    const out: AuditRestoreResponse = result;
    res.json(out);
  });

  return router;
}
