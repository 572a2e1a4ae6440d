import { Router, type Request } from "express";
import { fromNodeHeaders } from "better-auth/node";
import { and, asc, count, eq } from "drizzle-orm";
import { z } from "zod";
import type { AppDeps } from "../deps";
import { member, organization, user } from "../../db/schema";

import { HttpError, forbidden, notFound } from "../middleware/errors";
import { membershipOf, requireUser } from "../middleware/session";
import { parse } from "../middleware/validate";
import { isGroupRole, roleAtLeast, type GroupRole } from "../roles";

export const createGroupBody = z.object({
  name: z.string().trim().min(2, "Give the group a name of at least 2 characters.").max(80, "Keep the name under 80 characters."),
});
export const changeRoleBody = z.object({
  role: z.enum(["lead", "chemist", "owner"], { message: "Role must be owner, lead or chemist." }),
});
const idParam = z.string().min(1).max(100);

function slugify(name: string): string {
  const base = name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 40) || "group";
  return `${base}-${crypto.randomUUID().slice(0, 6)}`;
}

export function groupsRouter({ db, auth }: AppDeps): Router {
  const router = Router();

  /** The caller must belong to the group named in the URL; otherwise it does not exist for them. */
  async function membershipOr404(req: Request, min: GroupRole = "chemist") {
    const groupId = parse(idParam, req.params.id);
    const ctx = await membershipOf(db, req.user!.id, groupId);
    if (!ctx) throw notFound("That group");
    if (!roleAtLeast(ctx.role, min)) throw forbidden();
    return ctx;
  }

  router.get("/me", requireUser, async (req, res) => {
    const groups = await db
      .select({ id: organization.id, name: organization.name, slug: organization.slug, role: member.role })
      .from(member)
      .innerJoin(organization, eq(member.organizationId, organization.id))
      .where(eq(member.userId, req.user!.id))
      .orderBy(asc(organization.name));
    const active = groups.find((g) => g.id === req.activeGroupId) ?? groups[0] ?? null;
    res.json({ user: req.user, groups, activeGroupId: active?.id ?? null });
  });

  router.post("/groups", requireUser, async (req, res) => {
    const body = parse(createGroupBody, req.body);
    const created = await auth.api.createOrganization({
      headers: fromNodeHeaders(req.headers),
      body: { name: body.name, slug: slugify(body.name) },
    });
    if (!created) throw new HttpError(500, "internal", "The group could not be created.");
    res.status(201).json({ id: created.id, name: created.name, slug: created.slug, role: "owner" });
  });

  router.post("/groups/:id/activate", requireUser, async (req, res) => {
    const ctx = await membershipOr404(req);
    await auth.api.setActiveOrganization({ headers: fromNodeHeaders(req.headers), body: { organizationId: ctx.id } });
    res.json({ activeGroupId: ctx.id, role: ctx.role });
  });

  router.get("/groups/:id/members", requireUser, async (req, res) => {
    const ctx = await membershipOr404(req);
    const rows = await db
      .select({ id: member.id, userId: user.id, name: user.name, email: user.email, role: member.role, joinedAt: member.createdAt })
      .from(member)
      .innerJoin(user, eq(member.userId, user.id))
      .where(eq(member.organizationId, ctx.id))
      .orderBy(asc(user.name));
    res.json({ members: rows, yourRole: ctx.role });
  });

  async function ownerCount(groupId: string): Promise<number> {
    const rows = await db
      .select({ n: count() })
      .from(member)
      .where(and(eq(member.organizationId, groupId), eq(member.role, "owner")));
    return Number(rows[0]?.n ?? 0);
  }

  async function targetMember(groupId: string, memberId: string) {
    const rows = await db
      .select()
      .from(member)
      .where(and(eq(member.id, parse(idParam, memberId)), eq(member.organizationId, groupId)))
      .limit(1);
    const row = rows[0];
    if (!row || !isGroupRole(row.role)) throw notFound("That member");
    return row;
  }

  router.patch("/groups/:id/members/:memberId", requireUser, async (req, res) => {
    const ctx = await membershipOr404(req, "owner");
    const body = parse(changeRoleBody, req.body);
    const target = await targetMember(ctx.id, String(req.params.memberId));
    await db.transaction(async (tx) => {
      if (target.role === "owner" && body.role !== "owner") {
        const rows = await tx
          .select({ n: count() })
          .from(member)
          .where(and(eq(member.organizationId, ctx.id), eq(member.role, "owner")));
        if (Number(rows[0]?.n ?? 0) <= 1) {
          throw new HttpError(409, "last_owner", "A group keeps at least one owner: make someone else owner first.");
        }
      }
      await tx.update(member).set({ role: body.role }).where(eq(member.id, target.id));
    });
    res.json({ id: target.id, role: body.role });
  });

  router.delete("/groups/:id/members/:memberId", requireUser, async (req, res) => {
    const ctx = await membershipOr404(req, "owner");
    const target = await targetMember(ctx.id, String(req.params.memberId));
    if (target.role === "owner" && (await ownerCount(ctx.id)) <= 1) {
      throw new HttpError(409, "last_owner", "The last owner cannot be removed.");
    }
    await db.delete(member).where(eq(member.id, target.id));
    res.status(204).end();
  });

  return router;
}
