import { and, asc, count, eq, getTableColumns, gt, sql, type SQL } from "drizzle-orm";
import type { PgColumn, PgTable } from "drizzle-orm/pg-core";
import {
  BACKUP_FORMAT,
  BACKUP_TABLES,
  BACKUP_VERSION,
  type BackupCounts,
  type BackupDocument,
  type BackupTable,
  type ImportResponse,
} from "../knowledge/contracts/backup";
import { applyOverrides, type ReferenceOverride } from "../knowledge/overrides";
import { SHIPPED_REFERENCE } from "../knowledge/reference";
import { KnowledgeInputError } from "../knowledge/types";
import type { Database } from "../db/client";
import {
  auditLog,
  caseAttempts,
  caseFollowers,
  caseMerges,
  casePhotos,
  caseRequests,
  cases,
  groupAdvice,
  member,
  organization,
  referenceOverrides,
  user,
} from "../db/schema";
import { recordAudit, type DbOrTx, type Tx } from "./audit";
import { HttpError, badRequest, notFound } from "./middleware/errors";
import { newStorageKey, type Storage } from "./storage";

/*
 * Whole-group backup. The export streams one record per line, table by table, reading each
 * table in pages by id so a large group never sits in memory. The import writes everything
 * into an empty group in the caller's transaction, with new ids throughout.
 */

export const EXPORT_PAGE = 500;

// ── export ───────────────────────────────────────────────────────────────────

const { groupId: _cg, searchVector: _cv, ...caseCols } = getTableColumns(cases);
const { groupId: _ag, ...attemptCols } = getTableColumns(caseAttempts);
const { groupId: _pg, ...photoCols } = getTableColumns(casePhotos);
const { groupId: _rg, ...requestCols } = getTableColumns(caseRequests);
const { groupId: _mg, ...mergeCols } = getTableColumns(caseMerges);
const { groupId: _dg, ...adviceCols } = getTableColumns(groupAdvice);
const { groupId: _og, ...overrideCols } = getTableColumns(referenceOverrides);
const { groupId: _lg, ...auditCols } = getTableColumns(auditLog);

interface TableSpec {
  table: PgTable;
  columns: Record<string, PgColumn>;
  groupColumn: PgColumn;
  idColumn: PgColumn;
}

const SPECS: Partial<Record<BackupTable, TableSpec>> = {
  cases: { table: cases, columns: caseCols, groupColumn: cases.groupId, idColumn: cases.id },
  attempts: { table: caseAttempts, columns: attemptCols, groupColumn: caseAttempts.groupId, idColumn: caseAttempts.id },
  photos: { table: casePhotos, columns: photoCols, groupColumn: casePhotos.groupId, idColumn: casePhotos.id },
  requests: { table: caseRequests, columns: requestCols, groupColumn: caseRequests.groupId, idColumn: caseRequests.id },
  merges: { table: caseMerges, columns: mergeCols, groupColumn: caseMerges.groupId, idColumn: caseMerges.id },
  advice: { table: groupAdvice, columns: adviceCols, groupColumn: groupAdvice.groupId, idColumn: groupAdvice.id },
  overrides: { table: referenceOverrides, columns: overrideCols, groupColumn: referenceOverrides.groupId, idColumn: referenceOverrides.id },
  audit: { table: auditLog, columns: auditCols, groupColumn: auditLog.groupId, idColumn: auditLog.id },
};

function rowsOf(result: unknown): Record<string, unknown>[] {
  return (result as { rows: Record<string, unknown>[] }).rows;
}

/** Everyone a record of the group names, and its members: the backup maps them by e-mail. */
function peopleSql(groupId: string): SQL {
  return sql`select id, email, name from "user" where id in (
    select user_id from member where organization_id = ${groupId}
    union select author_id from cases where group_id = ${groupId}
    union select verified_by from cases where group_id = ${groupId}
    union select retired_by from cases where group_id = ${groupId}
    union select author_id from case_attempts where group_id = ${groupId}
    union select uploaded_by from case_photos where group_id = ${groupId}
    union select f.user_id from case_followers f join cases c on c.id = f.case_id where c.group_id = ${groupId}
    union select asked_by from case_requests where group_id = ${groupId}
    union select asked_of from case_requests where group_id = ${groupId}
    union select answered_by from case_requests where group_id = ${groupId}
    union select merged_by from case_merges where group_id = ${groupId}
    union select undone_by from case_merges where group_id = ${groupId}
    union select created_by from group_advice where group_id = ${groupId}
    union select retired_by from group_advice where group_id = ${groupId}
    union select created_by from reference_overrides where group_id = ${groupId}
    union select retired_by from reference_overrides where group_id = ${groupId}
    union select actor_id from audit_log where group_id = ${groupId}
  ) order by id`;
}

/** How many records each list of the backup will hold. */
export async function backupCounts(db: Database, groupId: string): Promise<BackupCounts> {
  const counts = {} as BackupCounts;
  const people = rowsOf(await db.execute(sql`select count(*)::int as n from (${peopleSql(groupId)}) p`));
  counts.people = Number(people[0]?.n ?? 0);
  const [members] = await db.select({ n: count() }).from(member).where(eq(member.organizationId, groupId));
  counts.members = Number(members?.n ?? 0);
  const [followers] = await db
    .select({ n: count() })
    .from(caseFollowers)
    .innerJoin(cases, eq(cases.id, caseFollowers.caseId))
    .where(eq(cases.groupId, groupId));
  counts.followers = Number(followers?.n ?? 0);
  for (const [name, spec] of Object.entries(SPECS) as [BackupTable, TableSpec][]) {
    const [row] = await db.select({ n: count() }).from(spec.table).where(eq(spec.groupColumn, groupId));
    counts[name] = Number(row?.n ?? 0);
  }
  return counts;
}

/** Pages of one table's group rows, by id. */
async function* pagesOf(db: Database, spec: TableSpec, groupId: string, page: number): AsyncGenerator<Record<string, unknown>[]> {
  let after: string | null = null;
  for (;;) {
    const where: SQL = after === null ? eq(spec.groupColumn, groupId) : and(eq(spec.groupColumn, groupId), gt(spec.idColumn, after))!;
    const rows = (await db.select(spec.columns).from(spec.table).where(where).orderBy(asc(spec.idColumn)).limit(page)) as Record<string, unknown>[];
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < page) return;
    after = String(rows[rows.length - 1]!.id);
  }
}

async function* followerPages(db: Database, groupId: string, page: number): AsyncGenerator<Record<string, unknown>[]> {
  let after: { caseId: string; userId: string } | null = null;
  for (;;) {
    const rows: { caseId: string; userId: string; createdAt: Date }[] = await db
      .select({ caseId: caseFollowers.caseId, userId: caseFollowers.userId, createdAt: caseFollowers.createdAt })
      .from(caseFollowers)
      .innerJoin(cases, eq(cases.id, caseFollowers.caseId))
      .where(
        after === null
          ? eq(cases.groupId, groupId)
          : and(eq(cases.groupId, groupId), sql`(${caseFollowers.caseId}, ${caseFollowers.userId}) > (${after.caseId}, ${after.userId})`),
      )
      .orderBy(asc(caseFollowers.caseId), asc(caseFollowers.userId))
      .limit(page);
    if (rows.length === 0) return;
    yield rows;
    if (rows.length < page) return;
    const last: { caseId: string; userId: string } = rows[rows.length - 1]!;
    after = { caseId: last.caseId, userId: last.userId };
  }
}

/**
 * Writes the group's backup through `write` (which should wait while the reader is behind).
 * Each record stands on its own line, so counting lines tells a reader how far it has got.
 */
export async function writeBackup(db: Database, groupId: string, write: (chunk: string) => Promise<void>, page = EXPORT_PAGE): Promise<void> {
  const [group] = await db.select({ id: organization.id, name: organization.name, slug: organization.slug }).from(organization).where(eq(organization.id, groupId));
  if (!group) throw notFound("That group");
  const head = { format: BACKUP_FORMAT, version: BACKUP_VERSION, exportedAt: new Date().toISOString(), group };
  await write(JSON.stringify(head).slice(0, -1));
  for (const name of BACKUP_TABLES) {
    await write(`,\n${JSON.stringify(name)}:[`);
    let first = true;
    const emit = async (rows: Record<string, unknown>[]) => {
      let chunk = "";
      for (const row of rows) {
        chunk += `${first ? "" : ","}\n${JSON.stringify(row)}`;
        first = false;
      }
      await write(chunk);
    };
    if (name === "people") await emit(rowsOf(await db.execute(peopleSql(groupId))));
    else if (name === "members") {
      await emit(await db.select({ userId: member.userId, role: member.role }).from(member).where(eq(member.organizationId, groupId)).orderBy(asc(member.userId)));
    } else if (name === "followers") for await (const rows of followerPages(db, groupId, page)) await emit(rows);
    else for await (const rows of pagesOf(db, SPECS[name]!, groupId, page)) await emit(rows);
    await write("]");
  }
  await write("}\n");
}

// ── import ───────────────────────────────────────────────────────────────────

const INSERT_CHUNK = 200;

async function insertAll<T extends Record<string, unknown>>(tx: Tx, table: PgTable, rows: T[]): Promise<void> {
  for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
    // drizzle's insert typing is per table; the rows are built to each table's shape below.
    await tx.insert(table).values(rows.slice(i, i + INSERT_CHUNK) as never);
  }
}

const date = (s: string) => new Date(s);
const dateOrNull = (s: string | null) => (s === null ? null : new Date(s));

/** Refuses a group that already holds records of its own (members alone do not count). */
async function assertEmpty(tx: DbOrTx, groupId: string): Promise<void> {
  const checks: [string, PgTable, PgColumn][] = [
    ["cases", cases, cases.groupId],
    ["advice notes", groupAdvice, groupAdvice.groupId],
    ["reference corrections", referenceOverrides, referenceOverrides.groupId],
  ];
  for (const [what, table, column] of checks) {
    const [row] = await tx.select({ n: count() }).from(table).where(eq(column, groupId));
    if (Number(row?.n ?? 0) > 0) {
      throw new HttpError(409, "group_not_empty", `This group already has ${what}. Import a backup into a new, empty group.`);
    }
  }
}

/**
 * Writes a backup into the empty group `groupId` inside `tx`. People are matched to the group's
 * members by e-mail, else credited to the importer; every record gets a new id, and ids inside
 * audit snapshots follow. A photo is kept when its files are in this server's storage (they are
 * copied under new keys); otherwise its record is left out and counted as missing. The keys of
 * copied files go into `writtenKeys` as they are written, so a caller can remove them if the
 * transaction rolls back.
 */
export async function importBackup(
  tx: Tx,
  storage: Storage,
  args: { groupId: string; importerId: string; doc: BackupDocument },
  writtenKeys: string[] = [],
): Promise<ImportResponse> {
  const { groupId, importerId, doc } = args;
  // Serialise imports into one group: the row lock holds until the transaction ends.
  const [locked] = await tx.select({ id: organization.id }).from(organization).where(eq(organization.id, groupId)).for("update");
  if (!locked) throw notFound("That group");
  await assertEmpty(tx, groupId);

  // People: by e-mail to this group's members, else to the importer.
  const here = await tx
    .select({ userId: member.userId, email: user.email })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, groupId));
  const byEmail = new Map(here.map((m) => [m.email.toLowerCase(), m.userId]));
  const people = new Map<string, string>();
  let peopleMatched = 0;
  for (const p of doc.people) {
    const match = byEmail.get(p.email.toLowerCase());
    if (match) peopleMatched += 1;
    people.set(p.id, match ?? importerId);
  }
  const person = (id: string) => people.get(id) ?? importerId;
  const personOrNull = (id: string | null) => (id === null ? null : person(id));

  // New ids for every record.
  const ids = new Map<string, string>();
  const fresh = (list: { id: string }[]) => {
    for (const r of list) {
      if (ids.has(r.id)) throw badRequest(`The backup holds the id ${r.id} twice.`);
      ids.set(r.id, crypto.randomUUID());
    }
  };
  for (const list of [doc.cases, doc.attempts, doc.photos, doc.requests, doc.merges, doc.advice, doc.overrides, doc.audit]) fresh(list);
  const caseIds = new Set(doc.cases.map((c) => c.id));
  const needCase = (id: string, what: string) => {
    if (!caseIds.has(id)) throw badRequest(`${what} refers to a case the backup does not hold (${id}).`);
    return ids.get(id)!;
  };
  const mapped = (id: string | null) => (id === null ? null : (ids.get(id) ?? null));

  // Ids inside audit snapshots follow the records (so a restore from an imported entry works).
  const remap = (value: unknown): unknown => {
    if (typeof value === "string") return ids.get(value) ?? (people.has(value) ? person(value) : value);
    if (Array.isArray(value)) return value.map(remap);
    if (value && typeof value === "object") return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, remap(v)]));
    return value;
  };

  // Corrections must still apply to the shipped tables, or every computation of the group would fail.
  const activeOverrides = doc.overrides.filter((o) => o.retiredAt === null).map((o) => o.payload as unknown as ReferenceOverride);
  try {
    applyOverrides(SHIPPED_REFERENCE, activeOverrides);
  } catch (e) {
    if (e instanceof KnowledgeInputError) throw badRequest(`A reference correction in the backup does not apply: ${e.message}`);
    throw e;
  }

  await insertAll(
    tx,
    cases,
    doc.cases.map((c) => ({
      ...c,
      id: ids.get(c.id)!,
      groupId,
      authorId: person(c.authorId),
      system: c.system as unknown as typeof cases.$inferInsert.system,
      components: c.components as unknown as typeof cases.$inferInsert.components,
      predicted: c.predicted as unknown as typeof cases.$inferInsert.predicted,
      seen: c.seen as unknown as typeof cases.$inferInsert.seen,
      recovery: c.recovery as typeof cases.$inferInsert.recovery,
      occurredAt: date(c.occurredAt),
      createdAt: date(c.createdAt),
      updatedAt: date(c.updatedAt),
      verifiedBy: personOrNull(c.verifiedBy),
      verifiedAt: dateOrNull(c.verifiedAt),
      verifiedAttemptId: mapped(c.verifiedAttemptId),
      retiredAt: dateOrNull(c.retiredAt),
      retiredBy: personOrNull(c.retiredBy),
      // Set once every case exists (it points at another case of the backup).
      mergedInto: null,
    })),
  );
  for (const c of doc.cases.filter((x) => x.mergedInto !== null)) {
    await tx.update(cases).set({ mergedInto: needCase(c.mergedInto!, "A merged case") }).where(eq(cases.id, ids.get(c.id)!));
  }

  await insertAll(
    tx,
    caseAttempts,
    doc.attempts.map((a) => ({
      ...a,
      id: ids.get(a.id)!,
      caseId: needCase(a.caseId, "An attempt"),
      groupId,
      authorId: person(a.authorId),
      createdAt: date(a.createdAt),
      updatedAt: date(a.updatedAt),
    })),
  );

  const photoRows: (typeof casePhotos.$inferInsert)[] = [];
  let photosMissing = 0;
  for (const p of doc.photos) {
    const caseId = needCase(p.caseId, "A photo");
    const [image, thumb] = await Promise.all([storage.get(p.storageKey).catch(() => null), storage.get(p.thumbnailKey).catch(() => null)]);
    if (!image || !thumb) {
      photosMissing += 1;
      ids.delete(p.id);
      continue;
    }
    const storageKey = newStorageKey("photos", image.contentType);
    const thumbnailKey = newStorageKey("photos", thumb.contentType, "thumb");
    await storage.put(storageKey, image.bytes, image.contentType);
    writtenKeys.push(storageKey);
    await storage.put(thumbnailKey, thumb.bytes, thumb.contentType);
    writtenKeys.push(thumbnailKey);
    photoRows.push({ ...p, id: ids.get(p.id)!, caseId, groupId, storageKey, thumbnailKey, uploadedBy: person(p.uploadedBy), createdAt: date(p.createdAt) });
  }
  await insertAll(tx, casePhotos, photoRows);

  const followers = new Map<string, typeof caseFollowers.$inferInsert>();
  for (const f of doc.followers) {
    const row = { caseId: needCase(f.caseId, "A follower"), userId: person(f.userId), createdAt: date(f.createdAt) };
    followers.set(`${row.caseId} ${row.userId}`, row);
  }
  await insertAll(tx, caseFollowers, [...followers.values()]);

  await insertAll(
    tx,
    caseRequests,
    doc.requests.map((r) => ({
      ...r,
      id: ids.get(r.id)!,
      groupId,
      caseId: needCase(r.caseId, "A request"),
      askedBy: person(r.askedBy),
      askedOf: person(r.askedOf),
      answeredBy: personOrNull(r.answeredBy),
      answeredAt: dateOrNull(r.answeredAt),
      createdAt: date(r.createdAt),
    })),
  );

  await insertAll(
    tx,
    caseMerges,
    doc.merges.map((m) => ({
      id: ids.get(m.id)!,
      groupId,
      keptId: needCase(m.keptId, "A merge"),
      mergedId: needCase(m.mergedId, "A merge"),
      movedAttempts: m.movedAttempts.filter((a) => ids.has(a.id)).map((a) => ({ id: ids.get(a.id)!, position: a.position })),
      movedPhotoIds: m.movedPhotoIds.filter((p) => ids.has(p)).map((p) => ids.get(p)!),
      addedFollowerIds: [...new Set(m.addedFollowerIds.map(person))],
      mergedBy: person(m.mergedBy),
      createdAt: date(m.createdAt),
      undoneAt: dateOrNull(m.undoneAt),
      undoneBy: personOrNull(m.undoneBy),
    })),
  );

  await insertAll(
    tx,
    groupAdvice,
    doc.advice.map((n) => ({
      ...n,
      id: ids.get(n.id)!,
      groupId,
      sourceCaseIds: n.sourceCaseIds.filter((c) => caseIds.has(c)).map((c) => ids.get(c)!),
      createdBy: person(n.createdBy),
      createdAt: date(n.createdAt),
      updatedAt: date(n.updatedAt),
      retiredAt: dateOrNull(n.retiredAt),
      retiredBy: personOrNull(n.retiredBy),
    })),
  );

  await insertAll(
    tx,
    referenceOverrides,
    doc.overrides.map((o) => ({
      ...o,
      id: ids.get(o.id)!,
      groupId,
      payload: o.payload as unknown as ReferenceOverride,
      createdBy: personOrNull(o.createdBy),
      createdAt: date(o.createdAt),
      retiredAt: dateOrNull(o.retiredAt),
      retiredBy: personOrNull(o.retiredBy),
    })),
  );

  await insertAll(
    tx,
    auditLog,
    doc.audit.map((e) => ({
      id: ids.get(e.id)!,
      groupId,
      actorId: personOrNull(e.actorId),
      action: e.action,
      entityType: e.entityType,
      entityId: ids.get(e.entityId) ?? e.entityId,
      before: remap(e.before ?? null),
      after: remap(e.after ?? null),
      reason: e.reason,
      restoredFrom: mapped(e.restoredFrom),
      createdAt: date(e.createdAt),
    })),
  );

  const imported: BackupCounts = {
    people: doc.people.length,
    members: 0,
    cases: doc.cases.length,
    attempts: doc.attempts.length,
    photos: photoRows.length,
    followers: followers.size,
    requests: doc.requests.length,
    merges: doc.merges.length,
    advice: doc.advice.length,
    overrides: doc.overrides.length,
    audit: doc.audit.length,
  };
  await recordAudit(tx, {
    groupId,
    actorId: importerId,
    action: "backup.import",
    entityType: "group",
    entityId: groupId,
    before: null,
    after: { imported, photosMissing, from: { group: doc.group.name, exportedAt: doc.exportedAt } },
    reason: `Imported the backup of “${doc.group.name}” made ${doc.exportedAt}.`,
  });
  return { groupId, imported, photosMissing, peopleMatched, peopleToImporter: doc.people.length - peopleMatched };
}
