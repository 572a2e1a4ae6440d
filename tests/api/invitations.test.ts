import request from "supertest";
import { eq } from "drizzle-orm";
import { invitation } from "../../db/schema";
import { ORIGIN, agentFor, groupWithRoles, signUp, startTestApp, uniqueEmail, type TestApp } from "./harness";

/* Invitations to a lab group: who may send them, the link, acceptance, revocation and expiry. */

let t: TestApp;
let g: Awaited<ReturnType<typeof groupWithRoles>>;
let other: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  g = await groupWithRoles(t, "inv");
  other = await groupWithRoles(t, "inv-other");
});
afterAll(async () => {
  await t.close();
});

const invite = (agent: typeof g.lead.agent, groupId: string, body: object) => agent.post(`/api/groups/${groupId}/invitations`).send(body);

describe("POST /api/groups/:id/invitations", () => {
  it("lets a lead invite a chemist and mails the invitee a link to the invitation", async () => {
    const email = uniqueEmail("new-chemist");
    const res = await invite(g.lead.agent, g.groupId, { email: email.toUpperCase(), role: "chemist" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, role: "chemist", status: "pending", groupId: g.groupId, invitedBy: { id: g.lead.userId }, mailed: true });
    // Valid for 7 days from now (within a minute).
    expect(Math.abs(Date.parse(res.body.expiresAt) - (Date.now() + 7 * 24 * 3600 * 1000))).toBeLessThan(60_000);
    const mail = t.mail.sent.find((m) => m.to === email);
    expect(mail?.text).toContain(`${ORIGIN}/invite/${res.body.id}`);
  });

  it.each([
    ["a chemist", () => g.chemist.agent, { role: "chemist" }, 403],
    ["a lead inviting an owner", () => g.lead.agent, { role: "owner" }, 403],
    ["a member of another group", () => other.owner.agent, { role: "chemist" }, 404],
    ["a bad role", () => g.owner.agent, { role: "admin" }, 400],
  ])("refuses %s", async (_label, who, body, status) => {
    const res = await invite(who(), g.groupId, { email: uniqueEmail("x"), ...body });
    expect(res.status).toBe(status);
  });

  it("lets an owner invite an owner", async () => {
    expect((await invite(g.owner.agent, g.groupId, { email: uniqueEmail("co-owner"), role: "owner" })).status).toBe(201);
  });

  it("answers 401 signed out, 400 for a bad address, 409 for a member already in the group", async () => {
    expect((await request(t.app).post(`/api/groups/${g.groupId}/invitations`).set("Origin", ORIGIN).send({ email: "a@b.example", role: "chemist" })).status).toBe(401);
    const bad = await invite(g.lead.agent, g.groupId, { email: "not an address", role: "chemist" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.email).toBeDefined();
    expect((await invite(g.lead.agent, g.groupId, { email: g.chemist.email, role: "lead" })).status).toBe(409);
  });

  it("replaces a pending invitation to the same address: only the newest link works", async () => {
    const email = uniqueEmail("twice");
    const first = await invite(g.lead.agent, g.groupId, { email, role: "chemist" });
    const second = await invite(g.owner.agent, g.groupId, { email, role: "lead" });
    expect(second.status).toBe(201);
    const pending = await g.lead.agent.get(`/api/groups/${g.groupId}/invitations`);
    const forEmail = pending.body.invitations.filter((i: { email: string }) => i.email === email);
    expect(forEmail).toEqual([expect.objectContaining({ id: second.body.id, role: "lead" })]);
    const [row] = await t.db.select().from(invitation).where(eq(invitation.id, first.body.id));
    expect(row?.status).toBe("canceled");
  });
});

describe("GET /api/groups/:id/invitations", () => {
  it("lists pending invitations for owners and leads only", async () => {
    const res = await g.owner.agent.get(`/api/groups/${g.groupId}/invitations`);
    expect(res.status).toBe(200);
    expect(res.body.invitations.length).toBeGreaterThan(0);
    expect(res.body.invitations.every((i: { status: string; groupId: string }) => i.status === "pending" && i.groupId === g.groupId)).toBe(true);
    expect((await g.chemist.agent.get(`/api/groups/${g.groupId}/invitations`)).status).toBe(403);
    expect((await other.lead.agent.get(`/api/groups/${g.groupId}/invitations`)).status).toBe(404);
    expect((await request(t.app).get(`/api/groups/${g.groupId}/invitations`)).status).toBe(401);
  });
});

describe("accepting by link", () => {
  it("shows the invitation before sign-in, then makes the invitee a member with the role", async () => {
    const email = uniqueEmail("joiner");
    const sent = await invite(g.lead.agent, g.groupId, { email, role: "lead" });
    const preview = await request(t.app).get(`/api/invitations/${sent.body.id}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ groupName: "inv lab", inviterName: "inv-lead", role: "lead", email, status: "pending", expired: false });

    const agent = agentFor(t.app);
    await agent.post("/api/auth/sign-up/email").send({ name: "Joiner", email, password: "correct-horse-1" });
    expect((await request(t.app).post(`/api/invitations/${sent.body.id}/accept`).set("Origin", ORIGIN).send({})).status).toBe(401);
    const res = await agent.post(`/api/invitations/${sent.body.id}/accept`).send({});
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ groupId: g.groupId, groupName: "inv lab", role: "lead" });
    const me = await agent.get("/api/me");
    expect(me.body.activeGroupId).toBe(g.groupId);
    expect(me.body.groups).toEqual([expect.objectContaining({ id: g.groupId, role: "lead" })]);
    // The desk of a lead opens for them now.
    expect((await agent.get(`/api/groups/${g.groupId}/invitations`)).status).toBe(200);
    // Used once.
    expect((await agent.post(`/api/invitations/${sent.body.id}/accept`).send({})).status).toBe(409);
    const audit = await g.lead.agent.get(`/api/audit?entity=invitation&entityId=${sent.body.id}`);
    expect(audit.body.entries.map((e: { action: string }) => e.action).sort()).toEqual(["invitation.accept", "invitation.create"]);
  });

  it("refuses someone signed in with another address", async () => {
    const sent = await invite(g.lead.agent, g.groupId, { email: uniqueEmail("meant-for"), role: "chemist" });
    const stranger = await signUp(t.app, "stranger");
    const res = await stranger.agent.post(`/api/invitations/${sent.body.id}/accept`).send({});
    expect(res.status).toBe(403);
    expect(res.body.error.message).toContain("This invitation is for");
  });

  it("refuses an expired invitation with 410", async () => {
    const email = uniqueEmail("late");
    const sent = await invite(g.lead.agent, g.groupId, { email, role: "chemist" });
    await t.db.update(invitation).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(invitation.id, sent.body.id));
    const agent = agentFor(t.app);
    await agent.post("/api/auth/sign-up/email").send({ name: "Late", email, password: "correct-horse-1" });
    expect((await request(t.app).get(`/api/invitations/${sent.body.id}`)).body.expired).toBe(true);
    expect((await agent.post(`/api/invitations/${sent.body.id}/accept`).send({})).status).toBe(410);
    const pending = await g.lead.agent.get(`/api/groups/${g.groupId}/invitations`);
    expect(pending.body.invitations.some((i: { id: string }) => i.id === sent.body.id)).toBe(false);
  });

  it("answers 404 for an unknown invitation", async () => {
    expect((await request(t.app).get("/api/invitations/no-such-invitation")).status).toBe(404);
  });
});

describe("DELETE /api/groups/:id/invitations/:invitationId", () => {
  it("revokes a pending invitation so its link no longer works", async () => {
    const email = uniqueEmail("revoked");
    const sent = await invite(g.lead.agent, g.groupId, { email, role: "chemist" });
    expect((await g.chemist.agent.delete(`/api/groups/${g.groupId}/invitations/${sent.body.id}`)).status).toBe(403);
    // Through another group's URL the invitation does not exist.
    expect((await other.lead.agent.delete(`/api/groups/${other.groupId}/invitations/${sent.body.id}`)).status).toBe(404);
    const res = await g.lead.agent.delete(`/api/groups/${g.groupId}/invitations/${sent.body.id}`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe("canceled");
    expect((await g.lead.agent.delete(`/api/groups/${g.groupId}/invitations/${sent.body.id}`)).status).toBe(409);
    const agent = agentFor(t.app);
    await agent.post("/api/auth/sign-up/email").send({ name: "Revoked", email, password: "correct-horse-1" });
    const accept = await agent.post(`/api/invitations/${sent.body.id}/accept`).send({});
    expect(accept.status).toBe(409);
    expect(accept.body.error.message).toBe("This invitation was revoked.");
    const audit = await g.owner.agent.get(`/api/audit?action=invitation.revoke&entityId=${sent.body.id}`);
    expect(audit.body.entries).toEqual([expect.objectContaining({ actor: expect.objectContaining({ id: g.lead.userId }), before: expect.objectContaining({ status: "pending" }), after: expect.objectContaining({ status: "canceled" }) })]);
  });
});
