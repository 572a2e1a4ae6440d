import { Router } from "express";
import { and, asc, desc, eq, inArray, isNull, isNotNull, type SQL } from "drizzle-orm";
import { z } from "zod";
import {
  SOLVENT_VALUE_FIELDS,
  createOverrideBody,
  overrideListQuery,
  overrideSubject,
  retireOverrideBody,
  type ComparedValue,
  type OverrideListResponse,
  type OverrideView,
  type SoluteComparison,
  type SolventComparison,
} from "../../knowledge/contracts/reference-overrides";
import { resolve, solventDetail, sourceTitle } from "../../knowledge/contracts/solvents";
import { interpolateDensity } from "../../knowledge/concentration";
import { applyOverrides, type ReferenceOverride } from "../../knowledge/overrides";
import { SHIPPED_REFERENCE, normaliseName, requireSolute, requireSolvent } from "../../knowledge/reference";
import { KnowledgeInputError } from "../../knowledge/types";
import { referenceOverrides, user, type ReferenceOverrideRow } from "../../db/schema";
import { recordAudit, registerRestorer, type DbOrTx } from "../audit";
import type { AppDeps } from "../deps";
import { groupReference, invalidateGroupReference, skippedOverrides } from "../group-reference";
import { HttpError, badRequest, notFound } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";

export const OVERRIDE_ENTITY = "reference-override";

const idParam = z.string().trim().min(1).max(120);

/** What the audit log keeps of a correction: enough to show it and to bring it back. */
export interface OverrideSnapshot {
  id: string;
  subject: string;
  payload: ReferenceOverride;
  source: string;
  reason: string;
  createdBy: string | null;
  createdAt: string;
}

function snapshotOf(row: ReferenceOverrideRow): OverrideSnapshot {
  return {
    id: row.id,
    subject: row.subject,
    payload: row.payload,
    source: row.source,
    reason: row.reason,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
  };
}

function isUniqueViolation(err: unknown): boolean {
  for (let e: unknown = err; e && typeof e === "object"; e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === "23505") return true;
  }
  return false;
}

// ── comparison of a correction with the shipped value ─────────────────────────

const shippedSolvent = (key: string) => SHIPPED_REFERENCE.solvents.find((s) => s.key === key);
const shippedSolute = (key: string) => SHIPPED_REFERENCE.solutes.find((s) => s.key === key);

function compared(value: number | null, source: string, note?: string): ComparedValue {
  const out: ComparedValue = { value, source, sourceTitle: sourceTitle(source).title };
  if (note) out.note = note;
  return out;
}

/** The shipped density at a mass fraction: the table point itself, else interpolated, else none beyond the table's end. */
function shippedAqueousValue(soluteKey: string, massFractionPct: number): ComparedValue {
  const solute = shippedSolute(soluteKey);
  if (!solute) return compared(null, "shipped", "not in the shipped tables");
  const points = solute.points.value;
  const exact = points.find((p) => p.massFractionPct === massFractionPct);
  if (exact) return compared(exact.densityGPerMl, solute.points.source);
  const last = points[points.length - 1];
  if (!last || massFractionPct > last.massFractionPct) {
    return compared(null, solute.points.source, `the shipped table ends at ${last?.massFractionPct ?? 0} % w/w`);
  }
  const below = [...points].reverse().find((p) => p.massFractionPct < massFractionPct);
  const above = points.find((p) => p.massFractionPct > massFractionPct);
  return compared(
    interpolateDensity(points, massFractionPct),
    solute.points.source,
    `interpolated between the ${below?.massFractionPct ?? 0} and ${above?.massFractionPct ?? 0} % w/w table points`,
  );
}

function describe(payload: ReferenceOverride): Pick<OverrideView, "targetName" | "label" | "unit" | "shipped" | "group"> {
  switch (payload.kind) {
    case "solvent-value": {
      const s = shippedSolvent(payload.solventKey);
      const f = SOLVENT_VALUE_FIELDS[payload.field];
      const shipped = s ? s[payload.field] : undefined;
      return {
        targetName: s?.name ?? payload.solventKey,
        label: f.label,
        unit: f.unit,
        shipped: shipped ? compared(shipped.value, shipped.source, shipped.note) : compared(null, "shipped", "not in the shipped tables"),
        group: compared(payload.value, payload.source),
      };
    }
    case "aqueous-point":
      return {
        targetName: shippedSolute(payload.soluteKey)?.name ?? payload.soluteKey,
        label: `Density at ${payload.massFractionPct} % w/w, 20 °C`,
        unit: "g/mL",
        shipped: shippedAqueousValue(payload.soluteKey, payload.massFractionPct),
        group: compared(payload.densityGPerMl, payload.source),
      };
    case "solvent-new":
      return {
        targetName: payload.solvent.name,
        label: "Density at 20 °C",
        unit: "g/mL",
        shipped: compared(null, "shipped", "not in the shipped tables"),
        group: compared(payload.solvent.densityGPerMl20C.value, payload.solvent.densityGPerMl20C.source),
      };
  }
}

async function views(db: DbOrTx, rows: ReferenceOverrideRow[], skipped: Set<string>): Promise<OverrideView[]> {
  const userIds = [...new Set(rows.flatMap((r) => [r.createdBy, r.retiredBy]).filter((x): x is string => !!x))];
  const people = userIds.length ? await db.select({ id: user.id, name: user.name }).from(user).where(inArray(user.id, userIds)) : [];
  const person = (id: string | null) => (id ? (people.find((p) => p.id === id) ?? { id, name: "" }) : null);
  return rows.map((row) => ({
    id: row.id,
    kind: row.kind,
    subject: row.subject,
    targetKey: row.targetKey,
    payload: row.payload,
    ...describe(row.payload),
    source: row.source,
    reason: row.reason,
    createdBy: person(row.createdBy),
    createdAt: row.createdAt.toISOString(),
    retiredAt: row.retiredAt?.toISOString() ?? null,
    retiredBy: person(row.retiredBy),
    retiredReason: row.retiredReason,
    applies: row.retiredAt === null && !skipped.has(row.id),
  }));
}

// ── writes (each with its audit entry in the same transaction) ─────────────────

async function activeFor(tx: DbOrTx, groupId: string, subject: string): Promise<ReferenceOverrideRow | undefined> {
  const rows = await tx
    .select()
    .from(referenceOverrides)
    .where(and(eq(referenceOverrides.groupId, groupId), eq(referenceOverrides.subject, subject), isNull(referenceOverrides.retiredAt)))
    .limit(1);
  return rows[0];
}

async function retireRow(tx: DbOrTx, row: ReferenceOverrideRow, actorId: string, reason: string): Promise<void> {
  await tx
    .update(referenceOverrides)
    .set({ retiredAt: new Date(), retiredBy: actorId, retiredReason: reason })
    .where(and(eq(referenceOverrides.id, row.id), eq(referenceOverrides.groupId, row.groupId)));
}

/** Turns the body into the correction knowledge/overrides.ts applies, resolving forgiving names to keys. */
function toPayload(body: z.infer<typeof createOverrideBody>): ReferenceOverride {
  if (body.kind === "solvent-value") {
    const solvent = requireSolvent(body.solventKey, "solventKey");
    return { kind: "solvent-value", solventKey: solvent.key, field: body.field, value: body.value, source: body.source };
  }
  const solute = requireSolute(body.soluteKey, "soluteKey");
  if (solute.key === "water") throw badRequest("Pure water has no concentration to correct.", { soluteKey: "Pick a dissolved salt, acid or base." });
  const saturation = solute.saturationWtPct?.value;
  // A solution above saturation at 20 °C does not exist; 0.5 % w/w allows for a rounded handbook limit.
  if (saturation !== undefined && body.massFractionPct > saturation + 0.5) {
    const message = `${solute.name} saturates at about ${saturation} % w/w at 20 °C; ${body.massFractionPct} % w/w is above it.`;
    throw badRequest(message, { massFractionPct: message });
  }
  return { kind: "aqueous-point", soluteKey: solute.key, massFractionPct: body.massFractionPct, densityGPerMl: body.densityGPerMl, source: body.source };
}

/** The same checks the computations make (a miscible solvent has no mutual solubility, …), as a 400 on the body's field. */
function checkApplies(payload: ReferenceOverride): void {
  try {
    applyOverrides(SHIPPED_REFERENCE, [payload]);
  } catch (err) {
    if (!(err instanceof KnowledgeInputError)) throw err;
    const field = err.field.replace(/^overrides\[\d+\]\./, "");
    throw badRequest(err.message, { [field]: err.message });
  }
}

registerRestorer(
  OVERRIDE_ENTITY,
  async ({ tx, groupId, actorId, entityId, snapshot }) => {
    const current = await activeFor(tx, groupId, entityId);
    if (snapshot === null) {
      if (!current) throw badRequest("The shipped value already applies: there is no correction to retire.");
      await retireRow(tx, current, actorId, "Restored the shipped value from the audit log.");
      return { before: snapshotOf(current), after: null };
    }
    const wanted = snapshot as OverrideSnapshot;
    const rows = await tx
      .select()
      .from(referenceOverrides)
      .where(and(eq(referenceOverrides.groupId, groupId), eq(referenceOverrides.id, String(wanted.id))))
      .limit(1);
    const row = rows[0];
    if (!row || row.subject !== entityId) throw notFound("That correction");
    if (current?.id === row.id) throw badRequest("That version is already in force.");
    if (current) await retireRow(tx, current, actorId, "Replaced by an earlier version restored from the audit log.");
    await tx
      .update(referenceOverrides)
      .set({ retiredAt: null, retiredBy: null, retiredReason: null })
      .where(and(eq(referenceOverrides.id, row.id), eq(referenceOverrides.groupId, groupId)));
    return { before: current ? snapshotOf(current) : null, after: snapshotOf(row) };
  },
  { restoresEmpty: true },
);

export function referenceRouter({ db }: AppDeps): Router {
  const router = Router();

  async function skippedSet(groupId: string) {
    return new Set((await skippedOverrides(db, groupId)).map((s) => s.id));
  }

  /** The active corrections of one solvent or solute, newest first. */
  async function correctionsOf(groupId: string, targetKey: string) {
    const rows = await db
      .select()
      .from(referenceOverrides)
      .where(and(eq(referenceOverrides.groupId, groupId), eq(referenceOverrides.targetKey, targetKey), isNull(referenceOverrides.retiredAt)))
      .orderBy(desc(referenceOverrides.createdAt));
    return views(db, rows, await skippedSet(groupId));
  }

  /** Exact key or CAS number only: a fuzzy match here would answer for another compound. */
  const byKeyOrCas = (raw: unknown) => {
    const key = normaliseName(parse(idParam, raw));
    return (s: { key: string; cas: string }) => normaliseName(s.key) === key || normaliseName(s.cas) === key;
  };

  router.get("/reference/overrides", requireGroup(db), async (req, res) => {
    const q = parse(overrideListQuery, req.query);
    const groupId = req.group!.id;
    const where: SQL[] = [eq(referenceOverrides.groupId, groupId)];
    if (q.status === "active") where.push(isNull(referenceOverrides.retiredAt));
    if (q.status === "retired") where.push(isNotNull(referenceOverrides.retiredAt));
    if (q.target) where.push(eq(referenceOverrides.targetKey, q.target));
    const rows = await db
      .select()
      .from(referenceOverrides)
      .where(and(...where))
      .orderBy(desc(referenceOverrides.createdAt), asc(referenceOverrides.id));
    const body: OverrideListResponse = { overrides: await views(db, rows, await skippedSet(groupId)) };
    res.json(body);
  });

  router.post("/reference/overrides", requireGroup(db, "lead"), async (req, res) => {
    const body = parse(createOverrideBody, req.body);
    const payload = toPayload(body);
    checkApplies(payload);
    const groupId = req.group!.id;
    const actorId = req.user!.id;
    const subject = overrideSubject(payload);
    const id = crypto.randomUUID();
    let created: ReferenceOverrideRow;
    try {
      created = await db.transaction(async (tx) => {
        const previous = await activeFor(tx, groupId, subject);
        if (previous) await retireRow(tx, previous, actorId, "Superseded by a newer correction.");
        const inserted = await tx
          .insert(referenceOverrides)
          .values({
            id,
            groupId,
            kind: payload.kind,
            subject,
            targetKey: payload.kind === "solvent-value" ? payload.solventKey : payload.kind === "aqueous-point" ? payload.soluteKey : payload.solvent.key,
            payload,
            source: body.source,
            reason: body.reason,
            createdBy: actorId,
          })
          .returning();
        const row = inserted[0]!;
        await recordAudit(tx, {
          groupId,
          actorId,
          action: previous ? "override.replace" : "override.create",
          entityType: OVERRIDE_ENTITY,
          entityId: subject,
          before: previous ? snapshotOf(previous) : null,
          after: snapshotOf(row),
          reason: body.reason,
        });
        return row;
      });
    } catch (err) {
      if (isUniqueViolation(err)) throw new HttpError(409, "conflict", "Someone corrected this value at the same moment; reload and try again.");
      throw err;
    }
    invalidateGroupReference(db, groupId);
    const [view] = await views(db, [created], new Set());
    res.status(201).json(view);
  });

  router.delete("/reference/overrides/:id", requireGroup(db, "lead"), async (req, res) => {
    const id = parse(idParam, req.params.id);
    const { reason } = parse(retireOverrideBody, req.body ?? {});
    const groupId = req.group!.id;
    const actorId = req.user!.id;
    const retired = await db.transaction(async (tx) => {
      const rows = await tx
        .select()
        .from(referenceOverrides)
        .where(and(eq(referenceOverrides.groupId, groupId), eq(referenceOverrides.id, id)))
        .limit(1);
      const row = rows[0];
      if (!row) throw notFound("That correction");
      if (row.retiredAt) throw new HttpError(409, "conflict", "That correction is already retired.");
      await retireRow(tx, row, actorId, reason);
      await recordAudit(tx, {
        groupId,
        actorId,
        action: "override.retire",
        entityType: OVERRIDE_ENTITY,
        entityId: row.subject,
        before: snapshotOf(row),
        after: null,
        reason,
      });
      const after = await tx.select().from(referenceOverrides).where(eq(referenceOverrides.id, id));
      return after[0]!;
    });
    invalidateGroupReference(db, groupId);
    const [view] = await views(db, [retired], new Set());
    res.json(view);
  });

  router.get("/reference/solvents/:key", requireGroup(db), async (req, res) => {
    const matches = byKeyOrCas(req.params.key);
    const groupId = req.group!.id;
    const ref = await groupReference(db, groupId);
    const group = ref.solvents.find(matches);
    if (!group) throw notFound("That solvent");
    const shipped = SHIPPED_REFERENCE.solvents.find(matches) ?? group;
    const body: SolventComparison = {
      key: group.key,
      name: group.name,
      shipped: solventDetail(shipped),
      group: solventDetail(group),
      corrections: await correctionsOf(groupId, group.key),
    };
    res.json(body);
  });

  router.get("/reference/solutes/:key", requireGroup(db), async (req, res) => {
    const matches = byKeyOrCas(req.params.key);
    const groupId = req.group!.id;
    const ref = await groupReference(db, groupId);
    const group = ref.solutes.find(matches);
    const shipped = SHIPPED_REFERENCE.solutes.find(matches);
    if (!group || !shipped) throw notFound("That aqueous solution");
    const body: SoluteComparison = {
      key: group.key,
      name: group.name,
      shippedPoints: resolve(shipped.points),
      groupPoints: resolve(group.points),
      corrections: await correctionsOf(groupId, group.key),
    };
    res.json(body);
  });

  return router;
}
