import { Router, type Request, type Response } from "express";
import { fieldErrors } from "../../knowledge/contracts/layers";
import {
  bodyFieldOf,
  troubleshootRequestSchema,
  troubleshootResponse,
  type RemedyCatalogueResponse,
} from "../../knowledge/contracts/emulsion";
import { CATALOGUE_SCALE_NOTE, catalogueEntry, remedyCatalogue, troubleshoot, type EvidenceRecord, type GroupNote } from "../../knowledge/emulsion";
import { KnowledgeInputError } from "../../knowledge/types";
import { adviceFor } from "../advice";
import { groupEvidence } from "../case-evidence";
import type { Database } from "../../db/client";
import type { AppDeps } from "../deps";
import { HttpError, badRequest, notFound } from "../middleware/errors";
import { requireGroup } from "../middleware/session";
import { referenceFor } from "../reference-data";

/** The group's advice notes on remedies, written by its leads (server/advice.ts). */
export async function groupNotesFor(db: Database, groupId: string): Promise<GroupNote[]> {
  return adviceFor(db, groupId);
}

/** Where the group's own knowledge comes from; tests may pass their own readers. */
export interface GroupKnowledge {
  evidence: (db: Database, groupId: string) => Promise<EvidenceRecord[]>;
  notes: (db: Database, groupId: string) => Promise<GroupNote[]>;
}

const GROUP_KNOWLEDGE: GroupKnowledge = { evidence: groupEvidence, notes: groupNotesFor };

/** The caller's active group, resolved as requireGroup does; null when anonymous or in no group. */
async function callerGroupId(db: Database, req: Request, res: Response): Promise<string | null> {
  if (!req.user) return null;
  try {
    await requireGroup(db)(req, res, () => undefined);
  } catch (e) {
    if (e instanceof HttpError && e.status === 403) return null;
    throw e;
  }
  return req.group?.id ?? null;
}

/** Emulsion help: public diagnosis and ranking, sharpened by the group's cases when signed in. */
export function emulsionRouter(deps: AppDeps, group: GroupKnowledge = GROUP_KNOWLEDGE): Router {
  const router = Router();

  router.post("/troubleshoot", async (req, res) => {
    const parsed = troubleshootRequestSchema.safeParse(req.body);
    if (!parsed.success) throw badRequest("Some fields need attention.", fieldErrors(parsed.error));
    const ref = await referenceFor(req, deps);
    const groupId = await callerGroupId(deps.db, req, res);
    const [evidence, groupNotes] = groupId ? await Promise.all([group.evidence(deps.db, groupId), group.notes(deps.db, groupId)]) : [[], []];
    try {
      const result = troubleshoot(parsed.data, { ref, evidence, ...(groupId ? { groupId } : {}), groupNotes });
      res.json(troubleshootResponse(result, evidence.length > 0));
    } catch (e) {
      if (!(e instanceof KnowledgeInputError)) throw e;
      const field = bodyFieldOf(e.field);
      throw badRequest(e.message, { [field]: e.message }, { suggestions: e.suggestions });
    }
  });

  router.get("/remedies", async (req, res) => {
    const body: RemedyCatalogueResponse = { remedies: remedyCatalogue(await referenceFor(req, deps)), scaleNote: CATALOGUE_SCALE_NOTE };
    res.json(body);
  });

  router.get("/remedies/:id", async (req, res) => {
    const entry = catalogueEntry(req.params.id, await referenceFor(req, deps));
    if (!entry) throw notFound("That remedy");
    res.json({ ...entry, scaleNote: CATALOGUE_SCALE_NOTE });
  });

  return router;
}
