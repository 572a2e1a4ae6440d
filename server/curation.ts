import { and, asc, count, desc, eq, inArray, isNull, max } from "drizzle-orm";
import { z } from "zod";
import type { CurationState } from "../knowledge/contracts/curation";
import { caseAttempts, caseFollowers, caseMerges, casePhotos, cases } from "../db/schema";
import { registerRestorer, type DbOrTx } from "./audit";
import { buildSearchText } from "./case-records";
import { HttpError, badRequest, notFound } from "./middleware/errors";

/*
 * A case's curation state and the two moves that change where its attempts live: merging a
 * duplicate into the case that remains, and undoing that merge. Both run inside the caller's
 * transaction so the audit entry commits with them.
 */

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** The case's curation as the audit log keeps it; 404 when the case is not the group's. */
export async function curationState(tx: DbOrTx, groupId: string, caseId: string, lock = false): Promise<CurationState> {
  const q = tx
    .select({
      id: cases.id,
      verified: cases.verified,
      verifiedBy: cases.verifiedBy,
      verifiedAt: cases.verifiedAt,
      verifiedAttemptId: cases.verifiedAttemptId,
      retired: cases.retired,
      retiredAt: cases.retiredAt,
      retiredBy: cases.retiredBy,
      retiredReason: cases.retiredReason,
      mergedInto: cases.mergedInto,
    })
    .from(cases)
    .where(and(eq(cases.id, caseId), eq(cases.groupId, groupId)))
    .limit(1);
  const [row] = lock ? await q.for("update") : await q;
  if (!row) throw notFound("That case");
  const [absorbed, attempts, photos] = await Promise.all([
    tx
      .select({ id: caseMerges.mergedId })
      .from(caseMerges)
      .where(and(eq(caseMerges.groupId, groupId), eq(caseMerges.keptId, caseId), isNull(caseMerges.undoneAt)))
      .orderBy(asc(caseMerges.createdAt)),
    tx.select({ n: count() }).from(caseAttempts).where(eq(caseAttempts.caseId, caseId)),
    tx.select({ n: count() }).from(casePhotos).where(eq(casePhotos.caseId, caseId)),
  ]);
  return {
    id: row.id,
    verified: row.verified,
    verifiedBy: row.verifiedBy,
    verifiedAt: iso(row.verifiedAt),
    verifiedAttemptId: row.verifiedAttemptId,
    retired: row.retired,
    retiredAt: iso(row.retiredAt),
    retiredBy: row.retiredBy,
    retiredReason: row.retiredReason,
    mergedInto: row.mergedInto,
    absorbed: absorbed.map((a) => a.id),
    attemptCount: Number(attempts[0]?.n ?? 0),
    photoCount: Number(photos[0]?.n ?? 0),
  };
}

/** The search text follows the attempts: recompute it for each case whose attempts moved. */
async function refreshSearchText(tx: DbOrTx, caseIds: string[]): Promise<void> {
  for (const id of caseIds) {
    const [row] = await tx.select().from(cases).where(eq(cases.id, id));
    if (!row) continue;
    const attempts = await tx.select().from(caseAttempts).where(eq(caseAttempts.caseId, id));
    await tx.update(cases).set({ searchText: buildSearchText(row, attempts), updatedAt: new Date() }).where(eq(cases.id, id));
  }
}

export interface MergeMove {
  attempts: number;
  photos: number;
  followers: number;
}

/**
 * Moves every attempt, photo and follower of `mergedId` onto `keptId` (attempts keep their order,
 * after the kept case's own), and retires the merged case pointing at the kept one.
 */
export async function mergeCase(
  tx: DbOrTx,
  args: { groupId: string; actorId: string; mergedId: string; keptId: string },
): Promise<MergeMove> {
  const { groupId, actorId, mergedId, keptId } = args;
  if (mergedId === keptId) throw badRequest("A case cannot be merged into itself.", { into: "Pick another case." });
  // Lock both rows in id order so two merges of the same pair cannot interleave.
  const [first, second] = [mergedId, keptId].sort();
  const locked = new Map<string, { id: string; title: string; mergedInto: string | null; retired: boolean }>();
  for (const id of [first!, second!]) {
    const [row] = await tx
      .select({ id: cases.id, title: cases.title, mergedInto: cases.mergedInto, retired: cases.retired })
      .from(cases)
      .where(and(eq(cases.id, id), eq(cases.groupId, groupId)))
      .for("update");
    if (!row) throw id === keptId ? notFound("The case to keep") : notFound("That case");
    locked.set(id, row);
  }
  const merged = locked.get(mergedId)!;
  const kept = locked.get(keptId)!;
  if (merged.mergedInto) throw new HttpError(409, "already_merged", "That case is already merged into another; restore it first.");
  if (kept.mergedInto) {
    throw badRequest("The case to keep was itself merged away; merge into the case that remains.", { into: "Merged away." });
  }
  if (kept.retired) throw badRequest("The case to keep is retired; restore it first.", { into: "That case is retired." });

  const moving = await tx
    .select({ id: caseAttempts.id, position: caseAttempts.position })
    .from(caseAttempts)
    .where(eq(caseAttempts.caseId, mergedId))
    .orderBy(asc(caseAttempts.position));
  const [top] = await tx.select({ top: max(caseAttempts.position) }).from(caseAttempts).where(eq(caseAttempts.caseId, keptId));
  let next = (top?.top ?? 0) + 1;
  for (const a of moving) {
    await tx.update(caseAttempts).set({ caseId: keptId, position: next, updatedAt: new Date() }).where(eq(caseAttempts.id, a.id));
    next += 1;
  }
  const photos = await tx.select({ id: casePhotos.id }).from(casePhotos).where(eq(casePhotos.caseId, mergedId));
  if (photos.length) {
    await tx
      .update(casePhotos)
      .set({ caseId: keptId })
      .where(inArray(casePhotos.id, photos.map((p) => p.id)));
  }
  const [mergedFollowers, keptFollowers] = await Promise.all([
    tx.select({ userId: caseFollowers.userId }).from(caseFollowers).where(eq(caseFollowers.caseId, mergedId)),
    tx.select({ userId: caseFollowers.userId }).from(caseFollowers).where(eq(caseFollowers.caseId, keptId)),
  ]);
  const already = new Set(keptFollowers.map((f) => f.userId));
  const added = mergedFollowers.map((f) => f.userId).filter((u) => !already.has(u));
  if (added.length) await tx.insert(caseFollowers).values(added.map((userId) => ({ caseId: keptId, userId, createdAt: new Date() })));

  const now = new Date();
  await tx.insert(caseMerges).values({
    id: crypto.randomUUID(),
    groupId,
    keptId,
    mergedId,
    movedAttempts: moving,
    movedPhotoIds: photos.map((p) => p.id),
    addedFollowerIds: added,
    mergedBy: actorId,
    createdAt: now,
  });
  await tx
    .update(cases)
    .set({ mergedInto: keptId, retired: true, retiredAt: now, retiredBy: actorId, retiredReason: `Merged into “${kept.title}”.` })
    .where(and(eq(cases.id, mergedId), eq(cases.groupId, groupId)));
  await refreshSearchText(tx, [keptId, mergedId]);
  return { attempts: moving.length, photos: photos.length, followers: added.length };
}

/**
 * Undoes the latest merge of `mergedId`: its attempts (back in their old places), photos and the
 * followers the merge added return, and the case is live again. Returns the case it had been merged into.
 */
export async function unmergeCase(tx: DbOrTx, args: { groupId: string; actorId: string; mergedId: string }): Promise<string> {
  const { groupId, actorId, mergedId } = args;
  const [merge] = await tx
    .select()
    .from(caseMerges)
    .where(and(eq(caseMerges.groupId, groupId), eq(caseMerges.mergedId, mergedId), isNull(caseMerges.undoneAt)))
    .orderBy(desc(caseMerges.createdAt))
    .limit(1);
  if (!merge) throw new HttpError(409, "not_merged", "That case is not merged into another.");
  // Attempts added to the merged case after the merge keep their places; moved ones go after them on a clash.
  const [top] = await tx.select({ top: max(caseAttempts.position) }).from(caseAttempts).where(eq(caseAttempts.caseId, mergedId));
  const taken = new Set<number>();
  const present = await tx.select({ position: caseAttempts.position }).from(caseAttempts).where(eq(caseAttempts.caseId, mergedId));
  for (const p of present) taken.add(p.position);
  let spare = (top?.top ?? 0) + 1;
  for (const a of merge.movedAttempts) {
    const position = taken.has(a.position) ? spare++ : a.position;
    taken.add(position);
    // Scoped by group: an attempt that has since moved on (a chained merge) still comes home.
    await tx
      .update(caseAttempts)
      .set({ caseId: mergedId, position, updatedAt: new Date() })
      .where(and(eq(caseAttempts.id, a.id), eq(caseAttempts.groupId, groupId)));
  }
  if (merge.movedPhotoIds.length) {
    await tx
      .update(casePhotos)
      .set({ caseId: mergedId })
      .where(and(inArray(casePhotos.id, merge.movedPhotoIds), eq(casePhotos.groupId, groupId)));
  }
  if (merge.addedFollowerIds.length) {
    await tx
      .delete(caseFollowers)
      .where(and(eq(caseFollowers.caseId, merge.keptId), inArray(caseFollowers.userId, merge.addedFollowerIds)));
  }
  await tx.update(caseMerges).set({ undoneAt: new Date(), undoneBy: actorId }).where(eq(caseMerges.id, merge.id));
  await tx
    .update(cases)
    .set({ mergedInto: null, retired: false, retiredAt: null, retiredBy: null, retiredReason: null })
    .where(and(eq(cases.id, mergedId), eq(cases.groupId, groupId)));
  await refreshSearchText(tx, [merge.keptId, mergedId]);
  return merge.keptId;
}

const isoOrNull = z.string().datetime({ offset: true }).nullable();
const curationSnapshot = z.object({
  id: z.string(),
  verified: z.boolean(),
  verifiedBy: z.string().nullable(),
  verifiedAt: isoOrNull,
  verifiedAttemptId: z.string().nullable(),
  retired: z.boolean(),
  retiredAt: isoOrNull,
  retiredBy: z.string().nullable(),
  retiredReason: z.string().nullable(),
  mergedInto: z.string().nullable(),
  absorbed: z.array(z.string()).default([]),
});

/**
 * Brings a case's curation back to a snapshot from the log: merges are undone or redone so the
 * attempts and photos follow, then verification and retirement are set as recorded.
 */
export async function applyCurationState(tx: DbOrTx, groupId: string, actorId: string, caseId: string, snapshot: unknown) {
  const parsed = curationSnapshot.safeParse(snapshot);
  if (!parsed.success || parsed.data.id !== caseId) throw badRequest("That entry does not hold a case's curation.");
  const snap = parsed.data;
  const before = await curationState(tx, groupId, caseId, true);
  if (before.mergedInto !== snap.mergedInto) {
    if (before.mergedInto) await unmergeCase(tx, { groupId, actorId, mergedId: caseId });
    if (snap.mergedInto) await mergeCase(tx, { groupId, actorId, mergedId: caseId, keptId: snap.mergedInto });
  }
  for (const id of before.absorbed.filter((x) => !snap.absorbed.includes(x))) {
    await unmergeCase(tx, { groupId, actorId, mergedId: id });
  }
  for (const id of snap.absorbed.filter((x) => !before.absorbed.includes(x))) {
    const other = await curationState(tx, groupId, id);
    if (other.mergedInto) await unmergeCase(tx, { groupId, actorId, mergedId: id });
    await mergeCase(tx, { groupId, actorId, mergedId: id, keptId: caseId });
  }
  await tx
    .update(cases)
    .set({
      verified: snap.verified,
      verifiedBy: snap.verifiedBy,
      verifiedAt: snap.verifiedAt ? new Date(snap.verifiedAt) : null,
      verifiedAttemptId: snap.verifiedAttemptId,
      retired: snap.retired,
      retiredAt: snap.retiredAt ? new Date(snap.retiredAt) : null,
      retiredBy: snap.retiredBy,
      retiredReason: snap.retiredReason,
    })
    .where(and(eq(cases.id, caseId), eq(cases.groupId, groupId)));
  return { before, after: await curationState(tx, groupId, caseId) };
}

registerRestorer("case", ({ tx, groupId, actorId, entityId, snapshot }) => applyCurationState(tx, groupId, actorId, entityId, snapshot));
