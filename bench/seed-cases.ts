import type { Database } from "../db/client";
import { caseAttempts, cases } from "../db/schema";
import { createCaseBody } from "../knowledge/contracts/cases";
import { buildSearchText, deriveSystem, type AttemptRow } from "../server/case-records";
import { generatedCase } from "./case-fixtures";

/**
 * Inserts generated cases [from, to) straight into the tables, in batches, with the same derived
 * columns POST /api/cases writes (resolved system, signature columns, search text). Far faster
 * than the API for building 100k-case benchmarks.
 */
export async function insertGeneratedCases(
  db: Database,
  opts: { groupId: string; authorId: string; from: number; to: number; batch?: number },
): Promise<void> {
  const batch = opts.batch ?? 500;
  for (let start = opts.from; start < opts.to; start += batch) {
    const caseRows: (typeof cases.$inferInsert)[] = [];
    const attemptRows: AttemptRow[] = [];
    for (let i = start; i < Math.min(opts.to, start + batch); i++) {
      const body = createCaseBody.parse(generatedCase(i));
      const derived = deriveSystem(body.system);
      const id = crypto.randomUUID();
      const when = new Date(body.occurredAt ?? Date.now());
      const row = {
        id,
        groupId: opts.groupId,
        authorId: opts.authorId,
        title: body.title,
        ...derived,
        tags: body.tags,
        causes: body.causes,
        components: body.components,
        observedBottom: body.observedBottom,
        seen: body.seen,
        emulsionKind: body.seen.kind,
        notes: body.notes,
        status: body.status,
        finalOutcome: body.finalOutcome,
        recovery: body.recovery,
        occurredAt: when,
        createdAt: when,
        updatedAt: when,
      };
      const attempts = body.attempts.map((a, k) => ({
        id: crypto.randomUUID(),
        caseId: id,
        groupId: opts.groupId,
        position: k + 1,
        remedyId: a.remedyId,
        description: a.description ?? null,
        amount: a.amount ?? null,
        minutes: a.minutes ?? null,
        outcome: a.outcome,
        note: a.note ?? null,
        authorId: opts.authorId,
        createdAt: when,
        updatedAt: when,
      }));
      caseRows.push({ ...row, searchText: buildSearchText(row, attempts) });
      attemptRows.push(...attempts);
    }
    await db.transaction(async (tx) => {
      await tx.insert(cases).values(caseRows);
      if (attemptRows.length) await tx.insert(caseAttempts).values(attemptRows);
    });
  }
}
