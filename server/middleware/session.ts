import type { RequestHandler } from "express";
import { fromNodeHeaders } from "better-auth/node";
import { and, asc, eq } from "drizzle-orm";
import type { Database } from "../../db/client";
import { member } from "../../db/schema";
import type { Auth } from "../auth";
import { isGroupRole, roleAtLeast, type GroupRole } from "../roles";
import { forbidden, unauthorised } from "./errors";

export interface SessionUser {
  id: string;
  email: string;
  name: string;
}

export interface GroupContext {
  id: string;
  role: GroupRole;
  memberId: string;
}

declare module "express-serve-static-core" {
  interface Request {
    user?: SessionUser;
    sessionId?: string;
    activeGroupId?: string | null;
    group?: GroupContext;
  }
}

/** Resolves the signed-in user once per request (or leaves it undefined). */
export function loadSession(auth: Auth): RequestHandler {
  return async (req, _res, next) => {
    if (!req.headers.cookie) return next(); // no cookie, no session: anonymous checks skip the lookup
    const found = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (found) {
      req.user = { id: found.user.id, email: found.user.email, name: found.user.name };
      req.sessionId = found.session.id;
      req.activeGroupId = (found.session as { activeOrganizationId?: string | null }).activeOrganizationId ?? null;
    }
    next();
  };
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthorised();
  next();
};

export async function membershipOf(db: Database, userId: string, groupId: string): Promise<GroupContext | null> {
  const rows = await db
    .select({ id: member.id, role: member.role })
    .from(member)
    .where(and(eq(member.userId, userId), eq(member.organizationId, groupId)))
    .limit(1);
  const row = rows[0];
  if (!row || !isGroupRole(row.role)) return null;
  return { id: groupId, role: row.role, memberId: row.id };
}

/** The member's active group (the session's, else their first); 401 without a session, 403 below `minRole`. */
export function requireGroup(db: Database, minRole: GroupRole = "chemist"): RequestHandler {
  return async (req, _res, next) => {
    if (!req.user) throw unauthorised();
    let ctx = req.activeGroupId ? await membershipOf(db, req.user.id, req.activeGroupId) : null;
    if (!ctx) {
      const first = await db
        .select({ id: member.id, role: member.role, organizationId: member.organizationId })
        .from(member)
        .where(eq(member.userId, req.user.id))
        .orderBy(asc(member.createdAt))
        .limit(1);
      const row = first[0];
      if (row && isGroupRole(row.role)) ctx = { id: row.organizationId, role: row.role, memberId: row.id };
    }
    if (!ctx) throw forbidden("Join or create a lab group first.");
    if (!roleAtLeast(ctx.role, minRole)) throw forbidden();
    req.group = ctx;
    next();
  };
}
