import { seedCases } from "../../db/seed-cases";
import { groupWithRoles, startTestApp, type TestApp } from "./harness";

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe("demo case log", () => {
  it("seeds twelve cases whose logged layer order agrees with the computed one", async () => {
    const g = await groupWithRoles(t, "demo");
    await seedCases({ db: t.db, groupId: g.groupId, users: { owner: g.owner.userId, lead: g.lead.userId, chemist: g.chemist.userId } });
    const list = (await g.chemist.agent.get("/api/cases?limit=50")).body;
    expect(list.total).toBe(12);
    for (const summary of list.cases) {
      const c = (await g.chemist.agent.get(`/api/cases/${summary.id}`)).body;
      // Only the tartrate case names a solution the tables lack (potassium sodium tartrate).
      if (c.system.aqueous.key === null) expect(c.predicted).toBeNull();
      else expect(c.layerSurprise).toBe(false);
    }
    // Three dichloromethane cases, logged as "DCM" and "dichloromethane".
    expect((await g.chemist.agent.get("/api/cases?q=methylene%20chloride")).body.total).toBe(3);
    expect((await g.chemist.agent.get("/api/cases?verified=true")).body.total).toBe(2);
  });
});
