import { and, asc, eq, isNotNull, isNull } from "drizzle-orm";
import type { EvidenceOutcome, EvidenceRecord } from "../knowledge/emulsion/evidence";
import type { Database } from "../db/client";
import { caseAttempts, cases } from "../db/schema";

/**
 * The group's own results for the emulsion ranking: one record per catalogued remedy attempt in
 * the group's live cases (retired and merged-away cases are left out; a merge keeps the attempts
 * on the case that remains). Attempts described in free text name no remedy and are skipped, as
 * are cases whose solvent family or pH band could not be worked out. The signature's cause is
 * the case's first-listed suspected cause.
 */
export async function groupEvidence(db: Database, groupId: string): Promise<EvidenceRecord[]> {
  const rows = await db
    .select({
      remedyId: caseAttempts.remedyId,
      outcome: caseAttempts.outcome,
      solventFamily: cases.solventFamily,
      phBand: cases.phBand,
      causes: cases.causes,
    })
    .from(caseAttempts)
    .innerJoin(cases, eq(cases.id, caseAttempts.caseId))
    .where(
      and(
        eq(cases.groupId, groupId),
        eq(caseAttempts.groupId, groupId),
        eq(cases.retired, false),
        isNull(cases.mergedInto),
        isNotNull(caseAttempts.remedyId),
        isNotNull(cases.solventFamily),
        isNotNull(cases.phBand),
      ),
    )
    .orderBy(asc(cases.occurredAt), asc(caseAttempts.position));
  return rows.map((r) => ({
    groupId,
    remedyId: r.remedyId!,
    outcome: r.outcome as EvidenceOutcome,
    solventFamily: r.solventFamily!,
    phBand: r.phBand!,
    ...(r.causes[0] ? { causeCode: r.causes[0] } : {}),
  }));
}
