import { Router, type Request } from "express";
import { and, arrayContains, asc, count, desc, eq, exists, getTableColumns, gte, inArray, lt, lte, max, ne, sql, type SQL } from "drizzle-orm";
import { z } from "zod";
import {
  MAX_ATTEMPTS_PER_CASE,
  attemptBody,
  attemptPatchBody,
  caseListQuery,
  createCaseBody,
  patchCaseBody,
  type CaseDetail,
  type CaseListFilters,
  type CaseListResponse,
  type CaseSummary,
  type FollowResponse,
  type SimilarCase,
  type CasePhBand,
  type EmulsionKind,
  type CaseStatus,
  type CasePhase,
} from "../../knowledge/contracts/cases";
import { requireSolute, requireSolvent } from "../../knowledge/reference";
import type { Database } from "../../db/client";
import { caseAttempts, caseFollowers, casePhotos, cases, user } from "../../db/schema";
import {
  buildSearchText,
  deriveSystem,
  insertCase,
  systemInputOf,
  toAttempt,
  toPhoto,
  toSummary,
  whatWorked,
  type CaseRow,
} from "../case-records";
import { VocabularyCache, parseSearchQuery, termTsQuery } from "../case-search";
import { notifyFollowers } from "../case-mail";
import type { AppDeps } from "../deps";
import { HttpError, badRequest, forbidden, notFound } from "../middleware/errors";
import { requireGroup, type GroupContext } from "../middleware/session";
import { parse } from "../middleware/validate";
import { roleAtLeast } from "../roles";
import { toCsv } from "../csv";

const idParam = z.string().min(1).max(100);
/** Everything but the search columns, which lists never need. */
const { searchVector: _v, searchText: _t, ...caseColumns } = getTableColumns(cases);
type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
type Db = Database | Tx;

export const EXPORT_ROW_LIMIT = 10_000;
/** A search ranks the newest this many matches and counts up to this many (then reports "at least"). */
export const SEARCH_MATCH_CAP = 1_000;

/** The author, a lead or an owner may change a case; every member reads it. */
export function canEditCase(group: GroupContext, userId: string, authorId: string): boolean {
  return authorId === userId || roleAtLeast(group.role, "lead");
}

/** The case in the caller's active group, or 404 (another group's case does not exist for them). */
export async function caseInGroup(db: Db, groupId: string, id: string, lock = false): Promise<CaseRow> {
  const q = db
    .select(caseColumns)
    .from(cases)
    .where(and(eq(cases.id, id), eq(cases.groupId, groupId)))
    .limit(1);
  const rows = lock ? await q.for("update") : await q;
  const row = rows[0];
  if (!row) throw notFound("That case");
  return row;
}

/** Re-derives the search text from the case and its attempts and stamps the update time. */
async function touchCase(tx: Db, row: CaseRow): Promise<void> {
  const attempts = await tx.select().from(caseAttempts).where(eq(caseAttempts.caseId, row.id));
  await tx
    .update(cases)
    .set({ searchText: buildSearchText(row, attempts), updatedAt: new Date() })
    .where(eq(cases.id, row.id));
}

function startOfDay(value: string): Date {
  return new Date(/^\d{4}-\d{2}-\d{2}$/.test(value) ? `${value}T00:00:00.000Z` : value);
}

export function casesRouter({ db, dbKind, mail, baseURL }: AppDeps): Router {
  const router = Router();
  const vocabularies = new VocabularyCache(db, { analyze: dbKind === "pglite" });

  /** WHERE and ORDER BY for a list query; every condition starts from the caller's group. */
  async function listQuery(req: Request, f: CaseListFilters) {
    const groupId = req.group!.id;
    const where: SQL[] = [eq(cases.groupId, groupId)];
    if (!f.includeRetired) where.push(eq(cases.retired, false));
    if (f.solvent) where.push(arrayContains(cases.solventKeys, [requireSolvent(f.solvent, "solvent").key]));
    if (f.aqueous) where.push(eq(cases.aqueousKey, requireSolute(f.aqueous, "aqueous").key));
    if (f.cause) where.push(arrayContains(cases.causes, [f.cause]));
    if (f.remedy || f.outcome) {
      // Remedy and outcome together mean the same attempt: "brine was tried and cleared it".
      const attemptWhere: SQL[] = [eq(caseAttempts.caseId, cases.id)];
      if (f.remedy) attemptWhere.push(eq(caseAttempts.remedyId, f.remedy));
      if (f.outcome) attemptWhere.push(eq(caseAttempts.outcome, f.outcome));
      where.push(exists(db.select({ one: sql`1` }).from(caseAttempts).where(and(...attemptWhere))));
    }
    if (f.status) where.push(eq(cases.status, f.status));
    if (f.author) where.push(eq(cases.authorId, f.author === "me" ? req.user!.id : f.author));
    if (f.from) where.push(gte(cases.occurredAt, startOfDay(f.from)));
    if (f.to) {
      if (/^\d{4}-\d{2}-\d{2}$/.test(f.to)) {
        const next = startOfDay(f.to);
        next.setUTCDate(next.getUTCDate() + 1);
        where.push(lt(cases.occurredAt, next));
      } else where.push(lte(cases.occurredAt, new Date(f.to)));
    }
    if (f.from && f.to && startOfDay(f.from) > new Date(f.to.length === 10 ? `${f.to}T23:59:59.999Z` : f.to)) {
      throw badRequest("The start date is after the end date.", { from: "The start date is after the end date." });
    }
    if (f.verified !== undefined) where.push(eq(cases.verified, f.verified));

    let rank: SQL | null = null;
    const terms = f.q ? parseSearchQuery(f.q) : [];
    if (terms.length > 0) {
      const vocab = await vocabularies.get(groupId);
      const queries: string[] = [];
      for (const term of terms) queries.push(`(${termTsQuery(term, vocab)})`);
      // Every term must match: one tsquery of them all, so each case's vector is tested once.
      where.push(sql`${cases.searchVector} @@ to_tsquery('simple', ${queries.join(" & ")})`);
      rank = sql`ts_rank(${cases.searchVector}, to_tsquery('simple', ${queries.join(" | ")}))`;
    }
    const dir = f.order === "asc" ? asc : desc;
    const sort = f.sort ?? (rank ? "relevance" : "occurredAt");
    const orderBy: SQL[] =
      sort === "relevance" && rank
        ? [f.order === "asc" ? asc(rank) : desc(rank), desc(cases.occurredAt)]
        : sort === "title"
          ? [f.order === "desc" ? desc(cases.title) : asc(cases.title), desc(cases.occurredAt)]
          : sort === "status"
            ? [dir(cases.status), desc(cases.occurredAt)]
            : sort === "updatedAt"
              ? [dir(cases.updatedAt)]
              : [dir(cases.occurredAt)];
    return { where: and(...where)!, orderBy: [...orderBy, asc(cases.id)], searching: terms.length > 0, rank: sort === "relevance" ? rank : null };
  }

  /** Case rows → summaries, with their attempts, photo counts and the caller's follows in three queries. */
  async function summaries(rows: (CaseRow & { authorName: string })[], userId: string) {
    const ids = rows.map((r) => r.id);
    if (ids.length === 0) return [];
    const [attempts, photos, follows] = await Promise.all([
      db
        .select({
          caseId: caseAttempts.caseId,
          position: caseAttempts.position,
          remedyId: caseAttempts.remedyId,
          description: caseAttempts.description,
          minutes: caseAttempts.minutes,
          outcome: caseAttempts.outcome,
        })
        .from(caseAttempts)
        .where(inArray(caseAttempts.caseId, ids)),
      db
        .select({ caseId: casePhotos.caseId, id: casePhotos.id, createdAt: casePhotos.createdAt })
        .from(casePhotos)
        .where(inArray(casePhotos.caseId, ids))
        .orderBy(asc(casePhotos.createdAt), asc(casePhotos.id)),
      db
        .select({ caseId: caseFollowers.caseId })
        .from(caseFollowers)
        .where(and(inArray(caseFollowers.caseId, ids), eq(caseFollowers.userId, userId))),
    ]);
    const followed = new Set(follows.map((f) => f.caseId));
    return rows.map((row) => {
      const own = photos.filter((p) => p.caseId === row.id);
      return toSummary(row, {
        authorName: row.authorName,
        attempts: attempts.filter((a) => a.caseId === row.id),
        photoCount: own.length,
        firstPhotoId: own[0]?.id ?? null,
        following: followed.has(row.id),
      });
    });
  }

  /**
   * A page of cases and the total. Without a search the total is exact. A search counts at most
   * `cap` matches, and ranking by relevance considers only the newest `cap` of them (ranking
   * every match of a broad word was most of a search's time in a large group); past the cap the
   * total is a lower bound. Other orders still sort every match.
   */
  async function listCases(req: Request, f: CaseListFilters, limit: number, offset: number, cap = SEARCH_MATCH_CAP) {
    const { where, orderBy, searching, rank } = await listQuery(req, f);
    const userId = req.user!.id;
    /** A search's total: the matches counted up to cap + 1 (unless the page query already did). */
    const capped = async (counted: number | undefined) => {
      const n = counted ?? Number((await db.select({ n: count() }).from(db.select({ one: sql`1` }).from(cases).where(where).limit(cap + 1).as("m")))[0]?.n ?? 0);
      return { total: Math.min(n, cap), totalIsLowerBound: n > cap };
    };
    if (rank) {
      // The newest cap + 1 matches, ranked in the same pass down the group/occurred index; the
      // first cap are ordered by rank for the page, the one more says "at least".
      const hits = db.$with("hits").as(
        db
          .select({ id: cases.id, occurredAt: cases.occurredAt, rank: sql<number>`${rank}`.as("rank") })
          .from(cases)
          .where(where)
          .orderBy(desc(cases.occurredAt), desc(cases.id))
          .limit(cap + 1),
      );
      const newest = db.select().from(hits).orderBy(desc(hits.occurredAt), desc(hits.id)).limit(cap).as("newest");
      const byRank = f.order === "asc" ? asc : desc;
      const page = db
        .select()
        .from(newest)
        .orderBy(byRank(newest.rank), desc(newest.occurredAt), asc(newest.id))
        .limit(limit)
        .offset(offset)
        .as("page");
      const rows = await db
        .with(hits)
        .select({ ...caseColumns, authorName: user.name, matches: sql<number>`(select count(*) from ${hits})`.mapWith(Number) })
        .from(page)
        .innerJoin(cases, eq(cases.id, page.id))
        .innerJoin(user, eq(user.id, cases.authorId))
        .orderBy(byRank(page.rank), desc(page.occurredAt), asc(page.id));
      return { cases: await summaries(rows, userId), ...(await capped(rows[0]?.matches)) };
    }
    // Without a search the total rides along as a window count, so the filters run once.
    const rows = await db
      .select({ ...caseColumns, authorName: user.name, total: (searching ? sql<number>`null` : sql<number>`count(*) over ()`).mapWith(Number) })
      .from(cases)
      .innerJoin(user, eq(user.id, cases.authorId))
      .where(where)
      .orderBy(...orderBy)
      .limit(limit)
      .offset(offset);
    if (searching) return { cases: await summaries(rows, userId), ...(await capped(undefined)) };
    const total = rows.length > 0 || offset === 0 ? (rows[0]?.total ?? 0) : Number((await db.select({ n: count() }).from(cases).where(where))[0]?.n ?? 0);
    return { cases: await summaries(rows, userId), total, totalIsLowerBound: false };
  }

  async function similarTo(row: CaseRow): Promise<SimilarCase[]> {
    if (!row.solventFamily) return [];
    const where: SQL[] = [
      eq(cases.groupId, row.groupId),
      ne(cases.id, row.id),
      eq(cases.retired, false),
      eq(cases.solventFamily, row.solventFamily),
    ];
    if (row.phBand) where.push(eq(cases.phBand, row.phBand));
    const candidates = await db
      .select({ ...caseColumns })
      .from(cases)
      .where(and(...where))
      .orderBy(desc(cases.occurredAt))
      .limit(100);
    const scored = candidates
      .map((c) => {
        const sharedCauses = c.causes.filter((x) => row.causes.includes(x));
        const sameKind = row.emulsionKind !== null && c.emulsionKind === row.emulsionKind;
        const matched = ["solvent family", ...(row.phBand ? ["pH band"] : []), ...(sharedCauses.length ? ["cause"] : []), ...(sameKind ? ["kind"] : [])];
        return { c, score: sharedCauses.length * 2 + (sameKind ? 1 : 0), matched };
      })
      // With a cause or a kind on record, a similar case must share one of them.
      .filter((s) => (row.causes.length === 0 && row.emulsionKind === null) || s.score > 0)
      .sort((a, b) => b.score - a.score || b.c.occurredAt.getTime() - a.c.occurredAt.getTime())
      .slice(0, 5);
    if (scored.length === 0) return [];
    const attempts = await db
      .select()
      .from(caseAttempts)
      .where(inArray(caseAttempts.caseId, scored.map((s) => s.c.id)));
    return scored.map(({ c, matched }) => ({
      id: c.id,
      title: c.title,
      status: c.status as CaseStatus,
      solventFamily: c.solventFamily,
      phBand: c.phBand as CasePhBand | null,
      kind: c.emulsionKind as EmulsionKind | null,
      whatWorked: whatWorked(attempts.filter((a) => a.caseId === c.id)),
      occurredAt: c.occurredAt.toISOString(),
      matched,
    }));
  }

  async function detail(req: Request, id: string): Promise<CaseDetail> {
    const row = await caseInGroup(db, req.group!.id, id);
    const [author] = await db.select({ name: user.name }).from(user).where(eq(user.id, row.authorId));
    const attempts = await db
      .select({ a: caseAttempts, authorName: user.name })
      .from(caseAttempts)
      .innerJoin(user, eq(user.id, caseAttempts.authorId))
      .where(eq(caseAttempts.caseId, row.id))
      .orderBy(asc(caseAttempts.position));
    const photos = await db
      .select()
      .from(casePhotos)
      .where(eq(casePhotos.caseId, row.id))
      .orderBy(asc(casePhotos.createdAt), asc(casePhotos.id));
    const followers = await db.select({ userId: caseFollowers.userId }).from(caseFollowers).where(eq(caseFollowers.caseId, row.id));
    const summary: CaseSummary = toSummary(row, {
      authorName: author?.name ?? "",
      attempts: attempts.map((x) => x.a),
      photoCount: photos.length,
      firstPhotoId: photos[0]?.id ?? null,
      following: followers.some((f) => f.userId === req.user!.id),
    });
    const observedBottom = row.observedBottom as CasePhase | null;
    return {
      ...summary,
      system: row.system,
      predicted: row.predicted,
      observedBottom,
      layerSurprise: row.predicted?.bottom != null && observedBottom !== null && row.predicted.bottom !== observedBottom,
      seen: row.seen,
      components: row.components,
      notes: row.notes,
      finalOutcome: row.finalOutcome,
      recovery: row.recovery,
      attempts: attempts.map((x) => toAttempt(x.a, x.authorName)),
      photos: photos.map(toPhoto),
      similar: await similarTo(row),
      followerCount: followers.length,
      canEdit: canEditCase(req.group!, req.user!.id, row.authorId),
      verifiedBy: row.verifiedBy,
      verifiedAt: row.verifiedAt?.toISOString() ?? null,
      verifiedAttemptId: row.verifiedAttemptId,
      retiredAt: row.retiredAt?.toISOString() ?? null,
      retiredBy: row.retiredBy,
      retiredReason: row.retiredReason,
      mergedInto: row.mergedInto,
    };
  }

  async function editableCase(req: Request, tx: Db, lock = false): Promise<CaseRow> {
    const row = await caseInGroup(tx, req.group!.id, parse(idParam, req.params.id), lock);
    if (!canEditCase(req.group!, req.user!.id, row.authorId)) {
      throw forbidden("Only the case's author or a lead can change it.");
    }
    return row;
  }

  const member = requireGroup(db);

  router.post("/cases", member, async (req, res) => {
    const body = parse(createCaseBody, req.body);
    const id = await db.transaction((tx) => insertCase(tx, { groupId: req.group!.id, authorId: req.user!.id, body }));
    res.status(201).json(await detail(req, id));
  });

  router.get("/cases", member, async (req, res) => {
    const f = parse(caseListQuery, req.query);
    const { cases: list, total, totalIsLowerBound } = await listCases(req, f, f.limit, f.offset);
    const body: CaseListResponse = { cases: list, total, totalIsLowerBound, limit: f.limit, offset: f.offset };
    res.json(body);
  });

  router.get("/cases/export.csv", member, async (req, res) => {
    const f = parse(caseListQuery, req.query);
    const { cases: list } = await listCases(req, f, EXPORT_ROW_LIMIT, 0, EXPORT_ROW_LIMIT);
    const header = [
      "id",
      "occurred",
      "title",
      "status",
      "author",
      "organic solvents",
      "aqueous phase",
      "solvent family",
      "pH band",
      "emulsion kind",
      "causes",
      "tags",
      "attempts",
      "what worked",
      "best outcome",
      "verified",
    ];
    const rows = list.map((c) => [
      c.id,
      c.occurredAt,
      c.title,
      c.status,
      c.authorName,
      c.solvents.join("; "),
      c.aqueousLabel,
      c.solventFamily ?? "",
      c.phBand ?? "",
      c.kind ?? "",
      c.causes.join("; "),
      c.tags.join("; "),
      c.attemptCount,
      c.whatWorked ?? "",
      c.bestOutcome ?? "",
      c.verified ? "yes" : "no",
    ]);
    res.setHeader("Content-Type", "text/csv; charset=utf-8");
    res.setHeader("Content-Disposition", 'attachment; filename="phasewise-cases.csv"');
    res.send(toCsv([header, ...rows]));
  });

  router.get("/cases/:id", member, async (req, res) => {
    res.json(await detail(req, parse(idParam, req.params.id)));
  });

  router.patch("/cases/:id", member, async (req, res) => {
    const patch = parse(patchCaseBody, req.body);
    const id = await db.transaction(async (tx) => {
      const row = await editableCase(req, tx, true);
      const derived = patch.system ? deriveSystem({ ...systemInputOf(row.system), ...patch.system }) : null;
      const seen = patch.seen ? { ...row.seen, ...patch.seen } : row.seen;
      const next: CaseRow = {
        ...row,
        ...(patch.title !== undefined ? { title: patch.title } : {}),
        ...(patch.tags !== undefined ? { tags: [...new Set(patch.tags)] } : {}),
        ...(patch.causes !== undefined ? { causes: [...new Set(patch.causes)] } : {}),
        ...(patch.components !== undefined ? { components: patch.components } : {}),
        ...(patch.observedBottom !== undefined ? { observedBottom: patch.observedBottom } : {}),
        ...(patch.notes !== undefined ? { notes: patch.notes } : {}),
        ...(patch.status !== undefined ? { status: patch.status } : {}),
        ...(patch.finalOutcome !== undefined ? { finalOutcome: patch.finalOutcome } : {}),
        ...(patch.recovery !== undefined ? { recovery: patch.recovery } : {}),
        ...(patch.occurredAt !== undefined ? { occurredAt: new Date(patch.occurredAt) } : {}),
        ...(derived
          ? {
              system: derived.system,
              solventKeys: derived.solventKeys,
              aqueousKey: derived.aqueousKey,
              solventFamily: derived.solventFamily,
              phBand: derived.phBand,
              predicted: derived.predicted,
            }
          : {}),
        seen,
        emulsionKind: seen.kind,
      };
      const { id: _id, groupId: _g, authorId: _a, createdAt: _c, ...changes } = next;
      await tx
        .update(cases)
        .set({ ...changes, updatedAt: new Date() })
        .where(and(eq(cases.id, row.id), eq(cases.groupId, row.groupId)));
      await touchCase(tx, next);
      return row.id;
    });
    res.json(await detail(req, id));
  });

  router.post("/cases/:id/attempts", member, async (req, res) => {
    const body = parse(attemptBody, req.body);
    const { caseId, attemptId } = await db.transaction(async (tx) => {
      // The row lock serialises concurrent additions, so positions stay 1, 2, 3…
      const row = await editableCase(req, tx, true);
      const [last] = await tx
        .select({ n: count(), top: max(caseAttempts.position) })
        .from(caseAttempts)
        .where(eq(caseAttempts.caseId, row.id));
      if (Number(last?.n ?? 0) >= MAX_ATTEMPTS_PER_CASE) {
        throw new HttpError(409, "attempt_limit", `A case holds at most ${MAX_ATTEMPTS_PER_CASE} attempts.`);
      }
      const now = new Date();
      const attemptId = crypto.randomUUID();
      await tx.insert(caseAttempts).values({
        id: attemptId,
        caseId: row.id,
        groupId: row.groupId,
        position: (last?.top ?? 0) + 1,
        remedyId: body.remedyId,
        description: body.description ?? null,
        amount: body.amount ?? null,
        minutes: body.minutes ?? null,
        outcome: body.outcome,
        note: body.note ?? null,
        authorId: req.user!.id,
        createdAt: now,
        updatedAt: now,
      });
      await touchCase(tx, row);
      return { caseId: row.id, attemptId };
    });
    const d = await detail(req, caseId);
    const attempt = d.attempts.find((a) => a.id === attemptId);
    res.status(201).json(attempt);
    // Followers hear of it after the answer has gone; a mail failure never fails the attempt.
    if (attempt) void notifyFollowers({ db, mail, baseURL }, caseId, attempt);
  });

  router.patch("/cases/:id/attempts/:attemptId", member, async (req, res) => {
    const patch = parse(attemptPatchBody, req.body);
    const attemptId = parse(idParam, req.params.attemptId);
    const caseId = await db.transaction(async (tx) => {
      const row = await editableCase(req, tx, true);
      const [current] = await tx
        .select()
        .from(caseAttempts)
        .where(and(eq(caseAttempts.id, attemptId), eq(caseAttempts.caseId, row.id)));
      if (!current) throw notFound("That attempt");
      const next = { ...current, ...patch };
      if (!next.remedyId && !(next.description ?? "").trim()) {
        throw badRequest("Pick a remedy or describe what you tried.", { remedyId: "Pick a remedy or describe what you tried." });
      }
      await tx
        .update(caseAttempts)
        .set({
          remedyId: next.remedyId ?? null,
          description: next.description?.trim() ? next.description : null,
          amount: next.amount?.trim() ? next.amount : null,
          minutes: next.minutes ?? null,
          outcome: next.outcome,
          note: next.note?.trim() ? next.note : null,
          updatedAt: new Date(),
        })
        .where(eq(caseAttempts.id, current.id));
      await touchCase(tx, row);
      return row.id;
    });
    const d = await detail(req, caseId);
    res.json(d.attempts.find((a) => a.id === attemptId));
  });

  async function followState(caseId: string, userId: string): Promise<FollowResponse> {
    const rows = await db.select({ userId: caseFollowers.userId }).from(caseFollowers).where(eq(caseFollowers.caseId, caseId));
    return { following: rows.some((r) => r.userId === userId), followerCount: rows.length };
  }

  router.post("/cases/:id/follow", member, async (req, res) => {
    const row = await caseInGroup(db, req.group!.id, parse(idParam, req.params.id));
    await db.insert(caseFollowers).values({ caseId: row.id, userId: req.user!.id, createdAt: new Date() }).onConflictDoNothing();
    res.json(await followState(row.id, req.user!.id));
  });

  router.delete("/cases/:id/follow", member, async (req, res) => {
    const row = await caseInGroup(db, req.group!.id, parse(idParam, req.params.id));
    await db.delete(caseFollowers).where(and(eq(caseFollowers.caseId, row.id), eq(caseFollowers.userId, req.user!.id)));
    res.json(await followState(row.id, req.user!.id));
  });

  return router;
}
