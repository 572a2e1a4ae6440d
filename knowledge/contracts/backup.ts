import * as z from "./zod";
import { ATTEMPT_OUTCOMES, CASE_STATUSES, PH_BANDS } from "./cases";

/*
 * A lab group's backup: everything the group has recorded, as one JSON document. Written by
 * GET /api/backup (one record per line, so a reader can count progress) and read back by
 * POST /api/backup/import into an empty group. Ids inside are the source group's; an import
 * gives every record a new id and maps people by e-mail.
 */

export const BACKUP_FORMAT = "phasewise-group-backup";
export const BACKUP_VERSION = 1;
/** The media type an import is sent with (the body may exceed the API's 1 MB JSON limit). */
export const BACKUP_MEDIA_TYPE = "application/vnd.phasewise.backup+json";
export const BACKUP_MAX_BYTES = 200 * 1024 * 1024;

const when = z.iso.datetime({ offset: true });
const whenOrNull = z.nullable(when);
const id = z.string().check(z.minLength(1), z.maxLength(200));
const idOrNull = z.nullable(id);
const textOrNull = z.nullable(z.string().check(z.maxLength(100_000)));
const json = z.unknown();

export const backupPerson = z.object({ id, email: z.email().check(z.maxLength(320)), name: z.string().check(z.maxLength(200)) });
export const backupMember = z.object({ userId: id, role: z.string().check(z.maxLength(40)) });

export const backupCase = z.object({
  id,
  authorId: id,
  title: z.string().check(z.minLength(1), z.maxLength(500)),
  system: z.looseObject({ organic: z.array(z.record(z.string(), json)).check(z.minLength(1)), aqueous: z.record(z.string(), json), temperatureC: z.number() }),
  solventKeys: z.array(z.string()),
  aqueousKey: textOrNull,
  solventFamily: textOrNull,
  phBand: z.nullable(z.enum(PH_BANDS)),
  tags: z.array(z.string()),
  causes: z.array(z.string()),
  components: z.array(z.record(z.string(), json)),
  predicted: z.nullable(z.record(z.string(), json)),
  observedBottom: z.nullable(z.enum(["organic", "aqueous"])),
  seen: z.record(z.string(), json),
  emulsionKind: textOrNull,
  notes: z.string().check(z.maxLength(100_000)),
  status: z.enum(CASE_STATUSES),
  finalOutcome: textOrNull,
  recovery: z.nullable(z.record(z.string(), json)),
  searchText: z.string().check(z.maxLength(1_000_000)),
  occurredAt: when,
  createdAt: when,
  updatedAt: when,
  verified: z.boolean(),
  verifiedBy: idOrNull,
  verifiedAt: whenOrNull,
  verifiedAttemptId: idOrNull,
  retired: z.boolean(),
  retiredAt: whenOrNull,
  retiredBy: idOrNull,
  retiredReason: textOrNull,
  mergedInto: idOrNull,
});

export const backupAttempt = z.object({
  id,
  caseId: id,
  position: z.number().check(z.int(), z.minimum(1)),
  remedyId: textOrNull,
  description: textOrNull,
  amount: textOrNull,
  minutes: z.nullable(z.number()),
  outcome: z.enum(ATTEMPT_OUTCOMES),
  note: textOrNull,
  authorId: id,
  createdAt: when,
  updatedAt: when,
});

export const backupPhoto = z.object({
  id,
  caseId: id,
  storageKey: z.string().check(z.maxLength(300)),
  thumbnailKey: z.string().check(z.maxLength(300)),
  mimeType: z.string().check(z.maxLength(100)),
  sizeBytes: z.number().check(z.int(), z.minimum(0)),
  width: z.number().check(z.int(), z.minimum(0)),
  height: z.number().check(z.int(), z.minimum(0)),
  thumbnailSizeBytes: z.number().check(z.int(), z.minimum(0)),
  uploadedBy: id,
  createdAt: when,
});

export const backupFollower = z.object({ caseId: id, userId: id, createdAt: when });

export const backupRequest = z.object({
  id,
  caseId: id,
  askedBy: id,
  askedOf: id,
  text: z.string().check(z.minLength(1), z.maxLength(10_000)),
  status: z.enum(["open", "answered"]),
  reply: textOrNull,
  answeredAt: whenOrNull,
  answeredBy: idOrNull,
  createdAt: when,
});

export const backupMerge = z.object({
  id,
  keptId: id,
  mergedId: id,
  movedAttempts: z.array(z.object({ id, position: z.number().check(z.int()) })),
  movedPhotoIds: z.array(id),
  addedFollowerIds: z.array(id),
  mergedBy: id,
  createdAt: when,
  undoneAt: whenOrNull,
  undoneBy: idOrNull,
});

export const backupAdvice = z.object({
  id,
  remedyId: z.string().check(z.minLength(1), z.maxLength(100)),
  solventFamily: textOrNull,
  phBand: z.nullable(z.enum(PH_BANDS)),
  causeCode: textOrNull,
  text: z.string().check(z.minLength(1), z.maxLength(10_000)),
  sourceCaseIds: z.array(id),
  createdBy: id,
  createdAt: when,
  updatedAt: when,
  version: z.number().check(z.int(), z.minimum(1)),
  retiredAt: whenOrNull,
  retiredBy: idOrNull,
  retiredReason: textOrNull,
});

export const backupOverride = z.object({
  id,
  kind: z.enum(["solvent-value", "aqueous-point", "solvent-new"]),
  subject: z.string().check(z.minLength(1), z.maxLength(500)),
  targetKey: z.string().check(z.minLength(1), z.maxLength(200)),
  payload: z.record(z.string(), json),
  source: z.string().check(z.minLength(1), z.maxLength(2000)),
  reason: z.string().check(z.minLength(1), z.maxLength(2000)),
  createdBy: idOrNull,
  createdAt: when,
  retiredAt: whenOrNull,
  retiredBy: idOrNull,
  retiredReason: textOrNull,
});

export const backupAudit = z.object({
  id,
  actorId: idOrNull,
  action: z.string().check(z.minLength(1), z.maxLength(100)),
  entityType: z.string().check(z.minLength(1), z.maxLength(100)),
  entityId: z.string().check(z.minLength(1), z.maxLength(500)),
  before: json,
  after: json,
  reason: textOrNull,
  restoredFrom: idOrNull,
  createdAt: when,
});

/** The record lists, in the order they are written and read. */
export const BACKUP_TABLES = ["people", "members", "cases", "attempts", "photos", "followers", "requests", "merges", "advice", "overrides", "audit"] as const;
export type BackupTable = (typeof BACKUP_TABLES)[number];

export const backupDocument = z.object({
  format: z.literal(BACKUP_FORMAT, { message: "This is not a Phasewise group backup." }),
  version: z.literal(BACKUP_VERSION, { message: `Only backups of version ${BACKUP_VERSION} can be read.` }),
  exportedAt: when,
  group: z.object({ id, name: z.string().check(z.maxLength(200)), slug: z.nullable(z.string().check(z.maxLength(200))) }),
  people: z.array(backupPerson),
  members: z.array(backupMember),
  cases: z.array(backupCase),
  attempts: z.array(backupAttempt),
  photos: z.array(backupPhoto),
  followers: z.array(backupFollower),
  requests: z.array(backupRequest),
  merges: z.array(backupMerge),
  advice: z.array(backupAdvice),
  overrides: z.array(backupOverride),
  audit: z.array(backupAudit),
});
export type BackupDocument = z.infer<typeof backupDocument>;

export type BackupCounts = Record<BackupTable, number>;

export interface ImportResponse {
  groupId: string;
  imported: BackupCounts;
  /** photos whose files were not in this server's storage: their records are not imported */
  photosMissing: number;
  /** people of the backup who are members here (matched by e-mail) */
  peopleMatched: number;
  /** people credited to the importer because no member here has their e-mail */
  peopleToImporter: number;
}
