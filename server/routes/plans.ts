import { Router, type Request } from "express";
import { and, desc, eq } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { z } from "zod";
import { fieldErrors } from "../../knowledge/contracts/layers";
import {
  createPlanSchema,
  evaporationFor,
  patchPlanSchema,
  planComputeRequestSchema,
  planInputOf,
  planSourceRefs,
  prefixKnowledgeError,
  recoveryFor,
  type PlanComputeResponse,
  type PlanDocument,
  type SavedPlan,
  type SavedPlanSummary,
} from "../../knowledge/contracts/plans";
import { computePlan } from "../../knowledge/plan";
import type { ReferenceData } from "../../knowledge/types";
import { plans, user } from "../../db/schema";
import type { AppDeps } from "../deps";
import { badRequest, forbidden, notFound } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { parse } from "../middleware/validate";
import { referenceFor } from "../reference-data";
import { roleAtLeast } from "../roles";

const round3 = (x: number) => Math.round(x * 1000) / 1000;
const idParam = z.string().trim().min(1).max(100);

/** The whole answer for one plan document: the wash sequence, then the panels it asks for. */
export function computePlanResponse(doc: PlanDocument, ref: ReferenceData): PlanComputeResponse {
  const plan = computePlan(planInputOf(doc), ref);
  const out: PlanComputeResponse = {
    ...plan,
    steps: plan.steps.map((s) => ({ ...s, densityDifferenceGPerMl: round3(s.densityDifferenceGPerMl) })),
    sourceTitles: [],
  };
  const sources = [...plan.sources];
  if (doc.recovery) {
    out.recovery = recoveryFor(doc, plan, doc.recovery, ref);
    sources.push(...out.recovery.sources);
  }
  if (doc.evaporation) {
    out.evaporation = evaporationFor(doc, doc.evaporation, ref);
    sources.push(...out.evaporation.sources);
  }
  out.sources = [...new Set(sources)];
  out.sourceTitles = planSourceRefs(out.sources);
  return out;
}

function parseBody<S extends z.core.$ZodType>(schema: S, body: unknown): z.output<S> {
  const parsed = z.safeParse(schema, body);
  // "washes[0].volumeMl": the same field names the knowledge module's errors use
  if (!parsed.success) throw badRequest("Some fields need attention.", fieldErrors(parsed.error));
  return parsed.data;
}

const author = alias(user, "plan_author");
const editor = alias(user, "plan_editor");

/** Public plan computation, and the group's saved plans. */
export function plansRouter(deps: AppDeps): Router {
  const { db } = deps;
  const router = Router();
  const member = requireGroup(db);

  router.post("/plans/compute", async (req, res) => {
    const doc = parseBody(planComputeRequestSchema, req.body);
    res.json(computePlanResponse(doc, await referenceFor(req, deps)));
  });

  /** A saved plan must compute: unknown names and impossible washes are refused with their field under `input.`. */
  async function checkDocument(req: Request, doc: PlanDocument): Promise<void> {
    try {
      computePlanResponse(doc, await referenceFor(req, deps));
    } catch (e) {
      throw prefixKnowledgeError(e, "input");
    }
  }

  const selectPlan = () =>
    db
      .select({
        id: plans.id,
        title: plans.title,
        notes: plans.notes,
        input: plans.input,
        createdAt: plans.createdAt,
        updatedAt: plans.updatedAt,
        authorId: plans.authorId,
        authorName: author.name,
        updatedById: plans.updatedBy,
        updatedByName: editor.name,
      })
      .from(plans)
      .innerJoin(author, eq(author.id, plans.authorId))
      .leftJoin(editor, eq(editor.id, plans.updatedBy));
  type Row = Awaited<ReturnType<ReturnType<typeof selectPlan>["where"]>>[number];

  function canEdit(req: Request, authorId: string): boolean {
    return authorId === req.user!.id || roleAtLeast(req.group!.role, "lead");
  }

  function summary(req: Request, r: Row): SavedPlanSummary {
    return {
      id: r.id,
      title: r.title,
      solvent: r.input.organic.solvent,
      componentNames: r.input.components.map((c) => c.name),
      washCount: r.input.washes.length,
      author: { id: r.authorId, name: r.authorName },
      updatedBy: r.updatedById ? { id: r.updatedById, name: r.updatedByName ?? "" } : null,
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
      canEdit: canEdit(req, r.authorId),
    };
  }
  const detail = (req: Request, r: Row): SavedPlan => ({ ...summary(req, r), notes: r.notes, input: r.input });

  /** The plan in the caller's active group, or 404 (another group's plan does not exist for them). */
  async function findPlan(req: Request, id = parse(idParam, req.params.id)): Promise<Row> {
    const rows = await selectPlan()
      .where(and(eq(plans.id, id), eq(plans.groupId, req.group!.id)))
      .limit(1);
    const row = rows[0];
    if (!row) throw notFound("That plan");
    return row;
  }

  router.get("/plans", member, async (req, res) => {
    const rows = await selectPlan().where(eq(plans.groupId, req.group!.id)).orderBy(desc(plans.updatedAt)).limit(500);
    res.json({ plans: rows.map((r) => summary(req, r)) });
  });

  router.post("/plans", member, async (req, res) => {
    const body = parseBody(createPlanSchema, req.body);
    await checkDocument(req, body.input);
    const id = crypto.randomUUID();
    await db.insert(plans).values({
      id,
      groupId: req.group!.id,
      authorId: req.user!.id,
      title: body.title,
      notes: body.notes ?? "",
      input: body.input,
    });
    res.status(201).json(detail(req, await findPlan(req, id)));
  });

  router.get("/plans/:id", member, async (req, res) => {
    res.json(detail(req, await findPlan(req)));
  });

  router.patch("/plans/:id", member, async (req, res) => {
    const row = await findPlan(req);
    if (!canEdit(req, row.authorId)) throw forbidden("Only the plan's author or a lead can change it.");
    const body = parseBody(patchPlanSchema, req.body);
    if (body.input) await checkDocument(req, body.input);
    await db
      .update(plans)
      .set({
        ...(body.title !== undefined ? { title: body.title } : {}),
        ...(body.notes !== undefined ? { notes: body.notes } : {}),
        ...(body.input !== undefined ? { input: body.input } : {}),
        updatedBy: req.user!.id,
        updatedAt: new Date(),
      })
      .where(and(eq(plans.id, row.id), eq(plans.groupId, req.group!.id)));
    res.json(detail(req, await findPlan(req, row.id)));
  });

  router.delete("/plans/:id", member, async (req, res) => {
    const row = await findPlan(req);
    if (!canEdit(req, row.authorId)) throw forbidden("Only the plan's author or a lead can delete it.");
    await db.delete(plans).where(and(eq(plans.id, row.id), eq(plans.groupId, req.group!.id)));
    res.status(204).end();
  });

  return router;
}
