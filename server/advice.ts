import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import { z } from "zod";
import { adviceScope, type AdviceNote } from "../knowledge/contracts/advice";
import type { CasePhBand } from "../knowledge/contracts/cases";
import { isSimilar, type EvidenceRecord } from "../knowledge/emulsion/evidence";
import type { GroupNote } from "../knowledge/emulsion";
import { CAUSES } from "../knowledge/emulsion/causes";
import { REMEDIES } from "../knowledge/emulsion/remedies";
import type { Database } from "../db/client";
import { caseAttempts, cases, groupAdvice, user } from "../db/schema";
import { registerRestorer, type DbOrTx } from "./audit";
import { groupEvidence } from "./case-evidence";
import { whatWorked } from "./case-records";
import { badRequest, notFound } from "./middleware/errors";

/*
 * The group's advice notes: read with their evidence (how the remedy did in the group's live
 * cases of the same kind, from the same records the emulsion ranking uses) and the cases they cite.
 */

export type AdviceRow = typeof groupAdvice.$inferSelect;

export function remedyTitle(remedyId: string): string {
  return REMEDIES.find((r) => r.id === remedyId)?.title ?? remedyId;
}

/** The note's scope as an evidence signature; a part the note leaves open matches anything. */
function matches(record: EvidenceRecord, note: Pick<AdviceRow, "remedyId" | "solventFamily" | "phBand" | "causeCode">): boolean {
  if (record.remedyId !== note.remedyId) return false;
  // isSimilar compares all of family and band; fill the open parts from the record itself.
  return isSimilar(record, {
    solventFamily: note.solventFamily ?? record.solventFamily,
    phBand: (note.phBand ?? record.phBand) as CasePhBand,
    ...(note.causeCode ? { causeCode: note.causeCode } : {}),
  });
}

/** cleared n of m for one note. */
export function noteEvidence(records: EvidenceRecord[], note: Pick<AdviceRow, "remedyId" | "solventFamily" | "phBand" | "causeCode">) {
  const own = records.filter((r) => matches(r, note));
  return { cleared: own.filter((r) => r.outcome === "cleared").length, tried: own.length };
}

/** The group's notes as the desk and the API show them. */
export async function adviceNotes(db: DbOrTx, groupId: string, options: { includeRetired?: boolean; ids?: string[] } = {}): Promise<AdviceNote[]> {
  const where = [eq(groupAdvice.groupId, groupId)];
  if (!options.includeRetired) where.push(isNull(groupAdvice.retiredAt));
  if (options.ids) where.push(inArray(groupAdvice.id, options.ids.length ? options.ids : [""]));
  const rows = await db
    .select({ n: groupAdvice, createdByName: user.name })
    .from(groupAdvice)
    .innerJoin(user, eq(user.id, groupAdvice.createdBy))
    .where(and(...where))
    .orderBy(asc(groupAdvice.remedyId), asc(groupAdvice.createdAt), asc(groupAdvice.id));
  if (rows.length === 0) return [];
  const caseIds = [...new Set(rows.flatMap((r) => r.n.sourceCaseIds))];
  const [records, sourceCases, attempts] = await Promise.all([
    groupEvidence(db as Database, groupId),
    caseIds.length
      ? db
          .select({ id: cases.id, title: cases.title, verified: cases.verified, retired: cases.retired })
          .from(cases)
          .where(and(eq(cases.groupId, groupId), inArray(cases.id, caseIds)))
      : Promise.resolve([]),
    caseIds.length ? db.select().from(caseAttempts).where(and(eq(caseAttempts.groupId, groupId), inArray(caseAttempts.caseId, caseIds))) : Promise.resolve([]),
  ]);
  return rows.map(({ n, createdByName }) => ({
    id: n.id,
    remedyId: n.remedyId,
    remedyTitle: remedyTitle(n.remedyId),
    solventFamily: n.solventFamily,
    phBand: n.phBand as CasePhBand | null,
    causeCode: n.causeCode,
    scope: adviceScope(n),
    text: n.text,
    sources: n.sourceCaseIds.flatMap((id) => {
      const c = sourceCases.find((x) => x.id === id);
      return c ? [{ id: c.id, title: c.title, verified: c.verified, retired: c.retired, whatWorked: whatWorked(attempts.filter((a) => a.caseId === id)) }] : [];
    }),
    evidence: noteEvidence(records, n),
    createdBy: { id: n.createdBy, name: createdByName },
    createdAt: n.createdAt.toISOString(),
    updatedAt: n.updatedAt.toISOString(),
    version: n.version,
    retired: n.retiredAt !== null,
    retiredAt: n.retiredAt?.toISOString() ?? null,
    retiredReason: n.retiredReason,
  }));
}

/**
 * The group's live notes for the emulsion help. The text carries its scope and the cases it
 * rests on; `evidence` (cleared n of m) travels beside it for the screen to show.
 */
export async function adviceFor(db: Database, groupId: string): Promise<(GroupNote & { id: string; evidence: { cleared: number; tried: number } })[]> {
  const notes = await adviceNotes(db, groupId);
  return notes.map((n) => {
    const cited = n.sources.filter((s) => !s.retired).map((s) => `“${s.title}”`);
    const when = n.causeCode ? `, when the likely cause is ${(CAUSES.find((c) => c.code === n.causeCode)?.title ?? n.causeCode).toLowerCase()}` : "";
    // The emulsion screen appends "(cleared n of m in this group)" from `evidence`.
    const text = `${n.text} — group advice for ${n.scope}${when}${cited.length ? `, from ${cited.join(", ")}` : ""}`;
    return {
      id: n.id,
      remedyId: n.remedyId,
      text,
      ...(n.solventFamily ? { solventFamily: n.solventFamily } : {}),
      ...(n.phBand ? { phBand: n.phBand } : {}),
      ...(n.causeCode ? { causeCode: n.causeCode } : {}),
      evidence: n.evidence,
    };
  });
}

/** A note as the audit log keeps it. */
export function adviceSnapshot(n: AdviceRow) {
  return {
    id: n.id,
    remedyId: n.remedyId,
    solventFamily: n.solventFamily,
    phBand: n.phBand,
    causeCode: n.causeCode,
    text: n.text,
    sourceCaseIds: n.sourceCaseIds,
    version: n.version,
    retiredAt: n.retiredAt?.toISOString() ?? null,
    retiredBy: n.retiredBy,
    retiredReason: n.retiredReason,
  };
}

const snapshotSchema = z.object({
  id: z.string(),
  solventFamily: z.string().nullable(),
  phBand: z.string().nullable(),
  causeCode: z.string().nullable(),
  text: z.string().min(1),
  sourceCaseIds: z.array(z.string()),
  retiredAt: z.string().datetime({ offset: true }).nullable(),
  retiredBy: z.string().nullable(),
  retiredReason: z.string().nullable(),
});

export async function adviceRow(tx: DbOrTx, groupId: string, id: string, lock = false): Promise<AdviceRow> {
  const q = tx
    .select()
    .from(groupAdvice)
    .where(and(eq(groupAdvice.id, id), eq(groupAdvice.groupId, groupId)))
    .limit(1);
  const [row] = lock ? await q.for("update") : await q;
  if (!row) throw notFound("That note");
  return row;
}

// A restore writes the recorded text, scope, sources and retirement back as a new version.
registerRestorer("advice-note", async ({ tx, groupId, entityId, snapshot }) => {
  const parsed = snapshotSchema.safeParse(snapshot);
  if (!parsed.success || parsed.data.id !== entityId) throw badRequest("That entry does not hold an advice note.");
  const s = parsed.data;
  const before = await adviceRow(tx, groupId, entityId, true);
  await tx
    .update(groupAdvice)
    .set({
      solventFamily: s.solventFamily,
      phBand: s.phBand,
      causeCode: s.causeCode,
      text: s.text,
      sourceCaseIds: s.sourceCaseIds,
      retiredAt: s.retiredAt ? new Date(s.retiredAt) : null,
      retiredBy: s.retiredBy,
      retiredReason: s.retiredReason,
      version: before.version + 1,
      updatedAt: new Date(),
    })
    .where(eq(groupAdvice.id, entityId));
  return { before: adviceSnapshot(before), after: adviceSnapshot(await adviceRow(tx, groupId, entityId)) };
});
