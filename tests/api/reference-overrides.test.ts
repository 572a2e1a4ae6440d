import request from "supertest";
import { and, eq, sql } from "drizzle-orm";
import { auditLog, referenceOverrides } from "../../db/schema";
import { groupWithRoles, signUp, startTestApp, type TestApp } from "./harness";

/*
 * A lead's corrections to the reference tables, applied in that group's computations only.
 * Shipped values the assertions compare against:
 *  - dichloromethane 1.3266 g/mL at 20 °C (CRC Handbook, physical constants of organic compounds)
 *  - NaCl 12 % w/w 1.0857 and 13 % w/w 1.0932 g/mL at 20 °C (CRC Handbook, concentrative properties)
 * Densities come back rounded to 3 decimals.
 */

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "ovr-a");
  b = await groupWithRoles(t, "ovr-b");
});
afterAll(async () => {
  await t.close();
});

const dcmUnderWater = {
  organic: [{ solvent: "DCM", volumeMl: 30 }],
  aqueous: { solute: "water", volumeMl: 30 },
  temperatureC: 20,
};
const brine12 = (pct: number) => ({
  organic: [{ solvent: "ethyl acetate", volumeMl: 30 }],
  aqueous: { solute: "NaCl", concentration: { value: pct, unit: "%w/w" }, volumeMl: 30 },
  temperatureC: 20,
});

const dcmCorrection = {
  kind: "solvent-value",
  solventKey: "methylene chloride",
  field: "densityGPerMl20C",
  value: 1.318,
  source: "Supplier SDS, lot 4471, section 9",
  reason: "Our stabilised grade is lighter than the handbook value.",
};

describe("POST /api/reference/overrides", () => {
  it("records a solvent correction that this group's layer check uses and another group's does not", async () => {
    const before = await a.chemist.agent.post("/api/layers/predict").send(dcmUnderWater);
    expect(before.body.organicDensityGPerMl).toBe(1.327); // CRC 1.3266

    const res = await a.lead.agent.post("/api/reference/overrides").send(dcmCorrection);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({
      kind: "solvent-value",
      targetKey: "dichloromethane", // "methylene chloride" resolved to the key
      targetName: "Dichloromethane",
      source: dcmCorrection.source,
      reason: dcmCorrection.reason,
      createdBy: { id: a.lead.userId },
      applies: true,
    });
    expect(res.body.shipped.value).toBeCloseTo(1.3266, 4);
    expect(res.body.group.value).toBe(1.318);

    const mine = await a.chemist.agent.post("/api/layers/predict").send(dcmUnderWater);
    expect(mine.body.organicDensityGPerMl).toBe(1.318);
    // Δρ against water 0.99820 (Kell): 1.318 − 0.9982 = 0.3198 → 0.320
    expect(mine.body.densityDifferenceGPerMl).toBe(0.32);
    const theirs = await b.chemist.agent.post("/api/layers/predict").send(dcmUnderWater);
    expect(theirs.body.organicDensityGPerMl).toBe(1.327);
    const anonymous = await request(t.app).post("/api/layers/predict").send(dcmUnderWater);
    expect(anonymous.body.organicDensityGPerMl).toBe(1.327);

    // The solvent detail of the group shows the group's value, and the comparison shows both.
    const detail = await a.chemist.agent.get("/api/solvents/dichloromethane");
    expect(detail.body.densityGPerMl20C.value).toBe(1.318);
    expect(detail.body.densityGPerMl20C.sourceTitle).toBe(dcmCorrection.source);
    const both = await a.chemist.agent.get("/api/reference/solvents/dichloromethane");
    expect(both.status).toBe(200);
    expect(both.body.shipped.densityGPerMl20C.value).toBeCloseTo(1.3266, 4);
    expect(both.body.group.densityGPerMl20C.value).toBe(1.318);
    expect(both.body.corrections).toHaveLength(1);
    const otherDetail = await b.chemist.agent.get("/api/reference/solvents/dichloromethane");
    expect(otherDetail.body.group.densityGPerMl20C.value).toBeCloseTo(1.3266, 4);
    expect(otherDetail.body.corrections).toHaveLength(0);
  });

  it("adds an aqueous density point the interpolation then passes through", async () => {
    // Shipped: 12.5 % w/w lies halfway between 1.0857 and 1.0932 → 1.08945 → 1.089.
    const shipped = await b.chemist.agent.post("/api/layers/predict").send(brine12(12.5));
    expect(shipped.body.aqueousDensityGPerMl).toBe(1.089);
    const res = await a.lead.agent.post("/api/reference/overrides").send({
      kind: "aqueous-point",
      soluteKey: "sat. brine",
      massFractionPct: 12.5,
      densityGPerMl: 1.0916,
      source: "Pycnometer, 20.0 °C, three readings",
      reason: "We make this wash by weight every week; our measurement sits above the interpolated value.",
    });
    expect(res.status).toBe(201);
    expect(res.body.targetKey).toBe("sodium-chloride");
    expect(res.body.shipped.value).toBeCloseTo(1.08945, 5);
    expect(res.body.shipped.note).toMatch(/interpolated between the 12 and 13/);
    const mine = await a.chemist.agent.post("/api/layers/predict").send(brine12(12.5));
    expect(mine.body.aqueousDensityGPerMl).toBe(1.092); // the new table point itself, 1.0916
    // 12.25 % now interpolates between 12 (1.0857) and the new 12.5 point (1.0916): 1.0857 + 0.5·0.0059 = 1.08865; shipped 1.0857 + 0.25·0.0075 = 1.08758
    const between = await a.chemist.agent.post("/api/layers/predict").send(brine12(12.25));
    expect(between.body.aqueousDensityGPerMl).toBe(1.089);
    const theirsBetween = await b.chemist.agent.post("/api/layers/predict").send(brine12(12.25));
    expect(theirsBetween.body.aqueousDensityGPerMl).toBe(1.088);
    const theirs = await b.chemist.agent.post("/api/layers/predict").send(brine12(12.5));
    expect(theirs.body.aqueousDensityGPerMl).toBe(1.089);
  });

  it.each([
    ["no source", { ...dcmCorrection, source: "" }, "source"],
    ["no reason", { ...dcmCorrection, reason: " " }, "reason"],
    ["density below 0.5 g/mL", { ...dcmCorrection, value: 0.13 }, "value"],
    ["density above 2.5 g/mL", { ...dcmCorrection, value: 13.3 }, "value"],
    ["a boiling point of 4000 °C", { ...dcmCorrection, field: "boilingPointC", value: 4000 }, "value"],
    ["a field that cannot be corrected", { ...dcmCorrection, field: "cas" }, "field"],
    ["an unknown solvent", { ...dcmCorrection, solventKey: "unobtainium" }, "solventKey"],
    ["a mutual solubility for a water-miscible solvent", { ...dcmCorrection, solventKey: "acetone", field: "solubilityInWaterWtPct", value: 5 }, "field"],
    [
      "NaCl above saturation (26.4 % w/w at 20 °C)",
      { kind: "aqueous-point", soluteKey: "NaCl", massFractionPct: 30, densityGPerMl: 1.23, source: "lab", reason: "test value" },
      "massFractionPct",
    ],
    [
      "an aqueous density of 3.1 g/mL",
      { kind: "aqueous-point", soluteKey: "NaCl", massFractionPct: 10, densityGPerMl: 3.1, source: "lab", reason: "test value" },
      "densityGPerMl",
    ],
  ])("refuses %s with a 400 naming the field", async (_label, body, field) => {
    const res = await a.lead.agent.post("/api/reference/overrides").send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it("is for leads and owners: 401 signed out, 403 for a chemist", async () => {
    expect((await request(t.app).post("/api/reference/overrides").set("Origin", "http://localhost:3000").send(dcmCorrection)).status).toBe(401);
    expect((await a.chemist.agent.post("/api/reference/overrides").send(dcmCorrection)).status).toBe(403);
    const owner = await a.owner.agent
      .post("/api/reference/overrides")
      .send({ ...dcmCorrection, solventKey: "ethyl acetate", field: "boilingPointC", value: 77.1, source: "Supplier SDS", reason: "Owner check" });
    expect(owner.status).toBe(201);
    const retired = await a.owner.agent.delete(`/api/reference/overrides/${owner.body.id}`).send({ reason: "Entered by mistake." });
    expect(retired.status).toBe(200);
  });

  it("supersedes the group's earlier correction of the same value, keeping it retired", async () => {
    const first = await b.lead.agent.post("/api/reference/overrides").send({ ...dcmCorrection, value: 1.32 });
    const second = await b.lead.agent.post("/api/reference/overrides").send({ ...dcmCorrection, value: 1.321 });
    expect(second.status).toBe(201);
    const all = await b.lead.agent.get("/api/reference/overrides?status=all");
    const byId = new Map(all.body.overrides.map((o: { id: string }) => [o.id, o]));
    expect(byId.get(first.body.id)).toMatchObject({ retiredReason: "Superseded by a newer correction.", applies: false });
    expect(byId.get(second.body.id)).toMatchObject({ retiredAt: null, applies: true });
    const predicted = await b.chemist.agent.post("/api/layers/predict").send(dcmUnderWater);
    expect(predicted.body.organicDensityGPerMl).toBe(1.321);
    const entries = await b.lead.agent.get(`/api/audit?entity=reference-override&action=override.replace`);
    expect(entries.body.entries[0]).toMatchObject({ before: { id: first.body.id }, after: { id: second.body.id } });
    // Clean up for the other tests: back to the shipped value.
    await b.lead.agent.delete(`/api/reference/overrides/${second.body.id}`).send({ reason: "Test over." });
  });
});

describe("DELETE /api/reference/overrides/:id (retire)", () => {
  it("retires instead of deleting, with an audit entry, and the shipped value applies again", async () => {
    const created = await a.lead.agent.post("/api/reference/overrides").send({ ...dcmCorrection, solventKey: "toluene", value: 0.862 });
    expect((await a.chemist.agent.post("/api/layers/predict").send({ ...dcmUnderWater, organic: [{ solvent: "toluene", volumeMl: 30 }] })).body.organicDensityGPerMl).toBe(0.862);
    expect((await a.lead.agent.delete(`/api/reference/overrides/${created.body.id}`).send({})).status).toBe(400); // reason required
    expect((await a.chemist.agent.delete(`/api/reference/overrides/${created.body.id}`).send({ reason: "no" })).status).toBe(403);
    expect((await b.lead.agent.delete(`/api/reference/overrides/${created.body.id}`).send({ reason: "not ours" })).status).toBe(404);
    const res = await a.lead.agent.delete(`/api/reference/overrides/${created.body.id}`).send({ reason: "The new lot matches the handbook." });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ retiredBy: { id: a.lead.userId }, retiredReason: "The new lot matches the handbook.", applies: false });
    expect((await a.lead.agent.delete(`/api/reference/overrides/${created.body.id}`).send({ reason: "again" })).status).toBe(409);
    // toluene 0.8669 g/mL at 20 °C (CRC)
    expect((await a.chemist.agent.post("/api/layers/predict").send({ ...dcmUnderWater, organic: [{ solvent: "toluene", volumeMl: 30 }] })).body.organicDensityGPerMl).toBe(0.867);
    const rows = await t.db.select().from(referenceOverrides).where(eq(referenceOverrides.id, created.body.id));
    expect(rows).toHaveLength(1);
    const audit = await t.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.groupId, a.groupId), eq(auditLog.entityId, "solvent-value:toluene:densityGPerMl20C")));
    expect(audit.map((e) => e.action).sort()).toEqual(["override.create", "override.retire"]);
  });
});

describe("a correction and its audit entry commit together", () => {
  it("leaves neither when the audit write fails", async () => {
    // A trigger makes the audit insert of this one group fail inside the route's transaction.
    await t.db.execute(sql.raw(`
      create or replace function refuse_audit_${a.groupId.replace(/-/g, "_")}() returns trigger as $$
      begin
        if new.group_id = '${a.groupId}' then raise exception 'audit refused for the test'; end if;
        return new;
      end $$ language plpgsql`));
    await t.db.execute(
      sql.raw(`create trigger refuse_audit_trigger_${a.groupId.replace(/-/g, "_")} before insert on audit_log
               for each row execute function refuse_audit_${a.groupId.replace(/-/g, "_")}()`),
    );
    const quiet = jest.spyOn(console, "error").mockImplementation(() => undefined);
    try {
      const res = await a.lead.agent.post("/api/reference/overrides").send({ ...dcmCorrection, solventKey: "heptane", value: 0.69 });
      expect(res.status).toBe(500);
      expect(quiet).toHaveBeenCalled();
      const rows = await t.db
        .select()
        .from(referenceOverrides)
        .where(and(eq(referenceOverrides.groupId, a.groupId), eq(referenceOverrides.targetKey, "heptane")));
      expect(rows).toHaveLength(0);
      // heptane 0.6838 g/mL at 20 °C (CRC): the shipped value still applies
      const p = await a.chemist.agent.post("/api/layers/predict").send({ ...dcmUnderWater, organic: [{ solvent: "heptane", volumeMl: 30 }] });
      expect(p.body.organicDensityGPerMl).toBe(0.684);
    } finally {
      quiet.mockRestore();
      await t.db.execute(sql.raw(`drop trigger refuse_audit_trigger_${a.groupId.replace(/-/g, "_")} on audit_log`));
    }
    const audit = await t.db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.groupId, a.groupId), eq(auditLog.entityId, "solvent-value:heptane:densityGPerMl20C")));
    expect(audit).toHaveLength(0);
  });
});

describe("GET /api/reference/overrides", () => {
  it("lists the group's corrections to any member, never another group's", async () => {
    const mine = await a.chemist.agent.get("/api/reference/overrides");
    expect(mine.status).toBe(200);
    expect(mine.body.overrides.length).toBeGreaterThan(0);
    expect(mine.body.overrides.every((o: { retiredAt: string | null }) => o.retiredAt === null)).toBe(true);
    const theirs = await b.chemist.agent.get("/api/reference/overrides?status=all");
    const mineIds = new Set(mine.body.overrides.map((o: { id: string }) => o.id));
    expect(theirs.body.overrides.some((o: { id: string }) => mineIds.has(o.id))).toBe(false);
    expect((await request(t.app).get("/api/reference/overrides")).status).toBe(401);
    const loner = await signUp(t.app, "ovr-loner");
    expect((await loner.agent.get("/api/reference/overrides")).status).toBe(403);
  });

  it("answers 404 for a solvent the tables lack", async () => {
    expect((await a.chemist.agent.get("/api/reference/solvents/unobtainium")).status).toBe(404);
    const solute = await a.chemist.agent.get("/api/reference/solutes/sodium-chloride");
    expect(solute.status).toBe(200);
    expect(solute.body.groupPoints.value.some((p: { massFractionPct: number }) => p.massFractionPct === 12.5)).toBe(true);
    expect(solute.body.shippedPoints.value.some((p: { massFractionPct: number }) => p.massFractionPct === 12.5)).toBe(false);
  });
});
