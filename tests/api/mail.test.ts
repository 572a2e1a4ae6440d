import { eq } from "drizzle-orm";
import { cases } from "../../db/schema";
import { openDatabase, type DatabaseHandle } from "../../db/client";
import { createApp } from "../../server/app";
import { createOutboxMailer, linksIn, type CapturedMail, type OutboxMailer } from "../../server/mail-outbox";
import { couplingCase, createCase } from "./case-helpers";
import { ORIGIN, agentFor, groupWithRoles, signUp, uniqueEmail, type TestApp } from "./harness";

/*
 * Mail end to end: the app sends through nodemailer over SMTP to the local outbox on 127.0.0.1,
 * which parses each message back (mailparser). Each test checks the message, its recipient, and
 * that following its link does what the message says.
 */

let handle: DatabaseHandle;
let mailer: OutboxMailer;
let t: TestApp;

beforeAll(async () => {
  const url = process.env.PHASEWISE_TEST_DATABASE_URL;
  handle = await openDatabase(url ? { url } : { dataDir: "memory://" });
  mailer = await createOutboxMailer("Phasewise <no-reply@phasewise.invalid>");
  const { app, deps } = createApp({
    db: handle.db,
    dbKind: handle.kind,
    mail: mailer,
    baseURL: ORIGIN,
    rateLimit: { enabled: false },
    quiet: true,
    dataDir: `/tmp/phasewise-mail-test-${process.pid}`,
  });
  // The harness's shape, with the outbox in place of the recording mailer.
  t = { app, deps, mail: { sent: [], send: mailer.send }, db: handle.db, handle, close: () => handle.close() } as unknown as TestApp;
});
afterAll(async () => {
  await mailer.outbox.close();
  await handle.close();
});

const to = (address: string) => (m: CapturedMail) => m.to.includes(address);
/** The path and query of a link in a message, for supertest (which talks to the app, not the origin). */
function pathOf(link: string): string {
  expect(link.startsWith(ORIGIN)).toBe(true);
  const u = new URL(link);
  return `${u.pathname}${u.search}`;
}

describe("the local outbox", () => {
  it("receives a message over SMTP with its recipient, subject, text and links", async () => {
    const address = uniqueEmail("round-trip");
    const started = Date.now();
    await mailer.send({ to: address, subject: "Round trip", text: "First line.\n\nhttp://localhost:3000/cases/abc and again http://localhost:3000/cases/abc" });
    const got = await mailer.outbox.waitFor(to(address));
    expect(Date.now() - started).toBeLessThan(5000);
    expect(got.to).toEqual([address]);
    expect(got.from).toBe("no-reply@phasewise.invalid");
    expect(got.subject).toBe("Round trip");
    expect(got.text).toContain("First line.");
    expect(got.links).toEqual(["http://localhost:3000/cases/abc"]);
  });

  it("is listed on the developer outbox page, newest first", async () => {
    const address = uniqueEmail("outbox-page");
    await mailer.send({ to: address, subject: "For the page", text: "See http://localhost:3000/desk" });
    await mailer.outbox.waitFor(to(address));
    const res = await agentFor(t.app).get("/api/dev/outbox");
    expect(res.status).toBe(200);
    expect(res.body.messages[0]).toMatchObject({ to: [address], subject: "For the page", links: ["http://localhost:3000/desk"] });
  });

  it("finds links in text and html alike", () => {
    expect(linksIn('<a href="https://x.example/a?b=1">here</a> and (https://x.example/c).')).toEqual(["https://x.example/a?b=1", "https://x.example/c"]);
  });
});

describe("invitation mail", () => {
  it("reaches the invitee, and its link lets them sign up and join with the role", async () => {
    const g = await groupWithRoles(t, "mail-invite");
    const invitee = uniqueEmail("invitee");
    const sent = await g.lead.agent.post(`/api/groups/${g.groupId}/invitations`).send({ email: invitee, role: "chemist" });
    expect(sent.status).toBe(201);
    expect(sent.body.mailed).toBe(true);
    const mail = await mailer.outbox.waitFor(to(invitee));
    expect(mail.subject).toBe("You are invited to mail-invite lab on Phasewise");
    expect(mail.text).toContain("as a chemist");
    const link = mail.links.find((l) => l.includes("/invite/"));
    expect(link).toBe(`${ORIGIN}/invite/${sent.body.id}`);

    // The page behind the link: what it shows before sign-in, then sign-up and accept.
    const id = pathOf(link!).split("/").pop()!;
    const preview = await agentFor(t.app).get(`/api/invitations/${id}`);
    expect(preview.body).toMatchObject({ groupName: "mail-invite lab", email: invitee, role: "chemist", status: "pending", expired: false });
    const agent = agentFor(t.app);
    expect((await agent.post("/api/auth/sign-up/email").send({ name: "Invitee", email: invitee, password: "correct-horse-1" })).status).toBe(200);
    const accepted = await agent.post(`/api/invitations/${id}/accept`).send({});
    expect(accepted.status).toBe(200);
    expect(accepted.body).toMatchObject({ groupId: g.groupId, role: "chemist" });
    const members = await agent.get(`/api/groups/${g.groupId}/members`);
    expect(members.body.members.find((m: { email: string }) => m.email === invitee)).toMatchObject({ role: "chemist" });
  });
});

describe("password reset mail", () => {
  it("sends a link whose token sets a new password once", async () => {
    const who = await signUp(t.app, "mail-reset");
    const asked = await agentFor(t.app).post("/api/auth/request-password-reset").send({ email: who.email, redirectTo: "/reset-password" });
    expect(asked.status).toBe(200);
    const mail = await mailer.outbox.waitFor(to(who.email));
    expect(mail.subject).toBe("Reset your Phasewise password");
    const link = mail.links.find((l) => l.includes("/reset-password"))!;
    const token = new URL(link).searchParams.get("token");
    expect(pathOf(link)).toBe(`/reset-password?token=${token}`);
    expect(token).toBeTruthy();

    const reset = await agentFor(t.app).post("/api/auth/reset-password").send({ token, newPassword: "a-new-pass-phrase-2" });
    expect(reset.status).toBe(200);
    const oldPw = await agentFor(t.app).post("/api/auth/sign-in/email").send({ email: who.email, password: who.password });
    expect(oldPw.status).toBe(401);
    const newPw = await agentFor(t.app).post("/api/auth/sign-in/email").send({ email: who.email, password: "a-new-pass-phrase-2" });
    expect(newPw.status).toBe(200);
    const again = await agentFor(t.app).post("/api/auth/reset-password").send({ token, newPassword: "third-pass-phrase-3" });
    expect(again.status).toBe(400);
  });

  it("sends nothing for an address without an account, and answers the same", async () => {
    const nobody = uniqueEmail("nobody");
    const asked = await agentFor(t.app).post("/api/auth/request-password-reset").send({ email: nobody, redirectTo: "/reset-password" });
    expect(asked.status).toBe(200);
    await expect(mailer.outbox.waitFor(to(nobody), 600)).rejects.toThrow(/No matching message/);
  });
});

describe("follower mail", () => {
  it("tells each follower but not the author about a new attempt, with a link to the case", async () => {
    const g = await groupWithRoles(t, "mail-follow");
    const c = await createCase(g.chemist.agent, couplingCase({ title: "Milky band after the bicarbonate wash" }));
    expect((await g.owner.agent.post(`/api/cases/${c.id}/follow`).send({})).status).toBe(200);
    expect((await g.lead.agent.post(`/api/cases/${c.id}/follow`).send({})).status).toBe(200);
    const added = await g.lead.agent.post(`/api/cases/${c.id}/attempts`).send({ remedyId: "saturated-brine", outcome: "partly", amount: "20 mL" });
    expect(added.status).toBe(201);
    const mail = await mailer.outbox.waitFor(to(g.owner.email));
    expect(mail.subject).toBe("New attempt on “Milky band after the bicarbonate wash”");
    expect(mail.text).toContain("mail-follow-lead logged an attempt");
    expect(mail.text).toContain("partly cleared");
    const link = mail.links[0]!;
    expect(link).toBe(`${ORIGIN}/cases/${c.id}`);
    const opened = await g.owner.agent.get(`/api/${pathOf(link).slice(1)}`);
    expect(opened.status).toBe(200);
    expect(opened.body.title).toBe("Milky band after the bicarbonate wash");
    // The lead follows too but wrote the attempt: no message for them.
    await expect(mailer.outbox.waitFor((m) => to(g.lead.email)(m) && m.subject.startsWith("New attempt"), 600)).rejects.toThrow();
  });
});

describe("weekly digest", () => {
  it("lists stubborn open cases and new verified fixes to leads and owners only", async () => {
    const g = await groupWithRoles(t, "mail-digest");
    const now = Date.now();
    const day = 24 * 60 * 60 * 1000;
    // Open 5 days: stubborn by age (> 3 days).
    const old = await createCase(g.chemist.agent, couplingCase({ title: "Old rag layer", occurredAt: new Date(now - 5 * day).toISOString() }));
    // Open today with 3 failed attempts (no-change, worse, no-change): stubborn by failures.
    const tried = await createCase(
      g.chemist.agent,
      couplingCase({
        title: "Three failed tries",
        attempts: [
          { remedyId: "let-stand", outcome: "no-change" },
          { remedyId: "solid-salt", outcome: "worse" },
          { remedyId: "swirl-interface", outcome: "no-change" },
        ],
      }),
    );
    // Open today, one failed and one partial attempt: not stubborn.
    await createCase(
      g.chemist.agent,
      couplingCase({ title: "Fresh and moving", attempts: [{ remedyId: "let-stand", outcome: "no-change" }, { remedyId: "saturated-brine", outcome: "partly" }] }),
    );
    // Resolved and verified this week through the filter pad.
    const fixed = await createCase(
      g.chemist.agent,
      couplingCase({ title: "Cleared through a pad", status: "resolved", attempts: [{ remedyId: "filter-pad", outcome: "cleared" }] }),
    );
    const fixedDetail = await g.chemist.agent.get(`/api/cases/${fixed.id}`);
    await t.db
      .update(cases)
      .set({ verified: true, verifiedAt: new Date(), verifiedBy: g.lead.userId, verifiedAttemptId: fixedDetail.body.attempts[0].id })
      .where(eq(cases.id, fixed.id));

    const preview = await g.lead.agent.get("/api/digest");
    expect(preview.status).toBe(200);
    expect(preview.body.stubborn.map((c: { title: string }) => c.title).sort()).toEqual(["Old rag layer", "Three failed tries"]);
    expect(preview.body.stubborn.find((c: { title: string }) => c.title === "Three failed tries").failedAttempts).toBe(3);
    expect(preview.body.stubborn.find((c: { title: string }) => c.title === "Old rag layer").openDays).toBe(5);
    expect(preview.body.verified).toEqual([expect.objectContaining({ title: "Cleared through a pad", fix: "Filtering through a pad" })]);

    expect((await g.chemist.agent.post("/api/digest/send").send({})).status).toBe(403);
    const sent = await g.lead.agent.post("/api/digest/send").send({});
    expect(sent.status).toBe(200);
    expect(sent.body.sent).toBe(2);
    expect(sent.body.recipients.sort()).toEqual([g.owner.email, g.lead.email].sort());
    for (const lead of [g.owner, g.lead]) {
      const mail = await mailer.outbox.waitFor((m) => to(lead.email)(m) && m.subject.startsWith("Phasewise weekly"));
      expect(mail.subject).toBe("Phasewise weekly: 2 stubborn, 1 newly verified — mail-digest lab");
      expect(mail.text).toContain("Old rag layer — open 5 days, 0 failed attempts");
      expect(mail.text).toContain("Three failed tries — open 0 days, 3 failed attempts");
      expect(mail.text).not.toContain("Fresh and moving");
      expect(mail.links).toEqual(expect.arrayContaining([`${ORIGIN}/cases/${old.id}`, `${ORIGIN}/cases/${tried.id}`, `${ORIGIN}/cases/${fixed.id}`, `${ORIGIN}/desk`]));
      const opened = await lead.agent.get(`/api${pathOf(`${ORIGIN}/cases/${old.id}`)}`);
      expect(opened.status).toBe(200);
    }
    await expect(mailer.outbox.waitFor((m) => to(g.chemist.email)(m) && m.subject.startsWith("Phasewise weekly"), 600)).rejects.toThrow();
  });
});
