import { and, asc, desc, eq, gte, inArray, isNull, ne, sql } from "drizzle-orm";
import type { CaseAttempt } from "../knowledge/contracts/cases";
import type { Digest, SentDigest } from "../knowledge/contracts/digest";
import { caseAttempts, caseFollowers, cases, member, organization, user } from "../db/schema";
import { remedyLabel } from "./case-records";
import type { AppDeps } from "./deps";
import { attemptMail, digestMail, type DigestLine } from "./mail-messages";

/*
 * Mail about cases: followers hear of each new attempt; leads get a weekly digest of what is
 * stuck and what was newly verified.
 */

export type MailDeps = Pick<AppDeps, "db" | "mail" | "baseURL">;

const OUTCOME_WORDS: Record<string, string> = {
  cleared: "cleared",
  partly: "partly cleared",
  "no-change": "no change",
  worse: "made it worse",
};

/** Attempts that did not help; "partly" counts as progress, not failure. */
export const FAILED_OUTCOMES = ["no-change", "worse"] as const;
/** A case is stubborn when open longer than this… */
export const STUBBORN_OPEN_DAYS = 3;
/** …or when this many attempts failed. */
export const STUBBORN_FAILED_ATTEMPTS = 3;
export const DIGEST_PERIOD_DAYS = 7;

const DAY_MS = 24 * 60 * 60 * 1000;

/**
 * Mails everyone who follows the case, except the attempt's author, who is still a member of the
 * case's group. Never throws: a mail failure must not undo or fail the attempt. Resolves with the
 * number of messages sent.
 */
export async function notifyFollowers(deps: MailDeps, caseId: string, attempt: CaseAttempt): Promise<number> {
  try {
    const found = await deps.db
      .select({ title: cases.title, groupId: cases.groupId })
      .from(cases)
      .where(eq(cases.id, caseId))
      .limit(1);
    const c = found[0];
    if (!c) return 0;
    const followers = await deps.db
      .select({ email: user.email })
      .from(caseFollowers)
      .innerJoin(user, eq(caseFollowers.userId, user.id))
      .innerJoin(member, and(eq(member.userId, caseFollowers.userId), eq(member.organizationId, c.groupId)))
      .where(and(eq(caseFollowers.caseId, caseId), ne(caseFollowers.userId, attempt.authorId)))
      .orderBy(asc(user.email));
    const link = `${deps.baseURL}/cases/${caseId}`;
    const results = await Promise.allSettled(
      followers.map((f) =>
        deps.mail.send(
          attemptMail({
            to: f.email,
            caseTitle: c.title,
            authorName: attempt.authorName,
            remedy: attempt.label,
            outcome: OUTCOME_WORDS[attempt.outcome] ?? attempt.outcome,
            link,
          }),
        ),
      ),
    );
    for (const r of results) if (r.status === "rejected") console.error("follower mail failed", r.reason);
    return results.filter((r) => r.status === "fulfilled").length;
  } catch (err) {
    console.error("follower mail failed", err);
    return 0;
  }
}

/** What this week's digest of a group holds (the desk shows it before sending). */
export async function buildDigest(deps: MailDeps, groupId: string, now = new Date()): Promise<Digest> {
  const { db } = deps;
  const since = new Date(now.getTime() - DIGEST_PERIOD_DAYS * DAY_MS);
  const openBefore = new Date(now.getTime() - STUBBORN_OPEN_DAYS * DAY_MS);
  const group = await db.select({ name: organization.name }).from(organization).where(eq(organization.id, groupId)).limit(1);

  const failed = sql<number>`count(${caseAttempts.id}) filter (where ${inArray(caseAttempts.outcome, [...FAILED_OUTCOMES])})`.mapWith(Number);
  const open = await db
    .select({ id: cases.id, title: cases.title, occurredAt: cases.occurredAt, failed })
    .from(cases)
    .leftJoin(caseAttempts, eq(caseAttempts.caseId, cases.id))
    .where(and(eq(cases.groupId, groupId), eq(cases.status, "open"), eq(cases.retired, false), isNull(cases.mergedInto)))
    .groupBy(cases.id)
    .orderBy(asc(cases.occurredAt));
  const stubborn = open
    .filter((c) => c.occurredAt < openBefore || c.failed >= STUBBORN_FAILED_ATTEMPTS)
    .map((c) => ({ id: c.id, title: c.title, openDays: Math.floor((now.getTime() - c.occurredAt.getTime()) / DAY_MS), failedAttempts: c.failed }));

  const verifiedRows = await db
    .select({
      id: cases.id,
      title: cases.title,
      verifiedAt: cases.verifiedAt,
      remedyId: caseAttempts.remedyId,
      description: caseAttempts.description,
    })
    .from(cases)
    .leftJoin(caseAttempts, eq(caseAttempts.id, cases.verifiedAttemptId))
    .where(and(eq(cases.groupId, groupId), eq(cases.verified, true), eq(cases.retired, false), gte(cases.verifiedAt, since)))
    .orderBy(desc(cases.verifiedAt));
  const verified = verifiedRows.map((r) => ({
    id: r.id,
    title: r.title,
    fix: r.remedyId || r.description ? remedyLabel(r.remedyId, r.description) : "the case as logged",
    verifiedAt: (r.verifiedAt ?? now).toISOString(),
  }));

  const leads = await db
    .select({ email: user.email })
    .from(member)
    .innerJoin(user, eq(member.userId, user.id))
    .where(and(eq(member.organizationId, groupId), inArray(member.role, ["lead", "owner"])))
    .orderBy(asc(user.email));

  return {
    groupId,
    groupName: group[0]?.name ?? "your group",
    since: since.toISOString(),
    stubborn,
    verified,
    recipients: leads.map((l) => l.email),
  };
}

/**
 * Sends the week's digest to each lead and owner of the group; resolves with what was sent.
 * `skipEmpty` (the timer and the script) sends nothing when nothing is stuck or newly verified.
 */
export async function sendDigest(
  deps: MailDeps,
  groupId: string,
  options: { now?: Date; skipEmpty?: boolean } = {},
): Promise<SentDigest> {
  const digest = await buildDigest(deps, groupId, options.now);
  if (options.skipEmpty && digest.stubborn.length === 0 && digest.verified.length === 0) return { ...digest, sent: 0 };
  const caseLink = (id: string) => `${deps.baseURL}/cases/${id}`;
  const stubborn: DigestLine[] = digest.stubborn.map((c) => ({
    title: c.title,
    detail: `open ${c.openDays} day${c.openDays === 1 ? "" : "s"}, ${c.failedAttempts} failed attempt${c.failedAttempts === 1 ? "" : "s"}`,
    link: caseLink(c.id),
  }));
  const verified: DigestLine[] = digest.verified.map((f) => ({ title: f.title, detail: `fixed ${f.fix}`, link: caseLink(f.id) }));
  const sinceLabel = new Date(digest.since).toISOString().slice(0, 10);
  let sent = 0;
  for (const to of digest.recipients) {
    await deps.mail.send(
      digestMail({ to, groupName: digest.groupName, stubborn, verified, deskLink: `${deps.baseURL}/desk`, sinceLabel }),
    );
    sent += 1;
  }
  return { ...digest, sent };
}

/** The digest for every group (the script and the timer). */
export async function sendAllDigests(deps: MailDeps, now = new Date()): Promise<{ groups: number; sent: number }> {
  const groups = await deps.db.select({ id: organization.id }).from(organization).orderBy(asc(organization.id));
  let sent = 0;
  for (const g of groups) {
    try {
      sent += (await sendDigest(deps, g.id, { now, skipEmpty: true })).sent;
    } catch (err) {
      console.error(`digest for group ${g.id} failed`, err);
    }
  }
  return { groups: groups.length, sent };
}

/** Sends every group's digest every `hours` hours (PHASEWISE_DIGEST_HOURS); returns a stop function. */
export function startDigestTimer(deps: MailDeps, hours: number): () => void {
  const timer = setInterval(() => {
    sendAllDigests(deps)
      .then((r) => console.log(`digest: ${r.sent} message(s) for ${r.groups} group(s)`))
      .catch((err) => console.error("digest failed", err));
  }, hours * 60 * 60 * 1000);
  // The timer alone must not keep the process alive.
  (timer as { unref?: () => void }).unref?.();
  return () => clearInterval(timer);
}
