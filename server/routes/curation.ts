import { Router, type Request } from "express";
import { and, asc, count, desc, eq, exists, getTableColumns, inArray, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { z } from "zod";
import {
  RETIRE_LABELS,
  bulkVerifyBody,
  mergeBody,
  myRequestsQuery,
  requestBody,
  requestPatchBody,
  restoreBody,
  retireBody,
  reviewQuery,
  verifyBody,
  type BulkVerifyResponse,
  type CaseRequest,
  type CaseRequestList,
  type CurationState,
  type MergeResponse,
  type RequestStatus,
  type ReviewItem,
  type ReviewKind,
  type ReviewResponse,
} from "../../knowledge/contracts/curation";
import type { Database } from "../../db/client";
import { caseAttempts, casePhotos, caseRequests, cases, user } from "../../db/schema";
import { recordAudit, registerRestorer, type DbOrTx } from "../audit";
import { toSummary, type CaseRow } from "../case-records";
import { curationState, mergeCase, unmergeCase } from "../curation";
import type { AppDeps } from "../deps";
import { HttpError, badRequest, forbidden, notFound } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";
import { reviewChecks } from "../review-checks";
import { roleAtLeast } from "../roles";
import { caseInGroup } from "./cases";

const idParam = z.string().min(1).max(100);

// ── verify ───────────────────────────────────────────────────────────────────

/**
 * Marks a case verified with its working fix: the attempt named, else the first that cleared.
 * Writes the audit entry in `tx`. Returns the state after, or the same state when nothing changed.
 */
async function verifyCase(
  tx: DbOrTx,
  args: { groupId: string; actorId: string; caseId: string; attemptId?: string; note?: string },
): Promise<CurationState> {
  const before = await curationState(tx, args.groupId, args.caseId, true);
  if (before.retired) {
    throw new HttpError(409, "retired", before.mergedInto ? "That case was merged into another; verify the case that remains." : "That case is retired; restore it first.");
  }
  const attempts = await tx
    .select({ id: caseAttempts.id, outcome: caseAttempts.outcome, position: caseAttempts.position })
    .from(caseAttempts)
    .where(eq(caseAttempts.caseId, args.caseId))
    .orderBy(asc(caseAttempts.position));
  let fixId: string | null;
  if (args.attemptId) {
    const chosen = attempts.find((a) => a.id === args.attemptId);
    if (!chosen) throw badRequest("That attempt is not on this case.", { attemptId: "Pick one of this case's attempts." });
    if (chosen.outcome !== "cleared" && chosen.outcome !== "partly") {
      throw badRequest("Only an attempt that cleared (or partly cleared) the emulsion can be the working fix.", {
        attemptId: "This attempt did not clear the emulsion.",
      });
    }
    fixId = chosen.id;
  } else {
    fixId = attempts.find((a) => a.outcome === "cleared")?.id ?? null;
  }
  if (before.verified && before.verifiedAttemptId === fixId) return before;
  await tx
    .update(cases)
    .set({ verified: true, verifiedBy: args.actorId, verifiedAt: new Date(), verifiedAttemptId: fixId })
    .where(and(eq(cases.id, args.caseId), eq(cases.groupId, args.groupId)));
  const after = await curationState(tx, args.groupId, args.caseId);
  await recordAudit(tx, {
    groupId: args.groupId,
    actorId: args.actorId,
    action: "verify",
    entityType: "case",
    entityId: args.caseId,
    before,
    after,
    reason: args.note ?? null,
  });
  return after;
}

// ── requests ─────────────────────────────────────────────────────────────────

const askedBy = alias(user, "asked_by_user");
const askedOf = alias(user, "asked_of_user");
const answeredBy = alias(user, "answered_by_user");

function requestRows(db: DbOrTx) {
  return db
    .select({
      r: caseRequests,
      caseTitle: cases.title,
      askedByName: askedBy.name,
      askedOfName: askedOf.name,
      answeredByName: answeredBy.name,
    })
    .from(caseRequests)
    .innerJoin(cases, eq(cases.id, caseRequests.caseId))
    .innerJoin(askedBy, eq(askedBy.id, caseRequests.askedBy))
    .innerJoin(askedOf, eq(askedOf.id, caseRequests.askedOf))
    .leftJoin(answeredBy, eq(answeredBy.id, caseRequests.answeredBy));
}

type RequestJoin = Awaited<ReturnType<ReturnType<typeof requestRows>["where"]>>[number];

function toRequest(x: RequestJoin): CaseRequest {
  return {
    id: x.r.id,
    caseId: x.r.caseId,
    caseTitle: x.caseTitle,
    text: x.r.text,
    status: x.r.status as RequestStatus,
    reply: x.r.reply,
    askedBy: { id: x.r.askedBy, name: x.askedByName },
    askedOf: { id: x.r.askedOf, name: x.askedOfName },
    answeredBy: x.r.answeredBy ? { id: x.r.answeredBy, name: x.answeredByName ?? "" } : null,
    createdAt: x.r.createdAt.toISOString(),
    answeredAt: x.r.answeredAt?.toISOString() ?? null,
  };
}

async function requestById(db: DbOrTx, groupId: string, id: string): Promise<CaseRequest> {
  const [row] = await requestRows(db).where(and(eq(caseRequests.id, id), eq(caseRequests.groupId, groupId)));
  if (!row) throw notFound("That request");
  return toRequest(row);
}

/** A request as the audit log keeps it. */
function requestSnapshot(r: typeof caseRequests.$inferSelect) {
  return {
    id: r.id,
    caseId: r.caseId,
    text: r.text,
    status: r.status,
    reply: r.reply,
    answeredAt: r.answeredAt?.toISOString() ?? null,
    answeredBy: r.answeredBy,
  };
}

const requestRestoreSnapshot = z.object({
  id: z.string(),
  text: z.string().min(1),
  status: z.enum(["open", "answered"]),
  reply: z.string().nullable(),
  answeredAt: z.string().datetime({ offset: true }).nullable(),
  answeredBy: z.string().nullable(),
});

registerRestorer("case-request", async ({ tx, groupId, entityId, snapshot }) => {
  const snap = requestRestoreSnapshot.safeParse(snapshot);
  if (!snap.success || snap.data.id !== entityId) throw badRequest("That entry does not hold a request.");
  const [current] = await tx
    .select()
    .from(caseRequests)
    .where(and(eq(caseRequests.id, entityId), eq(caseRequests.groupId, groupId)))
    .for("update");
  if (!current) throw notFound("That request");
  const s = snap.data;
  await tx
    .update(caseRequests)
    .set({ text: s.text, status: s.status, reply: s.reply, answeredAt: s.answeredAt ? new Date(s.answeredAt) : null, answeredBy: s.answeredBy })
    .where(eq(caseRequests.id, entityId));
  const [after] = await tx.select().from(caseRequests).where(eq(caseRequests.id, entityId));
  return { before: requestSnapshot(current), after: requestSnapshot(after!) };
});

// ── review queue ─────────────────────────────────────────────────────────────

/** Every case column but the search ones, which the queue never needs. */
const { searchVector: _v, searchText: _t, ...caseColumns } = getTableColumns(cases);

function openRequestExists(db: Database) {
  return exists(
    db
      .select({ one: sql`1` })
      .from(caseRequests)
      .where(and(eq(caseRequests.caseId, cases.id), eq(caseRequests.status, "open"))),
  );
}

function reviewWhere(db: Database, groupId: string, kind: ReviewKind): SQL {
  // Merged cases are retired too, so one condition keeps both out.
  const base: SQL[] = [eq(cases.groupId, groupId), eq(cases.verified, false), eq(cases.retired, false)];
  if (kind === "new") base.push(eq(cases.status, "open"));
  if (kind === "resolved") base.push(inArray(cases.status, ["resolved", "abandoned"]));
  if (kind === "asked") base.push(openRequestExists(db));
  return and(...base)!;
}

export function curationRouter({ db }: AppDeps): Router {
  const router = Router();
  const lead = requireGroup(db, "lead");
  const member = requireGroup(db);

  router.get("/review", lead, async (req, res) => {
    const q = parse(reviewQuery, req.query);
    const groupId = req.group!.id;
    const rows = await db
      .select({ ...caseColumns, authorName: user.name })
      .from(cases)
      .innerJoin(user, eq(user.id, cases.authorId))
      .where(reviewWhere(db, groupId, q.kind))
      .orderBy(desc(cases.updatedAt), asc(cases.id))
      .limit(q.limit)
      .offset(q.offset);
    const ids = rows.map((r) => r.id);
    const [attempts, photos, requests, ...counted] = await Promise.all([
      ids.length ? db.select().from(caseAttempts).where(inArray(caseAttempts.caseId, ids)) : Promise.resolve([]),
      ids.length
        ? db.select({ caseId: casePhotos.caseId, n: count() }).from(casePhotos).where(inArray(casePhotos.caseId, ids)).groupBy(casePhotos.caseId)
        : Promise.resolve([]),
      ids.length
        ? db
            .select({ caseId: caseRequests.caseId, n: count() })
            .from(caseRequests)
            .where(and(inArray(caseRequests.caseId, ids), eq(caseRequests.status, "open")))
            .groupBy(caseRequests.caseId)
        : Promise.resolve([]),
      ...(["all", "new", "resolved", "asked"] as const).map((k) => db.select({ n: count() }).from(cases).where(reviewWhere(db, groupId, k))),
    ]);
    const items: ReviewItem[] = rows.map((row) => {
      const own = attempts.filter((a) => a.caseId === row.id).sort((a, b) => a.position - b.position);
      const photoCount = Number(photos.find((p) => p.caseId === row.id)?.n ?? 0);
      const summary = toSummary(row as CaseRow, { authorName: row.authorName, attempts: own, photoCount, firstPhotoId: null, following: false });
      return {
        id: row.id,
        title: row.title,
        status: summary.status,
        queue: row.status === "open" ? "new" : "resolved",
        authorId: row.authorId,
        authorName: row.authorName,
        occurredAt: summary.occurredAt,
        createdAt: summary.createdAt,
        updatedAt: summary.updatedAt,
        solvents: summary.solvents,
        aqueousLabel: summary.aqueousLabel,
        solventFamily: row.solventFamily,
        phBand: summary.phBand,
        kind: summary.kind,
        attemptCount: own.length,
        photoCount,
        whatWorked: summary.whatWorked,
        bestOutcome: summary.bestOutcome,
        fixAttemptId: own.find((a) => a.outcome === "cleared")?.id ?? null,
        openRequests: Number(requests.find((r) => r.caseId === row.id)?.n ?? 0),
        checks: reviewChecks(row as CaseRow, own, photoCount),
      };
    });
    const [all, fresh, resolved, asked] = counted.map((c) => Number(c[0]?.n ?? 0));
    const body: ReviewResponse = {
      items,
      total: ({ all, new: fresh, resolved, asked } as Record<ReviewKind, number | undefined>)[q.kind] ?? 0,
      counts: { all: all ?? 0, new: fresh ?? 0, resolved: resolved ?? 0, asked: asked ?? 0 },
    };
    res.json(body);
  });

  router.post("/cases/:id/verify", lead, async (req, res) => {
    const body = parse(verifyBody, req.body ?? {});
    const caseId = parse(idParam, req.params.id);
    const state = await db.transaction((tx) =>
      verifyCase(tx, { groupId: req.group!.id, actorId: req.user!.id, caseId, ...body }),
    );
    res.json(state);
  });

  router.post("/review/verify", lead, async (req, res) => {
    const { ids } = parse(bulkVerifyBody, req.body);
    // All or nothing: one case that cannot be verified leaves every case as it was.
    const verified = await db.transaction(async (tx) => {
      const out: CurationState[] = [];
      for (const caseId of ids) out.push(await verifyCase(tx, { groupId: req.group!.id, actorId: req.user!.id, caseId }));
      return out;
    });
    const body: BulkVerifyResponse = { verified };
    res.json(body);
  });

  router.post("/cases/:id/retire", lead, async (req, res) => {
    const body = parse(retireBody, req.body);
    const caseId = parse(idParam, req.params.id);
    const groupId = req.group!.id;
    const state = await db.transaction(async (tx) => {
      const before = await curationState(tx, groupId, caseId, true);
      if (before.mergedInto) throw new HttpError(409, "merged", "That case was merged into another; restore it before retiring it.");
      if (before.retired) throw new HttpError(409, "retired", "That case is already retired.");
      const reason = `${RETIRE_LABELS[body.code]}: ${body.reason}`;
      await tx
        .update(cases)
        .set({ retired: true, retiredAt: new Date(), retiredBy: req.user!.id, retiredReason: reason })
        .where(and(eq(cases.id, caseId), eq(cases.groupId, groupId)));
      const after = await curationState(tx, groupId, caseId);
      await recordAudit(tx, { groupId, actorId: req.user!.id, action: "retire", entityType: "case", entityId: caseId, before, after, reason });
      return after;
    });
    res.json(state);
  });

  router.post("/cases/:id/restore", lead, async (req, res) => {
    const body = parse(restoreBody, req.body ?? {});
    const caseId = parse(idParam, req.params.id);
    const groupId = req.group!.id;
    const actorId = req.user!.id;
    const state = await db.transaction(async (tx) => {
      const before = await curationState(tx, groupId, caseId, true);
      if (!before.retired) throw new HttpError(409, "not_retired", "That case is live: there is nothing to restore.");
      const keptId = before.mergedInto;
      const keptBefore = keptId ? await curationState(tx, groupId, keptId) : null;
      if (keptId) await unmergeCase(tx, { groupId, actorId, mergedId: caseId });
      else {
        await tx
          .update(cases)
          .set({ retired: false, retiredAt: null, retiredBy: null, retiredReason: null })
          .where(and(eq(cases.id, caseId), eq(cases.groupId, groupId)));
      }
      const after = await curationState(tx, groupId, caseId);
      const reason = body.reason ?? null;
      await recordAudit(tx, { groupId, actorId, action: keptId ? "unmerge" : "restore", entityType: "case", entityId: caseId, before, after, reason });
      if (keptId && keptBefore) {
        // The case that had absorbed it changes too: it gets its own entry, restorable on its own.
        const keptAfter = await curationState(tx, groupId, keptId);
        await recordAudit(tx, { groupId, actorId, action: "unmerge.kept", entityType: "case", entityId: keptId, before: keptBefore, after: keptAfter, reason });
      }
      return after;
    });
    res.json(state);
  });

  router.post("/cases/:id/merge", lead, async (req, res) => {
    const body = parse(mergeBody, req.body);
    const mergedId = parse(idParam, req.params.id);
    const groupId = req.group!.id;
    const actorId = req.user!.id;
    const out = await db.transaction(async (tx): Promise<MergeResponse> => {
      // Both cases must be the caller's group's (404 otherwise) before anything moves.
      const mergedBefore = await curationState(tx, groupId, mergedId);
      let keptBefore: CurationState;
      try {
        keptBefore = await curationState(tx, groupId, body.into);
      } catch (e) {
        if (e instanceof HttpError && e.status === 404) throw notFound("The case to keep");
        throw e;
      }
      const moved = await mergeCase(tx, { groupId, actorId, mergedId, keptId: body.into });
      const [merged, kept] = [await curationState(tx, groupId, mergedId), await curationState(tx, groupId, body.into)];
      await recordAudit(tx, { groupId, actorId, action: "merge", entityType: "case", entityId: mergedId, before: mergedBefore, after: merged, reason: body.reason ?? null });
      await recordAudit(tx, { groupId, actorId, action: "merge.kept", entityType: "case", entityId: body.into, before: keptBefore, after: kept, reason: body.reason ?? null });
      return { kept, merged, moved };
    });
    res.json(out);
  });

  router.post("/cases/:id/requests", lead, async (req, res) => {
    const body = parse(requestBody, req.body);
    const groupId = req.group!.id;
    const id = await db.transaction(async (tx) => {
      const row = await caseInGroup(tx, groupId, parse(idParam, req.params.id));
      const id = crypto.randomUUID();
      await tx.insert(caseRequests).values({
        id,
        groupId,
        caseId: row.id,
        askedBy: req.user!.id,
        askedOf: row.authorId,
        text: body.text,
        status: "open",
        createdAt: new Date(),
      });
      const [created] = await tx.select().from(caseRequests).where(eq(caseRequests.id, id));
      await recordAudit(tx, { groupId, actorId: req.user!.id, action: "request", entityType: "case-request", entityId: id, before: null, after: requestSnapshot(created!) });
      return id;
    });
    res.status(201).json(await requestById(db, groupId, id));
  });

  router.get("/cases/:id/requests", member, async (req, res) => {
    const row = await caseInGroup(db, req.group!.id, parse(idParam, req.params.id));
    const rows = await requestRows(db)
      .where(and(eq(caseRequests.caseId, row.id), eq(caseRequests.groupId, req.group!.id)))
      .orderBy(asc(caseRequests.createdAt), asc(caseRequests.id));
    const body: CaseRequestList = { requests: rows.map(toRequest) };
    res.json(body);
  });

  router.get("/my-requests", member, async (req, res) => {
    const q = parse(myRequestsQuery, req.query);
    const where: SQL[] = [eq(caseRequests.groupId, req.group!.id), eq(cases.authorId, req.user!.id)];
    if (q.status !== "all") where.push(eq(caseRequests.status, q.status));
    const rows = await requestRows(db)
      .where(and(...where))
      .orderBy(desc(caseRequests.createdAt), asc(caseRequests.id))
      .limit(200);
    const body: CaseRequestList = { requests: rows.map(toRequest) };
    res.json(body);
  });

  /** The case's author answers; a lead may also close or reopen. */
  router.patch("/requests/:id", member, async (req: Request, res) => {
    const patch = parse(requestPatchBody, req.body);
    const id = parse(idParam, req.params.id);
    const groupId = req.group!.id;
    await db.transaction(async (tx) => {
      const [current] = await tx
        .select({ r: caseRequests, authorId: cases.authorId })
        .from(caseRequests)
        .innerJoin(cases, eq(cases.id, caseRequests.caseId))
        .where(and(eq(caseRequests.id, id), eq(caseRequests.groupId, groupId)))
        .for("update", { of: caseRequests });
      if (!current) throw notFound("That request");
      if (current.authorId !== req.user!.id && !roleAtLeast(req.group!.role, "lead")) {
        throw forbidden("Only the case's author or a lead can answer this request.");
      }
      const status = patch.status ?? (patch.reply !== undefined ? "answered" : current.r.status);
      const answered = status === "answered";
      await tx
        .update(caseRequests)
        .set({
          status,
          reply: patch.reply !== undefined ? patch.reply || null : current.r.reply,
          answeredAt: answered ? (current.r.answeredAt ?? new Date()) : null,
          answeredBy: answered ? (current.r.answeredBy ?? req.user!.id) : null,
        })
        .where(eq(caseRequests.id, id));
      const [after] = await tx.select().from(caseRequests).where(eq(caseRequests.id, id));
      await recordAudit(tx, {
        groupId,
        actorId: req.user!.id,
        action: answered ? "request.answer" : "request.reopen",
        entityType: "case-request",
        entityId: id,
        before: requestSnapshot(current.r),
        after: requestSnapshot(after!),
      });
    });
    res.json(await requestById(db, groupId, id));
  });

  return router;
}
