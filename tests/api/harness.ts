import request from "supertest";
import type { Express } from "express";
import { sql } from "drizzle-orm";
import { openDatabase, type DatabaseHandle } from "../../db/client";
import { createApp } from "../../server/app";
import { createRecordingMailer } from "../../server/mail";

export const ORIGIN = "http://localhost:3000";

/**
 * One app per test file: in-memory PGlite by default; with PHASEWISE_TEST_DATABASE_URL the same
 * suites run against a PostgreSQL server (each file gets its own fresh schema-less database state).
 */
export async function startTestApp(options: { rateLimit?: boolean } = {}) {
  const url = process.env.PHASEWISE_TEST_DATABASE_URL;
  const handle: DatabaseHandle = await openDatabase(url ? { url } : { dataDir: "memory://" });
  const mail = createRecordingMailer();
  const { app, deps } = createApp({
    db: handle.db,
    dbKind: handle.kind,
    mail,
    baseURL: ORIGIN,
    rateLimit: { enabled: options.rateLimit ?? false },
    quiet: true,
    dataDir: `/tmp/phasewise-test-${process.pid}-${Math.random().toString(36).slice(2)}`,
  });
  return { app, deps, mail, db: handle.db, handle, close: () => handle.close() };
}

export type TestApp = Awaited<ReturnType<typeof startTestApp>>;

let counter = 0;
/** A unique e-mail per call, so suites sharing one PostgreSQL database never collide. */
export function uniqueEmail(label: string): string {
  counter += 1;
  return `${label}-${process.pid}-${Date.now().toString(36)}-${counter}@test.example`;
}

/** A supertest agent that keeps cookies and always sends an Origin (better-auth requires it). */
export function agentFor(app: Express) {
  const agent = request.agent(app);
  agent.set("Origin", ORIGIN);
  return agent;
}

export type Agent = ReturnType<typeof agentFor>;

export async function signUp(app: Express, label: string, password = "correct-horse-1") {
  const agent = agentFor(app);
  const email = uniqueEmail(label);
  const res = await agent.post("/api/auth/sign-up/email").send({ name: label, email, password });
  if (res.status !== 200) throw new Error(`sign-up failed: ${res.status} ${res.text}`);
  return { agent, email, password, userId: res.body.user.id as string };
}

/** An owner with a new group, and a lead and a chemist added to it. */
export async function groupWithRoles(t: TestApp, label = "group") {
  const owner = await signUp(t.app, `${label}-owner`);
  const created = await owner.agent.post("/api/groups").send({ name: `${label} lab` });
  if (created.status !== 201) throw new Error(`group create failed: ${created.status} ${created.text}`);
  const groupId = created.body.id as string;
  const lead = await signUp(t.app, `${label}-lead`);
  const chemist = await signUp(t.app, `${label}-chemist`);
  for (const [who, role] of [
    [lead, "lead"],
    [chemist, "chemist"],
  ] as const) {
    await t.db.execute(
      sql`insert into member (id, organization_id, user_id, role, created_at) values (${crypto.randomUUID()}, ${groupId}, ${who.userId}, ${role}, now())`,
    );
  }
  return { groupId, owner, lead, chemist };
}
