import { and, asc, eq, isNull } from "drizzle-orm";
import type { Database } from "../db/client";
import { member, referenceOverrides } from "../db/schema";
import { applyCorrections } from "../knowledge/contracts/reference-overrides";
import { SHIPPED_REFERENCE } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";
import type { DbOrTx } from "./audit";

/*
 * The reference tables one lab group computes with: the shipped tables plus the group's active
 * corrections. The look-up indexes in knowledge/reference.ts are cached per ReferenceData object,
 * so the applied tables are cached per group and rebuilt only when the set of active corrections
 * changes. The set is re-read on every call (one indexed query), so a correction made by another
 * server process is seen on the next request; `invalidateGroupReference` drops the entry at once.
 */

interface CacheEntry {
  /** the ids of the active corrections, in order: rows are never edited, so the ids fix the result */
  fingerprint: string;
  ref: ReferenceData;
  skipped: SkippedOverride[];
}

export interface SkippedOverride {
  id: string;
  message: string;
}

const caches = new WeakMap<object, Map<string, CacheEntry>>();

function cacheOf(db: object): Map<string, CacheEntry> {
  let cache = caches.get(db);
  if (!cache) {
    cache = new Map();
    caches.set(db, cache);
  }
  return cache;
}

export async function activeOverrides(db: DbOrTx, groupId: string) {
  return db
    .select({ id: referenceOverrides.id, payload: referenceOverrides.payload })
    .from(referenceOverrides)
    .where(and(eq(referenceOverrides.groupId, groupId), isNull(referenceOverrides.retiredAt)))
    .orderBy(asc(referenceOverrides.createdAt), asc(referenceOverrides.id));
}

async function load(db: Database, groupId: string): Promise<CacheEntry> {
  const rows = await activeOverrides(db, groupId);
  const fingerprint = rows.map((r) => r.id).join(",");
  const cache = cacheOf(db);
  const hit = cache.get(groupId);
  if (hit && hit.fingerprint === fingerprint) return hit;
  const entry: CacheEntry = rows.length === 0 ? { fingerprint, ref: SHIPPED_REFERENCE, skipped: [] } : { fingerprint, ...applyCorrections(SHIPPED_REFERENCE, rows) };
  cache.set(groupId, entry);
  return entry;
}

/** The shipped tables with this group's active corrections applied. */
export async function groupReference(db: Database, groupId: string): Promise<ReferenceData> {
  return (await load(db, groupId)).ref;
}

/** The corrections that could not be applied (shown on the desk so a lead can retire them). */
export async function skippedOverrides(db: Database, groupId: string): Promise<SkippedOverride[]> {
  return (await load(db, groupId)).skipped;
}

/** Call after a correction is added, retired or restored. */
export function invalidateGroupReference(db: object, groupId: string): void {
  cacheOf(db).delete(groupId);
}

/** The group a signed-in user computes for: the session's active group if they belong to it, else their first. */
export async function computingGroupOf(db: Database, userId: string, activeGroupId: string | null | undefined): Promise<string | null> {
  const rows = await db
    .select({ groupId: member.organizationId })
    .from(member)
    .where(eq(member.userId, userId))
    .orderBy(asc(member.createdAt));
  if (activeGroupId && rows.some((r) => r.groupId === activeGroupId)) return activeGroupId;
  return rows[0]?.groupId ?? null;
}
