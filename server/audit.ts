import type { Database } from "../db/client";
import { auditLog } from "../db/schema";

/** A transaction handle from `db.transaction(async (tx) => …)`; the plain database also works. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type DbOrTx = Database | Tx;

export interface AuditInput {
  groupId: string;
  /** null when the system acted */
  actorId: string | null;
  action: string;
  entityType: string;
  entityId: string;
  before?: unknown;
  after?: unknown;
  reason?: string | null;
  restoredFrom?: string | null;
}

/** JSON columns keep plain data only: dates become ISO strings, undefined becomes null. */
function plain(value: unknown): unknown {
  if (value === undefined) return null;
  return JSON.parse(JSON.stringify(value)) as unknown;
}

/**
 * Writes one audit entry with the caller's transaction, so the entry and the change it
 * describes commit or roll back together. Returns the entry's id.
 */
export async function recordAudit(tx: DbOrTx, input: AuditInput): Promise<string> {
  const id = crypto.randomUUID();
  await tx.insert(auditLog).values({
    id,
    groupId: input.groupId,
    actorId: input.actorId,
    action: input.action,
    entityType: input.entityType,
    entityId: input.entityId,
    before: plain(input.before),
    after: plain(input.after),
    reason: input.reason ?? null,
    restoredFrom: input.restoredFrom ?? null,
  });
  return id;
}

export interface RestoreContext {
  tx: Tx;
  groupId: string;
  actorId: string;
  entityId: string;
  /** the snapshot to bring back (the entry's `before` or `after`) */
  snapshot: unknown;
  version: "before" | "after";
}

export interface RestoreResult {
  /** the record as it was just before the restore */
  before: unknown;
  /** the record as it is now */
  after: unknown;
}

/**
 * Puts a record back to `snapshot` inside `tx`, scoped to `groupId`. Throw `notFound` when the
 * record is not the group's, `badRequest` when the snapshot cannot be applied. The audit route
 * writes the "restore" entry itself; a restorer must not.
 */
export type Restorer = (ctx: RestoreContext) => Promise<RestoreResult>;

export interface RestorerOptions {
  /**
   * The restorer accepts a null snapshot (the record did not exist, or the shipped value applied):
   * e.g. restoring the version before a reference correction was created retires the correction.
   * Otherwise the route refuses an empty side with a 400.
   */
  restoresEmpty?: boolean;
}

interface Registered extends RestorerOptions {
  restore: Restorer;
}

const restorers = new Map<string, Registered>();

/** Each area registers how to restore its own entity type (once, at module load). */
export function registerRestorer(entityType: string, restore: Restorer, options: RestorerOptions = {}): void {
  restorers.set(entityType, { restore, ...options });
}

export function restorerFor(entityType: string): Registered | undefined {
  return restorers.get(entityType);
}

export function restorableTypes(): string[] {
  return [...restorers.keys()];
}
