import { Router, type Request } from "express";
import { fromNodeHeaders } from "better-auth/node";
import { and, asc, eq, gt } from "drizzle-orm";
import { z } from "zod";
import {
  createInvitationBody,
  type AcceptedInvitation,
  type CreatedInvitation,
  type InvitationPreview,
  type InvitationView,
} from "../../knowledge/contracts/invitations";
import { invitation, member, organization, user } from "../../db/schema";
import { recordAudit, type DbOrTx } from "../audit";
import { INVITATION_DAYS } from "../auth";
import type { AppDeps } from "../deps";
import { invitationMail } from "../mail-messages";
import { HttpError, forbidden, notFound } from "../middleware/errors";
import { membershipOf, requireUser } from "../middleware/session";
import { parse } from "../middleware/validate";
import { roleAtLeast, type GroupRole } from "../roles";

const idParam = z.string().trim().min(1).max(100);

type InvitationRow = typeof invitation.$inferSelect;

/** A snapshot for the audit log: who was invited to what, and the link's state. */
function snapshot(row: InvitationRow) {
  return { id: row.id, email: row.email, role: row.role, status: row.status, expiresAt: row.expiresAt.toISOString() };
}

async function viewOf(db: DbOrTx, row: InvitationRow): Promise<InvitationView> {
  const inviter = await db.select({ id: user.id, name: user.name }).from(user).where(eq(user.id, row.inviterId)).limit(1);
  return {
    id: row.id,
    groupId: row.organizationId,
    email: row.email,
    role: row.role ?? "chemist",
    status: row.status,
    expiresAt: row.expiresAt.toISOString(),
    createdAt: row.createdAt.toISOString(),
    invitedBy: inviter[0] ?? null,
  };
}

export function invitationsRouter({ db, auth, mail, baseURL }: AppDeps): Router {
  const router = Router();

  /** The caller must belong to the group in the URL (else 404) with at least `min` (else 403). */
  async function membership(req: Request, min: GroupRole) {
    const groupId = parse(idParam, req.params.id);
    const ctx = await membershipOf(db, req.user!.id, groupId);
    if (!ctx) throw notFound("That group");
    if (!roleAtLeast(ctx.role, min)) throw forbidden("Only an owner or a lead can manage invitations.");
    return ctx;
  }

  router.post("/groups/:id/invitations", requireUser, async (req, res) => {
    const ctx = await membership(req, "lead");
    const body = parse(createInvitationBody, req.body);
    if (body.role === "owner" && ctx.role !== "owner") throw forbidden("Only an owner can invite another owner.");
    const now = new Date();
    const created = await db.transaction(async (tx) => {
      const already = await tx
        .select({ id: member.id })
        .from(member)
        .innerJoin(user, eq(member.userId, user.id))
        .where(and(eq(member.organizationId, ctx.id), eq(user.email, body.email)))
        .limit(1);
      if (already[0]) throw new HttpError(409, "conflict", `${body.email} is already a member of this group.`, { email: "Already a member." });
      // A new invitation replaces a pending one to the same address: only the newest link works.
      const replaced = await tx
        .update(invitation)
        .set({ status: "canceled" })
        .where(and(eq(invitation.organizationId, ctx.id), eq(invitation.email, body.email), eq(invitation.status, "pending")))
        .returning();
      const inserted = await tx
        .insert(invitation)
        .values({
          id: crypto.randomUUID(),
          organizationId: ctx.id,
          email: body.email,
          role: body.role,
          status: "pending",
          expiresAt: new Date(now.getTime() + INVITATION_DAYS * 24 * 60 * 60 * 1000),
          createdAt: now,
          inviterId: req.user!.id,
        })
        .returning();
      const row = inserted[0]!;
      await recordAudit(tx, {
        groupId: ctx.id,
        actorId: req.user!.id,
        action: replaced.length ? "invitation.resend" : "invitation.create",
        entityType: "invitation",
        entityId: row.id,
        before: replaced[0] ? snapshot(replaced[0]) : null,
        after: snapshot(row),
      });
      return row;
    });
    const group = await db.select({ name: organization.name }).from(organization).where(eq(organization.id, ctx.id));
    // Mail goes out after the commit: a rolled-back invitation never reaches anyone.
    let mailed = true;
    try {
      await mail.send(
        invitationMail({
          to: created.email,
          groupName: group[0]?.name ?? "your lab group",
          inviterName: req.user!.name,
          role: created.role ?? "chemist",
          link: `${baseURL}/invite/${created.id}`,
          expiresAt: created.expiresAt,
        }),
      );
    } catch (err) {
      mailed = false;
      console.error("invitation mail failed", err);
    }
    const out: CreatedInvitation = { ...(await viewOf(db, created)), mailed };
    res.status(201).json(out);
  });

  router.get("/groups/:id/invitations", requireUser, async (req, res) => {
    const ctx = await membership(req, "lead");
    const rows = await db
      .select()
      .from(invitation)
      .where(and(eq(invitation.organizationId, ctx.id), eq(invitation.status, "pending"), gt(invitation.expiresAt, new Date())))
      .orderBy(asc(invitation.createdAt));
    const invitations = await Promise.all(rows.map((r) => viewOf(db, r)));
    res.json({ invitations });
  });

  router.delete("/groups/:id/invitations/:invitationId", requireUser, async (req, res) => {
    const ctx = await membership(req, "lead");
    const invitationId = parse(idParam, req.params.invitationId);
    const revoked = await db.transaction(async (tx) => {
      const rows = await tx
        .select()
        .from(invitation)
        .where(and(eq(invitation.organizationId, ctx.id), eq(invitation.id, invitationId)))
        .limit(1);
      const row = rows[0];
      if (!row) throw notFound("That invitation");
      if (row.status !== "pending") throw new HttpError(409, "conflict", `That invitation is already ${row.status}.`);
      const updated = await tx
        .update(invitation)
        .set({ status: "canceled" })
        .where(and(eq(invitation.id, row.id), eq(invitation.status, "pending")))
        .returning();
      const after = updated[0];
      if (!after) throw new HttpError(409, "conflict", "That invitation was just accepted or revoked.");
      await recordAudit(tx, {
        groupId: ctx.id,
        actorId: req.user!.id,
        action: "invitation.revoke",
        entityType: "invitation",
        entityId: row.id,
        before: snapshot(row),
        after: snapshot(after),
      });
      return after;
    });
    res.json(await viewOf(db, revoked));
  });

  // Public: the invite link's page shows whom the invitation is for before anyone signs in.
  // The id is a random UUID sent only to the invitee.
  router.get("/invitations/:id", async (req, res) => {
    const id = parse(idParam, req.params.id);
    const rows = await db
      .select({ row: invitation, groupName: organization.name, inviterName: user.name })
      .from(invitation)
      .innerJoin(organization, eq(invitation.organizationId, organization.id))
      .innerJoin(user, eq(invitation.inviterId, user.id))
      .where(eq(invitation.id, id))
      .limit(1);
    const found = rows[0];
    if (!found) throw notFound("That invitation");
    const out: InvitationPreview = {
      id: found.row.id,
      groupName: found.groupName,
      inviterName: found.inviterName,
      role: found.row.role ?? "chemist",
      email: found.row.email,
      status: found.row.status,
      expiresAt: found.row.expiresAt.toISOString(),
      expired: found.row.expiresAt.getTime() <= Date.now(),
    };
    res.json(out);
  });

  router.post("/invitations/:id/accept", requireUser, async (req, res) => {
    const id = parse(idParam, req.params.id);
    const me = req.user!;
    const accepted = await db.transaction(async (tx) => {
      const rows = await tx
        .select({ row: invitation, groupName: organization.name })
        .from(invitation)
        .innerJoin(organization, eq(invitation.organizationId, organization.id))
        .where(eq(invitation.id, id))
        .limit(1);
      const found = rows[0];
      if (!found) throw notFound("That invitation");
      const row = found.row;
      if (row.email.toLowerCase() !== me.email.toLowerCase()) {
        throw forbidden(`This invitation is for ${row.email}; you are signed in as ${me.email}. Sign in with the invited address.`);
      }
      if (row.status !== "pending") throw new HttpError(409, "conflict", `This invitation was ${row.status === "canceled" ? "revoked" : row.status}.`);
      if (row.expiresAt.getTime() <= Date.now()) throw new HttpError(410, "expired", "This invitation has expired; ask for a new one.");
      // The conditional update takes the row: two accepts at once make one member.
      const taken = await tx
        .update(invitation)
        .set({ status: "accepted" })
        .where(and(eq(invitation.id, row.id), eq(invitation.status, "pending")))
        .returning();
      if (!taken[0]) throw new HttpError(409, "conflict", "This invitation was just used.");
      const existingRows = await tx
        .select({ role: member.role })
        .from(member)
        .where(and(eq(member.organizationId, row.organizationId), eq(member.userId, me.id)))
        .limit(1);
      const existing = existingRows[0];
      const role = row.role ?? "chemist";
      if (!existing) {
        await tx.insert(member).values({ id: crypto.randomUUID(), organizationId: row.organizationId, userId: me.id, role, createdAt: new Date() });
      }
      await recordAudit(tx, {
        groupId: row.organizationId,
        actorId: me.id,
        action: "invitation.accept",
        entityType: "invitation",
        entityId: row.id,
        before: snapshot(row),
        after: snapshot(taken[0]),
      });
      const out: AcceptedInvitation = { groupId: row.organizationId, groupName: found.groupName, role: existing?.role ?? role };
      return out;
    });
    // Work in the group just joined.
    await auth.api.setActiveOrganization({ headers: fromNodeHeaders(req.headers), body: { organizationId: accepted.groupId } });
    res.json(accepted);
  });

  return router;
}
