import request from "supertest";
import { and, eq } from "drizzle-orm";
import { auditLog } from "../../db/schema";
import { recordAudit } from "../../server/audit";
import { groupWithRoles, startTestApp, type TestApp } from "./harness";

/*
 * The audit log: filterable for leads, scoped to the group, written with the change it
 * describes, and a way back to an earlier version. Shipped value used below: ethyl acetate
 * 0.9003 g/mL at 20 °C (CRC Handbook, physical constants of organic compounds).
 */

let t: TestApp;
let g: Awaited<ReturnType<typeof groupWithRoles>>;
let other: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  g = await groupWithRoles(t, "audit");
  other = await groupWithRoles(t, "audit-other");
});
afterAll(async () => {
  await t.close();
});

const etoac = (value: number, reason: string) => ({
  kind: "solvent-value",
  solventKey: "EtOAc",
  field: "densityGPerMl20C",
  value,
  source: "Pycnometer at 20.0 °C",
  reason,
});
const SUBJECT = "solvent-value:ethyl-acetate:densityGPerMl20C";
const layerOf = async (agent: typeof g.chemist.agent) =>
  (
    await agent.post("/api/layers/predict").send({
      organic: [{ solvent: "ethyl acetate", volumeMl: 50 }],
      aqueous: { solute: "water", volumeMl: 50 },
      temperatureC: 20,
    })
  ).body.organicDensityGPerMl as number;

describe("recordAudit", () => {
  it("writes with the caller's transaction: a rolled-back change leaves no entry", async () => {
    await expect(
      t.db.transaction(async (tx) => {
        await recordAudit(tx, { groupId: g.groupId, actorId: g.lead.userId, action: "test.rollback", entityType: "test", entityId: "x", after: { n: 1 } });
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    const rows = await t.db.select().from(auditLog).where(and(eq(auditLog.groupId, g.groupId), eq(auditLog.action, "test.rollback")));
    expect(rows).toHaveLength(0);

    await t.db.transaction(async (tx) => {
      await recordAudit(tx, {
        groupId: g.groupId,
        actorId: g.lead.userId,
        action: "test.commit",
        entityType: "test",
        entityId: "y",
        before: { when: new Date("2025-01-02T03:04:05Z") },
        after: undefined,
      });
    });
    const [row] = await t.db.select().from(auditLog).where(and(eq(auditLog.groupId, g.groupId), eq(auditLog.action, "test.commit")));
    // Plain JSON: a date becomes its ISO string, undefined becomes null.
    expect(row?.before).toEqual({ when: "2025-01-02T03:04:05.000Z" });
    expect(row?.after).toBeNull();
  });
});

describe("GET /api/audit", () => {
  beforeAll(async () => {
    await g.lead.agent.post("/api/reference/overrides").send(etoac(0.899, "First measurement of the new drum."));
    await g.owner.agent.post("/api/reference/overrides").send(etoac(0.901, "Second measurement, better thermostatted."));
    await other.lead.agent.post("/api/reference/overrides").send(etoac(0.95, "Other group's value."));
  });

  it("lists the group's entries newest first with actor, before and after", async () => {
    const res = await g.lead.agent.get("/api/audit?entity=reference-override");
    expect(res.status).toBe(200);
    expect(res.body.entries.map((e: { action: string }) => e.action)).toEqual(["override.replace", "override.create"]);
    const [replace, create] = res.body.entries;
    expect(replace).toMatchObject({
      entityId: SUBJECT,
      actor: { id: g.owner.userId, name: "audit-owner" },
      before: { payload: { value: 0.899 } },
      after: { payload: { value: 0.901 } },
      reason: "Second measurement, better thermostatted.",
      restorable: true,
    });
    expect(create).toMatchObject({ actor: { id: g.lead.userId }, before: null, after: { payload: { value: 0.899 } } });
    expect(res.body.entries.some((e: { after: { payload?: { value?: number } } }) => e.after?.payload?.value === 0.95)).toBe(false);
    expect(res.body.facets.actions).toEqual(expect.arrayContaining(["override.create", "override.replace"]));
    expect(res.body.facets.actors.map((a: { id: string }) => a.id).sort()).toEqual([g.lead.userId, g.owner.userId].sort());
  });

  it("filters by actor, action and period, sorts oldest first, and pages", async () => {
    const byOwner = await g.lead.agent.get(`/api/audit?actor=${g.owner.userId}`);
    expect(byOwner.body.entries.every((e: { actor: { id: string } }) => e.actor.id === g.owner.userId)).toBe(true);
    expect(byOwner.body.total).toBe(1);
    const created = await g.lead.agent.get("/api/audit?action=override.create");
    expect(created.body.entries).toHaveLength(1);
    const future = await g.lead.agent.get(`/api/audit?from=${new Date(Date.now() + 3600_000).toISOString()}`);
    expect(future.body.entries).toHaveLength(0);
    const past = await g.lead.agent.get(`/api/audit?to=2000-01-01`);
    expect(past.body.entries).toHaveLength(0);
    const oldest = await g.lead.agent.get("/api/audit?entity=reference-override&sort=oldest&limit=1");
    expect(oldest.body.entries.map((e: { action: string }) => e.action)).toEqual(["override.create"]);
    expect(oldest.body.total).toBe(2);
    const second = await g.lead.agent.get("/api/audit?entity=reference-override&sort=oldest&limit=1&offset=1");
    expect(second.body.entries.map((e: { action: string }) => e.action)).toEqual(["override.replace"]);
  });

  it("answers 400 for a bad date or a period that ends before it starts", async () => {
    expect((await g.lead.agent.get("/api/audit?from=yesterday-ish")).status).toBe(400);
    const backwards = await g.lead.agent.get("/api/audit?from=2025-03-02&to=2025-03-01");
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.from).toBeDefined();
  });

  it("is for leads and owners: 401 signed out, 403 for a chemist", async () => {
    expect((await request(t.app).get("/api/audit")).status).toBe(401);
    expect((await g.chemist.agent.get("/api/audit")).status).toBe(403);
    expect((await g.owner.agent.get("/api/audit")).status).toBe(200);
  });
});

describe("POST /api/audit/:id/restore", () => {
  const entryFor = async (action: string) => {
    const res = await g.lead.agent.get(`/api/audit?entity=reference-override&entityId=${encodeURIComponent(SUBJECT)}&action=${action}`);
    return res.body.entries[0] as { id: string };
  };

  it("brings back the version before a change, used at once in the group's computations, and logs the restore", async () => {
    expect(await layerOf(g.chemist.agent)).toBe(0.901);
    const replace = await entryFor("override.replace");
    expect((await g.chemist.agent.post(`/api/audit/${replace.id}/restore`).send({})).status).toBe(403);
    expect((await other.lead.agent.post(`/api/audit/${replace.id}/restore`).send({})).status).toBe(404);

    const res = await g.lead.agent.post(`/api/audit/${replace.id}/restore`).send({ version: "before", reason: "The second reading used a warm flask." });
    expect(res.status).toBe(200);
    expect(res.body.entry).toMatchObject({
      action: "restore",
      restoredFrom: replace.id,
      actor: { id: g.lead.userId },
      before: { payload: { value: 0.901 } },
      after: { payload: { value: 0.899 } },
      reason: "The second reading used a warm flask.",
    });
    expect(await layerOf(g.chemist.agent)).toBe(0.899);
    // The other group keeps its own correction.
    expect(await layerOf(other.chemist.agent)).toBe(0.95);
    // Once restored, the same version is already in force.
    expect((await g.lead.agent.post(`/api/audit/${replace.id}/restore`).send({ version: "before" })).status).toBe(400);
    // Re-applying the later version works too.
    const again = await g.lead.agent.post(`/api/audit/${replace.id}/restore`).send({ version: "after" });
    expect(again.status).toBe(200);
    expect(await layerOf(g.chemist.agent)).toBe(0.901);
  });

  it("restoring the version before the first correction brings back the shipped value", async () => {
    const create = await entryFor("override.create");
    const res = await g.owner.agent.post(`/api/audit/${create.id}/restore`).send({});
    expect(res.status).toBe(200);
    expect(res.body.entry.after).toBeNull();
    expect(res.body.record).toBeNull();
    expect(await layerOf(g.chemist.agent)).toBe(0.9); // CRC 0.9003
    const list = await g.lead.agent.get("/api/reference/overrides");
    expect(list.body.overrides.some((o: { targetKey: string }) => o.targetKey === "ethyl-acetate")).toBe(false);
  });

  it("answers 400 for an entry whose kind has no way back, 404 for an unknown entry", async () => {
    const inv = await g.lead.agent.post(`/api/groups/${g.groupId}/invitations`).send({ email: "restore-test@test.example", role: "chemist" });
    const [entry] = (await g.lead.agent.get(`/api/audit?entity=invitation&entityId=${inv.body.id}`)).body.entries;
    expect(entry.restorable).toBe(false);
    expect((await g.lead.agent.post(`/api/audit/${entry.id}/restore`).send({})).status).toBe(400);
    expect((await g.lead.agent.post("/api/audit/no-such-entry/restore").send({})).status).toBe(404);
  });
});
