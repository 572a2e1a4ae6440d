import { Router } from "express";
import { and, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { adviceCreateBody, adviceListQuery, advicePatchBody, type AdviceListResponse, type AdviceNote } from "../../knowledge/contracts/advice";
import { caseAttempts, cases, groupAdvice } from "../../db/schema";
import { adviceNotes, adviceRow, adviceSnapshot } from "../advice";
import { recordAudit, type DbOrTx } from "../audit";
import type { AppDeps } from "../deps";
import { HttpError, badRequest, notFound } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";

const idParam = z.string().min(1).max(100);

/** Every cited case must be the group's; 404 names the first that is not. */
async function checkCases(tx: DbOrTx, groupId: string, ids: string[]): Promise<void> {
  if (ids.length === 0) return;
  const found = await tx
    .select({ id: cases.id })
    .from(cases)
    .where(and(eq(cases.groupId, groupId), inArray(cases.id, ids)));
  const known = new Set(found.map((f) => f.id));
  if (ids.some((id) => !known.has(id))) throw notFound("A cited case");
}

async function oneNote(tx: DbOrTx, groupId: string, id: string): Promise<AdviceNote> {
  const [note] = await adviceNotes(tx, groupId, { includeRetired: true, ids: [id] });
  if (!note) throw notFound("That note");
  return note;
}

export function adviceRouter({ db }: AppDeps): Router {
  const router = Router();
  const lead = requireGroup(db, "lead");

  router.get("/advice", requireGroup(db), async (req, res) => {
    const q = parse(adviceListQuery, req.query);
    const notes = await adviceNotes(db, req.group!.id, { includeRetired: q.includeRetired });
    const body: AdviceListResponse = { notes: q.remedy ? notes.filter((n) => n.remedyId === q.remedy) : notes };
    res.json(body);
  });

  /** Promote a verified fix into a group note. */
  router.post("/advice", lead, async (req, res) => {
    const body = parse(adviceCreateBody, req.body);
    const groupId = req.group!.id;
    const id = await db.transaction(async (tx) => {
      const [source] = await tx
        .select()
        .from(cases)
        .where(and(eq(cases.id, body.caseId), eq(cases.groupId, groupId)));
      if (!source) throw notFound("That case");
      if (source.retired) throw new HttpError(409, "retired", "That case is retired; a note cannot rest on it.");
      if (!source.verified) throw badRequest("Verify the case before promoting its fix.", { caseId: "The case is not verified yet." });
      const attemptId = body.attemptId ?? source.verifiedAttemptId;
      if (!attemptId) throw badRequest("The verified case has no working fix to promote.", { attemptId: "Pick the attempt that worked." });
      const [attempt] = await tx
        .select()
        .from(caseAttempts)
        .where(and(eq(caseAttempts.id, attemptId), eq(caseAttempts.caseId, source.id)));
      if (!attempt) throw badRequest("That attempt is not on this case.", { attemptId: "Pick one of this case's attempts." });
      if (attempt.outcome !== "cleared" && attempt.outcome !== "partly") {
        throw badRequest("Only a fix that worked becomes advice.", { attemptId: "This attempt did not clear the emulsion." });
      }
      if (!attempt.remedyId) {
        throw badRequest("A free-text attempt names no catalogued remedy; log it with a remedy from the catalogue first.", {
          attemptId: "This attempt names no remedy from the catalogue.",
        });
      }
      const also = body.alsoCaseIds.filter((c) => c !== source.id);
      await checkCases(tx, groupId, also);
      const id = crypto.randomUUID();
      const now = new Date();
      await tx.insert(groupAdvice).values({
        id,
        groupId,
        remedyId: attempt.remedyId,
        solventFamily: body.solventFamily === undefined ? source.solventFamily : body.solventFamily,
        phBand: body.phBand === undefined ? source.phBand : body.phBand,
        causeCode: body.causeCode ?? null,
        text: body.text,
        sourceCaseIds: [source.id, ...new Set(also)],
        createdBy: req.user!.id,
        createdAt: now,
        updatedAt: now,
      });
      const row = await adviceRow(tx, groupId, id);
      await recordAudit(tx, { groupId, actorId: req.user!.id, action: "advice.create", entityType: "advice-note", entityId: id, before: null, after: adviceSnapshot(row) });
      return id;
    });
    res.status(201).json(await oneNote(db, groupId, id));
  });

  /** Edit, retire (with a reason) or bring back a note; each change is a new version in the log. */
  router.patch("/advice/:id", lead, async (req, res) => {
    const patch = parse(advicePatchBody, req.body);
    const groupId = req.group!.id;
    const id = parse(idParam, req.params.id);
    await db.transaction(async (tx) => {
      const before = await adviceRow(tx, groupId, id, true);
      if (patch.sourceCaseIds) await checkCases(tx, groupId, patch.sourceCaseIds);
      const retiring = patch.retired === true && before.retiredAt === null;
      const restoring = patch.retired === false && before.retiredAt !== null;
      await tx
        .update(groupAdvice)
        .set({
          ...(patch.text !== undefined ? { text: patch.text } : {}),
          ...(patch.solventFamily !== undefined ? { solventFamily: patch.solventFamily } : {}),
          ...(patch.phBand !== undefined ? { phBand: patch.phBand } : {}),
          ...(patch.causeCode !== undefined ? { causeCode: patch.causeCode } : {}),
          ...(patch.sourceCaseIds ? { sourceCaseIds: [...new Set(patch.sourceCaseIds)] } : {}),
          ...(retiring ? { retiredAt: new Date(), retiredBy: req.user!.id, retiredReason: patch.reason ?? null } : {}),
          ...(restoring ? { retiredAt: null, retiredBy: null, retiredReason: null } : {}),
          version: before.version + 1,
          updatedAt: new Date(),
        })
        .where(eq(groupAdvice.id, id));
      const after = await adviceRow(tx, groupId, id);
      await recordAudit(tx, {
        groupId,
        actorId: req.user!.id,
        action: retiring ? "advice.retire" : restoring ? "advice.restore" : "advice.update",
        entityType: "advice-note",
        entityId: id,
        before: adviceSnapshot(before),
        after: adviceSnapshot(after),
        reason: patch.reason ?? null,
      });
    });
    res.json(await oneNote(db, groupId, id));
  });

  return router;
}
