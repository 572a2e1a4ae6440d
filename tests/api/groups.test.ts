import request from "supertest";
import { agentFor, groupWithRoles, signUp, startTestApp, uniqueEmail, type TestApp } from "./harness";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe("health", () => {
  it("names the database it runs on", async () => {
    const res = await request(t.app).get("/api/health");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: "ok", database: t.handle.kind });
  });
});

describe("accounts", () => {
  it("signs up, reads the session, signs out, and signs in again", async () => {
    const agent = agentFor(t.app);
    const email = uniqueEmail("flow");
    const up = await agent.post("/api/auth/sign-up/email").send({ name: "Flow", email, password: "flow-password-1" });
    expect(up.status).toBe(200);
    const session = await agent.get("/api/auth/get-session");
    expect(session.body.user.email).toBe(email);
    const me = await agent.get("/api/me");
    expect(me.status).toBe(200);
    expect(me.body.groups).toEqual([]);

    const out = await agent.post("/api/auth/sign-out").send({});
    expect(out.status).toBe(200);
    expect((await agent.get("/api/me")).status).toBe(401);

    const wrong = await agent.post("/api/auth/sign-in/email").send({ email, password: "not-the-password" });
    expect(wrong.status).toBe(401);
    const right = await agent.post("/api/auth/sign-in/email").send({ email, password: "flow-password-1" });
    expect(right.status).toBe(200);
    expect((await agent.get("/api/me")).body.user.email).toBe(email);
  });

  it("answers /api/me without a session with 401", async () => {
    const res = await request(t.app).get("/api/me");
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe("unauthorised");
  });
});

describe("groups", () => {
  it("makes the creator the owner and the group active", async () => {
    const { agent } = await signUp(t.app, "creator");
    const res = await agent.post("/api/groups").send({ name: "Cold Room Crew" });
    expect(res.status).toBe(201);
    expect(res.body.role).toBe("owner");
    const me = await agent.get("/api/me");
    expect(me.body.activeGroupId).toBe(res.body.id);
    expect(me.body.groups).toEqual([expect.objectContaining({ id: res.body.id, name: "Cold Room Crew", role: "owner" })]);
  });

  it("refuses a group without a proper name with field errors", async () => {
    const { agent } = await signUp(t.app, "noname");
    const res = await agent.post("/api/groups").send({ name: " " });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.name).toMatch(/at least 2/);
    const missing = await agent.post("/api/groups").send({});
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields)).toContain("name");
  });

  it("refuses creating a group without a session", async () => {
    const res = await request(t.app).post("/api/groups").set("Origin", "http://localhost:3000").send({ name: "X lab" });
    expect(res.status).toBe(401);
  });

  it("switches the active group between two memberships", async () => {
    const { agent } = await signUp(t.app, "switcher");
    const a = (await agent.post("/api/groups").send({ name: "Alpha bench" })).body.id;
    const b = (await agent.post("/api/groups").send({ name: "Beta bench" })).body.id;
    expect((await agent.get("/api/me")).body.activeGroupId).toBe(b);
    const res = await agent.post(`/api/groups/${a}/activate`).send({});
    expect(res.status).toBe(200);
    expect((await agent.get("/api/me")).body.activeGroupId).toBe(a);
  });
});

describe("members and roles", () => {
  let g: Awaited<ReturnType<typeof groupWithRoles>>;
  let other: Awaited<ReturnType<typeof groupWithRoles>>;
  beforeAll(async () => {
    g = await groupWithRoles(t, "roles");
    other = await groupWithRoles(t, "rival");
  });

  const memberId = async (userId: string) => {
    const res = await g.owner.agent.get(`/api/groups/${g.groupId}/members`);
    return res.body.members.find((m: { userId: string }) => m.userId === userId).id as string;
  };

  it("lists the members with their roles to any member", async () => {
    const res = await g.chemist.agent.get(`/api/groups/${g.groupId}/members`);
    expect(res.status).toBe(200);
    const roles = Object.fromEntries(res.body.members.map((m: { email: string; role: string }) => [m.email, m.role]));
    expect(roles).toEqual({ [g.owner.email]: "owner", [g.lead.email]: "lead", [g.chemist.email]: "chemist" });
    expect(res.body.yourRole).toBe("chemist");
  });

  it("hides another group's members (404)", async () => {
    const res = await other.owner.agent.get(`/api/groups/${g.groupId}/members`);
    expect(res.status).toBe(404);
  });

  it("needs a session to list members (401)", async () => {
    expect((await request(t.app).get(`/api/groups/${g.groupId}/members`)).status).toBe(401);
  });

  it("lets the owner promote a chemist to lead (200)", async () => {
    const id = await memberId(g.chemist.userId);
    const res = await g.owner.agent.patch(`/api/groups/${g.groupId}/members/${id}`).send({ role: "lead" });
    expect(res.status).toBe(200);
    const list = await g.owner.agent.get(`/api/groups/${g.groupId}/members`);
    expect(list.body.members.find((m: { id: string }) => m.id === id).role).toBe("lead");
    await g.owner.agent.patch(`/api/groups/${g.groupId}/members/${id}`).send({ role: "chemist" });
  });

  it.each(["lead", "chemist"] as const)("refuses a role change by a %s (403)", async (who) => {
    const id = await memberId(g.chemist.userId);
    const res = await g[who].agent.patch(`/api/groups/${g.groupId}/members/${id}`).send({ role: "lead" });
    expect(res.status).toBe(403);
  });

  it("refuses a role change on another group's member (404)", async () => {
    const id = await memberId(g.chemist.userId);
    const res = await other.owner.agent.patch(`/api/groups/${g.groupId}/members/${id}`).send({ role: "lead" });
    expect(res.status).toBe(404);
    const viaOwnGroup = await other.owner.agent.patch(`/api/groups/${other.groupId}/members/${id}`).send({ role: "lead" });
    expect(viaOwnGroup.status).toBe(404);
  });

  it("refuses an unknown role with a field error (400)", async () => {
    const id = await memberId(g.chemist.userId);
    const res = await g.owner.agent.patch(`/api/groups/${g.groupId}/members/${id}`).send({ role: "admin" });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.role).toMatch(/owner, lead or chemist/);
  });

  it("never demotes or removes the last owner", async () => {
    const id = await memberId(g.owner.userId);
    const demote = await g.owner.agent.patch(`/api/groups/${g.groupId}/members/${id}`).send({ role: "lead" });
    expect(demote.status).toBe(409);
    const remove = await g.owner.agent.delete(`/api/groups/${g.groupId}/members/${id}`);
    expect(remove.status).toBe(409);
  });

  it("lets the owner remove a member, who then loses access", async () => {
    const extra = await groupWithRoles(t, "shrink");
    const list = await extra.owner.agent.get(`/api/groups/${extra.groupId}/members`);
    const id = list.body.members.find((m: { userId: string }) => m.userId === extra.chemist.userId).id;
    expect((await extra.lead.agent.delete(`/api/groups/${extra.groupId}/members/${id}`)).status).toBe(403);
    expect((await extra.owner.agent.delete(`/api/groups/${extra.groupId}/members/${id}`)).status).toBe(204);
    expect((await extra.chemist.agent.get(`/api/groups/${extra.groupId}/members`)).status).toBe(404);
  });
});
