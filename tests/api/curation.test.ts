import sharp from "sharp";
import { sql } from "drizzle-orm";
import { groupEvidence } from "../../server/case-evidence";
import { agentFor, groupWithRoles, startTestApp, type TestApp } from "./harness";
import { couplingCase, createCase } from "./case-helpers";

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "curate");
  b = await groupWithRoles(t, "other");
});
afterAll(async () => {
  await t.close();
});

const png = (shade: number) =>
  sharp({ create: { width: 12, height: 10, channels: 3, background: { r: shade, g: shade, b: shade } } })
    .png()
    .toBuffer();

async function auditFor(entityId: string) {
  const res = await a.lead.agent.get(`/api/audit?entityId=${entityId}&sort=oldest`);
  expect(res.status).toBe(200);
  return res.body.entries as { id: string; action: string; before: Record<string, unknown> | null; after: Record<string, unknown> | null; reason: string | null }[];
}

/** Two attempts: standing did nothing, the pad cleared it. */
const twoAttempts = () =>
  couplingCase({
    attempts: [
      { remedyId: "let-stand", minutes: 20, outcome: "no-change" },
      { remedyId: "filter-pad", minutes: 15, outcome: "cleared" },
    ],
  });

describe("verify", () => {
  it("marks the case and its first clearing attempt as verified, with an audit entry", async () => {
    const c = await createCase(a.chemist.agent, twoAttempts());
    const detail = (await a.chemist.agent.get(`/api/cases/${c.id}`)).body;
    const padAttempt = detail.attempts[1].id as string;

    const res = await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: c.id, verified: true, verifiedBy: a.lead.userId, verifiedAttemptId: padAttempt });

    const after = (await a.chemist.agent.get(`/api/cases/${c.id}`)).body;
    expect(after).toMatchObject({ verified: true, verifiedAttemptId: padAttempt, verifiedBy: a.lead.userId });

    const log = await auditFor(c.id);
    expect(log.map((e) => e.action)).toEqual(["verify"]);
    expect(log[0]!.before).toMatchObject({ verified: false, verifiedAttemptId: null });
    expect(log[0]!.after).toMatchObject({ verified: true, verifiedAttemptId: padAttempt });

    // Verifying again with the same fix changes nothing and writes nothing.
    await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({}).expect(200);
    expect(await auditFor(c.id)).toHaveLength(1);
  });

  it("takes a chosen attempt, and refuses one that did not clear or is not on the case", async () => {
    const c = await createCase(
      a.chemist.agent,
      couplingCase({
        attempts: [
          { remedyId: "saturated-brine", outcome: "partly" },
          { remedyId: "let-stand", outcome: "no-change" },
        ],
      }),
    );
    const other = await createCase(a.chemist.agent, twoAttempts());
    const d = (await a.lead.agent.get(`/api/cases/${c.id}`)).body;
    const otherAttempt = (await a.lead.agent.get(`/api/cases/${other.id}`)).body.attempts[1].id;

    const noChange = await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({ attemptId: d.attempts[1].id });
    expect(noChange.status).toBe(400);
    expect(noChange.body.error.fields.attemptId).toMatch(/did not clear/);
    const foreign = await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({ attemptId: otherAttempt });
    expect(foreign.status).toBe(400);

    const ok = await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({ attemptId: d.attempts[0].id });
    expect(ok.body).toMatchObject({ verified: true, verifiedAttemptId: d.attempts[0].id });
  });

  it("verifies a case with no clearing attempt as a record without a fix", async () => {
    const c = await createCase(a.chemist.agent, couplingCase({ attempts: [{ remedyId: "let-stand", outcome: "no-change" }] }));
    const res = await a.lead.agent.post(`/api/cases/${c.id}/verify`).send({});
    expect(res.body).toMatchObject({ verified: true, verifiedAttemptId: null });
  });

  it("bulk-verifies several cases, all or nothing", async () => {
    const [x, y] = [await createCase(a.chemist.agent, twoAttempts()), await createCase(a.chemist.agent, twoAttempts())];
    const elsewhere = await createCase(b.chemist.agent, twoAttempts());

    const mixed = await a.lead.agent.post("/api/review/verify").send({ ids: [x.id, elsewhere.id] });
    expect(mixed.status).toBe(404);
    expect((await a.lead.agent.get(`/api/cases/${x.id}`)).body.verified).toBe(false);

    const dup = await a.lead.agent.post("/api/review/verify").send({ ids: [x.id, x.id] });
    expect(dup.status).toBe(400);

    const res = await a.lead.agent.post("/api/review/verify").send({ ids: [x.id, y.id] });
    expect(res.status).toBe(200);
    expect(res.body.verified.map((s: { id: string; verified: boolean }) => [s.id, s.verified])).toEqual([
      [x.id, true],
      [y.id, true],
    ]);
  });
});

describe("review queue", () => {
  it("lists unverified live cases as new or resolved, with the checks a lead should make", async () => {
    const g = await groupWithRoles(t, "queue");
    const open = await createCase(g.chemist.agent, couplingCase({ title: "Still cloudy after brine" }));
    const resolved = await createCase(
      g.chemist.agent,
      couplingCase({
        title: "Cleared with the pad",
        status: "resolved",
        system: {
          organic: [{ solvent: "diethyl ether", volumeMl: 80 }],
          aqueous: { solute: "water", volumeMl: 40, ph: 7 },
          temperatureC: 20,
        },
        attempts: [{ remedyId: "warm-bath", outcome: "cleared" }],
      }),
    );
    const done = await createCase(g.chemist.agent, twoAttempts());
    await g.lead.agent.post(`/api/cases/${done.id}/verify`).send({}).expect(200);

    const res = await g.lead.agent.get("/api/review");
    expect(res.status).toBe(200);
    expect(res.body.counts).toEqual({ all: 2, new: 1, resolved: 1, asked: 0 });
    const byId = new Map(res.body.items.map((i: { id: string }) => [i.id, i]));
    expect(byId.has(done.id)).toBe(false);
    expect(byId.get(open.id)).toMatchObject({ queue: "new", attemptCount: 0, fixAttemptId: null });
    const r = byId.get(resolved.id) as { queue: string; checks: { code: string; tone: string; message: string }[]; fixAttemptId: string | null };
    expect(r.queue).toBe("resolved");
    expect(r.fixAttemptId).not.toBeNull();
    // Diethyl ether boils at 34.6 °C (CRC Handbook): a warm bath at about 40 °C boils it.
    expect(r.checks[0]).toMatchObject({ code: "safety", tone: "danger" });
    expect(r.checks[0]!.message).toMatch(/Diethyl ether \(bp 3\d(\.\d)? °C\)/i);
    expect(r.checks.map((c) => c.code)).toEqual(expect.arrayContaining(["no-outcome", "no-photo"]));

    const onlyNew = await g.lead.agent.get("/api/review?kind=new");
    expect(onlyNew.body.items.map((i: { id: string }) => i.id)).toEqual([open.id]);
    expect(onlyNew.body.total).toBe(1);

    await g.lead.agent.post(`/api/cases/${open.id}/requests`).send({ text: "Could you add the pH of the aqueous layer?" }).expect(201);
    const asked = await g.lead.agent.get("/api/review?kind=asked");
    expect(asked.body.items).toHaveLength(1);
    expect(asked.body.items[0]).toMatchObject({ id: open.id, openRequests: 1 });
  });

  it("is for leads and owners of the group only", async () => {
    expect((await agentFor(t.app).get("/api/review")).status).toBe(401);
    expect((await a.chemist.agent.get("/api/review")).status).toBe(403);
    expect((await a.owner.agent.get("/api/review")).status).toBe(200);
    const other = await b.lead.agent.get("/api/review");
    expect(other.body.items.every((i: { authorId: string }) => i.authorId !== a.chemist.userId)).toBe(true);
    expect((await a.lead.agent.get("/api/review?kind=everything")).status).toBe(400);
  });
});

describe("ask the author for more", () => {
  it("shows the request on the case and in the author's list; the author answers it", async () => {
    const c = await createCase(a.chemist.agent, twoAttempts());
    const res = await a.lead.agent.post(`/api/cases/${c.id}/requests`).send({ text: "Please add a photo of the interface." });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ caseId: c.id, status: "open", askedBy: { id: a.lead.userId }, askedOf: { id: a.chemist.userId } });
    const requestId = res.body.id as string;

    const onCase = await a.chemist.agent.get(`/api/cases/${c.id}/requests`);
    expect(onCase.body.requests.map((r: { text: string }) => r.text)).toEqual(["Please add a photo of the interface."]);
    const mine = await a.chemist.agent.get("/api/my-requests");
    expect(mine.body.requests.map((r: { id: string }) => r.id)).toContain(requestId);
    // The lead asked but authored nothing: their own list stays empty of it.
    const leads = await a.lead.agent.get("/api/my-requests");
    expect(leads.body.requests.map((r: { id: string }) => r.id)).not.toContain(requestId);

    // A member who is neither the author nor a lead cannot answer for the author.
    const bystander = await createCase(a.lead.agent, twoAttempts());
    const ask2 = await a.owner.agent.post(`/api/cases/${bystander.id}/requests`).send({ text: "Which lot of diatomaceous earth?" });
    expect((await a.chemist.agent.patch(`/api/requests/${ask2.body.id}`).send({ reply: "mine" })).status).toBe(403);

    const answered = await a.chemist.agent.patch(`/api/requests/${requestId}`).send({ reply: "Added two photos." });
    expect(answered.status).toBe(200);
    expect(answered.body).toMatchObject({ status: "answered", reply: "Added two photos.", answeredBy: { id: a.chemist.userId } });
    expect((await a.chemist.agent.get("/api/my-requests")).body.requests.map((r: { id: string }) => r.id)).not.toContain(requestId);
    expect((await a.chemist.agent.get("/api/my-requests?status=all")).body.requests.map((r: { id: string }) => r.id)).toContain(requestId);

    const log = await auditFor(requestId);
    expect(log.map((e) => e.action)).toEqual(["request", "request.answer"]);
  });

  it("validates, and only a lead asks", async () => {
    const c = await createCase(a.chemist.agent, twoAttempts());
    expect((await a.lead.agent.post(`/api/cases/${c.id}/requests`).send({ text: "" })).status).toBe(400);
    expect((await a.chemist.agent.post(`/api/cases/${c.id}/requests`).send({ text: "Add the pH" })).status).toBe(403);
    expect((await a.lead.agent.patch(`/api/requests/nope`).send({ status: "answered" })).status).toBe(404);
    expect((await a.lead.agent.patch(`/api/requests/nope`).send({})).status).toBe(400);
  });
});

describe("merge", () => {
  it("moves every attempt and photo onto the kept case, and a restore puts them back", async () => {
    const kept = await createCase(a.chemist.agent, twoAttempts());
    const dup = await createCase(
      a.lead.agent,
      couplingCase({
        title: "Duplicate: urea rag after HATU coupling",
        attempts: [
          { remedyId: "saturated-brine", minutes: 10, outcome: "no-change" },
          { remedyId: "centrifuge", minutes: 5, outcome: "cleared" },
        ],
      }),
    );
    for (const [id, shade] of [
      [kept.id, 40],
      [dup.id, 90],
      [dup.id, 140],
    ] as const) {
      await a.lead.agent.post(`/api/cases/${id}/photos`).attach("photo", await png(shade), { filename: "p.png" }).expect(201);
    }
    const dupBefore = (await a.lead.agent.get(`/api/cases/${dup.id}`)).body;
    const evidenceBefore = (await groupEvidence(t.db, a.groupId)).length;

    const res = await a.lead.agent.post(`/api/cases/${dup.id}/merge`).send({ into: kept.id });
    expect(res.status).toBe(200);
    expect(res.body.moved).toEqual({ attempts: 2, photos: 2, followers: 1 });
    expect(res.body.merged).toMatchObject({ id: dup.id, mergedInto: kept.id, retired: true, attemptCount: 0, photoCount: 0 });
    expect(res.body.kept).toMatchObject({ id: kept.id, absorbed: [dup.id], attemptCount: 4, photoCount: 3 });

    const k = (await a.chemist.agent.get(`/api/cases/${kept.id}`)).body;
    expect(k.attempts.map((x: { remedyId: string; position: number }) => [x.position, x.remedyId])).toEqual([
      [1, "let-stand"],
      [2, "filter-pad"],
      [3, "saturated-brine"],
      [4, "centrifuge"],
    ]);
    expect(k.photos).toHaveLength(3);
    // Photos that moved are still served (the bytes did not move, only the row).
    const moved = k.photos.find((p: { id: string }) => p.id === dupBefore.photos[0].id);
    await a.chemist.agent.get(moved.url).expect(200);
    // The lead followed their own case; they now follow the case that remains.
    expect(k.followerCount).toBe(2);

    // One case remains in the list and in search (the moved attempt is found on it); the merged one points to it.
    const list = await a.chemist.agent.get(`/api/cases?q=centrifuge`);
    expect(list.body.cases.map((c: { id: string }) => c.id)).toEqual([kept.id]);
    const withRetired = await a.chemist.agent.get(`/api/cases?includeRetired=true&limit=200`);
    expect(withRetired.body.cases.map((c: { id: string }) => c.id)).toContain(dup.id);
    const m = (await a.chemist.agent.get(`/api/cases/${dup.id}`)).body;
    expect(m).toMatchObject({ mergedInto: kept.id, retired: true, attempts: [], photos: [] });
    expect(m.retiredReason).toMatch(/Merged into/);
    // Evidence counts each attempt once, on the case that remains.
    expect((await groupEvidence(t.db, a.groupId)).length).toBe(evidenceBefore);

    const keptLog = await auditFor(kept.id);
    expect(keptLog.map((e) => e.action)).toEqual(["merge.kept"]);
    const dupLog = await auditFor(dup.id);
    expect(dupLog.map((e) => e.action)).toEqual(["merge"]);
    expect(dupLog[0]!.before).toMatchObject({ mergedInto: null, attemptCount: 2, photoCount: 2 });

    // Restore: the attempts go home in their old order, the photos too.
    const back = await a.lead.agent.post(`/api/cases/${dup.id}/restore`).send({});
    expect(back.status).toBe(200);
    expect(back.body).toMatchObject({ mergedInto: null, retired: false, attemptCount: 2, photoCount: 2 });
    const d2 = (await a.lead.agent.get(`/api/cases/${dup.id}`)).body;
    expect(d2.attempts.map((x: { id: string; position: number }) => [x.id, x.position])).toEqual(
      dupBefore.attempts.map((x: { id: string; position: number }) => [x.id, x.position]),
    );
    expect(d2.photos.map((p: { id: string }) => p.id).sort()).toEqual(dupBefore.photos.map((p: { id: string }) => p.id).sort());
    const k2 = (await a.lead.agent.get(`/api/cases/${kept.id}`)).body;
    expect(k2.attempts).toHaveLength(2);
    expect(k2.followerCount).toBe(1);
    expect((await auditFor(kept.id)).map((e) => e.action)).toEqual(["merge.kept", "unmerge.kept"]);

    // Redo the merge from the log: the "after" version of the merge entry.
    const redo = await a.lead.agent.post(`/api/audit/${dupLog[0]!.id}/restore`).send({ version: "after" });
    expect(redo.status).toBe(200);
    expect((await a.lead.agent.get(`/api/cases/${kept.id}`)).body.attempts).toHaveLength(4);
    // …and undo it from the kept case's entry.
    const undo = await a.lead.agent.post(`/api/audit/${keptLog[0]!.id}/restore`).send({ version: "before" });
    expect(undo.status).toBe(200);
    expect((await a.lead.agent.get(`/api/cases/${dup.id}`)).body).toMatchObject({ mergedInto: null, retired: false });
    expect((await a.lead.agent.get(`/api/cases/${dup.id}`)).body.attempts).toHaveLength(2);
  });

  it("refuses self-merges, merging into a merged-away case, and another group's case", async () => {
    const x = await createCase(a.chemist.agent, twoAttempts());
    const y = await createCase(a.chemist.agent, twoAttempts());
    const z = await createCase(a.chemist.agent, twoAttempts());
    const foreign = await createCase(b.chemist.agent, twoAttempts());
    expect((await a.lead.agent.post(`/api/cases/${x.id}/merge`).send({ into: x.id })).status).toBe(400);
    expect((await a.lead.agent.post(`/api/cases/${x.id}/merge`).send({ into: foreign.id })).status).toBe(404);
    expect((await a.lead.agent.post(`/api/cases/${foreign.id}/merge`).send({ into: x.id })).status).toBe(404);
    expect((await a.lead.agent.post(`/api/cases/${x.id}/merge`).send({})).status).toBe(400);
    await a.lead.agent.post(`/api/cases/${y.id}/merge`).send({ into: x.id }).expect(200);
    expect((await a.lead.agent.post(`/api/cases/${z.id}/merge`).send({ into: y.id })).status).toBe(400);
    expect((await a.lead.agent.post(`/api/cases/${y.id}/merge`).send({ into: z.id })).status).toBe(409);
    expect((await a.chemist.agent.post(`/api/cases/${z.id}/merge`).send({ into: x.id })).status).toBe(403);
    // Nothing moved for the refused attempts.
    expect((await a.lead.agent.get(`/api/cases/${foreign.id}`)).status).toBe(404);
    expect((await b.lead.agent.get(`/api/cases/${foreign.id}`)).body.attempts).toHaveLength(2);
  });
});

describe("retire and restore", () => {
  it("retires with a reason, hides the case from lists, search, review and evidence, and restores it", async () => {
    const g = await groupWithRoles(t, "retire");
    const c = await createCase(g.chemist.agent, couplingCase({ title: "Heat gun on the funnel", attempts: [{ remedyId: "filter-pad", outcome: "cleared" }] }));
    const evidence = (await groupEvidence(t.db, g.groupId)).length;
    expect(evidence).toBe(1);

    const bad = await g.lead.agent.post(`/api/cases/${c.id}/retire`).send({ code: "unsafe" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.reason).toBeDefined();

    const res = await g.lead.agent.post(`/api/cases/${c.id}/retire`).send({ code: "unsafe", reason: "Open heat source near diethyl ether." });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ retired: true, retiredBy: g.lead.userId, retiredReason: "Found unsafe: Open heat source near diethyl ether." });
    expect((await g.lead.agent.post(`/api/cases/${c.id}/retire`).send({ code: "other", reason: "again" })).status).toBe(409);

    expect((await g.chemist.agent.get("/api/cases")).body.cases).toHaveLength(0);
    expect((await g.chemist.agent.get("/api/cases?q=heat")).body.cases).toHaveLength(0);
    expect((await g.lead.agent.get("/api/review")).body.items).toHaveLength(0);
    expect(await groupEvidence(t.db, g.groupId)).toHaveLength(0);
    // Nothing is deleted: the case page still answers, saying why.
    expect((await g.chemist.agent.get(`/api/cases/${c.id}`)).body).toMatchObject({ retired: true, retiredReason: expect.stringMatching(/unsafe/i) });
    expect((await g.lead.agent.post(`/api/cases/${c.id}/verify`).send({})).status).toBe(409);

    const restored = await g.lead.agent.post(`/api/cases/${c.id}/restore`).send({ reason: "Checked with the supervisor." });
    expect(restored.body).toMatchObject({ retired: false, retiredReason: null });
    expect((await g.chemist.agent.get("/api/cases")).body.cases).toHaveLength(1);
    expect(await groupEvidence(t.db, g.groupId)).toHaveLength(1);
    expect((await g.lead.agent.post(`/api/cases/${c.id}/restore`).send({})).status).toBe(409);

    const log = (await g.lead.agent.get(`/api/audit?entityId=${c.id}&sort=oldest`)).body.entries;
    expect(log.map((e: { action: string }) => e.action)).toEqual(["retire", "restore"]);
    expect(log[1].reason).toBe("Checked with the supervisor.");

    // The log's own restore brings the retirement back (its "after" version).
    const again = await g.lead.agent.post(`/api/audit/${log[0].id}/restore`).send({ version: "after" });
    expect(again.status).toBe(200);
    expect((await g.chemist.agent.get(`/api/cases/${c.id}`)).body.retired).toBe(true);
  });

  it("guards every curation route: 401 signed out, 403 for a chemist, 404 for another group's case", async () => {
    const c = await createCase(a.chemist.agent, twoAttempts());
    const anon = agentFor(t.app);
    const routes: [string, Record<string, unknown>][] = [
      [`/api/cases/${c.id}/verify`, {}],
      [`/api/cases/${c.id}/retire`, { code: "other", reason: "test reason" }],
      [`/api/cases/${c.id}/restore`, {}],
      [`/api/cases/${c.id}/merge`, { into: c.id }],
      [`/api/cases/${c.id}/requests`, { text: "more please" }],
    ];
    for (const [path, body] of routes) {
      expect([path, (await anon.post(path).send(body)).status]).toEqual([path, 401]);
      expect([path, (await a.chemist.agent.post(path).send(body)).status]).toEqual([path, 403]);
      expect([path, (await b.lead.agent.post(path).send(body)).status]).toEqual([path, 404]);
      expect([path, (await b.owner.agent.post(path).send(body)).status]).toEqual([path, 404]);
    }
    expect((await anon.get(`/api/cases/${c.id}/requests`)).status).toBe(401);
    expect((await b.chemist.agent.get(`/api/cases/${c.id}/requests`)).status).toBe(404);
    expect((await anon.get("/api/my-requests")).status).toBe(401);
    const ask = await a.lead.agent.post(`/api/cases/${c.id}/requests`).send({ text: "Add the pH" });
    expect((await b.lead.agent.patch(`/api/requests/${ask.body.id}`).send({ status: "answered" })).status).toBe(404);
    // Nothing changed on the case.
    expect((await a.chemist.agent.get(`/api/cases/${c.id}`)).body).toMatchObject({ verified: false, retired: false });
  });
});

describe("audit entries share the change's transaction", () => {
  it("writes the entry in the same transaction as the change (same xmin)", async () => {
    const c = await createCase(a.chemist.agent, twoAttempts());
    await a.lead.agent.post(`/api/cases/${c.id}/retire`).send({ code: "duplicate", reason: "Logged twice." }).expect(200);
    const [entry] = await auditFor(c.id);
    // xmin is the id of the transaction that wrote a row version (PostgreSQL system columns).
    const rows = await t.db.execute(
      sql`select (select xmin::text from cases where id = ${c.id}) as case_tx, (select xmin::text from audit_log where id = ${entry!.id}) as audit_tx`,
    );
    const row = (rows as unknown as { rows: { case_tx: string; audit_tx: string }[] }).rows[0]!;
    expect(row.case_tx).toBe(row.audit_tx);
  });

  it("rolls the change back when its audit entry cannot be written", async () => {
    const g = await groupWithRoles(t, "atomic");
    const c = await createCase(g.chemist.agent, twoAttempts());
    const other = await createCase(g.chemist.agent, twoAttempts());
    // Refuse every audit entry of this one group only, so other suites sharing the database are untouched.
    const name = `no_audit_${g.groupId.replace(/-/g, "")}`;
    await t.db.execute(sql.raw(`alter table audit_log add constraint ${name} check (group_id <> '${g.groupId}')`));
    // The server logs each refused write as a 500; those lines are expected here.
    const quiet = jest.spyOn(console, "error").mockImplementation(() => undefined);
    try {
      expect((await g.lead.agent.post(`/api/cases/${c.id}/verify`).send({})).status).toBe(500);
      expect((await g.lead.agent.post(`/api/cases/${c.id}/retire`).send({ code: "other", reason: "test" })).status).toBe(500);
      expect((await g.lead.agent.post(`/api/cases/${other.id}/merge`).send({ into: c.id })).status).toBe(500);
      expect((await g.lead.agent.post(`/api/cases/${c.id}/requests`).send({ text: "pH?" })).status).toBe(500);
    } finally {
      quiet.mockRestore();
      await t.db.execute(sql.raw(`alter table audit_log drop constraint ${name}`));
    }
    const d = (await g.lead.agent.get(`/api/cases/${c.id}`)).body;
    expect(d).toMatchObject({ verified: false, retired: false });
    expect(d.attempts).toHaveLength(2);
    expect((await g.lead.agent.get(`/api/cases/${other.id}`)).body).toMatchObject({ mergedInto: null, retired: false });
    expect((await g.lead.agent.get(`/api/cases/${c.id}/requests`)).body.requests).toHaveLength(0);
  });
});
